import { twoSidedPRange, type Interval } from './pRange.js';
import { log10TwoSidedPFromLog10T, log10TwoSidedPFromT } from './tDistribution.js';

/** A reported p as an interval of true values, with open or closed ends. */
export interface PInterval {
  low: number;
  high: number;
  lowOpen: boolean;
  highOpen: boolean;
}

export interface PConsistencyInput {
  /** Interval of t values the printed t allows (by rounding, or by a bound such as t > 4.72). */
  tLow: number;
  tHigh: number;
  dfLow: number;
  dfHigh: number;
  reported: PInterval;
}

export interface PConsistency {
  /** Two-tailed p over the t/df box. */
  twoSided: Interval;
  /** One-tailed p in the direction of t (half the two-tailed p). */
  oneSidedSame: Interval;
  /** One-tailed p against the direction of t (1 − half), as equivalence tests report. */
  oneSidedOpposite: Interval;
  fitsTwoSided: boolean;
  fitsOneSidedSame: boolean;
  fitsOneSidedOpposite: boolean;
}

/**
 * Which readings of the reported p (two-tailed; one-tailed either way) some combination of
 * t and df within their intervals reproduces. Pure: the caller decides what counts.
 */
export function checkPAgainstT(input: PConsistencyInput): PConsistency {
  const twoSided = twoSidedPRange(input.tLow, input.tHigh, input.dfLow, input.dfHigh);
  const oneSidedSame = { low: twoSided.low / 2, high: twoSided.high / 2 };
  const oneSidedOpposite = { low: 1 - twoSided.high / 2, high: 1 - twoSided.low / 2 };
  return readings(twoSided, oneSidedSame, oneSidedOpposite, input.reported);
}

/** The three readings of a p and which of them the reported p fits (on whatever scale they share). */
function readings(twoSided: Interval, oneSidedSame: Interval, oneSidedOpposite: Interval, reported: PInterval): PConsistency {
  return {
    twoSided,
    oneSidedSame,
    oneSidedOpposite,
    fitsTwoSided: meets(twoSided, reported),
    fitsOneSidedSame: meets(oneSidedSame, reported),
    fitsOneSidedOpposite: meets(oneSidedOpposite, reported),
  };
}

/** Whether a closed interval meets a reported interval, honouring its open ends. */
export function meets(range: Interval, reported: PInterval): boolean {
  const belowHigh = range.low < reported.high || (range.low === reported.high && !reported.highOpen);
  const aboveLow = range.high > reported.low || (range.high === reported.low && !reported.lowOpen);
  return belowHigh && aboveLow;
}

/**
 * The side of alpha an interval of p values lies on: 'below' when every value is < alpha,
 * 'above' when every value is ≥ alpha, 'straddles' otherwise. (p = alpha counts as not
 * significant: common practice, no source.)
 */
export function sideOfAlpha(low: number, high: number, alpha: number, highOpen = false): 'below' | 'above' | 'straddles' {
  if (high < alpha || (high === alpha && highOpen)) return 'below';
  if (low >= alpha) return 'above';
  return 'straddles';
}

/** Distance between a closed interval and a point or interval (0 when they meet). */
export function distanceBetween(range: Interval, low: number, high: number): number {
  if (range.high < low) return low - range.high;
  if (range.low > high) return range.low - high;
  return 0;
}

/**
 * checkPAgainstT on the scale of log10 p, for a reported p beyond or near the edge of the
 * double range (`p = 1e-400`): `reported` and every returned interval are decimal logarithms
 * of p. The same corners of the t/df box give the extremes (log10 is monotone). The one-tailed
 * p against t's direction, 1 − p/2, is taken as log10(1 − 10^x / 2) through log1p.
 */
export function checkLog10PAgainstT(input: PConsistencyInput): PConsistency {
  const absLow = input.tLow <= 0 && input.tHigh >= 0 ? 0 : Math.min(Math.abs(input.tLow), Math.abs(input.tHigh));
  const absHigh = Math.max(Math.abs(input.tLow), Math.abs(input.tHigh));
  const twoSided = { low: log10TwoSidedPFromT(absHigh, input.dfHigh), high: absLow === 0 ? 0 : log10TwoSidedPFromT(absLow, input.dfLow) };
  return log10Readings(twoSided, input.reported);
}

/**
 * checkLog10PAgainstT for a |t| given as the interval of its decimal logarithm (a printed t
 * beyond a double, `t = 2e1000`: [log10 1.5 + 1000, log10 2.5 + 1000]).
 */
export function checkLog10PAgainstLog10T(input: { log10AbsTLow: number; log10AbsTHigh: number; dfLow: number; dfHigh: number; reported: PInterval }): PConsistency {
  const twoSided = { low: log10TwoSidedPFromLog10T(input.log10AbsTHigh, input.dfHigh), high: log10TwoSidedPFromLog10T(input.log10AbsTLow, input.dfLow) };
  return log10Readings(twoSided, input.reported);
}

function log10Readings(twoSided: Interval, reported: PInterval): PConsistency {
  const oneSidedSame = { low: twoSided.low - Math.LOG10E * Math.LN2, high: twoSided.high - Math.LOG10E * Math.LN2 };
  const oppositeOf = (x: number) => Math.log1p(-(10 ** x) / 2) * Math.LOG10E;
  const oneSidedOpposite = { low: oppositeOf(twoSided.high), high: oppositeOf(twoSided.low) };
  return readings(twoSided, oneSidedSame, oneSidedOpposite, reported);
}
