import { twoSidedPFromT } from './tDistribution.js';

export interface Interval {
  low: number;
  high: number;
}

/**
 * Range of the two-tailed p over a box of t and df values: t in [tLow, tHigh], df in
 * [dfLow, dfHigh]. Two-tailed p falls as |t| grows and as df grows (the t family is ordered
 * in peakedness; common practice, no source — the property tests check it on the grid), so
 * the extremes sit at the corners: the largest |t| with the largest df gives the smallest p.
 * A t interval that holds 0 reaches p = 1. NaN bounds give NaN bounds.
 */
export function twoSidedPRange(tLow: number, tHigh: number, dfLow: number, dfHigh: number): Interval {
  const absLow = tLow <= 0 && tHigh >= 0 ? 0 : Math.min(Math.abs(tLow), Math.abs(tHigh));
  const absHigh = Math.max(Math.abs(tLow), Math.abs(tHigh));
  return {
    low: twoSidedPFromT(absHigh, dfHigh),
    high: absLow === 0 ? 1 : twoSidedPFromT(absLow, dfLow),
  };
}

/** Same box, one-tailed in the direction of t: half the two-tailed range. */
export function oneSidedPRange(tLow: number, tHigh: number, dfLow: number, dfHigh: number): Interval {
  const two = twoSidedPRange(tLow, tHigh, dfLow, dfHigh);
  return { low: two.low / 2, high: two.high / 2 };
}

/** Whether two closed intervals share a point (open ends are handled by the caller). */
export function intervalsMeet(a: Interval, b: Interval): boolean {
  return a.low <= b.high && b.low <= a.high;
}
