import { twoSidedPRange, type Interval } from './pRange.js';
import type { Box } from './summaryT.js';
import { twoSidedCriticalT } from './tDistribution.js';

/**
 * The half-width a CI at `level` must have when its standard error is |estimate| / |t|:
 * t*(df) · |estimate| / |t|, as a range over the boxes (t* from twoSidedCriticalT).
 */
export function ciHalfWidthFromT(estimate: Box, absT: Box, df: number, level: number): Interval {
  const crit = twoSidedCriticalT(1 - level, df);
  const absLow = estimate[0] <= 0 && estimate[1] >= 0 ? 0 : Math.min(Math.abs(estimate[0]), Math.abs(estimate[1]));
  const absHigh = Math.max(Math.abs(estimate[0]), Math.abs(estimate[1]));
  return { low: (crit * absLow) / absT[1], high: absT[0] > 0 ? (crit * absHigh) / absT[0] : Infinity };
}

/**
 * The two-tailed p implied by an estimate and its CI (the method of Altman & Bland, BMJ 2011,
 * "How to obtain the P value from a confidence interval", with the t distribution on df in
 * place of the normal): SE = (upper − lower) / (2 t*), t = estimate / SE, p from t and df.
 * A range over the boxes of the estimate and both limits.
 */
export function pFromConfidenceInterval(estimate: Box, lower: Box, upper: Box, df: number, level: number): Interval {
  const crit = twoSidedCriticalT(1 - level, df);
  const widthLow = Math.max(upper[0] - lower[1], Number.MIN_VALUE);
  const widthHigh = upper[1] - lower[0];
  const seLow = widthLow / (2 * crit);
  const seHigh = widthHigh / (2 * crit);
  const absLow = estimate[0] <= 0 && estimate[1] >= 0 ? 0 : Math.min(Math.abs(estimate[0]), Math.abs(estimate[1]));
  const absHigh = Math.max(Math.abs(estimate[0]), Math.abs(estimate[1]));
  return twoSidedPRange(absLow / seHigh, absHigh / seLow, df, df);
}
