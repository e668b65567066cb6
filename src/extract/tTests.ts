import type { Segment } from '../parse/types.js';
import { readNumber, sentenceOf, sourceSpan } from './numbers.js';
import { LeadReader } from './topic.js';
import { comparisonsIn } from './comparisons.js';
import { decimalsOf, starBound } from './stars.js';
import type { AdjustMethod, Comparison, ReportedNumber, ReportedP, ReportStyle, Sidedness, TTestReport } from './types.js';
import { matchesOf } from './matches.js';
import { A_P_VALUE, EQUIVALENCE_WORD, LABELS_P, OTHER_TESTS_AFTER, OTHER_TESTS_BEFORE, OWN_P_LABEL_GAP, P_BEFORE } from './statements.js';

// Building blocks. Every quantifier is bounded or over a character class disjoint from what
// follows it, so no pattern can backtrack super-linearly (checked by test/regex-safety).
const OP = String.raw`(<=|>=|=<|=>|≤|≥|=|<|>)`;
// t as printed in full: up to 400 integer digits (a longer run is not read at all, see
// numberFromGroup), a fraction, and an `e` exponent as R and spreadsheets print it (`3.4e+01`),
// of up to 9 digits (`2e1000` is read whole, beyond a double, as its log10; a longer exponent is
// not read at all, never cut)
const EXP = String.raw`(?:[eE][-+]?\d{1,9}(?![\d.]))?`;
const T_NUM = String.raw`([-+]? ?(?:\d{1,400}(?:\.\d{1,20})?|\.\d{1,20})${EXP})`;
// a df printed negative is read, so that values-are-possible can say it cannot be; a df of up
// to 400 digits is read whole (one of ten digits or more is not recomputed, see evaluateP), a
// longer run is not read at all, never cut
const DF_NUM = String.raw`(-?(?:\d{1,3}(?:,\d{3}){1,3}(?:\.\d{1,12})?|\d{1,400}(?:\.\d{1,12})?)${EXP})`;
const NOT_AFTER_WORD = String.raw`(?<![\p{L}\p{N}_'’.\-])`;

/** t(28) = 2.10 · ts(22) > 4.72 · t[28] · t_{28} · t_28 · t( 3.187) · t-test (31) = 0.75 · t(df = 31) = 0.75 */
const BRACKETED = new RegExp(
  String.raw`${NOT_AFTER_WORD}(ts?|T)(?:[- ]?(?:tests?|values?|statistics?))?(?: ?_?\( ?| ?_?\[ ?|_\{ ?|_)(?:df ?= ?)?${DF_NUM} ?[)\]}]? ?${OP} ?${T_NUM}`,
  'dgu',
);
/** t28 = 2.10: a subscript df flattened by PDF copying. */
const ATTACHED = new RegExp(String.raw`${NOT_AFTER_WORD}(t)(\d{1,6}(?:\.\d{1,6})?) ?${OP} ?${T_NUM}`, 'dgu');
/** t = 2.10 · t-value: 2.10 · t-statistic = 2.10 · t value is (2.10), df given elsewhere. */
const LABELLED = new RegExp(
  String.raw`${NOT_AFTER_WORD}(t|T)(?:[- ]?(?:values?|statistics?|stat|ratio|score))? ?(=|:|is|of|was) ?\(? ?${T_NUM}`,
  'dgu',
);
/** df = 28 · d.f. = 28 · degrees of freedom: 28 · df(28) */
const DF_LABEL = new RegExp(String.raw`(?<![\p{L}])(?:df|d\.f\.|degrees of freedom)(?: ?(?:=|:|is|of|was) ?| ?\()? ?\(? ?${DF_NUM}`, 'dgiu');
/** (28 df) · 28 degrees of freedom */
const DF_AFTER = new RegExp(String.raw`(?<![\p{L}\p{N}.,])\(?${DF_NUM}\)? (?:df|d\.f\.|degrees of freedom)(?![\p{L}])`, 'dgiu');

/**
 * A p's number: a decimal with an optional exponent (`3.2e-6`, `3.2 × 10^-6`), or a bare power
 * of ten (`10^-6`, and `10-6` where a PDF lost the superscript: `p < 10` is never meant). A
 * minus sign is read (`p = -.05`, `p = -0`), so that values-are-possible can say it cannot be.
 * The pattern reads nine digits of an exponent; findP reads on to 400 (`1e-12345678901`: its
 * size kept as log10, see readNumber), a longer one is not read at all, never cut. (Four hundred
 * digits in the pattern itself made the regex checker judge it polynomial.)
 */
