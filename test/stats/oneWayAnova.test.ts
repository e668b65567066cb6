import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { oneWayF, oneWayFRange, type GroupBox } from '../../src/stats/index.js';

const ref = JSON.parse(readFileSync(new URL('../../fixtures/reference/one-way-anova.json', import.meta.url), 'utf8')) as {
  source: string;
  cases: Array<{ n: number[]; mean: number[]; sd: number[]; decimals: number; printedMean: string[]; printedSd: string[]; F: number; df: [number, number] }>;
};

/** The box a printed value stands for: half a unit of its last decimal either side (common practice, no source). */
function box(printed: string, decimals: number, floor = -Infinity): { low: number; high: number } {
  const v = Number(printed);
  const h = 0.5 * 10 ** -decimals;
  return { low: Math.max(floor, v - h), high: v + h };
}

describe('one-way F against scipy.stats.f_oneway on raw data (fixtures/reference/one-way-anova.json)', () => {
  it('holds seeded designs of 2 to 6 groups', () => {
    expect(ref.cases.length).toBeGreaterThanOrEqual(50);
    expect(new Set(ref.cases.map((c) => c.n.length)).size).toBeGreaterThanOrEqual(4);
  });
  it.each(ref.cases.map((c, i) => ({ ...c, i, k: c.n.length })))('case $i (k = $k): exact F, and the range over the printed rounding holds it', (c) => {
    // scipy: stats.f_oneway on the raw scores; relative tolerance 1e-10 (sums of a few hundred doubles)
    const f = oneWayF(c.n.map((n, j) => ({ n, mean: c.mean[j] as number, sd: c.sd[j] as number })));
    expect(Math.abs(f - c.F) / c.F).toBeLessThan(1e-10);
    const groups: GroupBox[] = c.n.map((n, j) => ({ n, mean: box(c.printedMean[j] as string, c.decimals), sd: box(c.printedSd[j] as string, c.decimals, 0) }));
    const r = oneWayFRange(groups);
    expect(r.low).toBeLessThanOrEqual(c.F * (1 + 1e-12));
    expect(r.high).toBeGreaterThanOrEqual(c.F * (1 - 1e-12));
  });
});

describe('one-way F on a handbook worked example', () => {
  it('gives F = 9.59 for the three groups of five of the NIST/SEMATECH e-Handbook one-way ANOVA example', () => {
    // NIST/SEMATECH e-Handbook of Statistical Methods, section 7.4.3 (one-way ANOVA worked
    // example; data and F = 9.59 from memory, confirmed here by scipy.stats.f_oneway: 9.5911):
    // groups 6.9 5.4 5.8 4.6 4.0 · 8.3 6.8 7.8 9.2 6.5 · 8.0 10.5 8.1 6.9 9.3
    const data = [[6.9, 5.4, 5.8, 4.6, 4.0], [8.3, 6.8, 7.8, 9.2, 6.5], [8.0, 10.5, 8.1, 6.9, 9.3]];
    const moments = data.map((xs) => {
      const mean = xs.reduce((a, b) => a + b, 0) / xs.length;
      const sd = Math.sqrt(xs.reduce((a, b) => a + (b - mean) ** 2, 0) / (xs.length - 1));
      return { n: xs.length, mean, sd };
    });
    expect(moments.map((m) => m.mean)).toEqual([expect.closeTo(5.34, 12), expect.closeTo(7.72, 12), expect.closeTo(8.56, 12)]);
    expect(oneWayF(moments)).toBeCloseTo(9.591107036442812, 10);
  });
});

