import type { Segment } from '../parse/types.js';
import { readNumber, sentenceOf, sourceSpan, trimEndOf } from './numbers.js';
import { topicStems } from './topic.js';
import { ORDER_WORDS } from './assignments.js';
import { UNITS, unitKind } from './units.js';
import type {
  UnitCount,
  CountPercent,
  DesignStatement,
  EffectSizeReport,
  EstimateReport,
  GroupSizes,
  GroupSummary,
  IntervalReport,
  ReferenceValue,
  ReportedNumber,
  SampleSize,
  SpreadKind,
} from './types.js';
import { matchesOf } from './matches.js';
import { indexOfSource, lowerBoundBy } from './offsets.js';
import { OTHER_ESTIMATE_BEFORE } from './otherEstimates.js';

// Bounded building blocks (see test/regex-safety for the linearity argument).
const NUM = String.raw`([-+]?(?:\d{1,3}(?:,\d{3}){1,3}|\d{1,12})(?:\.\d{1,12})?|[-+]?\.\d{1,12})`;
const INT = String.raw`(\d{1,3}(?:,\d{3}){1,3}|\d{1,9})`;
const SUFFIX = String.raw`(?:_\{[^{}\n]{1,30}\}|_[\p{L}\p{N}]{1,20}|\([\p{L}\p{N} .-]{1,30}\))?`;
const START = String.raw`(?<![\p{L}\p{N}_])`;

const MEAN = new RegExp(String.raw`${START}(?:M|Mean|mean|Avg|avg|Average|average)(?:${SUFFIX}|[A-Z]{2,20}) ?(?:=|:|of|was) ?${NUM}( ?%)?`, 'dgu');
/**
 * "SD of change 5.0", "SD of change from baseline 5.0": the spread of a group's change scores (two
 * groups' changes compared). Not "SD of the differences", the spread of a paired design's
 * differences, which is no group of its own.
 */
