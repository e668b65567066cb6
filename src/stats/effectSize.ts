import gammaln from '@stdlib/math-base-special-gammaln';
import type { Interval } from './pRange.js';
import type { Box } from './summaryT.js';

/**
 * Cohen's d for two independent groups from t: |d| = |t| √(1/n1 + 1/n2) (pooled-SD d; Cohen
 * 1988; Lakens 2013, eq. 2). For a paired or one-sample test, d_z = |t| / √n (Lakens 2013, eq. 7).
 */
export function dFromTIndependent(absT: Box, n1: number, n2: number): Interval {
  const k = Math.sqrt(1 / n1 + 1 / n2);
  return { low: absT[0] * k, high: absT[1] * k };
}

export function dzFromT(absT: Box, n: number): Interval {
  const k = 1 / Math.sqrt(n);
  return { low: absT[0] * k, high: absT[1] * k };
}

/** |M1 − M2| over the boxes (0 when they overlap). */
function absDifference(m1: Box, m2: Box): Box {
  const lo = m1[0] - m2[1];
  const hi = m1[1] - m2[0];
  return [lo <= 0 && hi >= 0 ? 0 : Math.min(Math.abs(lo), Math.abs(hi)), Math.max(Math.abs(lo), Math.abs(hi))];
}

/** Pooled-SD d = |M1 − M2| / sp (Cohen 1988), over the boxes; sp grows with each SD. */
export function dFromMeansPooled(m1: Box, sd1: Box, n1: number, m2: Box, sd2: Box, n2: number): Interval {
  const sp = (a: number, b: number) => Math.sqrt(((n1 - 1) * a * a + (n2 - 1) * b * b) / (n1 + n2 - 2));
  const d = absDifference(m1, m2);
  return { low: d[0] / sp(sd1[1], sd2[1]), high: d[1] / Math.max(sp(sd1[0], sd2[0]), Number.MIN_VALUE) };
}

/** d_av = |M1 − M2| / ((SD1 + SD2) / 2), for paired designs (Cumming 2012; Lakens 2013, eq. 10). */
export function dAverage(m1: Box, sd1: Box, m2: Box, sd2: Box): Interval {
  const d = absDifference(m1, m2);
  return { low: d[0] / ((sd1[1] + sd2[1]) / 2), high: d[1] / Math.max((sd1[0] + sd2[0]) / 2, Number.MIN_VALUE) };
}

/**
 * Hedges' correction J(df) = Γ(df/2) / (√(df/2) Γ((df − 1)/2)), so g = J·d (Hedges 1981);
 * computed in logs. NaN for df ≤ 1.
 */
export function hedgesCorrection(df: number): number {
  if (!(df > 1)) return NaN;
  return Math.exp(gammaln(df / 2) - 0.5 * Math.log(df / 2) - gammaln((df - 1) / 2));
}
