import betainc from '@stdlib/math-base-special-betainc';
import gammaln from '@stdlib/math-base-special-gammaln';
import { twoSidedPFromT } from './tDistribution.js';
import type { Interval } from './pRange.js';

/**
 * Upper tail of the F distribution: P(F >= f) for F ~ F(df1, df2).
 *
 * Definition: I_{df2/(df2 + df1·f)}(df2/2, df1/2), the regularized incomplete beta function
 * (common practice, no source). Both arguments are formed directly as fractions, so no
 * subtraction costs precision; when df1·f is small against df2 the complementary form
 * 1 − I_{df1·f/(df2 + df1·f)}(df1/2, df2/2) is taken through betainc's upper flag instead.
 * Domain: df1, df2 > 0 (real: Greenhouse–Geisser, Huynh–Feldt and Welch give fractional df),
 * f >= 0. Edge behaviour: f = 0 gives 1, f = Infinity gives 0, anything outside the domain
 * NaN. Accuracy: checked against scipy.stats.f.sf in fixtures/reference/other-tails.json.
 */
export function upperPFromF(f: number, df1: number, df2: number): number {
  if (Number.isNaN(f) || f < 0 || !(df1 > 0 && df1 < Infinity) || !(df2 > 0 && df2 < Infinity)) return NaN;
  if (f === 0) return 1;
  if (!Number.isFinite(f)) return 0;
  const a = df1 * f;
  if (a < df2) return betainc(a / (df2 + a), df1 / 2, df2 / 2, true, true);
  return betainc(df2 / (df2 + a), df2 / 2, df1 / 2, true, false);
}

/**
 * Upper tail of χ²: P(X >= x) for X ~ χ²(df) = Q(df/2, x/2), the regularized upper
 * incomplete gamma function (common practice, no source). Domain: df > 0, x >= 0; x = 0
 * gives 1, x = Infinity gives 0, anything else NaN. Accuracy: checked against
 * scipy.stats.chi2.sf in fixtures/reference/other-tails.json.
 */
export function upperPFromChiSquare(x: number, df: number): number {
  if (Number.isNaN(x) || x < 0 || !(df > 0 && df < Infinity)) return NaN;
  if (x === 0) return 1;
  if (!Number.isFinite(x)) return 0;
  return upperGammaQ(df / 2, x / 2);
}

/**
 * Two-sided p of a standard normal statistic: P(|Z| >= |z|) = erfc(|z|/√2) = Q(1/2, z²/2)
 * (common practice, no source). NaN for NaN; 0 for infinite z. Accuracy: checked against
 * scipy.stats.norm.sf in fixtures/reference/other-tails.json.
 */
export function twoSidedPFromZ(z: number): number {
  if (Number.isNaN(z)) return NaN;
  if (z === 0) return 1;
  if (!Number.isFinite(z)) return 0;
  return upperGammaQ(0.5, (z * z) / 2);
}

/**
 * The t of a Pearson correlation tested against 0: t = r·√(df / (1 − r²)) with df = n − 2
 * (common practice, no source). |r| = 1 gives ±Infinity; |r| > 1 or df <= 0 gives NaN.
 */
export function tFromR(r: number, df: number): number {
  if (Number.isNaN(r) || Math.abs(r) > 1 || !(df > 0)) return NaN;
  if (Math.abs(r) === 1) return r * Infinity;
  return r * Math.sqrt(df / ((1 - r) * (1 + r)));
}

/** Two-sided p of a Pearson r with df = n − 2, through tFromR and Student's t. */
export function twoSidedPFromR(r: number, df: number): number {
  return twoSidedPFromT(tFromR(r, df), df);
}

/**
 * Range of the upper-tail p of F over a box of f, df1 and df2. p falls as f grows, so the
 * extremes over f sit at its ends; over the dfs p is smooth but not monotone, so each end is
 * evaluated on a 5 × 5 grid over the df box and the range is widened by the largest change
 * between neighbouring grid points (a bound on what the grid can miss in a box this small).
 * Whole dfs are exact, so their box is a point and only the corners count.
 */
export function upperPRangeF(fLow: number, fHigh: number, df1Low: number, df1High: number, df2Low: number, df2High: number): Interval {
  const lowEnd = extremeOverDfs((a, b) => upperPFromF(fHigh, a, b), df1Low, df1High, df2Low, df2High);
  const highEnd = fLow <= 0 ? { min: 1, max: 1, slack: 0 } : extremeOverDfs((a, b) => upperPFromF(fLow, a, b), df1Low, df1High, df2Low, df2High);
  return { low: Math.max(0, lowEnd.min - lowEnd.slack), high: Math.min(1, highEnd.max + highEnd.slack) };
}

