import { readFileSync } from 'node:fs';
import tCdf from '@stdlib/stats-base-dists-t-cdf';
import { describe, expect, it } from 'vitest';
import { oneSidedPFromT, twoSidedCriticalT, twoSidedPFromT, upperTailT } from '../../src/stats/index.js';
import { expectRelativeClose } from '../helpers.js';

interface Row {
  t: string;
  df: string;
  pTwoTailed: string;
  scipyTwoTailed: string;
}
const golden = JSON.parse(readFileSync(new URL('../../fixtures/reference/t-tail.json', import.meta.url), 'utf8')) as { source: string; rows: Row[] };

describe('two-tailed p against mpmath (fixtures/reference/t-tail.json, scripts/make_t_reference.py)', () => {
  it('covers df 1 to 1e6 and p down to 1e-300', () => {
    const dfs = golden.rows.map((r) => Number(r.df));
    const ps = golden.rows.map((r) => Number(r.pTwoTailed)).filter((p) => p > 0);
    expect(Math.min(...dfs)).toBe(1);
    expect(Math.max(...dfs)).toBe(1e6);
    expect(Math.min(...ps)).toBeLessThan(1e-290);
    expect(golden.rows.length).toBeGreaterThan(300);
  });

  // Source: mpmath 1.3.0 at 60 digits (Debian python3-mpmath). Tolerance 1e-12 relative, the
  // bar the design sets; measured worst case is about 6e-14.
  it.each(golden.rows.map((r) => [r.t, r.df, r.pTwoTailed] as const))('t = %s, df = %s', (t, df, p) => {
    expectRelativeClose(twoSidedPFromT(Number(t), Number(df)), Number(p), 1e-12, `t=${t} df=${df}`);
    expectRelativeClose(twoSidedPFromT(-Number(t), Number(df)), Number(p), 1e-12, `t=-${t} df=${df}`);
  });

  // Source: scipy 1.17.1 stats.t.sf (Debian python3-scipy), recorded in the same fixture: a second,
  // independent implementation; scipy itself agrees with mpmath to about 4e-14 on this grid.
  it('agrees with scipy.stats.t.sf to 1e-12 relative', () => {
    for (const r of golden.rows) expectRelativeClose(twoSidedPFromT(Number(r.t), Number(r.df)), Number(r.scipyTwoTailed), 1e-12, `t=${r.t} df=${r.df}`);
  });
});

describe('cross-check with @stdlib/stats-base-dists-t-cdf (npm)', () => {
  // @stdlib's t cdf is a separate implementation (it shares only the incomplete beta with us);
  // it loses relative accuracy in the far tail through 1 − cdf, so the check stays where
  // p > 1e-10, with tolerance 1e-9 relative.
  const cases = golden.rows.filter((r) => Number(r.pTwoTailed) > 1e-10);
  it.each(cases.map((r) => [r.t, r.df] as const))('t = %s, df = %s', (t, df) => {
    const reference = 2 * tCdf(-Math.abs(Number(t)), Number(df));
    expectRelativeClose(twoSidedPFromT(Number(t), Number(df)), reference, 1e-9, `t=${t} df=${df}`);
  });
});

describe('critical values from the NIST/SEMATECH e-Handbook of Statistical Methods, §1.3.6.7.2', () => {
  // Upper-tail probabilities (columns) and df (rows) of the handbook's table of critical values
  // of Student's t, printed to 3 decimals; transcribed from memory of the table. Tolerance: half a
  // unit of the third decimal, except the df = 1, 0.001 cell, where the table prints 318.313 and
  // the exact value is 318.309 (scipy.stats.t.isf agrees with the latter).
  const tails = [0.1, 0.05, 0.025, 0.01, 0.005, 0.001];
  const table: Record<number, number[]> = {
    1: [3.078, 6.314, 12.706, 31.821, 63.657, 318.313],
    2: [1.886, 2.92, 4.303, 6.965, 9.925, 22.327],
    3: [1.638, 2.353, 3.182, 4.541, 5.841, 10.215],
    4: [1.533, 2.132, 2.776, 3.747, 4.604, 7.173],
    5: [1.476, 2.015, 2.571, 3.365, 4.032, 5.893],
    10: [1.372, 1.812, 2.228, 2.764, 3.169, 4.144],
    20: [1.325, 1.725, 2.086, 2.528, 2.845, 3.552],
    30: [1.31, 1.697, 2.042, 2.457, 2.75, 3.385],
    50: [1.299, 1.676, 2.009, 2.403, 2.678, 3.261],
    100: [1.29, 1.66, 1.984, 2.364, 2.626, 3.174],
  };
  const cells = Object.entries(table).flatMap(([df, row]) => row.map((value, i) => [Number(df), tails[i] as number, value] as const));
  it.each(cells)('df = %d, upper tail %d: %d', (df, tail, value) => {
    const tolerance = df === 1 && tail === 0.001 ? 0.005 : 0.0005 + 1e-9;
    expect(Math.abs(twoSidedCriticalT(2 * tail, df) - value)).toBeLessThanOrEqual(tolerance);
    // and the tail at the printed critical value brackets the column's probability
    const atPrinted = oneSidedPFromT(value, df);
    expect(Math.abs(atPrinted - tail) / tail).toBeLessThan(df === 1 && tail === 0.001 ? 0.01 : 0.002);
  });
});

