import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  tFromR, twoSidedPFromR, twoSidedPFromZ, twoSidedPRangeR, twoSidedPRangeZ, upperPFromChiSquare, upperPFromF, upperPRangeChiSquare, upperPRangeF, upperPRangeFSphericity,
} from '../../src/stats/index.js';

// Reference values: mpmath at 60 digits, written by scripts/make_other_reference.py (scipy beside them).
const ref = JSON.parse(readFileSync(new URL('../../fixtures/reference/other-tails.json', import.meta.url), 'utf8')) as {
  f: Array<{ f: string; df1: string; df2: string; p: string; scipy: number }>;
  chiSquare: Array<{ x: string; df: string; p: string; scipy: number }>;
  z: Array<{ z: string; p: string; scipy: number }>;
  r: Array<{ r: string; df: string; p: string; scipy: number }>;
};

function relErr(got: number, want: number): number {
  if (want === 0) return got === 0 ? 0 : Infinity;
  return Math.abs(got - want) / want;
}

describe('tails against mpmath (fixtures/reference/other-tails.json)', () => {
  it('F upper tail (mpmath betainc; scipy.stats.f.sf beside it)', () => {
    let worst = 0;
    for (const c of ref.f) worst = Math.max(worst, relErr(upperPFromF(Number(c.f), Number(c.df1), Number(c.df2)), Number(c.p)));
    expect(ref.f.length).toBeGreaterThan(150);
    expect(worst).toBeLessThan(1e-11);
  });
  it('χ² upper tail (mpmath gammainc; scipy.stats.chi2.sf beside it)', () => {
    let worst = 0;
    for (const c of ref.chiSquare) worst = Math.max(worst, relErr(upperPFromChiSquare(Number(c.x), Number(c.df)), Number(c.p)));
    expect(worst).toBeLessThan(1e-11);
  });
  it('z two-sided (mpmath erfc; scipy.stats.norm.sf beside it)', () => {
    let worst = 0;
    for (const c of ref.z) worst = Math.max(worst, relErr(twoSidedPFromZ(Number(c.z)), Number(c.p)));
    expect(worst).toBeLessThan(1e-12);
  });
  it('r two-sided through t (mpmath; scipy.stats.t.sf beside it)', () => {
    let worst = 0;
    for (const c of ref.r) worst = Math.max(worst, relErr(twoSidedPFromR(Number(c.r), Number(c.df)), Number(c.p)));
    expect(worst).toBeLessThan(1e-11);
  });
  it('scipy agrees with mpmath on the same points (the fixture is sound)', () => {
    for (const c of ref.f) expect(relErr(c.scipy, Number(c.p))).toBeLessThan(1e-8);
    // below the double range scipy returns 0, as a double must
    for (const c of ref.chiSquare) if (Number(c.p) > 1e-300) expect(relErr(c.scipy, Number(c.p))).toBeLessThan(1e-8);
  });
});

describe('edges and worked values', () => {
  it('F(1, df) = t² gives the two-tailed p of t (common practice, no source)', () => {
    // scipy: stats.t.sf(2.1, 28)*2 = stats.f.sf(4.41, 1, 28) = 0.044863224128917
    expect(upperPFromF(2.1 ** 2, 1, 28)).toBeCloseTo(0.044863224128917, 12);
  });
  it('χ²(1) = z² gives the two-sided p of z (common practice, no source)', () => {
    expect(upperPFromChiSquare(1.96 ** 2, 1)).toBeCloseTo(twoSidedPFromZ(1.96), 14);
    // 1.96 gives .04999579 (scipy.stats.norm.sf(1.96)*2)
    expect(twoSidedPFromZ(1.96)).toBeCloseTo(0.04999579, 8);
  });
  it('domains', () => {
    expect(upperPFromF(0, 2, 10)).toBe(1);
    expect(upperPFromF(Infinity, 2, 10)).toBe(0);
    expect(upperPFromF(-1, 2, 10)).toBeNaN();
    expect(upperPFromChiSquare(3, 0)).toBeNaN();
    expect(tFromR(1.2, 10)).toBeNaN();
    expect(tFromR(1, 10)).toBe(Infinity);
    expect(twoSidedPFromZ(0)).toBe(1);
  });
});

