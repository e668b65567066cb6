import type { ReportedNumber, ReportedP, TTestReport } from '../extract/types.js';
import type { LinkedResult } from '../link/types.js';
import { lastDigitUnit, roundingInterval, type PInterval } from '../stats/index.js';
import { showBound, showNumber } from './format.js';

/** The interval of true values a printed number allows (its rounding interval). */
export function numberInterval(n: ReportedNumber): [number, number] {
  if (!Number.isFinite(n.value)) return [n.value, n.value];
  const [lo, hi] = roundingInterval(mantissaOf(n), n.decimals);
  const scale = 10 ** n.exponent;
  return [lo * scale, hi * scale];
}

/** The printed digits before the exponent (`1.5` of `1.5e1`), from the text's own reading when a double lost the number. */
function mantissaOf(n: ReportedNumber): number {
  if (n.beyondDouble?.mantissa !== undefined) return Math.sign(n.value) < 0 || Object.is(n.value, -0) ? -n.beyondDouble.mantissa : n.beyondDouble.mantissa;
  return n.exponent === 0 ? n.value : n.value / 10 ** n.exponent;
}

/** log10 of a printed number's magnitude, also where a double cannot hold it (`1e-400`). */
export function log10Of(n: ReportedNumber): number {
  return n.beyondDouble ? n.beyondDouble.log10 : Math.log10(Math.abs(n.value));
}

/**
 * A printed positive number's rounding interval on the scale of log10: `1.5e-400` →
 * [log10 1.45 − 400, log10 1.55 − 400]. A number whose mantissa no double holds (hundreds of
 * digits) is a point there: its rounding moves it by less than a double's precision.
 */
export function numberLog10Interval(n: ReportedNumber): [number, number] {
  const m = Math.abs(n.beyondDouble ? (n.beyondDouble.mantissa ?? NaN) : mantissaOf(n));
  if (!Number.isFinite(m)) return [log10Of(n), log10Of(n)];
  const [lo, hi] = roundingInterval(m, n.decimals);
  return [Math.log10(Math.max(0, lo)) + n.exponent, Math.log10(hi) + n.exponent];
}

/**
 * pInterval on the scale of log10 p (for a p beyond or near the edge of the double range). Where
 * log10 p is large (`p = 1e-12345678901`: −12345678901), a double holds it only to some units in
 * its last place, and so does the recomputed side: the interval is widened by 16 of those units
 * (|log10 p| · 2^−48: 4e-5 at ten digits, nothing at the usual sizes) so that no finding rests
 * on the last bits of a double.
 */
export function pLog10Interval(p: ReportedP, alpha: number): PInterval {
  const i = pLog10IntervalAsPrinted(p, alpha);
  const slack = (x: number) => (Number.isFinite(x) ? Math.abs(x) * 2 ** -48 : 0);
  return { ...i, low: i.low - slack(i.low), high: Math.min(0, i.high + slack(i.high)) };
}

function pLog10IntervalAsPrinted(p: ReportedP, alpha: number): PInterval {
  if (p.kind === 'ns' || !p.number) return { low: Math.log10(alpha), high: 0, lowOpen: false, highOpen: false };
  const v = log10Of(p.number);
  switch (p.op) {
    case '<':
      return { low: -Infinity, high: v, lowOpen: false, highOpen: true };
    case '<=':
      return { low: -Infinity, high: v, lowOpen: false, highOpen: false };
    case '>':
      return { low: v, high: 0, lowOpen: true, highOpen: false };
    case '>=':
      return { low: v, high: 0, lowOpen: false, highOpen: false };
    default: {
      const [lo, hi] = numberLog10Interval(p.number);
      return { low: lo, high: Math.min(0, hi), lowOpen: false, highOpen: false };
    }
  }
}

/** t's interval: rounding for `t = 2.10`, a half-line for bounds (`t > 4.72`, `t < 1`). */
export function tInterval(report: TTestReport): [number, number] {
  const [lo, hi] = numberInterval(report.t);
  const v = report.t.value;
  switch (report.tOp) {
    case '<':
    case '<=':
      return [0, Math.abs(v)];
    case '>':
    case '>=':
      return v >= 0 ? [Math.abs(v), Infinity] : [-Infinity, v];
    default:
      return [lo, hi];
  }
}

/**
 * A df printed without decimals is a count (Student, paired, one-sample) and exact; one printed
 * with decimals (`17.8`, and `20.0` too: software prints Welch's df that way) was rounded like t.
 */
