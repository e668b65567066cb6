import type { ContextStatement, Mention } from '../extract/types.js';
import type { LinkedResult } from '../link/types.js';
import type { Span } from '../parse/types.js';
import { adjustedPRange, checkLog10PAgainstLog10T, checkLog10PAgainstT, checkPAgainstT, distanceBetween, meets, sideOfAlpha, type Interval, type PConsistency, type PInterval } from '../stats/index.js';
import { showInterval, showNumber } from './format.js';
import { describeResultDf, describeT, isWholeDf, log10Of, numberLog10Interval, pInterval, pLastDigit, pLog10Interval, resultDfInterval, tInterval, welchDfInterval } from './intervals.js';
import { oncePer } from './once.js';
import type { Gap, Recomputed } from './types.js';

/**
 * How a reported p stands against its t and df:
 * - consistent: the reading that applies (two-tailed unless the text says one-tailed) fits;
 * - one-tailed-only: nothing says one-tailed, and only the one-tailed p in t's direction fits;
 * - one-tailed-opposite-only: nothing says one-tailed, and only the one-tailed p against t's
 *   direction (1 − half, as equivalence tests report) fits an exactly printed p;
 * - one-tailed-although-two-stated / two-tailed-although-one-stated: the text names the
 *   tails, and only the other reading fits;
 * - mismatch: no reading fits.
 */
export type PStanding = 'consistent' | 'one-tailed-only' | 'one-tailed-opposite-only' | 'one-tailed-although-two-stated' | 'two-tailed-although-one-stated' | 'mismatch';

export interface PEvaluation {
  standing: PStanding;
  check: PConsistency;
  reported: PInterval;
  /** The recomputed range of the reading that applies to this result. */
  applicable: Interval;
  applicableName: string;
  /** Reported and recomputed sides of alpha, and whether they disagree. */
  reportedSide: 'below' | 'above' | 'straddles';
  recomputedSide: 'below' | 'above' | 'straddles';
  decisionFlips: boolean;
  recomputed: Recomputed;
  gap: Gap;
  /**
   * Set when the reported p lies below 1e-300 (`p = 1e-400`): the comparison was made on the
   * scale of log10 p, and these are `check`, `reported` and `applicable` on that scale (the
   * fields above then hold the same intervals as doubles, where such p values underflow to 0).
   */
  log10?: { check: PConsistency; reported: PInterval; applicable: Interval };
  /**
   * Set when the reading that applies does not reproduce the reported p with the whole df as
   * printed, but does with that df read as a rounded Welch df (df − 0.5 to df + 0.5), and the
   * text names Welch's test where it reports no test (LinkedResult.untiedWelch): the range of
   * that reading. A finding then rests on the df being a count, which is not certain.
   */
  welchElsewhere?: { applicable: Interval; dfLow: number; dfHigh: number };
  /**
   * Set when the reported p lies outside the range that applies, the df is printed whole and the
   * text says dfs were approximated (LinkedResult.approximateDf), and the df read as rounded gives
   * the p: the range of that reading. A finding then rests on the df being exact, which is not certain.
   */
  approximateDf?: { applicable: Interval; dfLow: number; dfHigh: number };
  /**
   * Set when the reported p lies wholly above the range that applies and the text names a
   * correction for multiple comparisons for it or for every p, labelling no p as adjusted
   * (LinkedResult.adjustmentSaid): the p may be an adjusted one, which is never smaller.
   */
  maybeAdjusted?: true;
}

/** Below this a p is compared as log10 p: a double's precision thins out near its smallest values. */
const LOG_SCALE_BELOW = -300;

/**
 * The df from which a p is no longer recomputed: the t distribution's tail here is checked
 * against mpmath for df up to 1e6 (fixtures/reference/t-tail.json, t-log-tail.json), and dfs
 * of nine digits were all the extractor read before; a df of ten digits or more is read, not
 * recomputed.
 */
export const DF_RECOMPUTED_BELOW = 1e9;

/**
 * Why a result's p is not recomputed from its t and df although all three are printed: a df of
 * ten digits or more (or beyond a double), or a p whose exponent has more digits than a double
 * holds exactly (`p = 1e-12345678901234567`). Undefined when nothing stands in the way.
 */
