import type { Interval } from './pRange.js';

/** A value known only to lie in [low, high] (a printed number's rounding interval). */
export type Box = [number, number];

/**
 * Range of |t| = |a| / s over a ∈ box, s ∈ [sLow, sHigh] with sLow > 0: |a| is smallest at
 * the point of the box nearest 0, and t is monotone in both, so the corners decide.
 */
function absRatioRange(a: Box, s: Box): Interval {
  const absLow = a[0] <= 0 && a[1] >= 0 ? 0 : Math.min(Math.abs(a[0]), Math.abs(a[1]));
  const absHigh = Math.max(Math.abs(a[0]), Math.abs(a[1]));
  return { low: absLow / s[1], high: absHigh / s[0] };
}

/**
 * One-sample t = (M − μ0) / (SD / √n), as a range of |t| over the rounding boxes of M and SD
 * (μ0 and n exact). Also the paired t from the mean and SD of the differences.
 * NaN bounds when n < 2 or SD ≤ 0. Common practice, no source.
 */
export function oneSampleAbsT(mean: Box, sd: Box, n: number, mu0 = 0): Interval {
  if (!(n >= 2) || !(sd[1] > 0)) return { low: NaN, high: NaN };
  const root = Math.sqrt(n);
  return absRatioRange([mean[0] - mu0, mean[1] - mu0], [Math.max(sd[0], 0) / root || Number.MIN_VALUE, sd[1] / root]);
}

/**
 * Student's pooled two-sample t = (M1 − M2) / (sp √(1/n1 + 1/n2)), sp² = ((n1−1)SD1² +
 * (n2−1)SD2²) / (n1 + n2 − 2); |t| range over the boxes of the means and SDs (ns exact).
 * sp grows with each SD, so the corners decide. Common practice, no source.
 */
export function studentAbsT(m1: Box, sd1: Box, n1: number, m2: Box, sd2: Box, n2: number): Interval {
  if (!(n1 >= 1 && n2 >= 1 && n1 + n2 > 2)) return { low: NaN, high: NaN };
  const pooled = (a: number, b: number) => Math.sqrt(((n1 - 1) * a * a + (n2 - 1) * b * b) / (n1 + n2 - 2)) * Math.sqrt(1 / n1 + 1 / n2);
  const se: Box = [pooled(Math.max(sd1[0], 0), Math.max(sd2[0], 0)) || Number.MIN_VALUE, pooled(sd1[1], sd2[1])];
  return absRatioRange([m1[0] - m2[1], m1[1] - m2[0]], se);
}

/** Welch's t = (M1 − M2) / √(SD1²/n1 + SD2²/n2); |t| range over the boxes. Common practice, no source. */
export function welchAbsT(m1: Box, sd1: Box, n1: number, m2: Box, sd2: Box, n2: number): Interval {
  if (!(n1 >= 2 && n2 >= 2)) return { low: NaN, high: NaN };
  const se = (a: number, b: number) => Math.sqrt((a * a) / n1 + (b * b) / n2);
  return absRatioRange([m1[0] - m2[1], m1[1] - m2[0]], [se(Math.max(sd1[0], 0), Math.max(sd2[0], 0)) || Number.MIN_VALUE, se(sd1[1], sd2[1])]);
}

/**
 * Welch–Satterthwaite df = (a + b)² / (a²/(n1−1) + b²/(n2−1)), a = SD1²/n1, b = SD2²/n2,
 * as a range over the SD boxes. df depends on the ratio ρ = a/b only, rising to a single
 * maximum at ρ = (n1−1)/(n2−1) and falling on both sides, so the range comes from the ends
 * of ρ's interval and, when inside it, that maximum (Welch 1947; Satterthwaite 1946).
 */
export function welchDfRange(sd1: Box, n1: number, sd2: Box, n2: number): Interval {
  if (!(n1 >= 2 && n2 >= 2)) return { low: NaN, high: NaN };
  const dfAt = (rho: number) => {
    if (rho === Infinity) return n1 - 1;
    return (rho + 1) ** 2 / ((rho * rho) / (n1 - 1) + 1 / (n2 - 1));
  };
  const a = (sd: number) => (sd * sd) / n1;
  const b = (sd: number) => (sd * sd) / n2;
  const rhoLow = b(sd2[1]) > 0 ? a(Math.max(sd1[0], 0)) / b(sd2[1]) : Infinity;
  const rhoHigh = b(Math.max(sd2[0], 0)) > 0 ? a(sd1[1]) / b(Math.max(sd2[0], 0)) : Infinity;
  const ends = [dfAt(rhoLow), dfAt(rhoHigh)];
  const peak = (n1 - 1) / (n2 - 1);
  const values = peak >= rhoLow && peak <= rhoHigh ? [...ends, dfAt(peak)] : ends;
  return { low: Math.min(...values), high: Math.max(...values) };
}

/**
 * The correlation between two paired measurements implied by their means, SDs, n and the
 * paired t: SD_diff = |M1 − M2| √n / |t|, r = (SD1² + SD2² − SD_diff²) / (2 SD1 SD2), as a
 * range over the boxes of every input. r falls as SD_diff grows, and SD_diff grows with
 * |M1 − M2| and falls with |t|. In SD1 (for fixed SD2 and SD_diff) r = SD1/(2 SD2) + c/SD1 is
 * either increasing or convex, so its maximum is at an end of SD1's box and its minimum at an
 * end or at SD1 = √(SD2² − SD_diff²); by symmetry the same holds in SD2. The maximum is taken
 * over the corners; the minimum over a fine grid of SD2 with SD1 minimised exactly. Outside
 * [−1, 1] the numbers cannot all be true. Common practice, no source.
 */
export function pairedImpliedCorrelation(m1: Box, sd1: Box, m2: Box, sd2: Box, n: number, absT: Box): Interval {
  const diff: Box = [m1[0] - m2[1], m1[1] - m2[0]];
  const dLow = diff[0] <= 0 && diff[1] >= 0 ? 0 : Math.min(Math.abs(diff[0]), Math.abs(diff[1]));
  const dHigh = Math.max(Math.abs(diff[0]), Math.abs(diff[1]));
  const root = Math.sqrt(n);
  const sdDiffLow = absT[1] > 0 ? (dLow * root) / absT[1] : 0;
  const sdDiffHigh = absT[0] > 0 ? (dHigh * root) / absT[0] : Infinity;
  const r = (s1: number, s2: number, sdd: number) => (s1 * s1 + s2 * s2 - sdd * sdd) / (2 * s1 * s2);
  const lo1 = Math.max(sd1[0], Number.MIN_VALUE);
  const lo2 = Math.max(sd2[0], Number.MIN_VALUE);
  let high = -Infinity;
  for (const s1 of [lo1, sd1[1]]) for (const s2 of [lo2, sd2[1]]) high = Math.max(high, r(s1, s2, sdDiffLow));
  let low = Infinity;
  if (sdDiffHigh === Infinity) low = -Infinity;
  else {
    const steps = 64;
    for (let j = 0; j <= steps; j += 1) {
      const s2 = lo2 + ((sd2[1] - lo2) * j) / steps;
      const inner = s2 * s2 - sdDiffHigh * sdDiffHigh;
      const candidates = [lo1, sd1[1]];
      if (inner > 0) candidates.push(Math.min(sd1[1], Math.max(lo1, Math.sqrt(inner))));
      for (const s1 of candidates) low = Math.min(low, r(s1, s2, sdDiffHigh));
    }
  }
  return { low, high };
}