export function isWholeDf(df: ReportedNumber): boolean {
  return df.decimals === 0 && df.exponent === 0;
}

/** A whole-number df is a count and exact; a fractional (Welch) df was rounded like t. */
export function dfInterval(df: ReportedNumber): [number, number] {
  if (isWholeDf(df)) return [df.value, df.value];
  return numberInterval(df);
}

/**
 * The reported p as an interval: `= .045` → [.0445, .0455]; `< .05` → [0, .05);
 * `≤ .01` → [0, .01]; `> .25` → (.25, 1]; `n.s.` → [alpha, 1]; `≈ x` as `= x`.
 * Clipped to [0, 1].
 */
export function pInterval(p: ReportedP, alpha: number): PInterval {
  if (p.kind === 'ns' || !p.number) return { low: alpha, high: 1, lowOpen: false, highOpen: false };
  const v = p.number.value;
  switch (p.op) {
    case '<':
      return { low: 0, high: v, lowOpen: false, highOpen: true };
    case '<=':
      return { low: 0, high: v, lowOpen: false, highOpen: false };
    case '>':
      return { low: v, high: 1, lowOpen: true, highOpen: false };
    case '>=':
      return { low: v, high: 1, lowOpen: false, highOpen: false };
    default: {
      const [lo, hi] = numberInterval(p.number);
      return { low: Math.max(0, lo), high: Math.min(1, hi), lowOpen: false, highOpen: false };
    }
  }
}

/** "t = 2.10 (2.095 to 2.105)" — the printed input and the interval used. */
export function describeT(report: TTestReport): string {
  const [lo, hi] = tInterval(report);
  if (report.tOp !== '=') return `t ${report.tOp} ${report.t.printed.trim()}`;
  // a t no double holds: its rounding interval says nothing a reader can use
  if (report.t.beyondDouble && !Number.isFinite(report.t.value)) return `t = ${report.t.printed.trim()} (about 10^${Math.round(report.t.beyondDouble.log10)})`;
  return `t = ${report.t.printed.trim()} (read as ${showBound(lo, report.t.decimals, report.t.exponent)} to ${showBound(hi, report.t.decimals, report.t.exponent)})`;
}

export function describeDf(df: ReportedNumber): string {
  const [lo, hi] = dfInterval(df);
  return lo === hi ? `df = ${df.printed}` : `df = ${df.printed} (read as ${showBound(lo, df.decimals, df.exponent)} to ${showBound(hi, df.decimals, df.exponent)})`;
}

/**
 * A result's df as an interval of true values. A Welch df is a real number, so a whole df
 * printed for a result its own words name Welch's test as a test (`LinkedResult.testName`, not
 * "Welch's method") was rounded or cut to its whole part:
 * `t(5)` stands for 4.5 to 6 there, as `t(5.4)` stands for 5.35 to 5.45. Any other whole df is
 * a count and exact (dfInterval).
 */
export function resultDfInterval(result: LinkedResult): [number, number] {
  const df = result.report.df;
  if (!df) return [NaN, NaN];
  if (roundedWelchDf(result)) return welchDfInterval(df.value);
  return dfInterval(df);
}

/**
 * A real-valued df (Welch's, or a mixed model's approximation) printed whole as `df`, read as
 * rounded (df − 0.5 to df + 0.5) or cut to its whole part (df to df + 1): df − 0.5 to df + 1,
 * never below 1 (the smaller group's n − 1; common practice, no source).
 */
export function welchDfInterval(df: number): [number, number] {
  return [Math.max(df - 0.5, 1), df + 1];
}

/** The df as resultDfInterval reads it, in words. */
export function describeResultDf(result: LinkedResult): string {
  const df = result.report.df;
  if (!df) return '';
  if (!roundedWelchDf(result)) return describeDf(df);
  const [lo, hi] = resultDfInterval(result);
  return `df = ${df.printed} (Welch's test, a df printed whole, rounded or cut: read as ${showNumber(lo)} to ${showNumber(hi)})`;
}

const roundedWelchDf = (result: LinkedResult): boolean =>
  result.report.df !== undefined && isWholeDf(result.report.df) && result.testName?.variant === 'welch' && result.testName.namesWelchTest === true && result.context.coefficient === undefined;

/** The unit of the last printed digit of a reported p, when it is an `=` value. */
export function pLastDigit(p: ReportedP): number | undefined {
  if (p.kind !== 'value' || !p.number) return undefined;
  return lastDigitUnit(p.number.decimals) * 10 ** p.number.exponent;
}