export function notRecomputed(result: LinkedResult): string | undefined {
  const r = result.report;
  if (!r.p || !r.df || r.p.adjusted) return undefined;
  const df = r.df.value;
  if (!Number.isFinite(df) || Math.abs(df) >= DF_RECOMPUTED_BELOW) {
    return `a df of ${r.df.printed.trim()} is beyond the dfs for which plumbline computes the t distribution (below ${DF_RECOMPUTED_BELOW.toLocaleString('en-US')})`;
  }
  const n = r.p.kind === 'value' ? r.p.number : undefined;
  if (n && !Number.isSafeInteger(n.exponent)) return `the exponent of p = ${n.printed.trim()} has more digits than a double holds exactly`;
  return undefined;
}

/** Assumption wording for a result's tails, saying where it came from. */
export function describeTails(result: LinkedResult): string {
  const where = {
    'in-report': 'as stated beside the result',
    sentence: 'as stated in its sentence',
    paragraph: 'as stated in its paragraph',
    structure: 'from the layout of the numbers',
    'equivalence-test': 'an equivalence test is named beside it',
    methods: 'as the Methods state it',
    'document-text': 'as stated in the document',
    'front-matter': 'set in front matter',
    'command-line': 'set on the command line',
    configuration: 'set in a configuration file',
    default: 'by default; nothing says otherwise',
  }[result.sidedness.basis];
  return `${result.sidedness.value === 'one' ? 'one-tailed' : 'two-tailed'} (${where})`;
}

/**
 * Evaluate a result's p against t and df; undefined when there is nothing to check. Made once
 * per result (oncePer): the report's record and up to five rules ask for the same result's
 * evaluation; on 20,000 results in one paragraph the evaluations and their numerics were a tenth
 * of the check, made four to six times over. Shared by every caller: copy what is to be changed.
 */
export function evaluateP(result: LinkedResult): PEvaluation | undefined {
  return evaluatePOncePer(result);
}

