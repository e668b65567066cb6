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

/**
 * d_rm for a paired design: d_z · √(2(1 − r)) (Morris & DeShon 2002; Lakens 2013, eq. 9),
 * where r, the correlation between the two measurements, is the one the means, SDs, n and t
 * imply: SD_diff = |M1 − M2|·√n / |t| and r = (SD1² + SD2² − SD_diff²) / (2·SD1·SD2), kept
 * within [−1, 1]. Evaluated on a 3-point grid over each rounding box (the boxes are a few
 * last-digit units wide); NaN when t is 0 or an SD is 0.
 */
export function dRepeatedMeasures(m1: Box, sd1: Box, m2: Box, sd2: Box, n: number, absT: Box): Interval {
  const points = (b: Box) => [b[0], (b[0] + b[1]) / 2, b[1]];
  let low = Infinity;
  let high = -Infinity;
  for (const a of points(m1)) for (const b of points(m2)) for (const s1 of points(sd1)) for (const s2 of points(sd2)) for (const t of points(absT)) {
    if (!(t > 0) || !(s1 > 0) || !(s2 > 0)) continue;
    const sdDiff = (Math.abs(a - b) * Math.sqrt(n)) / t;
    const r = Math.max(-1, Math.min(1, (s1 * s1 + s2 * s2 - sdDiff * sdDiff) / (2 * s1 * s2)));
    const d = (t / Math.sqrt(n)) * Math.sqrt(2 * (1 - r));
    if (d < low) low = d;
    if (d > high) high = d;
  }
  return low <= high ? { low, high } : { low: NaN, high: NaN };
}