describe('ranges over rounding boxes hold every point of the box', () => {
  // The range must contain p at every point of the box (checked on a dense grid).
  it('F with fractional dfs', () => {
    const [f0, f1, a0, a1, b0, b1] = [4.205, 4.215, 1.445, 1.455, 57.25, 57.35];
    const range = upperPRangeF(f0, f1, a0, a1, b0, b1);
    for (let i = 0; i <= 10; i += 1) for (let j = 0; j <= 10; j += 1) for (const f of [f0, (f0 + f1) / 2, f1]) {
      const p = upperPFromF(f, a0 + ((a1 - a0) * i) / 10, b0 + ((b1 - b0) * j) / 10);
      expect(p).toBeGreaterThanOrEqual(range.low);
      expect(p).toBeLessThanOrEqual(range.high);
    }
  });
  it('χ², r and z at the corners', () => {
    const c = upperPRangeChiSquare(6.05, 6.15, 2, 2);
    expect(c.low).toBeCloseTo(upperPFromChiSquare(6.15, 2), 15);
    expect(c.high).toBeCloseTo(upperPFromChiSquare(6.05, 2), 15);
    const r = twoSidedPRangeR(0.315, 0.325, 48, 48);
    expect(r.low).toBeCloseTo(twoSidedPFromR(0.325, 48), 15);
    expect(r.high).toBeCloseTo(twoSidedPFromR(0.315, 48), 15);
    expect(twoSidedPRangeZ(-0.005, 0.005).high).toBe(1);
  });
});

// Reference: scripts/make_sphericity_reference.py (scipy.stats.f.sf over a 4,001-point ε grid,
// refined with scipy.optimize.minimize_scalar; p at the ε found by mpmath betainc, 50 digits).
const sphericity = JSON.parse(readFileSync(new URL('../../fixtures/reference/sphericity-ranges.json', import.meta.url), 'utf8')) as {
  cases: Array<{ fLow: string; fHigh: string; df1: number; df2: number; low: string; high: string; epsilonAtLow: number; epsilonAtHigh: number }>;
};

describe('p of F with an unprinted sphericity correction (ε from 1/df1 to 1 on both dfs)', () => {
  it('the range over ε and the rounding of F matches scipy and mpmath (fixtures/reference/sphericity-ranges.json)', () => {
    expect(sphericity.cases.length).toBe(308);
    let worst = 0;
    for (const c of sphericity.cases) {
      const r = upperPRangeFSphericity(Number(c.fLow), Number(c.fHigh), c.df1, c.df2);
      worst = Math.max(worst, relErr(r.low, Number(c.low)), relErr(r.high, Number(c.high)));
    }
    expect(worst).toBeLessThan(1e-9);
  });
  it('holds p at every ε and F of the box (250 drawn points per case, off the grid)', () => {
    // a fixed linear congruential sequence, so the points are the same on every run
    let seed = 20261205;
    const next = () => {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      return seed / 2147483648;
    };
    for (const c of sphericity.cases) {
      const r = upperPRangeFSphericity(Number(c.fLow), Number(c.fHigh), c.df1, c.df2);
      for (let i = 0; i < 250; i += 1) {
        const e = 1 / c.df1 + (1 - 1 / c.df1) * next();
        const f = Number(c.fLow) + (Number(c.fHigh) - Number(c.fLow)) * next();
        const p = upperPFromF(f, e * c.df1, e * c.df2);
        expect(p).toBeGreaterThanOrEqual(r.low * (1 - 1e-12));
        expect(p).toBeLessThanOrEqual(r.high * (1 + 1e-12));
      }
    }
  });
  it('finds the largest p inside the first grid cell of ε (F(20, 800) = 1.67)', () => {
    const c = sphericity.cases.find((x) => x.df1 === 20 && x.df2 === 800 && x.fLow === '1.665');
    expect(c?.epsilonAtHigh).toBeGreaterThan(1 / 20 + 1e-4);
    expect(c?.epsilonAtHigh).toBeLessThan(1 / 20 + (1 - 1 / 20) / 64);
    const r = upperPRangeFSphericity(1.665, 1.675, 20, 800);
    expect(relErr(r.high, Number(c?.high))).toBeLessThan(1e-9);
  });
  it('finds an inner extreme where p first rises and then falls over ε', () => {
    // the reference puts the largest p at an ε strictly inside (1/df1, 1) for some cases
    // (p of 1 to the last digit is flat in ε: its ε says nothing)
    const inner = sphericity.cases.filter((c) => c.epsilonAtHigh > 1 / c.df1 + 1e-6 && c.epsilonAtHigh < 1 - 1e-6 && Number(c.high) < 1 - 1e-9);
    expect(inner.length).toBeGreaterThan(5);
    for (const c of inner) {
      const r = upperPRangeFSphericity(Number(c.fLow), Number(c.fHigh), c.df1, c.df2);
      const ends = Math.max(upperPFromF(Number(c.fLow), 1, c.df2 / c.df1), upperPFromF(Number(c.fLow), c.df1, c.df2));
      expect(Number(c.high)).toBeGreaterThan(ends);
      expect(relErr(r.high, Number(c.high))).toBeLessThan(1e-9);
    }
  });
});
