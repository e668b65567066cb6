import type { EstimateReport, ReportedNumber } from '../extract/types.js';
import { distanceBetween, quotientRange } from '../stats/index.js';
import { showBound } from './format.js';
import { numberInterval } from './intervals.js';

/** What a coefficient and its SE give for b / SE, how far a printed statistic stands from it, and the inputs as a finding names them. */
export interface CoefficientRatio {
  low: number;
  high: number;
  /** 0 when the printed statistic, of either sign, meets [low, high]. */
  gap: number;
  inputs: string[];
}

/**
 * b / SE over the rounding intervals of a coefficient and its SE (quotientRange), against a
 * printed statistic (a regression's t or z) of either sign: some print |t| whatever the
 * coefficient's sign. Undefined when nothing can be checked: a value that is not a finite
 * number, or an SE printed as 0.00, which allows any ratio.
 */
export function coefficientRatio(coefficient: EstimateReport & { se: ReportedNumber }, statistic: ReportedNumber): CoefficientRatio | undefined {
  const { value: b, se } = coefficient;
  if (!Number.isFinite(b.value) || !Number.isFinite(se.value) || !Number.isFinite(statistic.value)) return undefined;
  const [b0, b1] = numberInterval(b);
  const [s0, s1] = numberInterval(se);
  if (!(s0 > 0)) return undefined;
  const range = quotientRange(b0, b1, s0, s1);
  if (Number.isNaN(range.low) || Number.isNaN(range.high)) return undefined;
  const [x0, x1] = numberInterval(statistic);
  const gap = Math.min(distanceBetween(range, x0, x1), distanceBetween(range, -x1, -x0));
  return {
    low: range.low,
    high: range.high,
    gap,
    inputs: [
      `${coefficient.printed.trim()} (read as ${showBound(b0, b.decimals, b.exponent)} to ${showBound(b1, b.decimals, b.exponent)})`,
      `SE = ${se.printed.trim()} (read as ${showBound(s0, se.decimals, se.exponent)} to ${showBound(s1, se.decimals, se.exponent)})`,
    ],
  };
}
