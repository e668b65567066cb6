import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { associationRange, cramersV } from '../../src/stats/index.js';

const ref = JSON.parse(readFileSync(new URL('../../fixtures/reference/association.json', import.meta.url), 'utf8')) as {
  source: string;
  cases: Array<{ rows: number; cols: number; n: number; chiSquare: number; df: number; cramerV: number }>;
};

describe("Cramér's V against scipy.stats.contingency.association (fixtures/reference/association.json)", () => {
  it('holds seeded tables of several sizes, 2 × 2 among them', () => {
    expect(ref.cases.length).toBeGreaterThan(30);
    expect(ref.cases.some((c) => c.rows === 2 && c.cols === 2)).toBe(true);
    expect(ref.cases.some((c) => Math.min(c.rows, c.cols) > 2)).toBe(true);
  });
  it.each(ref.cases.map((c, i) => ({ ...c, i })))('table $i ($rows × $cols, N = $n)', (c) => {
    // scipy: stats.contingency.association(table, method="cramer")
    expect(cramersV(c.chiSquare, c.n, c.rows, c.cols)).toBeCloseTo(c.cramerV, 12);
    // scipy: stats.chi2_contingency(...).dof is (r − 1)(c − 1)
    expect(c.df).toBe((c.rows - 1) * (c.cols - 1));
    const k = Math.min(c.rows, c.cols) - 1;
    const r = associationRange(c.chiSquare, c.chiSquare, c.n, c.n, k);
    expect(r.low).toBeCloseTo(c.cramerV, 12);
    expect(r.high).toBeCloseTo(c.cramerV, 12);
  });
  it('widens with the rounding of χ² and N at the box corners', () => {
    const r = associationRange(5.25, 5.35, 120, 120, 1);
    expect(r.low).toBeCloseTo(Math.sqrt(5.25 / 120), 14);
    expect(r.high).toBeCloseTo(Math.sqrt(5.35 / 120), 14);
  });
  it('is NaN outside its domain', () => {
    expect(Number.isNaN(cramersV(3, 0, 2, 2))).toBe(true);
    expect(Number.isNaN(cramersV(3, 50, 1, 4))).toBe(true);
  });
});
