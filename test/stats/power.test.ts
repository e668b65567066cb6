import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { requiredN, tTestPower, type PowerDesign } from '../../src/stats/index.js';

interface Row {
  design: PowerDesign;
  d: number;
  alpha: number;
  sides: 1 | 2;
  target: number;
  requiredN: number;
  powerAtN: number;
  powerBelow: number | null;
}
const golden = JSON.parse(readFileSync(new URL('../../fixtures/reference/power.json', import.meta.url), 'utf8')) as { rows: Row[] };

describe("Cohen's (1988) power table for two independent groups (from memory)", () => {
  // n per group for power .80 at alpha .05 two-sided: 26, 64, 393 for d = 0.8, 0.5, 0.2. The
  // table's 393 comes from an approximation; the exact noncentral-t answer (scipy.stats.nct) is 394.
  it.each([
    [0.8, 26],
    [0.5, 64],
    [0.2, 394],
  ])('d = %d needs %d per group', (d, n) => {
    expect(requiredN('two-sample', 0.8, d, 0.05, 2)).toBe(n);
  });
});

describe('power and required n against scipy.stats.nct (fixtures/reference/power.json, scripts/make_power_reference.py)', () => {
  it.each(golden.rows.map((r) => [r.design, r.d, r.alpha, r.sides, r.target, r] as const))('%s, d = %d, alpha %d, %d-sided, power %d', (_a, _b, _c, _e, _f, r) => {
    expect(requiredN(r.design, r.target, r.d, r.alpha, r.sides)).toBe(r.requiredN);
    // absolute tolerance 1e-7 on power: jstat's noncentral t cdf against scipy's
    expect(Math.abs(tTestPower(r.design, r.requiredN, r.d, r.alpha, r.sides) - r.powerAtN)).toBeLessThan(1e-7);
    if (r.powerBelow !== null) expect(Math.abs(tTestPower(r.design, r.requiredN - 1, r.d, r.alpha, r.sides) - r.powerBelow)).toBeLessThan(1e-7);
  });
});

describe('properties', () => {
  it('power rises with n and with |d|, and one-sided power exceeds two-sided', () => {
    const ps = [5, 10, 20, 40, 80].map((n) => tTestPower('two-sample', n, 0.5, 0.05, 2));
    for (let i = 1; i < ps.length; i += 1) expect(ps[i]).toBeGreaterThan(ps[i - 1] as number);
    expect(tTestPower('paired', 20, 0.8, 0.05, 2)).toBeGreaterThan(tTestPower('paired', 20, 0.4, 0.05, 2));
    expect(tTestPower('one-sample', 20, 0.5, 0.05, 1)).toBeGreaterThan(tTestPower('one-sample', 20, 0.5, 0.05, 2));
  });
  it('power at d = 0 is alpha (common practice, no source)', () => {
    // tolerance 5e-9: jstat's noncentral t cdf is good to about 2e-10 here
    expect(tTestPower('two-sample', 30, 0, 0.05, 2)).toBeCloseTo(0.05, 8);
  });
});