function evaluatePOnce(result: LinkedResult): PEvaluation | undefined {
  const r = result.report;
  // an adjusted p is not the p of t and df (adjusted-p-follows checks it where it can)
  if (!r.p || !r.df || r.p.adjusted) return undefined;
  const n = r.p.kind === 'value' ? r.p.number : undefined;
  // values-are-possible speaks for a p above 1, a negative p (`-0` too) and a bound at or below 0
  if (n && (n.value > 1 || n.value < 0 || Object.is(n.value, -0) || (n.value === 0 && !n.beyondDouble && (r.p.op === '<' || r.p.op === '<=')))) return undefined;
  const [dfLow, dfHigh] = resultDfInterval(result);
  if (!(dfLow > 0) || Number.isNaN(dfHigh)) return undefined;
  // a df of ten digits or more (`t(12345678901)`, `t(1e400)`), or a p whose exponent no double
  // holds exactly, is not recomputed (no finding can rest on it; p-follows-from-t says so in a
  // note, see notRecomputed); values-are-possible and df-follows-from-n still read them
  if (notRecomputed(result) !== undefined) return undefined;
  const [tLow, tHigh] = tInterval(r);
  if (Number.isNaN(tLow) || Number.isNaN(tHigh)) return undefined;
  const alpha = result.alpha.value;
  const logScale = n !== undefined && n.value !== 0 ? log10Of(n) < LOG_SCALE_BELOW : n?.beyondDouble !== undefined;
  const log10 = logScale ? logComparison(r, alpha, { tLow, tHigh, dfLow, dfHigh }) : undefined;
  const reported = log10 ? toP(log10.reported) : pInterval(r.p, alpha);
  const check = log10 ? { ...log10.check, twoSided: toPRange(log10.check.twoSided), oneSidedSame: toPRange(log10.check.oneSidedSame), oneSidedOpposite: toPRange(log10.check.oneSidedOpposite) } : checkPAgainstT({ tLow, tHigh, dfLow, dfHigh, reported });
  // a range the numerics could not give (NaN at an extreme of t and df) is no ground for a finding
  const ranges = log10 ? [log10.check.twoSided, log10.check.oneSidedSame, log10.check.oneSidedOpposite] : [check.twoSided, check.oneSidedSame, check.oneSidedOpposite];
  if (ranges.some((i) => Number.isNaN(i.low) || Number.isNaN(i.high))) return undefined;
  const explicit = result.sidedness.basis !== 'default';
  let standing: PStanding;
  if (result.sidedness.basis === 'equivalence-test') {
    // An equivalence test named nearby makes a one-tailed p likely, not certain: the same
    // paragraph often reports the ordinary two-tailed test too. Either reading fits.
    standing = check.fitsTwoSided || check.fitsOneSidedSame || check.fitsOneSidedOpposite ? 'consistent' : 'mismatch';
  } else if (result.sidedness.value === 'two') {
    // Where nothing declares one tail, the opposite tail (near 1) is considered only for an
    // exactly printed p: as a bound it would "fit" every n.s. and every p > x.
    // An exactly printed p that equals 1 − half is still a one-tailed p (the other direction).
    const exact = r.p.kind === 'value' && (r.p.op === '=' || r.p.op === '~');
    if (check.fitsTwoSided) standing = 'consistent';
    else if (check.fitsOneSidedSame) standing = explicit ? 'one-tailed-although-two-stated' : 'one-tailed-only';
    else if (check.fitsOneSidedOpposite && exact) standing = explicit ? 'one-tailed-although-two-stated' : 'one-tailed-opposite-only';
    else standing = 'mismatch';
  } else if (check.fitsOneSidedSame || check.fitsOneSidedOpposite) standing = 'consistent';
  else standing = check.fitsTwoSided ? 'two-tailed-although-one-stated' : 'mismatch';

  const useOne = result.sidedness.value === 'one';
  // For one-tailed tests the same-direction tail is the usual reading; the opposite tail
  // (equivalence tests) is taken when it is the nearer one.
  const applicable = applicableReading(check, reported, useOne);
  const applicableName = useOne ? 'one-tailed p' : 'two-tailed p';
  const logApplicable = log10 ? applicableReading(log10.check, log10.reported, useOne) : undefined;
  const reportedSide = log10 ? sideOfAlpha(log10.reported.low, log10.reported.high, Math.log10(alpha), log10.reported.highOpen) : sideOfAlpha(reported.low, reported.high, alpha, reported.highOpen);
  const recomputedSide = logApplicable ? sideOfAlpha(logApplicable.low, logApplicable.high, Math.log10(alpha)) : sideOfAlpha(applicable.low, applicable.high, alpha);
  const decisionFlips = reportedSide !== 'straddles' && recomputedSide !== 'straddles' && reportedSide !== recomputedSide;
  const inputs = [describeT(r), describeResultDf(result)];
  const recomputed: Recomputed = {
    quantity: applicableName,
    low: applicable.low,
    high: applicable.high,
    inputs,
    assumptions: [describeTails(result), `alpha ${alpha} (${result.alpha.basis === 'default' ? 'default' : result.alpha.basis.replace('-', ' ')})`],
    ...(logApplicable ? { log10: { low: logApplicable.low, high: logApplicable.high } } : {}),
  };
  const absolute = distanceBetween(applicable, reported.low, reported.high);
  const unit = r.p.op === '=' ? pLastDigit(r.p) : undefined;
  const pointDistance = r.p.number ? distanceBetween(applicable, r.p.number.value, r.p.number.value) : absolute;
  // a last digit below the double range (`1e-400`) has no unit a double can divide by
  const gap: Gap = unit && !log10
    ? { absolute: pointDistance, lastDigitUnits: pointDistance / unit, roundingAllowance: unit / 2 }
    : { absolute };
  // a paired or one-sample test, or a regression coefficient's t, has a count for its df whatever the text says of Welch
  const design = result.testName?.design ?? result.context.design.value;
  const countDf = design === 'paired' || design === 'one-sample' || result.context.coefficient !== undefined;
  const welchElsewhere = standing !== 'consistent' && !log10 && result.untiedWelch && !countDf && isWholeDf(r.df) ? asWelchDf({ tLow, tHigh, df: r.df.value, reported }, useOne) : undefined;
  // an approximated df (a mixed model's) printed whole, for a result its own words do not name a
  // t-test and whose df is not the count its own group sizes give
  const approximateDf = standing !== 'consistent' && !log10 && !welchElsewhere && result.approximateDf && result.testName === undefined && isWholeDf(r.df) && !countsItsSizes(result, r.df.value) ? asWelchDf({ tLow, tHigh, df: r.df.value, reported }, useOne) : undefined;
  return {
    standing, check, reported, applicable, applicableName, reportedSide, recomputedSide, decisionFlips, recomputed, gap,
    ...(log10 && logApplicable ? { log10: { ...log10, applicable: logApplicable } } : {}),
    ...(welchElsewhere ? { welchElsewhere } : {}),
    ...(approximateDf ? { approximateDf } : {}),
    ...(standing !== 'consistent' && !log10 && result.adjustmentSaid && mayBeAdjusted(result.adjustmentSaid, applicable, reported) ? { maybeAdjusted: true as const } : {}),
  };
}

