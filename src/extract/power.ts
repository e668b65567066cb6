import type { Segment } from '../parse/types.js';
import { matchesOf } from './matches.js';
import { readNumber, sentenceOf, sourceSpan } from './numbers.js';
import type { PowerStatement, ReportedNumber } from './types.js';
import { UNITS } from './units.js';

const HAS_POWER = /(?<![\p{L}])power(?![\p{L}])/iu;
const POWER_VALUE = /(?<![\p{L}\p{N}.])(\d{1,3}(?:\.\d{1,2})?) ?% (?:statistical )?power|(?<![\p{L}])power (?:of |= ?|was |is |at )?(0?\.\d{1,3}|\d{1,3}(?:\.\d{1,2})? ?%)/diu;
const EFFECT = /(?<![\p{L}\p{N}_'’])(?:Cohen['’]s )?d(?:_?\{?z\}?)? ?(?:=|of) ?([-+]?\d{0,2}\.\d{1,3}|\d{1,2})(?![\d.])/du;
const ALPHA = /(?:α|alpha)(?: level)? ?(?:=|of|at) ?(0?\.\d{1,4})/iu;
const SIDES = /(one|two|1|2)[- ](?:tailed|sided)/iu;
const PER_GROUP = /(?<![\p{L}\p{N}.,])(\d{1,3}(?:,\d{3})?|\d{1,7}) (?:[\p{L}]{3,15} )?(?:per group|in each group|per arm|per condition|in each arm|each)(?![\p{L}])/diu;
const N_PER_GROUP = /(?<![\p{L}])n ?= ?(\d{1,7}) (?:per group|in each group|per arm|each)/diu;
const TOTAL = /(?<![\p{L}])(?:total (?:sample )?(?:size )?(?:of |N ?= ?|n ?= ?)?|N ?= ?)(\d{1,3}(?:,\d{3})?|\d{1,7})(?![\d.])/diu;
/** "22 shift workers give 90% power": the number before the verb that gives the power, whatever its noun. */
const GIVES_POWER = /(?<![\p{L}\p{N}.,])(\d{1,3}(?:,\d{3})?|\d{1,7}) (?:\p{L}{2,20} ){1,2}(?:give|gives|gave|provide|provides|provided|yield|yields|yielded|would give|would provide)(?![\p{L}])/du;
const PEOPLE = new RegExp(String.raw`(?<![\p{L}\p{N}.,])(\d{1,3}(?:,\d{3})?|\d{1,7}) ${UNITS}(?![\p{L}])`, 'du');
/** Words right before a power value that make it a bound ("more than 80% power", "at least 80%"). */
const AT_LEAST_BEFORE = /(?<![\p{L}])(?:more than|at least|over|above|greater than|in excess of|exceeding|no less than|>|≥|>=) ?$/iu;
/** A loss the n allows for ("allowing for 20% attrition", "a 15% drop-out rate", "inflated for loss to follow-up"). */
const LOSS = /(?<![\p{L}])(?:allow(?:ing|ed|s)?|account(?:ing|ed|s)? for|inflat\p{L}*|adjust(?:ing|ed)? for|anticipat\p{L}*|expect(?:ing|ed)?|assum(?:ing|ed)?)(?: [\p{L}\p{N}%.-]+){0,4} (?:attrition|drop-?outs?|drop-?out rate|loss to follow-?up|withdrawals?|non-?response)(?![\p{L}])/iu;
const LOSS_RATE = /(?<![\p{N}.])(\d{1,2}(?:\.\d)?) ?% (?:\p{L}{1,15} ){0,2}(?:attrition|drop-?outs?|drop-?out rate|loss to follow-?up|lost to follow-?up|non-?response|withdrawals?)(?![\p{L}])/iu;
/** An allocation ratio other than 1:1 ("a 2:1 allocation", "randomised 2:1"). */
const RATIO = /(?<![\p{N}.:])([1-9]) ?: ?([1-9])(?![\p{N}.:])/u;
/** Two group sizes printed in the sentence ("96 intervention and 48 control participants"). */
const TWO_SIZES = /(?<![\p{L}\p{N}.,])(\d{1,5}) (?:\p{L}{2,20} )?and (\d{1,5}) (?:\p{L}{2,20} )?(?:participants|patients|people|subjects|children|adults|nurses|staff|pupils|students|per group|in the)(?![\p{L}])/iu;
/**
 * Words of a sample-size calculation for another model than two independent groups compared by a
 * t-test: clustering (a design effect, an ICC), adjustment for baseline or covariates (ANCOVA, a
 * baseline–outcome correlation), counts or survival, non-inferiority or equivalence margins.
 */