const OF_CHANGE = String.raw`(?: (?:of|for) (?:the )?(?:changes?|change scores?)(?: from (?:baseline|pre-?test|pre-?treatment))?)?`;
const SD = new RegExp(String.raw`${START}\{?(?:SD|sd|s\.d\.|S\.D\.|Std\.? ?Dev\.?|[Ss]tandard deviation)\}?${SUFFIX}${OF_CHANGE} ?(?:=|:|of|was)? ?${NUM}( ?%)?`, 'dgu');
const SE = new RegExp(String.raw`${START}\{?(?:SEM|SE|s\.e\.m\.|s\.e\.|S\.E\.|[Ss]tandard error(?: of the mean)?)\}?${SUFFIX} ?(?:=|:|of|was)? ?${NUM}( ?%)?`, 'dgu');
/** The sizes of two groups printed together: `n = 25 and 23`, `ns = 24 and 23`, `in 26 and 28 employees`, `n = 25 vs 23`. */
const N_PAIR = new RegExp(String.raw`${START}(?:[nN]s?|sample sizes?) ?(?:=|:|of) ?${INT} ?(?:and|vs\.?|versus|,) ?${INT}(?![\d.,])|(?<![\p{L}\p{N}.,])in ${INT} and ${INT} ${UNITS}(?![\p{L}])`, 'dgu');
const N = new RegExp(String.raw`${START}(?:(n|N)(?:_\{[^{}\n]{1,20}\}|_?[0-9]|_[\p{L}]{1,20})?|[Ss]ample size) ?(?:=|:) ?${INT}(?: (per (?:group|condition|arm|cell|site|class)|(?:in|to|for|into) each (?:group|condition|arm|cell|site|class)|each))?(?!\d|\.\d)`, 'dgu');
const PER_GROUP_AFTER = /^,? (?:each|per (?:group|arm|condition|cell|class|site)|(?:in|to|for|into) each (?:group|arm|condition|cell|class|site))(?![\p{L}])/u;
const PER_GROUP_BEFORE = /(?<![\p{L}])(?:groups|arms) of $/u;
/** Words naming a reference a sample is compared with, near the end of a group's label ("than the published norm", "the published reference for women aged 70–79", "population norms"; not "the reference group", "population controls"). */
const REFERENCE_GROUP = /(?<![\p{L}])(?:published|reference(?! (?:group|arm|condition|sample))|norms?|normative|(?:population|national) (?:norms?|means?|averages?|values|reference)|benchmark|expected values?|pass mark|test value)(?![\p{L}])/iu;
/** A number of pairs right before a count in brackets: "24 twin pairs (", "36 patient–carer dyads (", "60 couples (". */
const PAIRS_BEFORE = /(?<![\p{L}\p{N}])(\d{1,6}) (?:[\p{L}–-]{1,30} ){0,2}(?:pairs|dyads|couples|twins) \($/u;
/** A group's (or the total's) n right before a count, in its bracket ("(n = 30; 18 women)", "n = 30 (18 women)"): the count is part of it. */
const GROUP_N_BEFORE = /(?<![\p{L}\p{N}])[nN] ?= ?\d{1,6}(?:[;,] ?| ?\()$/u;
/** `n = 4 of whom`, `n = 6 of them`: a part of some group, not a group of the total. (`n = 21 of the
 *  garden group` is left open: it may be the group itself or a part of it.) */
const SUBSET_AFTER = /^,? (?:of|among) (?:whom|them|those|these|each|both)(?![\p{L}])/u;
/** "in the usual-routine group", "for the walking arm" right after a group's numbers. */
const LABEL_AFTER = /^,? (?:in|for|among|from|of) (?:the |all )?(\p{L}[\p{L}\p{N}-]{0,30}(?: \p{L}[\p{L}\p{N}-]{0,30}){0,3})/u;
/**
 * An occasion of measurement ("baseline", "week 8", "pre-test", "follow-up", "T2", "the 6-month
 * follow-up"), as the words that end a group's label say it ("pain fell from baseline (M = …) to
 * week 8 (M = …)") or as the words right after its numbers do ("(SD = 5.1) at baseline"). Only at
 * that edge: an occasion further off ("at week 8 the yoga group (M = …)") may be the whole
 * sentence's. Not a duration, an age or a wave ("after 6 weeks", "aged 8 years", "wave 2"),
 * which may label independent groups (those treated 2 or 6 weeks, children of two ages, two
 * cohorts).
 */
const OCCASION_WORDS = String.raw`(?:baseline|pre-?(?:test|treatment|intervention|operative(?:ly)?|training)?|post-?(?:test|treatment|intervention|operative(?:ly)?|training)?|follow-?up|admission|discharge|(?:week|month|day|visit|session|time) ?\d{1,3}|T\d{1,2}|(?:\d{1,3}|one|two|three|four|six|nine|twelve)[- ](?:week|month|day)s? follow-?up)`;
const OCCASION_END = new RegExp(String.raw`(?<![\p{L}\p{N}-])(${OCCASION_WORDS})$`, 'iu');
const OCCASION_AFTER = new RegExp(String.raw`^\)?,? (?:at|on|in|after|by) (?:the )?(${OCCASION_WORDS})(?![\p{L}\p{N}-])`, 'iu');
/** A bare number (and %) up to 20 characters before the `(` of a lone spread: its mean. */
const BARE_MEAN = /(?<![\p{L}\p{N}.,])([-+]?\d{1,9}(?:\.\d{1,9})?)( ?%)?[^\d()]{0,20}\($/u;
/** A decimal number, then only words (its unit and a short phrase), before the `(` of a lone spread. */
const WORDED_MEAN = /(?<![\p{L}\p{N}.,])(?<![=<>≤≥] ?)([-+]?\d{1,9}\.\d{1,9})( ?%)? \p{L}[\p{L}'’ -]{0,38}\($/u;
const PARTICIPANTS = new RegExp(String.raw`(?<![\p{L}\p{N}.,])${INT} (${UNITS})(?![\p{L}])`, 'dgu');
/** Number words up to ninety-nine, by value. */
const NUMBER_WORDS: ReadonlyMap<string, number> = new Map(
  'one two three four five six seven eight nine ten eleven twelve thirteen fourteen fifteen sixteen seventeen eighteen nineteen'.split(' ').map((w, i) => [w, i + 1] as const).concat(
    'twenty thirty forty fifty sixty seventy eighty ninety'.split(' ').map((w, i) => [w, 20 + 10 * i] as const),
  ),
);
/**
 * A count of people or units spelled out, as a sentence must open ("Forty participants took
 * part", "Twenty-four registered nurses", "Twelve wards"): tens, a unit after them, or a number
 * below twenty, and one word between it and the noun at most. Never part of a larger number
 * ("Three hundred sixty residents", "One hundred participants"), which is not read at all.
 */
/** A number of cluster means compared ("the 12 school means", "24 ward-level means", "means of the 30 practices"). */
const CLUSTER_MEANS = /(?<![\p{L}\p{N}.,])(\d{1,4}) (?:(?:school|ward|class|classroom|clinic|practice|site|cluster|village|team|hospital|unit|home|district|community|household|farm|plot)(?:[- ]level)? (?:means|averages)|(?:means|averages) of (?:the )?(?:school|ward|class|classroom|clinic|practice|site|cluster|village|team|hospital|unit|home|district|community|household|farm|plot)s)(?![\p{L}])/gu;
const WORDED_COUNT = new RegExp(
  String.raw`(?<![\p{L}-])(?<!(?:hundred|thousand)(?: and)? )(?:(twenty|thirty|forty|fifty|sixty|seventy|eighty|ninety)(?:[- ](one|two|three|four|five|six|seven|eight|nine))?|(one|two|three|four|five|six|seven|eight|nine|ten|eleven|twelve|thirteen|fourteen|fifteen|sixteen|seventeen|eighteen|nineteen)) (?!hundred |thousand )(?:\p{L}{3,15} )?${UNITS}(?![\p{L}])`,
  'giu',
);
// the look-behind starts a number only at the start of a digit run (recheck judges it linear then)
const PLUS_MINUS = new RegExp(String.raw`(?<![\d.])${NUM}( ?%)? ?± ?${NUM}( ?%)?(?: ?\(? ?(SD|SE|SEM|s\.d\.|s\.e\.m\.|s\.e\.|standard deviations?|standard errors?)\)?)?`, 'dgu');
const MEAN_PAREN = new RegExp(String.raw`(?<![\p{L}\p{N}_.(=])${NUM}( ?%)? ?\((?:(SD|SE|SEM|s\.d\.|s\.e\.)(?: ?=)? ?)?${NUM}( ?%)?\)`, 'dgu');
const MEAN_PAREN_HEADER = /(?<![\p{L}])(?:M|mean|means)s? ?\((SD|SE|SEM)\)/iu;
/** Words right before a CI naming a method other than estimate ± t × SE ("bootstrap 95% CI", "BCa", "Wilson", "exact", "profile-likelihood"). */
const NOT_T_INTERVAL_BEFORE = /(?<![\p{L}])(bootstrap(?:ped)?|BCa|bias[- ]corrected(?: and accelerated)?|percentile|Wilson|Clopper[-–‐ ]Pearson|exact|profile[- ]likelihood|Bayesian|credible|Hodges[-–‐ ]Lehmann|Newcombe)(?: (?:\p{L}{2,15}))? \(?$/iu;
const CI = new RegExp(
  String.raw`(\d{2}(?:\.\d)?) ?(?:%|percent) ?(?:CI|C\.I\.|KI|IC|confidence intervals?)[^\d\-+.\n]{0,18}${NUM} ?(?:,|;|to|–|—| - | |-(?=\.?\d)) ?${NUM}(?: ?[\])])?`,
  'dgu',
);
/** `difference = 3.8`, `b = 0.37`, `MD: 3.1`; a spelled-out `mean difference 24.28` or `mean change -0.18` needs no sign. */
const ESTIMATE = new RegExp(String.raw`${START}(?:(?:mean difference|difference|MD|M_?\{?diff\}?|b|B|β|estimate|Δ|mean change) ?(?:=|:|of|was) ?|(?:mean difference|mean change) (?=[-+]?\d{0,9}\.\d))${NUM}`, 'dgu');
/**
 * The standard error printed right after a coefficient: `, SE = 0.15`, ` (SE = 0.15)`, `; SE(b) =
 * 0.15`, `, SE B = 0.15`, `, s.e. = 0.15`. Read on the few characters after the coefficient only.
 */
const COEFFICIENT_SE = /^[,;]? ?\(? ?(?:SE|S\.E\.|s\.e\.|SE_?\{?[bB]\}?|SE ?\([bB]\)|SE [bB]|standard error) ?(?:=|:|of) ?(\d{1,9}(?:\.\d{1,12})?|\.\d{1,12})(?![\d.,]?\d)/du;
/**
 * Words right before an effect size that make it a reference rather than a result's: power to
 * detect it ("80% power only for effects of", "powered to detect"), "could detect only", a
 * detectable, minimum or smallest effect ("minimum detectable effect"), or one expected, assumed,
 * hypothesised or targeted ("the expected d", "an assumed effect of"). Only right before it: not
 * "Peak power did not differ with d", "less than expected: d", "the effect we detected was d".
 */
const REFERENCE_EFFECT = /(?<![\p{L}])(?:power(?:ed)?(?: [\p{L}%]{1,12}){0,3} (?:to detect|for)(?: (?:an? |effects? |effect sizes? )?(?:of|as small as|as large as))?|could (?:only )?detect(?: only)?|detectable(?: effects?(?: sizes?)?)?(?: of)?|(?:minimum|smallest)(?: clinically)?(?: important| detectable| relevant)? (?:effect|difference)(?: sizes?)?(?: of)?|(?:expected|assumed|anticipated|hypothesi[sz]ed|target(?:ed)?)(?: (?:effect(?: sizes?)?|difference)(?: of)?)?|MDE|SESOI) $/iu;
const REFERENCE_EFFECT_REACH = 60;
const EFFECT = new RegExp(String.raw`(?<![\p{L}\p{N}_'’])(?:(?:Cohen['’]s|Hedges['’]s?) ?)?(d_?\{?z\}?|d_?\{?av\}?|d|g)(?![\p{L}\p{N}′'’]) ?= ?${NUM}`, 'dgu');
/**
 * Words that say one set of units was measured twice: the same participants, units or plots;
 * within-subject or within-X comparisons (not "within-group" variance); before and after;
 * crossover; paired, related or dependent samples; each participant in both conditions.
 */
// Two patterns rather than one alternation: each is judged linear by recheck on its own.
const PAIRED_WORDS = /(?<![\p{L}])(paired|pre-?test|post-?test|pre- and post|pre\/post|before and after|baseline and (?:at )?(?:follow-?up|post-?\p{L}{0,12})|within-?(?!groups?(?![\p{L}]))\p{L}{3,15}|repeated[- ]measures?|cross-?over|crossed over|matched[- ]pairs?|(?:measured|tested|assessed|rated|scored|observed|sampled|weighed|examined|surveyed) (?:twice|again(?! (?:if|when|whenever|unless|until|to confirm)(?![\p{L}])))|(?:related|dependent)[- ]samples?|each (?:participant|patient|subject|child|student|person|animal|plot|site|unit) (?:was|completed|performed|received|underwent|took part in)|(?:completed|performed|received|underwent|experienced) both (?:conditions|treatments|sessions|tasks|versions|interventions)|counterbalanced order|on two occasions|at (?:both|two) time ?points)(?![\p{L}])/giu;
const SAME_UNITS = new RegExp(String.raw`(?<![\p{L}])(same (?:\d{1,5} )?(?:${UNITS}|sample|group|individuals))(?![\p{L}])`, 'giu');
/**
 * "the same beds were assessed in spring and autumn": whatever the units are called, the same
 * ones measured (not "patients from the same ward were measured", a place).
 */
const SAME_MEASURED = /(?<!(?:from|in|on|at|of|during|within|into|to) the )(?<![\p{L}])(same (?:\d{1,5} )?\p{L}{3,20} (?:were|was) (?:again |also |then )?(?:assessed|measured|tested|rated|scored|observed|sampled|weighed|examined|surveyed|recorded|interviewed|counted))(?![\p{L}])/giu;
const INDEPENDENT_WORDS = /(?<![\p{L}])(independent[- ]samples?|two independent groups|independent groups|separate groups|different (?:participants|groups of participants|individuals)|randomi[sz]ed (?:to|groups)|randomly (?:assigned|allocated) (?:to|groups)|allocated to|assigned to one of|between-?subjects?|between-participants?|two-sample|unpaired|unrelated samples?)(?![\p{L}])/giu;
/**
 * Tests named in a statement about the analysis that compare separate groups: Welch's test,
 * Student's t-test (not "paired Student's t-test", set aside in code), and independent samples,
 * groups or cohorts with one word between ("two independent school samples").
 */
const INDEPENDENT_TESTS = /(?<![\p{L}])(Welch(?:['’]s)?(?: corrected| unequal-variance)? (?:t[- ]?tests?|tests?|correction)|Student['’]s (?:unpaired |two-sample )?t[- ]?tests?|independent \p{L}{2,20} (?:samples|groups|cohorts))(?![\p{L}])/giu;
/** Words right before an n that make it the number randomised, allocated or enrolled ("randomised n = 32"; not "ITT n", whose analysis is of those randomised). */
const ASSIGNED_N_BEFORE = /(?<![\p{L}])(?:randomi[sz]ed|allocated|assigned|enrolled|recruited)[ :]?\(?$/iu;
/** Words after a total that say it counts those randomised or enrolled ("N = 62 women were randomised"). */
const ASSIGNED_AFTER = /^(?: [\p{L}-]{1,20}){0,2} (?:were|was) (?:randomi[sz]ed|allocated|assigned|enrolled|recruited)(?![\p{L}])/iu;
/** A unit of measure right after a count's percentage ("9 (10%) kilograms", "2 (25%) days"): the number is an amount, not a count. */
const QUANTITY_AFTER = /^ ?(?:kg|kilo(?:gram)?s?|g|grams?|mg|µg|lbs?|pounds|days?|hours?|hrs?|h|minutes?|mins?|seconds?|s|months?|years?|points?|percentage points|mmol\/(?:mol|l)|mg\/dl|mm ?hg|mmhg|cm|mm|km|m|ml|l|litres?|liters?|beats|bpm|kcal|calories|euros?|dollars?)(?![\p{L}])/iu;
/** Words of a change right before a count ("fell by 9 (10%)", "rose by", "reduced by"): an amount. */
const CHANGE_BY = /(?<![\p{L}])(?:fell|rose|dropped|declined|decreased|increased|reduced|improved|lower|higher|shorter|longer|gained|lost) by $/iu;
/** "of them", "of these", "of whom" right after a count's percentage: a part of the count before it. */
const OF_THEM_AFTER = /^,? (?:of|among) (?:them|these|those|whom|which)(?![\p{L}])/iu;
/** A count before it in its sentence that is itself a part ("80 responded", "24 reported pain"): the base may be that part. */
const SUBSET_BEFORE = /(?<![\p{L}\p{N}.,])\d{1,6} (?:(?:of (?:them|these|those)|[\p{L}-]{3,20}) )?(?:responded|replied|completed|attended|returned|consented|agreed|remained|reported|received|underwent|answered|participated|took part|were eligible|were included|were analy[sz]ed|had)(?![\p{L}])/giu;
/** A whole number, not part of a decimal or of a word. */
const WHOLE_NUMBER = /(?<![\p{L}\p{N}.,])\d{1,6}(?![\p{N}.,]\d)/gu;
/** A count said of one group right after it ("18 (60%) in the sock arm", "12 (40%) of those in the control group"): its base is that group's size. */
const IN_GROUP_AFTER = /^ (?:(?:were|was) )?(?:in|of those in|from) the (?:[\p{L}-]+ ){0,3}(?:arm|group|condition|cohort|ward|clinic|site|sample)s?(?![\p{L}])/iu;
/** A participle that says when units joined ("staff hired before and after the change"): two cohorts, not one measured twice. */
const ENTRY_EVENT = /(?:admitted|hired|recruited|enrolled|born|employed|diagnosed|registered|appointed|joined|started|graduated|qualified|referred|discharged|operated on) $/iu;
/** After "each participant received …": one of the conditions, not both. */
const ONE_OF = /^ (?:only |just )?(?:one|a single|either|only|a randomly|randomly|at random|one of)(?![\p{L}])/iu;

/** A study or experiment named by its number: "Experiment 2", "Study II", "Exp. 3", "study one". */
const STUDY_LABEL = /(?<![\p{L}])(?:experiments?|stud(?:y|ies)|exp\.) ?(?:\d{1,2}|[IVX]{1,4}|one|two|three|four)(?![\p{L}\p{N}])/iu;

/** Randomisation words, which an order of conditions uses too ("randomly assigned to the quiet condition first"). */
const RANDOM_ORDER = /randomi|randomly|allocated|assigned/iu;
const ONE_SAMPLE_WORDS = /(?<![\p{L}])(one-sample|single-sample)(?![\p{L}])/giu;
const REFERENCE = new RegExp(
  String.raw`(?:test value|hypothesi[sz]ed (?:value|mean)|reference value|population mean|norm|benchmark|target|recommended|(?:scale )?midpoint|chance(?:[- ]level)?)(?: of| =| at| was| is)? ?\(? ?${NUM}( ?%)?`,
  'dgiu',
);
const OF_AFTER = /^ of (?:the |all )?(\d{1,6})(?![\d,]|\.\d)/du;
/** "Of the 14 beds in the marigold group, 5 (36%)": no other number before the count. */
const OF_BEFORE = /^(?:Of|Among|In) (?:the |all )?(\d{1,6}) [^\d]{0,80}$/du;
const COUNT_PERCENT = new RegExp(String.raw`(?<![\p{L}\p{N}.,])(\d{1,6}) ?\((\d{1,3}(?:\.\d{1,3})?) ?%\)`, 'dgu');

/** How far back, in characters, a group's topic words are read within its sentence. */
const TOPIC_REACH = 600;

type TokenKind = 'mean' | 'sd' | 'se' | 'n' | 'pm' | 'paren';
interface Token {
  kind: TokenKind;
  start: number;
  end: number;
  a?: ReportedNumber;
  b?: ReportedNumber;
  spreadKind?: SpreadKind;
  kindSpan?: [number, number];
  printedKind?: string;
  percent: boolean;
  perGroup?: boolean;
  /** An n said to be of those randomised, allocated or enrolled ("randomised n = 32"). */
  assigned?: boolean;
}

export interface SegmentSummaries {
  summaries: GroupSummary[];
  sampleSizes: SampleSize[];
  unitCounts: UnitCount[];
  groupSizes: GroupSizes[];
  intervals: IntervalReport[];
  estimates: EstimateReport[];
  effectSizes: EffectSizeReport[];
  designs: DesignStatement[];
  references: ReferenceValue[];
  counts: CountPercent[];
}

const group = (m: RegExpMatchArray, g: number): [number, number] | undefined => m.indices?.[g] as [number, number] | undefined;
const num = (seg: Segment, m: RegExpMatchArray, g: number): ReportedNumber | undefined => {
  const at = group(m, g);
  return at ? readNumber(seg, at[0], at[1]) : undefined;
};

/** Descriptives and the other context a test is recomputed from, in one prose segment. */
export function findSummaries(seg: Segment, sentenceStarts: number[]): SegmentSummaries {
  const text = seg.text;
  const sentenceAt = (at: number) => {
    const i = sentenceOf(sentenceStarts, at);
    return text.slice(sentenceStarts[i] as number, sentenceStarts[i + 1] ?? text.length);
  };
  /**
   * A fact about the sentence holding a text index, computed once per sentence: a sentence of
   * thousands of matches is read once, not once per match.
   */
  const perSentence = <T>(compute: (sentence: string) => T): ((at: number) => T) => {
    const memo = new Map<number, T>();
    return (at) => {
      const i = sentenceOf(sentenceStarts, at);
      if (!memo.has(i)) memo.set(i, compute(sentenceAt(at)));
      return memo.get(i) as T;
    };
  };
  const where = (a: number, b: number) => ({
    segment: seg.id,
    block: seg.block,
    sentence: sentenceOf(sentenceStarts, a),
    span: sourceSpan(seg, a, b),
    printed: text.slice(a, b),
    ...(seg.table ? { table: { table: seg.table.table, row: seg.table.row } } : {}),
  });
  // Tokens never overlap, so kept sorted by start their ends are sorted too: a binary search
  // finds the one neighbour that could overlap a new token (a linear scan was quadratic).
  const tokens: Token[] = [];
  const push = (t: Token) => {
    let lo = 0;
    let hi = tokens.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if ((tokens[mid] as Token).start < t.start) lo = mid + 1;
      else hi = mid;
    }
    const before = tokens[lo - 1];
    const after = tokens[lo];
    if ((before && before.end > t.start) || (after && after.start < t.end)) return;
    if (lo === tokens.length) tokens.push(t);
    else tokens.splice(lo, 0, t);
  };
  if (text.includes('±')) for (const m of matchesOf(PLUS_MINUS, text)) {
    const a = num(seg, m, 1);
    const b = num(seg, m, 3);
    const k = m[5];
    if (!a || !b) continue;
    push({ kind: 'pm', start: m.index, end: m.index + m[0].length, a, b, spreadKind: spreadKind(k), percent: m[2] !== undefined, ...(k ? { kindSpan: group(m, 5) as [number, number], printedKind: k } : {}) });
  }
  const headerKind = MEAN_PAREN_HEADER.exec(text)?.[1];
  if (/\d ?%? ?\(/.test(text)) for (const m of matchesOf(MEAN_PAREN, text)) {
    const a = num(seg, m, 1);
    const b = num(seg, m, 4);
    const k = m[3] ?? headerKind;
    // "4.1 (1.2)" means nothing without a stated kind; "12 (40%)" is a count and its percentage
    if (!a || !b || !k || m[5] !== undefined) continue;
    push({ kind: 'paren', start: m.index, end: m.index + m[0].length, a, b, spreadKind: spreadKind(k), percent: m[2] !== undefined, printedKind: k, ...(m[3] ? { kindSpan: group(m, 3) as [number, number] } : {}) });
  }
  for (const [re, kind, may] of [[MEAN, 'mean', /\bM|mean|avg|average/i], [SD, 'sd', /sd|s\.d|std|standard dev/i], [SE, 'se', /SE|s\.e\.|S\.E\.|standard error/]] as const) {
    if (!may.test(text)) continue;
    for (const m of matchesOf(re, text)) {
      const a = num(seg, m, 1);
      if (!a) continue;
      push({ kind, start: m.index, end: m.index + m[0].length, a, percent: m[2] !== undefined });
    }
  }
  const sampleSizes: SampleSize[] = [];
  if (/\b[nN](?:_\S{1,20}|\d)? ?[=:]|[Ss]ample size/.test(text)) for (const m of matchesOf(N, text)) {
    const a = num(seg, m, 2);
    if (!a) continue;
    const perGroup = m[3] !== undefined;
    const capital = m[1] === 'N';
    // "randomised n = 32": those randomised, which need not be those analysed
    const assigned = ASSIGNED_N_BEFORE.test(text.slice(Math.max(0, m.index - 28), m.index)) || (capital && ASSIGNED_AFTER.test(text.slice(m.index + m[0].length, m.index + m[0].length + 50)));
    push({ kind: 'n', start: m.index, end: m.index + m[0].length, a, percent: false, perGroup, ...(assigned ? { assigned } : {}) });
    const end = m.index + m[0].length;
    const subset = !perGroup && SUBSET_AFTER.test(text.slice(end, end + 16));
    sampleSizes.push(Object.assign(where(m.index, end), { n: a, scope: perGroup ? ('per-group' as const) : subset ? ('subset' as const) : capital ? ('total' as const) : ('unspecified' as const) }, assigned ? { assigned: true as const } : {}));
  }
  const groupSizes: GroupSizes[] = [];
  if (/ and | vs|versus|, /.test(text)) for (const m of matchesOf(N_PAIR, text)) {
    const a = num(seg, m, 1) ?? num(seg, m, 3);
    const b = num(seg, m, 2) ?? num(seg, m, 4);
    if (a && b) groupSizes.push(Object.assign(where(m.index, m.index + m[0].length), { ns: [a, b] as [ReportedNumber, ReportedNumber] }));
  }
  // the kinds of unit each sentence counts
  const kindsOfSentence = perSentence(unitKindsIn);
  const unitCounts: UnitCount[] = [];
  if (/\d (?:[a-z]{3,12})/.test(text)) for (const m of matchesOf(PARTICIPANTS, text)) {
    const a = num(seg, m, 1);
    if (a) unitCounts.push(Object.assign(where(m.index, m.index + m[0].length), { value: a.value, worded: false }));
    // "groups of 30 nurses each", "24 pupils per class": a group's size, not the total
    const end = m.index + m[0].length;
    const perGroup = PER_GROUP_AFTER.test(text.slice(end, end + 20)) || PER_GROUP_BEFORE.test(text.slice(Math.max(0, m.index - 12), m.index));
    // "forty plots, each holding 30 plants": a count within each unit, neither a group nor the total
    if (!perGroup && countWithinEach(text, m.index)) continue;
    // "forty plots … (a total of 1,200 plants)": a sentence that counts two kinds of unit does
    // not say which the groups are of, so neither count is certainly their total
    if (!perGroup && otherKindIn(kindsOfSentence(m.index), m[2] as string)) continue;
    // "coaching (n = 30; 18 women)", "n = 30 (18 women)": how a group is made up, not a total
    if (!perGroup && GROUP_N_BEFORE.test(text.slice(Math.max(0, m.index - 24), m.index))) continue;
    // "24 twin pairs (48 twins)", "60 couples (120 individuals)": the members of pairs, whose
    // analysed units are the pairs (a paired test of them has the pairs' df): the total is the
    // number of pairs
    const reach = Math.max(0, m.index - 40);
    const pairs = perGroup ? null : PAIRS_BEFORE.exec(text.slice(reach, m.index));
    if (pairs) {
      const at = reach + pairs.index;
      const count = readNumber(seg, at, at + (pairs[1] as string).length);
      if (count && !sampleSizes.some((x) => x.n.span.start === count.span.start)) sampleSizes.push(Object.assign(where(at, m.index - 2), { n: count, scope: 'total' as const }));
      continue;
    }
    // "N = 60 staff" is one statement of the total, already read
    if (a && !sampleSizes.some((s) => s.n.span.start === a.span.start)) sampleSizes.push(Object.assign(where(m.index, end), { n: a, scope: perGroup ? ('per-group' as const) : ('total' as const) }));
  }
  for (const m of matchesOf(WORDED_COUNT, text)) {
    const tens = m[1] ? (NUMBER_WORDS.get(m[1].toLowerCase()) ?? 0) : 0;
    const value = tens + (NUMBER_WORDS.get((m[2] ?? m[3] ?? '').toLowerCase()) ?? 0);
    unitCounts.push(Object.assign(where(m.index, m.index + m[0].length), { value, worded: true }));
  }
  // "comparing the 12 school means": a test of cluster means, whose units are the clusters
  if (/means/.test(text)) for (const m of matchesOf(CLUSTER_MEANS, text)) {
    const value = Number(m[1]);
    if (value > 0) unitCounts.push(Object.assign(where(m.index, m.index + m[0].length), { value, worded: false, clusterMeans: true as const }));
  }
  tokens.sort((x, y) => x.start - y.start);

  // "12.0/10.2 (SD 3.0/3.3; n = 30/30)", "M = 6.8 vs 5.6; SD = 2.2 vs 2.4": two groups' values
  // printed in pairs under one label, which the reader would take as one group's; not read
  const summaries = /\/|vs|versus/.test(text) ? groupTokens(seg, tokens, sentenceStarts).filter((g) => !printedInPairs(seg, g)) : groupTokens(seg, tokens, sentenceStarts);
  // "than the published reference (M = 21.5, SD = 7.0)": a reference a sample is tested against
  for (const s of summaries) if (s.label !== undefined && REFERENCE_GROUP.test(s.label.slice(-60))) s.asReference = true;
  // "33.88% of the time (SD = 31%)": a bare number just before a lone spread is its mean;
  // so is a decimal number followed only by words, as its unit and a short phrase ("saved
  // 20.43 keywords across their lists (N=14, SD=7.33)"), when no value sign precedes it.
  for (const s of summaries) {
    if (s.mean || !s.spread) continue;
    const startIndex = indexOfSource(seg, s.span.start);
    const before = text.slice(Math.max(0, startIndex - 50), startIndex);
    const m = BARE_MEAN.exec(before.slice(-30)) ?? WORDED_MEAN.exec(before);
    if (m) {
      const at = startIndex - (m.input as string).length + m.index;
      const mean = readNumber(seg, at, at + (m[1] as string).length);
      if (mean) {
        s.mean = mean;
        s.span = { start: mean.span.start, end: s.span.end };
        // the printed text runs from the mean, so a finding quotes the mean it used
        s.printed = text.slice(at, startIndex) + s.printed;
        s.percent ||= m[2] !== undefined;
      }
    }
  }
  // "a mean of 127.2 minutes a week (SD = 53.2)": the mean read above is the one the mean-only
  // group "mean of 127.2" holds; it is one group, not two
  const meansWithSpread = new Set(summaries.filter((s) => s.mean && s.spread).map((s) => s.mean!.span.start));
  const merged = summaries.filter((s) => !(s.mean && !s.spread && !s.n && meansWithSpread.has(s.mean.span.start)));
  if (merged.length < summaries.length) {
    summaries.length = 0;
    for (const s of merged) summaries.push(s);
  }

  // what each group's sentence is about, up to the group (the link layer compares a test's lead
  // with it); read over at most TOPIC_REACH characters before the group, so a sentence of
  // thousands of groups costs each one a bounded window, not the whole sentence so far (a
  // lead word printed further back only makes the link less certain, never more)
  if (!seg.table) for (const s of summaries) {
    const end = indexOfSource(seg, s.span.end - 1) + 1;
    const sentenceStart = sentenceStarts[s.sentence] ?? 0;
    let from = Math.max(sentenceStart, end - TOPIC_REACH);
    if (from > sentenceStart) while (from < end && /\p{L}/u.test(text[from - 1] ?? '')) from += 1;
    s.topic = topicStems(text.slice(from, end));
  }

  const intervals: IntervalReport[] = [];
  if (/CI|C\.I\.|KI|IC|confidence interval/.test(text)) for (const m of matchesOf(CI, text)) {
    const low = num(seg, m, 2);
    const high = num(seg, m, 3);
    if (!low || !high || low.value > high.value) continue;
    // "bootstrap 95% CI", "percentile 95% CI", "Wilson 95% CI": not estimate ± t × SE
    const method = NOT_T_INTERVAL_BEFORE.exec(text.slice(Math.max(0, m.index - 30), m.index))?.[1];
    // "ICC = 0.86 (95% CI …)", "SMD = −0.46 (95% CI …)": another estimate's interval
    const of = OTHER_ESTIMATE_BEFORE.exec(text.slice(Math.max(0, m.index - 60), m.index))?.[1];
    intervals.push(Object.assign(where(m.index, m.index + m[0].length), { level: Number(m[1]) / 100, low, high }, method ? { method } : {}, of ? { ofOther: of } : {}));
  }
  const estimates: EstimateReport[] = [];
  if (/difference|MD|diff|\b[bB] ?[=:]|β|estimate|Δ|change/.test(text)) for (const m of matchesOf(ESTIMATE, text)) {
    const value = num(seg, m, 1);
    if (!value) continue;
    const label = m[0].replace(/^[^\p{L}β]+/u, '');
    const coefficient = /^(?:b|B|β)(?![\p{L}])/u.test(label);
    const end = m.index + m[0].length;
    const seMatch = coefficient ? COEFFICIENT_SE.exec(text.slice(end, end + 40)) : null;
    const seAt = seMatch?.indices?.[1];
    const se = seAt ? readNumber(seg, end + seAt[0], end + seAt[1]) : undefined;
    estimates.push(Object.assign(where(m.index, end), { value, ...(coefficient ? { kind: 'coefficient' as const } : {}), ...(se ? { se } : {}) }));
  }
  const effectSizes: EffectSizeReport[] = [];
  if (/\b[dg](?:_?\{?(?:z|av)\}?)? ?=/.test(text)) for (const m of matchesOf(EFFECT, text)) {
    const value = num(seg, m, 2);
    const k = (m[1] as string).replace(/[_{}]/g, '');
    // a d of a power or sensitivity statement, or one expected ("could detect only d = 0.74",
    // "minimum detectable effect d = 0.74", "the expected d = 0.50") is a reference, not a result's
    if (value && REFERENCE_EFFECT.test(text.slice(Math.max(0, m.index - REFERENCE_EFFECT_REACH), m.index))) continue;
    if (value) effectSizes.push(Object.assign(where(m.index, m.index + m[0].length), { value, kind: k === 'dz' ? ('dz' as const) : k === 'dav' ? ('dav' as const) : k === 'g' ? ('g' as const) : ('d' as const) }));
  }
  const designs: DesignStatement[] = [];
  // whether a sentence names a study or experiment ("Experiment 2", "Study II"); an order of
  // conditions; both a pre-test and a post-test
  const namesStudy = perSentence((sentence) => STUDY_LABEL.test(sentence));
  const namesOrder = perSentence((sentence) => ORDER_WORDS.test(sentence));
  const namesBothTimes = perSentence((sentence) => /pre-?test/iu.test(sentence) && /post-?test/iu.test(sentence));
  if (/paired|pre|post|before|baseline|same|within|repeated|cross|matched|twice|again|each|both|occasions|time ?points|related|dependent|counterbalanced|independent|separate|different|randomi|randomly|allocated|assigned|between|sample|welch|student/i.test(text)) for (const [re, design] of [[PAIRED_WORDS, 'paired'], [SAME_UNITS, 'paired'], [SAME_MEASURED, 'paired'], [INDEPENDENT_WORDS, 'independent'], [INDEPENDENT_TESTS, 'independent'], [ONE_SAMPLE_WORDS, 'one-sample']] as const) {
    for (const m of matchesOf(re, text)) {
      // "randomly assigned to the quiet condition first": an order of conditions, not separate groups
      if (design === 'independent' && RANDOM_ORDER.test(m[0]) && namesOrder(m.index)) continue;
      if (design === 'paired' && !pairedInContext(text, m.index, m[0], namesBothTimes)) continue;
      // "paired Student's t-test" is a paired test
      if (design === 'independent' && /^student/iu.test(m[0]) && /paired $/iu.test(text.slice(Math.max(0, m.index - 7), m.index))) continue;
      designs.push(Object.assign(where(m.index, m.index + m[0].length), { design, ...(namesStudy(m.index) ? { namesStudy: true } : {}) }));
    }
  }
  const references: ReferenceValue[] = [];
  if (/test value|hypothesi|reference value|population mean|norm|benchmark|target|recommended|midpoint|chance/i.test(text)) for (const m of matchesOf(REFERENCE, text)) {
    const value = num(seg, m, 1);
    if (value) references.push(Object.assign(where(m.index, m.index + m[0].length), { value }));
  }
  const counts: CountPercent[] = [];
  // whole numbers of the text, once: how many distinct ones stand before a place in its sentence,
  // and where a part is said ("80 responded"), each found by a binary search (a sentence of
  // thousands of counts stays linear)
  const numbers: Array<{ at: number; sentence: number; distinct: number }> = [];
  const subsets: number[] = [];
  if (text.includes('%)') || text.includes('% )')) {
    let sentence = -1;
    let seen = new Set<string>();
    for (const m of matchesOf(WHOLE_NUMBER, text)) {
      const k = sentenceOf(sentenceStarts, m.index);
      if (k !== sentence) {
        sentence = k;
        seen = new Set<string>();
      }
      seen.add(m[0]);
      numbers.push({ at: m.index, sentence: k, distinct: seen.size });
    }
    for (const m of matchesOf(SUBSET_BEFORE, text)) subsets.push(m.index);
  }
  const lastBefore = <T>(list: readonly T[], at: (x: T) => number, before: number): T | undefined => {
    const lo = lowerBoundBy(list, at, before);
    return lo > 0 ? list[lo - 1] : undefined;
  };
  const distinctBefore = (at: number): number => {
    const n = lastBefore(numbers, (x) => x.at, at);
    return n && n.sentence === sentenceOf(sentenceStarts, at) ? n.distinct : 0;
  };
  const subsetBefore = (at: number): boolean => {
    const s = lastBefore(subsets, (x) => x, at);
    return s !== undefined && sentenceOf(sentenceStarts, s) === sentenceOf(sentenceStarts, at);
  };
  if (text.includes('%)') || text.includes('% )')) for (const m of matchesOf(COUNT_PERCENT, text)) {
    const count = num(seg, m, 1);
    const percent = num(seg, m, 2);
    if (!count || !percent) continue;
    // "55 of 202 (27.2%)": the number before the brackets is the denominator, the count before it
    const lead = countOf(text, m.index);
    if (lead) {
      const c = readNumber(seg, lead.start, lead.end);
      if (c) {
        counts.push(Object.assign(where(lead.start, m.index + m[0].length), { count: c, percent, of: count }));
        continue;
      }
    }
    // the denominator named with it: "5 (24%) of the 21 beds", "Of the 14 beds in …, 5 (24%)"
    const end = m.index + m[0].length;
    const after = OF_AFTER.exec(text.slice(end, end + 16));
    const sentenceStart = sentenceStarts[sentenceOf(sentenceStarts, m.index)] as number;
    const before = after ? null : OF_BEFORE.exec(text.slice(sentenceStart, m.index));
    const ofAt = after ? end + (after.indices?.[1]?.[0] ?? 0) : before ? sentenceStart + (before.indices?.[1]?.[0] ?? 0) : -1;
    const ofText = (after ?? before)?.[1];
    const of = ofText && ofAt >= 0 ? readNumber(seg, ofAt, ofAt + ofText.length) : undefined;
    // "weight fell by 9 (10%) kg": an amount of a measure and its relative change, not a count
    if (QUANTITY_AFTER.test(text.slice(end, end + 24)) || CHANGE_BY.test(text.slice(Math.max(0, m.index - 24), m.index))) continue;
    const inGroup = !after && IN_GROUP_AFTER.test(text.slice(end, end + 60));
    // "24 reported pain, and 18 (75%) of them", "80 responded; 60 (75%)": a part of a part, where
    // a second number stands before it in its sentence (with the n alone, "120 adults, 30 (25%)
    // of whom", the part is of the n)
    const baseOpen = (OF_THEM_AFTER.test(text.slice(end, end + 20)) || subsetBefore(m.index)) && distinctBefore(m.index) >= 2;
    counts.push(Object.assign(where(m.index, end), { count, percent, ...(of ? { of } : {}), ...(inGroup ? { inGroup: true as const } : {}), ...(baseOpen ? { baseOpen: true as const } : {}) }));
  }
  return { summaries, sampleSizes, unitCounts, groupSizes, intervals, estimates, effectSizes, designs, references, counts };
}

/** The kinds of unit a sentence names (unitKind of each word). */
function unitKindsIn(sentence: string): Set<string> {
  const kinds = new Set<string>();
  let word = '';
  for (let i = 0; i <= sentence.length; i += 1) {
    const c = sentence[i];
    if (c !== undefined && /\p{L}/u.test(c)) {
      word += c;
      continue;
    }
    const kind = word.length > 2 ? unitKind(word) : undefined;
    if (kind) kinds.add(kind);
    word = '';
  }
  return kinds;
}

/** Whether a sentence's kinds of unit include one other than `noun`'s (plots beside plants; wards beside patients). */
function otherKindIn(kinds: Set<string>, noun: string): boolean {
  const kind = unitKind(noun);
  return kind !== undefined && [...kinds].some((k) => k !== kind);
}

/**
 * Whether the count at `at` follows "each" and at most two words that name no group ("each
 * holding", "each with", "each containing about"): a count within every unit, not of them.
 */
function countWithinEach(text: string, at: number): boolean {
  const before = text.slice(Math.max(0, at - 40), at);
  const k = before.toLowerCase().lastIndexOf('each ');
  if (k < 0 || (k > 0 && /\p{L}/u.test(before[k - 1] as string))) return false;
  const words = before.slice(k + 5).trim();
  if (words === '') return false;
  const list = words.split(' ');
  if (list.length > 2 || !list.every((w) => /^\p{L}+$/u.test(w))) return false;
  return !list.some((w) => /^(?:of|group|arm|condition|cell)s?$/iu.test(w));
}

/**
 * The count printed before "of" or "out of" right before a number at `at` ("55 of 202 (27.2%)"):
 * its start and end, when the text there is digits, a space, "of" or "out of", and a space.
 */
function countOf(text: string, at: number): { start: number; end: number } | undefined {
  const before = text.slice(Math.max(0, at - 20), at);
  const tail = before.endsWith(' out of ') ? ' out of ' : before.endsWith(' of ') ? ' of ' : undefined;
  if (!tail) return undefined;
  const end = at - tail.length;
  let start = end;
  while (start > 0 && start > end - 6 && /\d/u.test(text[start - 1] as string)) start -= 1;
  if (start === end || /[\p{L}\p{N}.,]/u.test(text[start - 1] ?? ' ')) return undefined;
  return { start, end };
}

/** Words of an analysis step after "before and after" ("… adjustment for age", "… correction", "… excluding outliers"). */
const ANALYSIS_STEP = /^ (?:the )?(?:adjustment|adjusting|correction|correcting|controlling for|exclusion|excluding|imputation|weighting)(?![\p{L}])/iu;

/**
 * The words before "crossed over" when one arm or group, named with "the", is what crossed
 * ("although the control arm later crossed over to mentoring", "participants in the wait-list
 * group then crossed over"): a switch of treatment in one group, not units measured under both
 * conditions. Not "each group", "both arms", nor "the mentoring group and the control group"
 * (every group crossed), nor a crossing "to the other condition" (ONE_GROUP_CROSSED_TO).
 */
const ONE_GROUP_CROSSED = /(?<![\p{L}])(?<!and )the (?:[\p{L}-]{2,20} ){1,2}(?:arm|group)(?: (?:later|then|subsequently|eventually|also))? (?:had |have |were |was )?$/iu;
/** "crossed over to the other condition": the design's crossing, whoever is said to cross. */
const ONE_GROUP_CROSSED_TO = /^ (?:to|into) the other (?:condition|treatment|arm|group|intervention|sequence|period|diet|drug)(?![\p{L}])/iu;

/**
 * Whether paired words say, where they stand, that one set of units was measured twice:
 * - "paired with a tutor" pairs people for a treatment, and says nothing of the analysis;
 * - "pre-test" or "post-test" alone names one time ("At pre-test, the tutored pupils …"); the
 *   sentence must name both;
 * - "staff hired before and after the change" are two cohorts, and "before and after adjustment
 *   for age" two steps of an analysis;
 * - "each participant received one of the two treatments" (or took part in one role only) is
 *   the opposite of a paired design, and "each participant was randomly assigned" says nothing
 *   of one;
 * - "the control arm later crossed over to mentoring" is one group switching treatment.
 */
function pairedInContext(text: string, at: number, words: string, namesBothTimes: (at: number) => boolean): boolean {
  const lower = words.toLowerCase();
  const after = text.slice(at + words.length, at + words.length + 40);
  if (lower === 'paired' && /^ with(?![\p{L}])/u.test(after)) return false;
  if (lower === 'crossed over' && ONE_GROUP_CROSSED.test(text.slice(Math.max(0, at - 50), at)) && !ONE_GROUP_CROSSED_TO.test(after)) return false;
  if (/^(?:pre|post)-?test$/u.test(lower) && !namesBothTimes(at)) return false;
  if (lower.startsWith('before and after') && ENTRY_EVENT.test(text.slice(Math.max(0, at - 20), at))) return false;
  // "before and after adjustment for age": two steps of the analysis, not two measurements
  if (lower.startsWith('before and after') && ANALYSIS_STEP.test(after)) return false;
  if (lower.startsWith('each ') && (ONE_OF.test(after) || (/ was$/u.test(lower) && /^ (?:randomi[sz]ed|randomly|assigned|allocated)(?![\p{L}])/iu.test(after)))) return false;
  return true;
}

function spreadKind(word: string | undefined): SpreadKind {
  if (!word) return 'unstated';
  return /^(sd|s\.d\.|standard deviation)/i.test(word) ? 'SD' : 'SE';
}

/**
 * Tokens into groups: a new group starts at a second mean, a second spread or n, or at a
 * mean that follows a closed parenthesis after the current group's mean.
 */
function groupTokens(seg: Segment, tokens: Token[], sentenceStarts: number[]): GroupSummary[] {
  const out: GroupSummary[] = [];
  let current: Token[] = [];
  const flush = () => {
    const s = toSummary(seg, current, sentenceStarts);
    if (s) out.push(s);
    current = [];
  };
  for (const tok of tokens) {
    const has = (k: TokenKind[]) => current.some((c) => k.includes(c.kind));
    const prev = current[current.length - 1];
    const gap = prev ? seg.text.slice(prev.end, tok.start) : '';
    const sentenceBreak = prev ? sentenceOf(sentenceStarts, prev.start) !== sentenceOf(sentenceStarts, tok.start) : false;
    // A closed parenthesis, or one opened after other words, separates groups:
    // "(M = 40.4, SD = 18.2) than caps (M = …" and "… 2.9 after (mean ± SEM, N = 1,024)".
    const parenBreak = gap.includes(')') || wordsBeforeParenthesis(gap);
    const isMeanLike = tok.kind === 'mean' || tok.kind === 'pm' || tok.kind === 'paren';
    const isSpread = tok.kind === 'sd' || tok.kind === 'se' || tok.kind === 'pm' || tok.kind === 'paren';
    // "2.91 (1.22) in the usual-lesson group (n = 11)": a group's n printed after its label
    const lateN = tok.kind === 'n' && !has(['n']) && has(['mean', 'pm', 'paren']) && !/\d/.test(gap);
    if (
      prev &&
      (sentenceBreak ||
        (parenBreak && !lateN) ||
        gap.length > 60 ||
        (isMeanLike && has(['mean', 'pm', 'paren'])) ||
        (isSpread && has(['sd', 'se', 'pm', 'paren'])) ||
        (tok.kind === 'n' && has(['n'])))
    ) {
      flush();
    }
    current.push(tok);
  }
  flush();
  return out;
}

function toSummary(seg: Segment, tokens: Token[], sentenceStarts: number[]): GroupSummary | undefined {
  if (tokens.length === 0) return undefined;
  const meanTok = tokens.find((t) => t.kind === 'mean' || t.kind === 'pm' || t.kind === 'paren');
  const spreadTok = tokens.find((t) => t.kind === 'sd' || t.kind === 'se' || t.kind === 'pm' || t.kind === 'paren');
  const nTok = tokens.find((t) => t.kind === 'n');
  if (!meanTok && !spreadTok) return undefined; // a lone n is a sample size, not a group
  const first = tokens[0] as Token;
  const last = tokens[tokens.length - 1] as Token;
  // "M = 2.39 (SD = 1.10, n = 19)": take the closing parenthesis the group opened.
  const inner = seg.text.slice(first.start, last.end);
  const end = (inner.match(/\(/g)?.length ?? 0) > (inner.match(/\)/g)?.length ?? 0) && seg.text[last.end] === ')' ? last.end + 1 : last.end;
  const mean = meanTok?.a;
  let spread: GroupSummary['spread'];
  if (spreadTok) {
    const number = spreadTok.kind === 'pm' || spreadTok.kind === 'paren' ? spreadTok.b : spreadTok.a;
    const kind: SpreadKind = spreadTok.kind === 'sd' ? 'SD' : spreadTok.kind === 'se' ? 'SE' : (spreadTok.spreadKind ?? 'unstated');
    if (number) {
      spread = {
        number,
        kind,
        ...(spreadTok.kindSpan ? { kindSpan: sourceSpan(seg, spreadTok.kindSpan[0], spreadTok.kindSpan[1]) } : {}),
        ...(spreadTok.printedKind ? { printedKind: spreadTok.printedKind } : {}),
      };
    }
  }
  const from = Math.max(0, first.start - 45);
  // start the label at a word, not inside one cut by the 45-character window
  const cut = from > 0 && /\p{L}/u.test(seg.text[from - 1] ?? '') ? seg.text.indexOf(' ', from) + 1 : from;
  const labelText = trimEndOf(seg.text.slice(cut > 0 && cut < first.start ? cut : from, first.start), '(,;:');
  const label = labelText.split(/[;)]|, |\. /).pop()?.trim();
  // "7.34 (1.97) in the usual-routine group vs …": whose the numbers are, said after them
  const after = LABEL_AFTER.exec(seg.text.slice(end, end + 60))?.[1];
  const occasion = occasionOf(label, seg.text.slice(end, end + 40));
  return {
    id: `${seg.id}:${first.start}`,
    segment: seg.id,
    block: seg.block,
    sentence: sentenceOf(sentenceStarts, first.start),
    span: sourceSpan(seg, first.start, end),
    printed: seg.text.slice(first.start, end),
    ...(mean ? { mean } : {}),
    ...(spread ? { spread } : {}),
    ...(nTok?.a ? { n: nTok.a } : {}),
    ...(nTok?.a && nTok.assigned ? { nAssigned: true as const } : {}),
    ...(label ? { label } : {}),
    ...(after ? { labelAfter: after } : {}),
    ...(occasion ? { occasion } : {}),
    percent: tokens.some((t) => t.percent),
  };
}

/** The occasion a group's numbers were measured on, said right after them or at the end of its label: lower case, no hyphen or space ("week8", "posttest"). */
function occasionOf(label: string | undefined, following: string): string | undefined {
  const said = OCCASION_AFTER.exec(following)?.[1] ?? (label ? OCCASION_END.exec(label)?.[1] : undefined);
  return said?.toLowerCase().replace(/[- ]/g, '');
}

/**
 * A number printed in a pair: "10.2" in "12.0/10.2", "3.0" in "3.0/3.3", "6.8" in "M = 6.8 vs
 * 5.6;" (a bare value after "vs", not a group's own numbers: "10.96 ± 0.99 vs 12.48 ± 0.69").
 */
const PAIRED_AFTER = /^(?: ?\/ ?[-−]?\.?\d| (?:vs\.?|versus) [-−]?\.?\d[\d.,]*(?=[;)]|, |$))/u;
const PAIRED_BEFORE = /\d ?\/ ?$/u;

/**
 * Whether two or more of a group's printed numbers (mean, spread, n) are each one of a pair of
 * values: one alone may be a scale's maximum ("M = 4.1/5") or those analysed of those randomised
 * ("n = 28/30").
 */
function printedInPairs(seg: Segment, g: GroupSummary): boolean {
  let paired = 0;
  for (const n of [g.mean, g.spread?.number, g.n]) {
    if (!n) continue;
    const from = indexOfSource(seg, n.span.start);
    const to = indexOfSource(seg, n.span.end);
    if (PAIRED_AFTER.test(seg.text.slice(to, to + 12)) || PAIRED_BEFORE.test(seg.text.slice(Math.max(0, from - 10), from))) paired += 1;
  }
  return paired >= 2;
}

/** Whether some "(" in the text comes after a word (not only after spaces and , ; :) since the last parenthesis. */
function wordsBeforeParenthesis(text: string): boolean {
  for (let j = text.indexOf('('); j >= 0; j = text.indexOf('(', j + 1)) {
    for (let k = j - 1; k >= 0; k--) {
      const c = text[k] as string;
      if (c === '(' || c === ')') break;
      if (!/[\s,;:]/.test(c)) return true;
    }
  }
  return false;
}