/** The df is the count the result's own group sizes give: n − 1 for one group; n1 + n2 − 2, or n − 1 for two equal groups (pairs). */
function countsItsSizes(result: LinkedResult, df: number): boolean {
  const ns = result.context.descriptives?.groups.map((g) => g.n?.value) ?? [];
  const [a, b] = ns;
  if (ns.length === 1 && a !== undefined) return df === a - 1;
  if (ns.length === 2 && a !== undefined && b !== undefined) return df === a + b - 2 || (a === b && df === a - 1);
  return false;
}

/** The applicable reading with a whole df read as a real df printed whole (welchDfInterval), when it reproduces the reported p. */
function asWelchDf(box: { tLow: number; tHigh: number; df: number; reported: PInterval }, useOne: boolean): PEvaluation['welchElsewhere'] {
  const [dfLow, dfHigh] = welchDfInterval(box.df);
  const check = checkPAgainstT({ tLow: box.tLow, tHigh: box.tHigh, dfLow, dfHigh, reported: box.reported });
  const fits = useOne ? check.fitsOneSidedSame || check.fitsOneSidedOpposite : check.fitsTwoSided;
  if (!fits) return undefined;
  return { applicable: applicableReading(check, box.reported, useOne), dfLow, dfHigh };
}

/**
 * The range of the reading that applies to a result: two-tailed, or for a one-tailed test the
 * same-direction tail, the opposite tail (equivalence tests) when it is the nearer one.
 */
function applicableReading(check: PConsistency, reported: PInterval, useOne: boolean): Interval {
  return useOne ? nearer(check.oneSidedSame, check.oneSidedOpposite, reported) : check.twoSided;
}

/**
 * `{ uncertain, related }` for a finding about a result's p that rests on a reading the text
 * leaves open: its whole df being a count where the text names Welch's test elsewhere and a
 * rounded Welch df would give the p (welchElsewhere), or an approximated df printed whole would
 * (approximateDf), or its p being unadjusted where the text
 * names a correction for it or for every p and the p is larger than t and df give
 * (maybeAdjusted). Empty when neither applies.
 */
export function pDoubts(result: LinkedResult, e: PEvaluation): { uncertain?: string[]; related?: Array<{ span: Span; message: string }> } {
  const uncertain: string[] = [];
  const related: Array<{ span: Span; message: string }> = [];
  const w = e.welchElsewhere;
  const named = result.untiedWelch;
  if (w && named && result.report.df) {
    uncertain.push(`Welch's test is named elsewhere in the text, “${named.printed}”, not with this result: if its df of ${result.report.df.printed.trim()} is a Welch df printed whole (rounded or cut: ${showNumber(w.dfLow)} to ${showNumber(w.dfHigh)}), the ${e.applicableName} would be ${showInterval(w.applicable.low, w.applicable.high)}, which holds the reported p`);
    related.push({ span: named.span, message: "Welch's test named here" });
  }
  const approximate = e.approximateDf;
  const words = result.approximateDf;
  if (approximate && words && result.report.df) {
    uncertain.push(`the text says dfs were approximated, “${words.printed}”: if its df of ${result.report.df.printed.trim()} is such a df printed whole (rounded or cut: ${showNumber(approximate.dfLow)} to ${showNumber(approximate.dfHigh)}), the ${e.applicableName} would be ${showInterval(approximate.applicable.low, approximate.applicable.high)}, which holds the reported p`);
    related.push({ span: words.span, message: 'approximated dfs named here' });
  }
  const adjustment = result.adjustmentSaid;
  if (e.maybeAdjusted && adjustment) {
    uncertain.push(adjustmentDoubt(adjustment, 't and df give', e.applicable));
    related.push({ span: adjustment.span, message: 'the correction named here' });
  }
  const resampled = result.resampledP;
  if (resampled && e.standing !== 'consistent') {
    uncertain.push(resampledDoubt(resampled, 't and df'));
    related.push({ span: resampled.span, message: 'resampling named here' });
  }
  return uncertain.length > 0 ? { uncertain, related } : {};
}