/**
 * Range of the upper-tail p of F under a sphericity correction whose factor is not printed: both
 * dfs multiplied by one ε from its lower bound 1/df1 to 1 (Greenhouse & Geisser, 1959, take
 * ε·df1 and ε·df2, with ε ≥ 1/(k − 1) = 1/df1; Huynh–Feldt's ε is used the same way, capped at
 * 1), and f over [fLow, fHigh]. p falls as f grows, so the lower end is taken at fHigh and the
 * upper at fLow. Over ε, p is smooth but not monotone (for f a little above 1 it rises and then
 * falls), so each end is found on a grid of ε and refined by a golden-section search around the
 * best grid point. `df1` and `df2` are the uncorrected, whole dfs; df1 >= 2 (with df1 = 1, ε is 1).
 */
export function upperPRangeFSphericity(fLow: number, fHigh: number, df1: number, df2: number): Interval {
  const eps0 = 1 / df1;
  const at = (f: number) => (e: number) => upperPFromF(f, e * df1, e * df2);
  const low = extremeOverEpsilon(at(fHigh), eps0, 1, 1);
  const high = fLow <= 0 ? 1 : extremeOverEpsilon(at(fLow), eps0, 1, -1);
  return { low: Math.max(0, low), high: Math.min(1, high) };
}

/**
 * The smallest (sign 1) or largest (sign −1) value of a smooth g over [a, b]: a grid, then a
 * golden-section search over the grid cells beside its best point (the grid points stay
 * candidates, so the search can only improve on them).
 */
function extremeOverEpsilon(g: (e: number) => number, a: number, b: number, sign: 1 | -1): number {
  const steps = 64;
  let best = 0;
  let bestValue = Infinity;
  for (let i = 0; i <= steps; i += 1) {
    const v = sign * g(a + ((b - a) * i) / steps);
    if (v < bestValue) {
      bestValue = v;
      best = i;
    }
  }
  // the cells on both sides of the best grid point; one cell at an end of [a, b], where the
  // extreme may lie inside the first or the last cell
  let lo = a + ((b - a) * Math.max(best - 1, 0)) / steps;
  let hi = a + ((b - a) * Math.min(best + 1, steps)) / steps;
  const r = (Math.sqrt(5) - 1) / 2;
  let x1 = hi - r * (hi - lo);
  let x2 = lo + r * (hi - lo);
  let f1 = sign * g(x1);
  let f2 = sign * g(x2);
  bestValue = Math.min(bestValue, f1, f2);
  for (let k = 0; k < 80 && hi - lo > 1e-13; k += 1) {
    if (f1 <= f2) {
      hi = x2;
      x2 = x1;
      f2 = f1;
      x1 = hi - r * (hi - lo);
      f1 = sign * g(x1);
    } else {
      lo = x1;
      x1 = x2;
      f1 = f2;
      x2 = lo + r * (hi - lo);
      f2 = sign * g(x2);
    }
    bestValue = Math.min(bestValue, f1, f2);
  }
  return sign * bestValue;
}

/**
 * Range of the upper-tail p of χ² over x in [xLow, xHigh] and df in [dfLow, dfHigh]: p falls
 * as x grows and rises as df grows (χ²(k) is a sum of k squares, stochastically increasing in
 * k; common practice, no source), so the extremes are corners.
 */
export function upperPRangeChiSquare(xLow: number, xHigh: number, dfLow: number, dfHigh: number): Interval {
  return { low: upperPFromChiSquare(xHigh, dfLow), high: xLow <= 0 ? 1 : upperPFromChiSquare(xLow, dfHigh) };
}

/** Range of the two-sided p of z over [zLow, zHigh]; an interval holding 0 reaches 1. */
export function twoSidedPRangeZ(zLow: number, zHigh: number): Interval {
  const absLow = zLow <= 0 && zHigh >= 0 ? 0 : Math.min(Math.abs(zLow), Math.abs(zHigh));
  const absHigh = Math.max(Math.abs(zLow), Math.abs(zHigh));
  return { low: twoSidedPFromZ(absHigh), high: absLow === 0 ? 1 : twoSidedPFromZ(absLow) };
}

