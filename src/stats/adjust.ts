import type { Interval } from './pRange.js';

/**
 * Bonferroni-adjusted p for m comparisons: min(1, m·p) (Bonferroni 1936; Dunn 1961, from
 * memory), applied to both ends of an interval of p (the map is monotone). NaN for m < 1 or
 * p outside [0, 1].
 */
export function bonferroniAdjusted(p: Interval, m: number): Interval {
  if (!(m >= 1) || !(p.low >= 0) || !(p.high <= 1)) return { low: NaN, high: NaN };
  return { low: Math.min(1, m * p.low), high: Math.min(1, m * p.high) };
}

/**
 * Šidák-adjusted p for m comparisons: 1 − (1 − p)^m (Šidák 1967, from memory), computed as
 * −expm1(m·log1p(−p)) so small p keep their digits; monotone in p. NaN as for Bonferroni.
 */
export function sidakAdjusted(p: Interval, m: number): Interval {
  if (!(m >= 1) || !(p.low >= 0) || !(p.high <= 1)) return { low: NaN, high: NaN };
  const f = (x: number) => (x >= 1 ? 1 : -Math.expm1(m * Math.log1p(-x)));
  return { low: f(p.low), high: f(p.high) };
}

/**
 * Every value an adjusted p can take when the unadjusted p lies in `p`, for a correction of the
 * named kind over `m` comparisons (undefined when the text does not say how many; at least 2).
 * Bonferroni and Šidák: their formulas. Holm, Hochberg and Benjamini–Hochberg: at least p and at
 * most min(1, m·p), since each multiplies a p by at most m and gives no p below its own
 * (Holm 1979; Hochberg 1988; Benjamini & Hochberg 1995; the bounds follow from their step-down
 * and step-up formulas, from memory). Any other or unnamed correction: at least p.
 */
export function adjustedPRange(method: 'bonferroni' | 'sidak' | 'holm' | 'hochberg' | 'fdr' | 'unspecified', m: number | undefined, p: Interval): Interval {
  const k = m ?? 2;
  if (method === 'bonferroni') {
    const r = bonferroniAdjusted(p, k);
    return m === undefined ? { low: r.low, high: 1 } : r;
  }
  if (method === 'sidak') {
    const r = sidakAdjusted(p, k);
    return m === undefined ? { low: r.low, high: 1 } : r;
  }
  if (method === 'unspecified' || m === undefined) return { low: p.low, high: 1 };
  return { low: p.low, high: Math.min(1, m * p.high) };
}
