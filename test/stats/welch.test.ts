import { describe, expect, it } from 'vitest';
import { welchWithinDf } from '../../src/rule-api/descriptives.js';
import { welchAbsT, welchDfRange } from '../../src/stats/index.js';

/**
 * Welch–Satterthwaite df against scipy: scipy.stats.ttest_ind(a, b, equal_var=False).df (scipy
 * 1.17, Debian's python3-scipy) on samples scaled to exactly the SDs below. Its bounds
 * min(n1, n2) − 1 ≤ df ≤ n1 + n2 − 2 (Welch 1947; Satterthwaite 1946; recalled from memory) are
 * checked on scipy's values, and the sizes welchWithinDf allows must include the true ones.
 */
const SCIPY: Array<[number, number, number, number, number]> = [
  // sd1, sd2, n1, n2, scipy's Welch df
  [1.97, 4.68, 2, 26, 2.041329],
  [1.97, 4.68, 26, 2, 1.027438],
  [1.97, 4.68, 14, 14, 17.466717],
  [10.0, 1.0, 5, 200, 4.002],
  [1.0, 10.0, 5, 200, 43.53125],
  [3.0, 3.0, 30, 30, 58.0],
  [0.5, 8.0, 40, 3, 2.001172],
  [7.0, 5.1, 40, 40, 71.302054],
];

describe('Welch df and the group sizes it allows', () => {
  it.each(SCIPY)('SDs %s and %s, n %s and %s: df as scipy gives it, within min(n) − 1 and n1 + n2 − 2', (sd1, sd2, n1, n2, df) => {
    const range = welchDfRange([sd1, sd1], n1, [sd2, sd2], n2);
    expect(range.low).toBeCloseTo(df, 5);
    expect(range.high).toBeCloseTo(df, 5);
    expect(df).toBeGreaterThanOrEqual(Math.min(n1, n2) - 1 - 1e-9);
    expect(df).toBeLessThanOrEqual(n1 + n2 - 2 + 1e-9);
  });
  it.each(SCIPY)('SDs %s and %s, n %s and %s: the sizes the df printed to two decimals allows include the true ones', (_sd1, _sd2, n1, n2, df) => {
    const printed = Math.round(df * 100) / 100;
    const bound = welchWithinDf([printed - 0.005, printed + 0.005]);
    expect(bound).toBeDefined();
    expect(Math.min(n1, n2)).toBeLessThanOrEqual(bound!.maxSmaller);
    expect(n1 + n2).toBeGreaterThanOrEqual(bound!.minTotal);
  });
  it('|t| rises with each group size, toward its limit with infinitely many units in one group', () => {
    const at = (n1: number, n2: number) => welchAbsT([4.36, 4.36], [1.97, 1.97], n1, [0, 0], [4.68, 4.68], n2).low;
    expect(at(2, 26)).toBeLessThan(at(2, 27));
    expect(at(2, 1000)).toBeLessThan(at(2, Infinity));
    // limit: 4.36 / (1.97 / √2), common practice, no source
    expect(at(2, Infinity)).toBeCloseTo(4.36 / (1.97 / Math.SQRT2), 10);
    // scipy.stats.ttest_ind_from_stats(7.34, 1.97, 2, 2.98, 4.68, 26, equal_var=False).statistic = 2.613614857955438
    expect(at(2, 26)).toBeCloseTo(2.613614857955438, 10);
  });
});
