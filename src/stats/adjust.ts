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
