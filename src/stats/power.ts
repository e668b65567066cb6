import jStat from 'jstat';
import { twoSidedCriticalT } from './tDistribution.js';

export type PowerDesign = 'two-sample' | 'paired' | 'one-sample';

/**
 * Power of a t-test against standardised effect d: the probability that |T| (two-sided) or T
 * (one-sided) exceeds its critical value when T has the noncentral t distribution with
 * df = 2n − 2 and noncentrality d·√(n/2) (two equal groups of n), or df = n − 1 and d·√n
 * (paired differences, one sample). Cohen (1988), ch. 2.
 *
 * Which library and why: jstat's `noncentralt.cdf` was measured here against
 * scipy.stats.nct.cdf at about 1e-9 absolute (fixtures/reference/power.json checks it), well
 * inside what a sample-size statement needs, so jstat is used. Critical values come from our
 * own twoSidedCriticalT. NaN for n < 2, d or alpha out of range.
 */
export function tTestPower(design: PowerDesign, n: number, d: number, alpha: number, sides: 1 | 2): number {
  if (!(n >= 2) || !(alpha > 0 && alpha < 1) || !Number.isFinite(d)) return NaN;
  const df = design === 'two-sample' ? 2 * n - 2 : n - 1;
  const ncp = Math.abs(d) * (design === 'two-sample' ? Math.sqrt(n / 2) : Math.sqrt(n));
  const crit = twoSidedCriticalT(sides === 2 ? alpha : 2 * alpha, df);
  const upper = 1 - jStat.noncentralt.cdf(crit, df, ncp);
  return sides === 2 ? upper + jStat.noncentralt.cdf(-crit, df, ncp) : upper;
}

/**
 * The smallest n (per group for two samples; pairs or participants otherwise) whose power
 * reaches `target`. Power rises with n, so a doubling search then bisection finds it; n is
 * searched up to 1e7. NaN when the target is not reachable there.
 */
export function requiredN(design: PowerDesign, target: number, d: number, alpha: number, sides: 1 | 2): number {
  if (!(target > 0 && target < 1) || !(d !== 0)) return NaN;
  let lo = 2;
  if (tTestPower(design, lo, d, alpha, sides) >= target) return lo;
  let hi = 4;
  while (tTestPower(design, hi, d, alpha, sides) < target) {
    lo = hi;
    hi *= 2;
    if (hi > 1e7) return NaN;
  }
  while (hi - lo > 1) {
    const mid = Math.floor((lo + hi) / 2);
    if (tTestPower(design, mid, d, alpha, sides) >= target) hi = mid;
    else lo = mid;
  }
  return hi;
}