describe('properties', () => {
  const dfs = [1, 2.5, 7, 30, 1000, 1e6];
  const ts = [0.01, 0.5, 1, 2, 5, 20];
  it('is symmetric in t and one-tailed is half of two-tailed', () => {
    for (const df of dfs) for (const t of ts) {
      expect(twoSidedPFromT(-t, df)).toBe(twoSidedPFromT(t, df));
      expect(oneSidedPFromT(t, df) * 2).toBe(twoSidedPFromT(t, df));
      expectRelativeClose(upperTailT(t, df) + upperTailT(-t, df), 1, 1e-15, `t=${t} df=${df}`);
    }
  });
  it('falls as |t| grows and as df grows (t ≠ 0)', () => {
    for (const df of dfs) {
      const ps = ts.map((t) => twoSidedPFromT(t, df));
      for (let i = 1; i < ps.length; i += 1) expect(ps[i]).toBeLessThan(ps[i - 1] as number);
    }
    for (const t of ts) {
      const ps = dfs.map((df) => twoSidedPFromT(t, df));
      for (let i = 1; i < ps.length; i += 1) expect(ps[i]).toBeLessThanOrEqual(ps[i - 1] as number);
    }
  });
  it('has the limits p(0) = 1 and p(±∞) = 0, and NaN outside its domain', () => {
    expect(twoSidedPFromT(0, 5)).toBe(1);
    expect(twoSidedPFromT(Infinity, 5)).toBe(0);
    expect(twoSidedPFromT(-Infinity, 5)).toBe(0);
    expect(twoSidedPFromT(2, 0)).toBeNaN();
    expect(twoSidedPFromT(2, -3)).toBeNaN();
    expect(twoSidedPFromT(Number.NaN, 3)).toBeNaN();
    expect(twoSidedPFromT(2, Number.NaN)).toBeNaN();
  });
  it('does not underflow where the value is representable (df = 1, t = 1e200: p = 2/(π t))', () => {
    // Cauchy tail, closed form (common practice, no source): P(|T| > t) = 1 − (2/π)·atan(t) ≈ 2/(π t).
    expectRelativeClose(twoSidedPFromT(1e200, 1), 2 / (Math.PI * 1e200), 1e-12, 'df=1 t=1e200');
  });
  it('matches the Cauchy closed form at df = 1 (common practice, no source)', () => {
    for (const t of [0.3, 1, 3, 30]) expectRelativeClose(twoSidedPFromT(t, 1), 1 - (2 / Math.PI) * Math.atan(t), 1e-13, `t=${t}`);
  });
});

describe('a fact of the trade (common practice, no source)', () => {
  it('two-sided 5% critical values of t exceed 1.96 and fall toward it as df grows', () => {
    const dfs = [1, 2, 3, 5, 10, 20, 30, 60, 120, 1000, 1e5];
    const crit = dfs.map((df) => twoSidedCriticalT(0.05, df));
    for (const c of crit) expect(c).toBeGreaterThan(1.959963984540054);
    for (let i = 1; i < crit.length; i += 1) expect(crit[i]).toBeLessThan(crit[i - 1] as number);
    expect((crit.at(-1) as number) - 1.959963984540054).toBeLessThan(1e-4);
  });
});
