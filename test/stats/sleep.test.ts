import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { twoSidedPFromT } from '../../src/stats/index.js';

/**
 * Student's sleep data (1908), as shipped in R's `datasets::sleep`: extra hours of sleep for ten
 * patients under two drugs (the same patients, so paired). Open dataset; the raw values and R's
 * printed results below are from memory of R's `?sleep` / `?t.test` examples:
 *   paired: t = -4.0621, df = 9, p-value = 0.002833
 *   Welch:  t = -1.8608, df = 17.776, p-value = 0.07939
 * scipy.stats.ttest_rel / ttest_ind(equal_var=False) on the same values agree to every printed digit.
 */
const drug1 = [0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0];
const drug2 = [1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4];

const mean = (x: number[]) => x.reduce((s, v) => s + v, 0) / x.length;
const variance = (x: number[]) => {
  const m = mean(x);
  return x.reduce((s, v) => s + (v - m) ** 2, 0) / (x.length - 1);
};

describe("Student's sleep data, recomputed from the raw values", () => {
  it('paired t-test: t = -4.0621, df = 9, p = 0.002833', () => {
    const d = drug1.map((v, i) => v - (drug2[i] as number));
    const t = mean(d) / Math.sqrt(variance(d) / d.length);
    expect(t).toBeCloseTo(-4.0621, 4);
    expect(twoSidedPFromT(t, d.length - 1)).toBeCloseTo(0.002833, 6);
  });

  it("Welch's t-test: t = -1.8608, df = 17.776, p = 0.07939", () => {
    const [v1, v2] = [variance(drug1) / drug1.length, variance(drug2) / drug2.length];
    const t = (mean(drug1) - mean(drug2)) / Math.sqrt(v1 + v2);
    const df = (v1 + v2) ** 2 / (v1 ** 2 / (drug1.length - 1) + v2 ** 2 / (drug2.length - 1));
    expect(t).toBeCloseTo(-1.8608, 4);
    expect(df).toBeCloseTo(17.776, 3);
    expect(twoSidedPFromT(t, df)).toBeCloseTo(0.07939, 5);
  });

  it('the printed results pass every rule; a mis-stated p does not', () => {
    const clean = checkSource(
      'sleep.md',
      'The second drug added more sleep, paired t(9) = -4.0621, p = 0.002833. Treated as independent groups, Welch\'s t(17.776) = -1.8608, p = 0.07939.\n',
    );
    expect(clean.results).toHaveLength(2);
    expect(clean.findings).toEqual([]);
    const wrong = checkSource('sleep.md', 'The second drug added more sleep, paired t(9) = -4.0621, p = 0.02833.\n');
    expect(wrong.findings.map((f) => f.ruleId)).toEqual(['p-follows-from-t']);
  });
});