/** Why a p may not follow from its statistic at all: the words saying it came from resampling. */
export function resampledDoubt(said: Mention, from: string): string {
  return `the text says its p came from resampling, “${said.printed}”: such a p need not follow from ${from}`;
}

/** The values the correction a statement names could turn an unadjusted p in `unadjusted` into (adjustedPRange). */
export function adjustedRangeOf(said: ContextStatement, unadjusted: Interval): Interval {
  const method = said.method === undefined || said.method === 'tukey' ? 'unspecified' : said.method;
  return adjustedPRange(method, said.comparisons, unadjusted);
}

/** The reported p lies wholly above the unadjusted range and within what the named correction could make of it. */
export function mayBeAdjusted(said: ContextStatement, unadjusted: Interval, reported: PInterval): boolean {
  return reported.low > unadjusted.high && meets(adjustedRangeOf(said, unadjusted), reported);
}

/** Why a p larger than its statistic gives may be an adjusted one: the correction the text names, that it labels no p as adjusted, and what the correction could give. */
export function adjustmentDoubt(said: ContextStatement, gives: string, unadjusted: Interval): string {
  const r = adjustedRangeOf(said, unadjusted);
  const m = said.comparisons !== undefined ? ` for ${said.comparisons} comparisons` : '';
  const what = said.unnamed === true ? `says a correction for multiple comparisons was made, “${said.printed}”, without naming it,` : `names a correction for multiple comparisons, “${said.printed}”,`;
  return `the text ${what} and labels no p as adjusted: this p, larger than ${gives}, may be an adjusted one (the correction${m} could give ${showInterval(r.low, r.high)})`;
}

function logComparison(r: LinkedResult['report'], alpha: number, box: { tLow: number; tHigh: number; dfLow: number; dfHigh: number }): { check: PConsistency; reported: PInterval } {
  const reported = pLog10Interval(r.p as NonNullable<typeof r.p>, alpha);
  // a printed t no double holds (`t = 2e1000`) is infinite as a double: its size is taken from the
  // text instead, as log10 |t| within its rounding
  if (r.tOp === '=' && r.t.beyondDouble && !Number.isFinite(r.t.value)) {
    const [log10AbsTLow, log10AbsTHigh] = numberLog10Interval(r.t);
    return { check: checkLog10PAgainstLog10T({ log10AbsTLow, log10AbsTHigh, dfLow: box.dfLow, dfHigh: box.dfHigh, reported }), reported };
  }
  return { check: checkLog10PAgainstT({ ...box, reported }), reported };
}

const toPRange = (i: Interval): Interval => ({ low: 10 ** i.low, high: 10 ** i.high });
const toP = (i: PInterval): PInterval => ({ ...i, low: 10 ** i.low, high: 10 ** i.high });

function nearer(a: Interval, b: Interval, reported: PInterval): Interval {
  const da = distanceBetween(a, reported.low, reported.high);
  const db = distanceBetween(b, reported.low, reported.high);
  return db < da ? b : a;
}

/** "0.3207 to 0.3256" */
export function showRange(i: Interval): string {
  return showInterval(i.low, i.high);
}

const evaluatePOncePer = oncePer(evaluatePOnce);