/**
 * Range of the two-sided p of r over [rLow, rHigh] (clipped to [−1, 1]) and df in [dfLow,
 * dfHigh]: |t| grows with |r| and with df, and p falls with both |t| and df, so the extremes are
 * corners.
 */
export function twoSidedPRangeR(rLow: number, rHigh: number, dfLow: number, dfHigh: number): Interval {
  const lo = Math.max(-1, rLow);
  const hi = Math.min(1, rHigh);
  const absLow = lo <= 0 && hi >= 0 ? 0 : Math.min(Math.abs(lo), Math.abs(hi));
  const absHigh = Math.max(Math.abs(lo), Math.abs(hi));
  return { low: twoSidedPFromR(absHigh, dfHigh), high: absLow === 0 ? 1 : twoSidedPFromR(absLow, dfLow) };
}

function extremeOverDfs(p: (df1: number, df2: number) => number, a0: number, a1: number, b0: number, b1: number): { min: number; max: number; slack: number } {
  const steps = 4;
  const grid: number[][] = [];
  for (let i = 0; i <= steps; i += 1) {
    const row: number[] = [];
    for (let j = 0; j <= steps; j += 1) row.push(p(a0 + ((a1 - a0) * i) / steps, b0 + ((b1 - b0) * j) / steps));
    grid.push(row);
  }
  let min = Infinity;
  let max = -Infinity;
  let slack = 0;
  for (let i = 0; i <= steps; i += 1) {
    for (let j = 0; j <= steps; j += 1) {
      const v = (grid[i] as number[])[j] as number;
      min = Math.min(min, v);
      max = Math.max(max, v);
      if (i < steps) slack = Math.max(slack, Math.abs(v - ((grid[i + 1] as number[])[j] as number)));
      if (j < steps) slack = Math.max(slack, Math.abs(v - ((grid[i] as number[])[j + 1] as number)));
    }
  }
  return { min, max, slack };
}

/**
 * Regularized upper incomplete gamma Q(a, x) for a > 0, x > 0: the series for P when
 * x < a + 1 (Q = 1 − P), else the continued fraction for Q, evaluated by the modified Lentz
 * method; the prefactor x^a·e^−x / Γ(a) is formed in logs, so Q stays accurate down to the
 * smallest doubles (the method is the textbook one, common practice, no source; its accuracy
 * is checked against scipy in fixtures/reference/other-tails.json).
 */
function upperGammaQ(a: number, x: number): number {
  const logPrefactor = a * Math.log(x) - x - gammaln(a);
  if (x < a + 1) {
    // P(a, x) = prefactor/a · Σ x^n / ((a+1)…(a+n))
    let term = 1 / a;
    let sum = term;
    for (let n = 1; n < 100000; n += 1) {
      term *= x / (a + n);
      sum += term;
      if (Math.abs(term) < Math.abs(sum) * 1e-17) break;
    }
    return Math.max(0, 1 - sum * Math.exp(logPrefactor));
  }
  const tiny = 1e-300;
  let b = x + 1 - a;
  let c = 1 / tiny;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < 100000; i += 1) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < tiny) d = tiny;
    c = b + an / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return Math.exp(logPrefactor) * h;
}

/**
 * Partial η² from an F and its dfs: η²p = F·df1 / (F·df1 + df2) (common practice, no source;
 * the identity SS_effect / (SS_effect + SS_error) with F = (SS_effect/df1) / (SS_error/df2)).
 * It grows with F and df1 and falls with df2, so its range over a box of F, df1 and df2 is
 * given by the box's corners. NaN outside F >= 0, df1, df2 > 0.
 */
export function partialEtaSquaredFromF(f: number, df1: number, df2: number): number {
  if (!(f >= 0) || !(df1 > 0) || !(df2 > 0)) return NaN;
  if (!Number.isFinite(f)) return 1;
  return (f * df1) / (f * df1 + df2);
}

/** The range of partial η² over F in [fLow, fHigh], df1 in [df1Low, df1High], df2 in [df2Low, df2High]. */
export function partialEtaSquaredRange(fLow: number, fHigh: number, df1Low: number, df1High: number, df2Low: number, df2High: number): Interval {
  return { low: partialEtaSquaredFromF(Math.max(0, fLow), df1Low, df2High), high: partialEtaSquaredFromF(fHigh, df1High, df2Low) };
}
