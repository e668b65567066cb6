import type { Interval } from './pRange.js';

/** One group of a one-way design: its mean, its SD and its (whole) size. */
export interface GroupMoments {
  mean: number;
  sd: number;
  n: number;
}

/** One group as printed: the values its mean and SD may have under rounding, and its exact size. */
export interface GroupBox {
  mean: Interval;
  sd: Interval;
  n: number;
}

/**
 * The one-way analysis-of-variance F from each group's mean, SD and size:
 * F = MS_between / MS_within, MS_between = Σ nᵢ (mᵢ − m̄)² / (k − 1) with m̄ = Σ nᵢ mᵢ / N,
 * MS_within = Σ (nᵢ − 1) sᵢ² / (N − k) (the textbook decomposition of the total sum of squares;
 * common practice, no source). Checked against scipy.stats.f_oneway on raw data in
 * fixtures/reference/one-way-anova.json. NaN with fewer than two groups, a size below 1, a
 * negative SD, N ≤ k, or no spread within groups.
 */
export function oneWayF(groups: readonly GroupMoments[]): number {
  const k = groups.length;
  if (k < 2 || groups.some((g) => !(g.n >= 1) || !(g.sd >= 0) || !Number.isFinite(g.mean))) return NaN;
  const total = groups.reduce((s, g) => s + g.n, 0);
  if (!(total > k)) return NaN;
  const grand = groups.reduce((s, g) => s + g.n * g.mean, 0) / total;
  const between = groups.reduce((s, g) => s + g.n * (g.mean - grand) ** 2, 0) / (k - 1);
  const within = groups.reduce((s, g) => s + (g.n - 1) * g.sd ** 2, 0) / (total - k);
  return within > 0 ? between / within : NaN;
}

/** Largest number of groups whose box corners are searched for the largest between-group sum of squares (2^k corners). */
export const MAX_ANOVA_GROUPS = 12;

/**
 * The exact range of the one-way F over a box of means and SDs (each a closed interval) with
 * exact group sizes. Means and SDs enter apart, F = (SS_between(m) / (k − 1)) / (SS_within(s) /
 * (N − k)), so the range is [min SS_b / max SS_w, max SS_b / min SS_w] scaled by the dfs:
 *
 * - SS_within = Σ (nᵢ − 1) sᵢ² grows with each sᵢ ≥ 0: its ends are at the SD intervals' ends.
 * - SS_between(m) = Σ nᵢ (mᵢ − m̄)² is a convex quadratic (a weighted variance; F is not
 *   monotone in any one mean). Its maximum over a box is at a corner: all 2^k corners are
 *   searched (k ≤ MAX_ANOVA_GROUPS). Its minimum is min over c of Σ nᵢ dist(c, [loᵢ, hiᵢ])²,
 *   since Σ nᵢ (mᵢ − c)² is least at c = m̄ and, for a given c, each mᵢ is best clamped to c; that
 *   function of c is convex and quadratic between the sorted interval ends, so each piece's
 *   minimiser (the weighted mean of the ends that bind there, clamped to the piece) is tried.
 *
 * Both are exact up to floating-point rounding of the sums. NaN where `oneWayF` would be, or
 * with more than MAX_ANOVA_GROUPS groups, or a box whose lower SDs are all 0 (F unbounded).
 */
export function oneWayFRange(groups: readonly GroupBox[]): Interval {
  const nan = { low: NaN, high: NaN };
  const k = groups.length;
  if (k < 2 || k > MAX_ANOVA_GROUPS) return nan;
  if (groups.some((g) => !(g.n >= 1) || !(g.sd.low >= 0) || !(g.sd.high >= g.sd.low) || !(g.mean.high >= g.mean.low) || !Number.isFinite(g.mean.low) || !Number.isFinite(g.mean.high))) return nan;
  const total = groups.reduce((s, g) => s + g.n, 0);
  if (!(total > k)) return nan;
  const withinLow = groups.reduce((s, g) => s + (g.n - 1) * g.sd.low ** 2, 0);
  const withinHigh = groups.reduce((s, g) => s + (g.n - 1) * g.sd.high ** 2, 0);
  if (!(withinHigh > 0)) return nan;
  const betweenLow = minBetweenSumOfSquares(groups);
  const betweenHigh = maxBetweenSumOfSquares(groups, total);
  const scale = (total - k) / (k - 1);
  return { low: (betweenLow / withinHigh) * scale, high: withinLow > 0 ? (betweenHigh / withinLow) * scale : Infinity };
}

/** max over the box of Σ nᵢ (mᵢ − m̄)²: a convex function, so at one of the 2^k corners. */
function maxBetweenSumOfSquares(groups: readonly GroupBox[], total: number): number {
  const k = groups.length;
  let best = 0;
  for (let mask = 0; mask < 1 << k; mask += 1) {
    let sum = 0;
    for (let i = 0; i < k; i += 1) {
      const g = groups[i] as GroupBox;
      sum += g.n * (mask & (1 << i) ? g.mean.high : g.mean.low);
    }
    const grand = sum / total;
    let ss = 0;
    for (let i = 0; i < k; i += 1) {
      const g = groups[i] as GroupBox;
      ss += g.n * ((mask & (1 << i) ? g.mean.high : g.mean.low) - grand) ** 2;
    }
    if (ss > best) best = ss;
  }
  return best;
}

/** min over the box of Σ nᵢ (mᵢ − m̄)² = min over c of Σ nᵢ dist(c, [loᵢ, hiᵢ])² (see oneWayFRange). */
function minBetweenSumOfSquares(groups: readonly GroupBox[]): number {
  const cost = (c: number) => groups.reduce((s, g) => s + g.n * (c < g.mean.low ? g.mean.low - c : c > g.mean.high ? c - g.mean.high : 0) ** 2, 0);
  const ends = [...new Set(groups.flatMap((g) => [g.mean.low, g.mean.high]))].sort((a, b) => a - b);
  let best = Infinity;
  // the pieces: (−∞, e0], [e0, e1], …, [e_last, ∞); on each, the groups above c pull toward their low
  // end and those below toward their high end, and the cost is a quadratic in c
  for (let j = 0; j <= ends.length; j += 1) {
    const left = j === 0 ? -Infinity : (ends[j - 1] as number);
    const right = j === ends.length ? Infinity : (ends[j] as number);
    const probe = Number.isFinite(left) && Number.isFinite(right) ? (left + right) / 2 : Number.isFinite(left) ? left + 1 : right - 1;
    let weight = 0;
    let moment = 0;
    for (const g of groups) {
      if (probe < g.mean.low) {
        weight += g.n;
        moment += g.n * g.mean.low;
      } else if (probe > g.mean.high) {
        weight += g.n;
        moment += g.n * g.mean.high;
      }
    }
    const c = weight > 0 ? Math.min(right, Math.max(left, moment / weight)) : Number.isFinite(left) ? left : right;
    best = Math.min(best, cost(c));
    if (Number.isFinite(left)) best = Math.min(best, cost(left));
  }
  return best;
}