describe('the range over a box is exact', () => {
  it('for two groups equals Student t² over the box: n1·n2/N · gap² / pooled variance (common practice, no source)', () => {
    // means 10.0 and 12.0 (±0.05), SDs 2.0 and 2.5 (±0.05), n 20 and 25
    const r = oneWayFRange([
      { n: 20, mean: { low: 9.95, high: 10.05 }, sd: { low: 1.95, high: 2.05 } },
      { n: 25, mean: { low: 11.95, high: 12.05 }, sd: { low: 2.45, high: 2.55 } },
    ]);
    const pooled = (s1: number, s2: number) => (19 * s1 ** 2 + 24 * s2 ** 2) / 43;
    const w = (20 * 25) / 45;
    expect(r.low).toBeCloseTo((w * 1.9 ** 2) / pooled(2.05, 2.55), 12);
    expect(r.high).toBeCloseTo((w * 2.1 ** 2) / pooled(1.95, 2.45), 12);
  });
  it('reaches 0 when the mean intervals share a point, though no mean sits at its own end', () => {
    const r = oneWayFRange([
      { n: 10, mean: { low: 4.5, high: 5.5 }, sd: { low: 1, high: 1 } },
      { n: 30, mean: { low: 5.2, high: 6.2 }, sd: { low: 1, high: 1 } },
      { n: 5, mean: { low: 5.0, high: 5.3 }, sd: { low: 1, high: 1 } },
    ]);
    expect(r.low).toBe(0);
  });
  it('is never narrower than the F at thousands of random points of the box (seeded), and each end is nearly reached', () => {
    let seed = 12345;
    const rand = () => {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      return seed / 2147483648;
    };
    for (let trial = 0; trial < 40; trial += 1) {
      const k = 2 + Math.floor(rand() * 4);
      const groups: GroupBox[] = Array.from({ length: k }, () => {
        const m = rand() * 3;
        const s = 0.5 + rand();
        const hm = rand() * 0.6;
        const hs = rand() * 0.2;
        return { n: 3 + Math.floor(rand() * 20), mean: { low: m - hm, high: m + hm }, sd: { low: s - hs, high: s + hs } };
      });
      const r = oneWayFRange(groups);
      let lo = Infinity;
      let hi = -Infinity;
      for (let i = 0; i < 4000; i += 1) {
        // corners of the means half the time (the maximum lies at one), random points otherwise
        const pick = (iv: { low: number; high: number }) => (i % 2 === 0 ? (rand() < 0.5 ? iv.low : iv.high) : iv.low + rand() * (iv.high - iv.low));
        const f = oneWayF(groups.map((g) => ({ n: g.n, mean: pick(g.mean), sd: i % 4 === 0 ? g.sd.high : i % 4 === 2 ? g.sd.low : pick(g.sd) })));
        lo = Math.min(lo, f);
        hi = Math.max(hi, f);
      }
      expect(r.low).toBeLessThanOrEqual(lo * (1 + 1e-12));
      expect(r.high).toBeGreaterThanOrEqual(hi * (1 - 1e-12));
      // the upper end is a corner of the means with the smallest SDs: a search of all corners finds it
      let cornerMax = 0;
      for (let mask = 0; mask < 1 << k; mask += 1) {
        cornerMax = Math.max(cornerMax, oneWayF(groups.map((g, j) => ({ n: g.n, mean: mask & (1 << j) ? g.mean.high : g.mean.low, sd: g.sd.low }))));
      }
      expect(r.high).toBeCloseTo(cornerMax, 9);
    }
  });
  it('is NaN with one group, no spread, or too many groups to search', () => {
    expect(Number.isNaN(oneWayFRange([{ n: 10, mean: { low: 1, high: 1 }, sd: { low: 1, high: 1 } }]).low)).toBe(true);
    expect(Number.isNaN(oneWayF([{ n: 5, mean: 1, sd: 0 }, { n: 5, mean: 2, sd: 0 }]))).toBe(true);
    const many = Array.from({ length: 13 }, () => ({ n: 5, mean: { low: 1, high: 2 }, sd: { low: 1, high: 1 } }));
    expect(Number.isNaN(oneWayFRange(many).high)).toBe(true);
  });
});