const P_NUM = String.raw`(?<sign>-)?(?:10 ?(?:\^ ?|(?=-\d))(?<power>-\d{1,9})|(?<mantissa>\d{1,12}(?:\.\d{1,20})?|\.\d{1,20})(?: ?(?:[eE] ?(?<eExp>[-+]?\d{1,9})|[×xX*·] ?10 ?\^? ?(?<tenExp>[-+]?\d{1,9})))?)`;
/** A subscript or label after the p: `p_adj`, `p_{Holm}`, `p(2-t)`, `p (one-tailed)`. */
const P_LABEL = String.raw`(?:_\{?(?<sub>[\p{L}-]{1,20})\}?| ?\((?<paren>(?:one|two|1|2)[- ]?(?:tailed|sided|t)|adj\.?|corr\.?|adjusted|corrected)\))?`;
/** p = .045 · P<0.05 · p-value = 0.02 · ps ≤ .0001 · p = < .001 · p (two-tailed) = .03 · p value is (0.04) · p_adj = .04 */
const P_VALUE = new RegExp(
  String.raw`(?<![\p{L}\p{N}_])(?<symbol>p|P|ps|Ps)(?:[- ]?values?)?${P_LABEL} ?(?:(?<word>is|of|was) )?(?<first>=?<|=?>|<=|>=|≤|≥|=|:|≈|~)? ?(?<second><|>|≤|≥)? ?\(? ?${P_NUM}`,
  'dgu',
);
/** Words before a p that say it was adjusted for multiplicity: `Bonferroni-corrected p`, `adjusted p`. */
const ADJUSTED_BEFORE = /(?<![\p{L}])(Bonferroni|Holm|Hochberg|Šidák|Sidak|Tukey|FDR|BH|Benjamini[- ]Hochberg|multiplicity)?[- ]?(adjusted|corrected)[- ]$/iu;
/** Words after a p that say so: `(Bonferroni-corrected)`, `, Holm-adjusted`, `after Bonferroni correction`. */
const ADJUSTED_AFTER = /^[ ,;]{0,2}\(?(?:(Bonferroni|Holm|Hochberg|Šidák|Sidak|Tukey|FDR|BH|Benjamini[- ]Hochberg)[- ]?(?:adjusted|corrected|correction)?|adjusted|corrected|after (?:(Bonferroni|Holm|Šidák|Sidak|FDR)[- ]?)?(?:correction|adjustment))(?![\p{L}])/iu;
const ADJUSTED_IN_BRACKET = /(?<![\p{L}])(Bonferroni|Holm|Hochberg|Šidák|Sidak|Tukey|FDR|BH)?[- ]?(?:adjusted|corrected|adjustment|correction)(?![\p{L}])/iu;
/** A p value with its comparison: `p = 1.000`, `p_adj < .01`. */
const ANOTHER_P = /(?<![\p{L}\p{N}])[pP](?:_?\{?[\p{L}]{1,12}\}?)? ?(?:=|<|>|≤|≥)/u;

/**
 * Whether words of adjustment after a p introduce the next p of the same bracket or clause
 * (`p = .49 (Bonferroni-corrected for 4 comparisons: p = 1.000)`) rather than describe it.
 */
function introducesAnotherP(rest: string): boolean {
  const end = rest.search(/[);]/u);
  return ANOTHER_P.test(end < 0 ? rest : rest.slice(0, end));
}
const ADJUSTED_SUBSCRIPT = /^(?:adj|adjusted|corr|corrected|bonf|bonferroni|holm|fdr|bh|tukey|sidak|šidák|hochberg)$/iu;
const NS = /^[ ,;]{0,3}\(?(n\. ?s\.?|ns|NS|n\.s)(?![\p{L}])/u;
const SIDED_NEAR = /(one|two|1|2)[- ]?(tailed|sided)/iu;
/** Another statistic's symbol: a p after it belongs to it, not to the t before. */
const OTHER_STATISTIC = /(?<![\p{L}\p{N}_])(?:F ?\(|χ|chi|r ?\(|r ?=|z ?=|Z ?=|W ?=|U ?=|H ?\(|OR ?=|t ?\(|t ?=)/u;
const VARIANT_BEFORE = /(welch|student|paired|related|dependent|repeated[- ]measures|within[- ]subjects?|one[- ]sample|independent|unpaired)[\p{L}\s'’-]{0,30}$/iu;

interface Anchor {
  start: number;
  /** End of t's number. */
  end: number;
  style: ReportStyle;
  symbol: string;
  tOp: Comparison;
  t: ReportedNumber;
  df?: ReportedNumber;
}

/** Every reported t-test in one segment. */
export function findTTests(seg: Segment, sentenceStarts: number[]): TTestReport[] {
  const text = seg.text;
  if (!/[tT]/.test(text)) return [];
  const anchors = findAnchors(seg);
  const leads = new LeadReader(text);
  const dfBefore = new DfBefore(seg, sentenceStarts);
  const out: TTestReport[] = [];
  // where each report's t starts in the text, and how far its words may reach
  const starts: number[] = [];
  const limits: number[] = [];
  anchors.forEach((anchor, i) => {
    const next = anchors[i + 1];
    const sentenceEnd = sentenceStarts[sentenceOf(sentenceStarts, anchor.start) + 1] ?? text.length;
    const limit = Math.min(next ? next.start : text.length, sentenceEnd, anchor.end + 200);
    const report = completeReport(seg, anchor, limit, sentenceStarts, leads, dfBefore);
    if (report) {
      out.push(report);
      starts.push(anchor.start);
      limits.push(Math.min(sentenceEnd, anchor.end + 400));
    }
  });
  if (out.length > 0) shareListedPs(seg, out, starts, limits);
  return out;
}

/** What joins the items of a list of p values: `p < .001 and p = .24`, `p = .024, p = .38`, `(p = .024; p = .38)`. */
const P_LIST_LINK = /^\)?(?:,? (?:and|or|&) |, |; )\(?(?=[pP])/u;
/** Items of a list of p values read at most. */
const P_LIST_MAX = 12;

/**
 * A list of p values after a list of t values, each p its t's in order: `t(29) = 4.10 and
 * t(29) = 1.20, p < .001 and p = .24, respectively`, `t(38) = 2.35 and t(38) = 0.88 (p = .024 and
 * p = .38)`. The first p after the last t is then not that t's alone. Only where the t values
 * form a list themselves (joined by "and", commas or semicolons alone) or the p values are said
 * to follow them "respectively": then, where as many p values are listed as there are t values in
 * the list, each takes its p by position; where "respectively" says so but the counts differ, the
 * listed p values are tied to none (a p tied to the wrong t would be checked against it). Any
 * other p list (`p = .015, and p = .021 in the per-protocol analysis`) is left as read.
 */
function shareListedPs(seg: Segment, out: TTestReport[], starts: number[], limits: number[]): void {
  const text = seg.text;
  for (let i = 0; i < out.length; i += 1) {
    const last = out[i] as TTestReport;
    const first = last.p;
    if (!first || first.kind !== 'value' || first.adjusted || last.adjustedP) continue;
    const ps: ReportedP[] = [first];
    let at = indexOfSpanEnd(seg, first);
    const limit = limits[i] as number;
    while (ps.length < P_LIST_MAX) {
      const link = P_LIST_LINK.exec(text.slice(at, Math.min(limit, at + 12)));
      if (!link) break;
      const from = at + link[0].length;
      const next = findP(seg, from, Math.min(limit, from + 60));
      if (!next || next.kind !== 'value' || next.adjusted) break;
      const end = indexOfSpanEnd(seg, next);
      // the next p must start right after the words that join it, not further on
      if (end - next.printed.length !== from) break;
      ps.push(next);
      at = end;
    }
    if (ps.length < 2) continue;
    const respectively = RESPECTIVELY_AFTER.test(text.slice(at, Math.min(limit, at + 20)));
    // the t values before it in its sentence with no p of their own, as many at most as there are
    // p values, that form a list with it (or any, where "respectively" follows)
    let j = i;
    while (j > 0 && i - j < ps.length && (out[j - 1] as TTestReport).sentence === last.sentence && (out[j - 1] as TTestReport).p === undefined && (out[j - 1] as TTestReport).listedPs === undefined) {
      if (!respectively && !joinsTValues(text.slice(indexOfSpanEnd(seg, out[j - 1] as TTestReport), starts[j] as number))) break;
      j -= 1;
    }
    const listed = out.slice(j, i + 1);
    if (listed.length === ps.length && (respectively || listed.length > 1)) {
      listed.forEach((r, k) => {
        if (r === last) endAt(seg, r, starts[j + k] as number, ps[k] as ReportedP);
        else r.p = ps[k] as ReportedP;
      });
    } else if (respectively) {
      const from = indexOfSpanEnd(seg, first) - first.printed.length;
      last.listedPs = { span: sourceSpan(seg, from, at), printed: text.slice(from, at), count: ps.length, tests: listed.length };
      endAt(seg, last, starts[i] as number, undefined);
    }
  }
}

/** "respectively" right after a list of p values (a comma or bracket between). */
const RESPECTIVELY_AFTER = /^[,;)\s]{0,3}respectively(?![\p{L}])/iu;
/** What joins two t values of one list: "and", a comma or a semicolon, nothing more. */
function joinsTValues(between: string): boolean {
  let words = '';
  for (const c of between) if (c !== ',' && c !== ';' && c.trim() !== '') words += c;
  return words === '' || words === 'and' || words === '&';
}

/** A report given the p `p` (or none), its span and printed text ending at that p (or at its t and df). */
function endAt(seg: Segment, r: TTestReport, start: number, p: ReportedP | undefined): void {
  const fromP = r.p?.statedSidedness !== undefined && r.statedSidedness?.span === r.p.span;
  if (p) r.p = p;
  else delete r.p;
  if (fromP) delete r.statedSidedness;
  if (p?.statedSidedness && !r.statedSidedness) r.statedSidedness = { value: p.statedSidedness, span: p.span };
  const endPart = p ?? (r.df && r.df.span.end > r.t.span.end ? r.df : r.t);
  const end = indexOfSpanEnd(seg, endPart);
  r.span = sourceSpan(seg, start, end);
  r.printed = seg.text.slice(start, end);
}

function findAnchors(seg: Segment): Anchor[] {
  const text = seg.text;
  // Anchors of each pattern, in reading order and apart from each other (one pattern's matches
  // never overlap), so whether a stretch overlaps one is a binary search, not a scan of all.
  const bracketed: Anchor[] = [];
  const attached: Anchor[] = [];
  const overlaps = (list: Anchor[], a: number, b: number) => {
    let lo = 0;
    let hi = list.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if ((list[mid] as Anchor).start < b) lo = mid + 1;
      else hi = mid;
    }
    const last = list[lo - 1];
    return last !== undefined && a < last.end;
  };
  const taken = (a: number, b: number) => overlaps(bracketed, a, b) || overlaps(attached, a, b);
  for (const m of matchesOf(BRACKETED, text)) {
    const df = readNumber(seg, idx(m, 2), idx(m, 2) + (m[2] as string).length);
    const t = numberFromGroup(seg, m, 4);
    if (!df || !t) continue;
    bracketed.push({ start: m.index, end: m.index + m[0].length, style: 'bracketed-df', symbol: m[1] as string, tOp: comparison(m[3] as string), t, df });
  }
  for (const m of matchesOf(ATTACHED, text)) {
    if (taken(m.index, m.index + m[0].length)) continue;
    const df = readNumber(seg, idx(m, 2), idx(m, 2) + (m[2] as string).length);
    const t = numberFromGroup(seg, m, 4);
    if (!df || !t) continue;
    attached.push({ start: m.index, end: m.index + m[0].length, style: 'attached-df', symbol: 't', tOp: comparison(m[3] as string), t, df });
  }
  // one list in the same order as before the labelled ones join (a spread would overflow the stack)
  const found = bracketed.concat(attached);
  for (const m of matchesOf(LABELLED, text)) {
    if (taken(m.index, m.index + m[0].length)) continue;
    const t = numberFromGroup(seg, m, 3);
    if (!t) continue;
    const after = text.slice(m.index + m[0].length, m.index + m[0].length + 12);
    // "t = 8.02 > 1.714" compares t with a critical value: not a reported result.
    if (/^ ?[<>≤≥] ?[-+]?\.?\d/.test(after)) continue;
    // "t = 2.10" directly followed by more digits or letters is something else (t = 67ms).
    if (/^[\p{L}]/u.test(after)) continue;
    found.push({ start: m.index, end: m.index + m[0].length, style: 'labelled-df', symbol: m[1] as string, tOp: '=', t });
  }
  return found.sort((a, b) => a.start - b.start);
}

function completeReport(seg: Segment, anchor: Anchor, limit: number, sentenceStarts: number[], leads: LeadReader, dfBefore: DfBefore): TTestReport | undefined {
  const text = seg.text;
  let df = anchor.df;
  let end = anchor.end;
  const windowText = text.slice(anchor.end, limit);
  const stop = OTHER_STATISTIC.exec(windowText);
  const windowEnd = anchor.end + (stop ? stop.index : windowText.length);
  if (!df) {
    df = findDf(seg, anchor.end, windowEnd);
    if (df) end = Math.max(end, indexOfSpanEnd(seg, df));
    // "with 23 degrees of freedom, … the t value is 8.02": a df stated earlier in the sentence
    else df = dfBefore.find(sentenceOf(sentenceStarts, anchor.start), anchor.start);
  }
  const tailEnd = reportTailEnd(text, anchor.end, windowEnd);
  const p = findP(seg, anchor.end, tailEnd) ?? starsAfter(seg, anchor.end);
  if (p) end = Math.max(end, indexOfSpanEnd(seg, p));
  // `p = .045, Bonferroni-corrected p = .135`: the adjusted p printed after the unadjusted one
  const second = p && !p.adjusted && p.kind === 'value' ? findP(seg, end, tailEnd) : undefined;
  const adjustedP = second?.adjusted ? second : undefined;
  if (adjustedP) end = Math.max(end, indexOfSpanEnd(seg, adjustedP));
  // A labelled t needs a df or a p beside it to be a reported result; an uppercase T
  // (also Wilcoxon's statistic) needs a df; an attached df ("t14") needs a p.
  if (anchor.style === 'labelled-df' && !df && !p) return undefined;
  if (anchor.style === 'labelled-df' && anchor.symbol === 'T' && !df) return undefined;
  if (anchor.style === 'attached-df' && !p) return undefined;
  if (seg.kind === 'code' && !(df && p)) return undefined;
  const tailText = text.slice(anchor.start, Math.min(text.length, end + 40));
  const near = SIDED_NEAR.exec(tailText);
  // a tails word after the result's own p that labels a second p ("p = .075 (one-tailed p =
  // .037)") is that p's, not this result's
  const pEnd = p ? indexOfSpanEnd(seg, p) - anchor.start : -1;
  const after = near ? anchor.start + near.index + near[0].length : 0;
  // (a tails word right after the result's own p, "p = .075 one-tailed (p = .15 two-tailed)", is
  // that p's unless a p follows it at once, "p = .075 (one-tailed p = .037)")
  const labelsAnother = near && p && near.index >= pEnd && (LABELS_P.test(text.slice(after, after + 60)) || (near.index - pEnd > OWN_P_LABEL_GAP && (A_P_VALUE.test(tailText.slice(pEnd, near.index)) || P_BEFORE.test(tailText.slice(pEnd, near.index)))));
  // nor is one that names other tests after it: the pair of an equivalence procedure ("…, p =
  // .689, and both one-sided tests rejected non-equivalence", with words of equivalence)
  // (plural "tests" right after the result's own p, "p = .02 (one-sided tests)", labels that p)
  const namesOthers =
    near && p && near.index >= pEnd &&
    ((OTHER_TESTS_BEFORE.test(tailText.slice(Math.max(pEnd, near.index - 12), near.index)) && EQUIVALENCE_WORD.test(text.slice(anchor.start, after + 80))) || (near.index - pEnd > OWN_P_LABEL_GAP && OTHER_TESTS_AFTER.test(text.slice(after, after + 12))));
  const sided = labelsAnother || namesOthers ? null : near;
  const before = text.slice(Math.max(0, anchor.start - 60), anchor.start);
  const variant = VARIANT_BEFORE.exec(before);
  const sentence = sentenceOf(sentenceStarts, anchor.start);
  const sentenceStart = sentenceStarts[sentence] as number;
  const lead = leads.start(sentenceStart, sentenceStarts[sentence + 1] ?? text.length, anchor.start);
  // Object.assign onto a fresh object: a literal opening with a spread gives each record a hidden
  // class of its own in V8 (DEVELOPERS.md, Speed)
  const report: TTestReport = Object.assign({}, lead < anchor.start ? { lead: { start: sourceSpan(seg, lead, anchor.start).start, words: leads.wordsOf(lead, anchor.start) } } : undefined, {
    id: `${seg.id}:${anchor.start}`,
    segment: seg.id,
    block: seg.block,
    sentence,
    span: sourceSpan(seg, anchor.start, end),
    printed: text.slice(anchor.start, end),
    style: anchor.style,
    plural: anchor.symbol === 'ts' || p?.printed.startsWith('ps') === true,
    inCode: seg.kind === 'code',
    tOp: anchor.tOp,
    t: anchor.t,
    ...(df ? { df } : {}),
    ...(p ? { p } : {}),
    ...(adjustedP ? { adjustedP } : {}),
    ...(p?.statedSidedness && !sided
      ? { statedSidedness: { value: p.statedSidedness, span: p.span } }
      : {}),
    ...(sided
      ? {
          statedSidedness: {
            value: (/^(one|1)$/i.test(sided[1] as string) ? 'one' : 'two') as Sidedness,
            span: sourceSpan(seg, anchor.start + sided.index, anchor.start + sided.index + sided[0].length),
          },
        }
      : {}),
    ...(variant ? { namedVariant: variantName(variant[1] as string) } : {}),
    ...(seg.table ? { table: { table: seg.table.table, row: seg.table.row } } : {}),
  });
  return report;
}

/** Significance stars right after t (`5.63***`), read as a p bound; see `starBound`. */
const STARS = /^\)?(\*{1,4}|†)(?![*\p{L}\p{N}])/u;

function starsAfter(seg: Segment, at: number): ReportedP | undefined {
  const m = STARS.exec(seg.text.slice(at, at + 6));
  if (!m) return undefined;
  const symbol = m[1] as string;
  const a = at + m[0].length - symbol.length;
  const b = at + m[0].length;
  const bound = starBound(symbol);
  if (bound === undefined) return undefined;
  const span = sourceSpan(seg, a, b);
  const number: ReportedNumber = { printed: symbol, value: bound, decimals: decimalsOf(bound), exponent: 0, span };
  return { kind: 'value', op: '<', number, span, printed: symbol, stars: { count: symbol === '†' ? 0 : symbol.length, symbol, basis: 'lenient-convention' } };
}

/**
 * Where a t's report can end: a p belongs to the t only when the words between them are the
 * report's own (df, CI, d, "two-tailed", "and", …). A contrast ("but not in the other
 * condition, p = .46") or a run of other prose starts another clause: the p there is about
 * something else.
 */
const CLAUSE_BREAK = /(?<![\p{L}])(?:but|whereas|while|although|though|however|yet|unlike|compared with|in contrast)(?![\p{L}])/iu;
const REPORT_WORD = /^(?:df|d|f|se|sem|ci|cohen|cohen's|cohen’s|hedges|g|and|with|degrees?|of|freedom|a|an|the|values?|was|is|were|are|two|one|tailed|sided|tails?|ns|n|p|ps|mean|difference|md|diff|b|beta|t|lower|upper|bounds?|confidence|intervals?|estimate|dz|dav|eta|partial|exact|respectively|statistic|stat|test|welch|welch's|welch’s|student|student's|student’s|corrected|adjusted|approx|approximately|equal|variances?|assumed|not|significant|bonferroni|holm|šidák|sidak|hochberg|fdr|correction|for|across|comparisons|tests)$/iu;

export function reportTailEnd(text: string, from: number, to: number, ownWords?: RegExp): number {
  const gap = text.slice(from, to);
  const br = CLAUSE_BREAK.exec(gap);
  let end = br ? from + br.index : to;
  let prose = 0;
  for (const m of matchesOf(/\p{L}[\p{L}'’]{1,30}/gu, gap.slice(0, end - from))) {
    if (REPORT_WORD.test(m[0]) || ownWords?.test(m[0])) continue;
    prose += 1;
    // three words of other prose: whatever p follows belongs to another statement
    if (prose >= 3) {
      end = from + m.index;
      break;
    }
  }
  return end;
}

function variantName(word: string): TTestReport['namedVariant'] {
  const w = word.toLowerCase();
  if (w === 'welch') return 'welch';
  if (w === 'student') return 'student';
  if (w === 'paired' || w === 'related' || w === 'dependent' || w.startsWith('repeated') || w.startsWith('within')) return 'paired';
  if (w === 'independent' || w === 'unpaired') return 'independent';
  return 'one-sample';
}

function findDf(seg: Segment, from: number, to: number, statedBefore = false): ReportedNumber | undefined {
  const slice = seg.text.slice(from, to);
  for (const re of statedBefore ? [DF_AFTER] : [DF_LABEL, DF_AFTER]) {
    re.lastIndex = 0;
    const m = re.exec(slice);
    if (m) {
      const a = from + idx(m, 1);
      return readNumber(seg, a, a + (m[1] as string).length);
    }
  }
  return undefined;
}

/**
 * `findDf(seg, sentenceStart, at, true)` for the tests of one segment: the first df stated in
 * each sentence is searched for once, not once per test (a sentence of thousands of labelled t
 * values without a df would otherwise be rescanned from its start for each). The text up to `at`
 * is a prefix of the sentence, so its first df is the sentence's when that one ends before
 * `at`; where a df word ends right at `at` or the sentence's first df runs across it (its
 * look-ahead or its digits would read otherwise in the shorter text), `findDf` decides.
 */
class DfBefore {
  private readonly first = new Map<number, { index: number; end: number; df: number; dfEnd: number } | null>();
  constructor(
    private readonly seg: Segment,
    private readonly sentenceStarts: number[],
  ) {}

  find(sentence: number, at: number): ReportedNumber | undefined {
    const from = this.sentenceStarts[sentence] as number;
    const text = this.seg.text;
    if (DF_WORD_AT_END.test(text.slice(Math.max(from, at - DF_WORD_REACH), at))) return findDf(this.seg, from, at, true);
    let m = this.first.get(sentence);
    if (m === undefined) {
      DF_AFTER.lastIndex = 0;
      const found = DF_AFTER.exec(text.slice(from, this.sentenceStarts[sentence + 1] ?? text.length));
      m = found ? { index: from + found.index, end: from + found.index + found[0].length, df: from + idx(found, 1), dfEnd: from + idx(found, 1) + (found[1] as string).length } : null;
      this.first.set(sentence, m);
    }
    if (m === null || m.index >= at) return undefined;
    if (m.end > at) return findDf(this.seg, from, at, true);
    return readNumber(this.seg, m.df, m.dfEnd);
  }
}
/** The words a df stated before its test ends with (DF_AFTER), at the end of a stretch. */
const DF_WORD_AT_END = /(?:df|d\.f\.|degrees of freedom)$/iu;
const DF_WORD_REACH = 'degrees of freedom'.length;

export function findP(seg: Segment, from: number, to: number): ReportedP | undefined {
  const slice = seg.text.slice(from, to);
  const ns = NS.exec(slice);
  if (ns) {
    const a = from + ns.index + ns[0].indexOf(ns[1] as string);
    const b = a + (ns[1] as string).length;
    return { kind: 'ns', op: '>', span: sourceSpan(seg, a, b), printed: seg.text.slice(a, b) };
  }
  P_VALUE.lastIndex = 0;
  for (let m = P_VALUE.exec(slice); m; m = P_VALUE.exec(slice)) {
    const g = m.groups ?? {};
    const at = m.indices?.groups ?? {};
    if (!g.first && !g.second && !g.word) continue; // "p 0.05" without a comparison is not a report
    const op = pComparison(g.first ?? '=', g.second);
    let numEnd = from + m.index + m[0].length;
    // an exponent longer than the pattern's nine digits is read on, to 400 digits; any other
    // number longer than the pattern reads (a 21st decimal, a 401st digit of exponent) is not
    // read in part: its first digits would be another number
    const exp = at.power ?? at.eExp ?? at.tenExp;
    let expText = g.power ?? g.eExp ?? g.tenExp;
    if (exp && expText !== undefined && from + exp[1] === numEnd) {
      const stop = longExponentEnd(seg.text, numEnd, expText.replace(/^[-+]/, '').length);
      if (stop === undefined) continue;
      expText += seg.text.slice(numEnd, stop);
      numEnd = stop;
    }
    if (/\d/.test(seg.text.charAt(numEnd))) continue;
    let number: ReportedNumber | undefined;
    if (g.power !== undefined) {
      if (g.sign !== undefined) continue; // `p = -10^-6` is no reading of a p worth guessing
      // a bare power of ten: the whole `10^-6` is the printed number
      const exponentAt = from + (at.power as [number, number])[0];
      number = readPower(seg, seg.text.lastIndexOf('10', exponentAt), numEnd, Number(expText));
    } else {
      const numStart = from + ((g.sign !== undefined ? at.sign : at.mantissa) as [number, number])[0];
      const exponent = Number(expText ?? 0);
      number = readNumber(seg, numStart, numEnd, exponent, from + (at.mantissa as [number, number])[1]);
    }
    if (!number) continue;
    const a = from + m.index;
    const p: ReportedP = { kind: 'value', op, number, span: sourceSpan(seg, a, numEnd), printed: seg.text.slice(a, numEnd) };
    const adjusted = adjustment(seg, a, numEnd, g.sub ?? g.paren);
    if (adjusted) {
      // `p_adj = .074 (3 tests)`, `p = .12 (m = 3)`: the number of comparisons printed with it
      const after = seg.text.slice(numEnd, numEnd + 40);
      const close = after.search(/[);]/u);
      const own = comparisonsIn(close < 0 ? after : after.slice(0, close));
      p.adjusted = own ? { ...adjusted, comparisons: own.m } : adjusted;
    }
    const label = g.paren ?? g.sub;
    if (label) {
      const sided = SIDED_LABEL.exec(label);
      if (sided) p.statedSidedness = /^(one|1)$/i.test(sided[1] as string) ? 'one' : 'two';
    }
    return p;
  }
  return undefined;
}

const SIDED_LABEL = /^(one|two|1|2)[- ]?(?:tailed|sided|t)$/iu;

/** Digits an exponent may have in all (`1e-12345678901` has eleven). */
const EXPONENT_DIGITS = 400;

/**
 * Where an exponent whose first `read` digits end at `at` ends, reading on over digits; undefined
 * when it runs past EXPONENT_DIGITS (never read in part). A plain loop, linear in the digits.
 */
function longExponentEnd(text: string, at: number, read: number): number | undefined {
  let k = at;
  while (k < text.length && text.charCodeAt(k) >= 0x30 && text.charCodeAt(k) <= 0x39) k += 1;
  return read + (k - at) > EXPONENT_DIGITS ? undefined : k;
}

/**
 * `10^-6` read as 1 × 10^-6 (no decimals: the bound is exact); `10^-400`, below a double, keeps
 * its size as log10 (value 0).
 */
function readPower(seg: Segment, a: number, b: number, exponent: number): ReportedNumber | undefined {
  const value = Number.isSafeInteger(exponent) ? Number(`1e${exponent}`) : exponent > 0 ? Infinity : 0;
  if (Number.isNaN(value) || a < 0 || a >= b) return undefined;
  const out: ReportedNumber = { printed: seg.text.slice(a, b), value, decimals: 0, exponent, span: sourceSpan(seg, a, b) };
  if (!Number.isFinite(value) || value < 2.2250738585072014e-308) out.beyondDouble = { log10: exponent, mantissa: 1 };
  return out;
}

/** The multiplicity adjustment said with a p, before it, in its label or right after it. */
function adjustment(seg: Segment, a: number, b: number, label: string | undefined): ReportedP['adjusted'] {
  if (label && ADJUSTED_SUBSCRIPT.test(label)) return { method: adjustMethod(label), span: sourceSpan(seg, a, b), printed: seg.text.slice(a, b) };
  const before = ADJUSTED_BEFORE.exec(seg.text.slice(Math.max(0, a - 40), a));
  if (before) {
    const start = a - before[0].length;
    return { method: adjustMethod(before[1] ?? ''), span: sourceSpan(seg, start, b), printed: seg.text.slice(start, b) };
  }
  // `(Bonferroni-corrected for 4 comparisons: p = 1.000)`: the bracket the p sits in says so
  const open = seg.text.lastIndexOf('(', a);
  const bracket = open >= 0 && a - open <= 60 && !seg.text.slice(open, a).includes(')') ? seg.text.slice(open, a) : '';
  const said = ADJUSTED_IN_BRACKET.exec(bracket);
  if (said) return { method: adjustMethod(said[1] ?? ''), span: sourceSpan(seg, open + 1, b), printed: seg.text.slice(open + 1, b) };
  const after = ADJUSTED_AFTER.exec(seg.text.slice(b, b + 50));
  // `p = .045, Bonferroni-corrected p = .135`: the words introduce the next p, not this one
  if (after && !introducesAnotherP(seg.text.slice(b + after[0].length, b + after[0].length + 40))) {
    const end = b + after[0].length;
    return { method: adjustMethod(after[1] ?? after[2] ?? ''), span: sourceSpan(seg, a, end), printed: seg.text.slice(a, end) };
  }
  return undefined;
}

function adjustMethod(word: string): AdjustMethod {
  const w = word.toLowerCase();
  if (w.startsWith('bonf')) return 'bonferroni';
  if (w === 'holm') return 'holm';
  if (w === 'hochberg') return 'hochberg';
  if (w === 'sidak' || w === 'šidák') return 'sidak';
  if (w === 'tukey') return 'tukey';
  if (w === 'fdr' || w === 'bh' || w.startsWith('benjamini')) return 'fdr';
  return 'unspecified';
}

function pComparison(first: string, second: string | undefined): Comparison {
  // "p = < .001" and "p: < .001" read as the inner comparison
  if (second && (first === '=' || first === ':')) return comparison(second);
  if (first === '=<') return '<=';
  if (first === '=>') return '>=';
  if (first === ':') return '=';
  return comparison(first);
}

function comparison(s: string): Comparison {
  switch (s) {
    case '<':
      return '<';
    case '>':
      return '>';
    case '<=':
    case '=<':
    case '≤':
      return '<=';
    case '>=':
    case '=>':
    case '≥':
      return '>=';
    case '≈':
    case '~':
      return '~';
    default:
      return '=';
  }
}

function numberFromGroup(seg: Segment, m: RegExpMatchArray, group: number): ReportedNumber | undefined {
  const g = m[group];
  if (g === undefined) return undefined;
  const a = idx(m, group);
  // a run of digits longer than T_NUM reads, or an exponent longer than EXP reads, is not read
  // in part (it would be another number: `2e1000000000` is not 2)
  if (/^(?:\d|[eE][-+]?\d)/.test(seg.text.slice(a + g.length, a + g.length + 3))) return undefined;
  return readNumber(seg, a, a + g.length);
}

/** Start index of capture group `g` (patterns carry the `d` flag). */
function idx(m: RegExpMatchArray, g: number): number {
  return m.indices?.[g]?.[0] ?? m.index ?? 0;
}

/** Segments whose source ends never decrease (most do: the map follows the source in order). */
const ordered = new WeakMap<Int32Array, boolean>();
function endsInOrder(ends: Int32Array): boolean {
  let known = ordered.get(ends);
  if (known === undefined) {
    known = true;
    for (let i = 1; i < ends.length; i += 1) {
      if ((ends[i] as number) < (ends[i - 1] as number)) {
        known = false;
        break;
      }
    }
    ordered.set(ends, known);
  }
  return known;
}

function indexOfSpanEnd(seg: Segment, part: { span: { end: number } }): number {
  // Largest text index whose source end is within the part's span: a binary search where the
  // ends are in order (a walk back from the segment's end costs the whole paragraph per result),
  // else that walk.
  const ends = seg.ends;
  if (ends.length > 0 && endsInOrder(ends)) {
    let lo = 1;
    let hi = ends.length;
    // the first index past 0 whose end lies beyond the span; the one before it is the answer
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if ((ends[mid] as number) > part.span.end) hi = mid;
      else lo = mid + 1;
    }
    return lo;
  }
  let i = ends.length - 1;
  while (i > 0 && (ends[i] as number) > part.span.end) i -= 1;
  return i + 1;
}