const OTHER_MODEL = /(?<![\p{L}])(?:design effect|ICC|intra-?class correlation|intra-?cluster correlation|clustering|clustered|cluster[- ]randomi[sz]ed|ANCOVA|analysis of covariance|adjust(?:s|ed|ing|ment)? for (?:the )?(?:baseline|covariates?)|baseline[–-](?:outcome|follow-?up) correlation|correlation (?:of|between|with) (?:the )?baseline|mixed[- ]models?|Poisson|negative binomial|log-?rank|hazard ratio|non-?inferiority|equivalence margin)(?![\p{L}])/giu;
/** Words after them that deny them ("clustering was not expected"). */
const OTHER_MODEL_DENIED_AFTER = /^ (?:was|were|is|are) (?:not|never)(?![\p{L}])/iu;
/** A negation right before such words ("without adjustment for covariates", "no clustering was expected", "ignoring clustering"). */
const OTHER_MODEL_DENIED = /(?<![\p{L}])(?:no|not|without|ignoring|never|nor)(?: [\p{L}-]{1,15}){0,2} $/iu;
const PAIRED = /(?<![\p{L}])(paired|within-subjects?|repeated[- ]measures|crossover|pre-post|before and after)(?![\p{L}])/iu;
const ONE_SAMPLE = /(?<![\p{L}])one-sample(?![\p{L}])/iu;

/** Power and sample-size statements: a sentence that names power, a power value and a d. */
export function findPowerStatements(seg: Segment, starts: number[]): PowerStatement[] {
  if (!HAS_POWER.test(seg.text)) return [];
  const out: PowerStatement[] = [];
  for (let s = 0; s < starts.length; s += 1) {
    const a = starts[s] as number;
    const b = starts[s + 1] ?? seg.text.length;
    const sentence = seg.text.slice(a, b);
    if (!HAS_POWER.test(sentence)) continue;
    const pv = POWER_VALUE.exec(sentence);
    const d = EFFECT.exec(sentence);
    if (!pv || !d) continue;
    const num = (m: RegExpExecArray, g: number): ReportedNumber | undefined => {
      const at = m.indices?.[g];
      return at ? readNumber(seg, a + at[0], a + at[1]) : undefined;
    };
    const powerGroup = pv[1] !== undefined ? 1 : 2;
    const rawPower = (pv[powerGroup] as string).replace(/ ?%$/, '');
    const powerStart = a + (pv.indices?.[powerGroup]?.[0] ?? 0);
    const power = readNumber(seg, powerStart, powerStart + rawPower.length);
    const dValue = num(d, 1);
    if (!power || !dValue) continue;
    const percent = pv[1] !== undefined || /%$/.test(pv[2] ?? '');
    const perGroup = N_PER_GROUP.exec(sentence) ?? PER_GROUP.exec(sentence);
    const total = perGroup ? undefined : (TOTAL.exec(sentence) ?? PEOPLE.exec(sentence) ?? GIVES_POWER.exec(sentence));
    const nMatch = perGroup ?? total;
    const n = nMatch ? num(nMatch, 1) : undefined;
    const alpha = ALPHA.exec(sentence);
    const sides = SIDES.exec(sentence);
    const design = PAIRED.test(sentence) ? 'paired' : ONE_SAMPLE.test(sentence) ? 'one-sample' : 'two-sample';
    const atLeast = AT_LEAST_BEFORE.test(sentence.slice(Math.max(0, pv.index - 16), pv.index));
    const lossRate = LOSS_RATE.exec(sentence);
    // a loss allowed for in the calculation, at its rate where the words give one ("allowing for 20% attrition")
    const allowed = LOSS.test(sentence);
    const loss = allowed ? (lossRate ? Number(lossRate[1]) / 100 : NaN) : undefined;
    const ratio = RATIO.exec(sentence);
    const sizes = TWO_SIZES.exec(sentence);
    const unequal = (ratio !== null && ratio[1] !== ratio[2]) || (sizes !== null && sizes[1] !== sizes[2]);
    let other: RegExpExecArray | undefined;
    for (const m of matchesOf(OTHER_MODEL, sentence)) {
      if (OTHER_MODEL_DENIED.test(sentence.slice(Math.max(0, m.index - 40), m.index)) || OTHER_MODEL_DENIED_AFTER.test(sentence.slice(m.index + m[0].length, m.index + m[0].length + 30))) continue;
      other = m;
      break;
    }
    out.push({
      segment: seg.id,
      block: seg.block,
      sentence: sentenceOf(starts, a),
      span: sourceSpan(seg, a + pv.index, Math.max(a + pv.index + pv[0].length, n ? indexAfter(seg, n) : 0, indexAfter(seg, dValue))),
      printed: sentence.trim(),
      power,
      powerPercent: percent,
      d: dValue,
      ...(alpha ? { alpha: Number(alpha[1]) } : {}),
      ...(sides ? { sides: /^(one|1)$/i.test(sides[1] as string) ? 1 : 2 } : {}),
      ...(n ? { n } : {}),
      nScope: perGroup ? 'per-group' : total && /total|N ?=/i.test(total[0]) ? 'total' : 'unspecified',
      design,
      ...(atLeast ? { powerAtLeast: true } : {}),
      ...(loss !== undefined ? { allowsForLoss: loss } : {}),
      ...(unequal ? { unequalGroups: true } : {}),
      ...(other ? { otherModel: other[0] } : {}),
    } as PowerStatement);
  }
  return out;
}

function indexAfter(seg: Segment, n: ReportedNumber): number {
  let i = 0;
  while (i < seg.ends.length && (seg.ends[i] as number) <= n.span.end) i += 1;
  return i;
}
