import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { adjustedPRange } from '../../src/stats/index.js';

// Reference: scripts/make_adjusted_reference.py — Benjamini–Hochberg by scipy.stats.false_discovery_control
// (Debian python3-scipy), Holm and Hochberg by their step-down and step-up formulas written out
// in the script, Bonferroni and Šidák by their formulas; 100 seeded sets of 2 to 20 p values.
const ref = JSON.parse(readFileSync(new URL('../../fixtures/reference/adjusted-p.json', import.meta.url), 'utf8')) as {
  sets: Array<{ m: number; p: number[]; fdr: number[]; holm: number[]; hochberg: number[]; bonferroni: number[]; sidak: number[] }>;
};

const within = (x: number, r: { low: number; high: number }) => x >= r.low * (1 - 1e-12) && x <= r.high * (1 + 1e-12);

describe('adjustedPRange holds every adjusted p of its kind (fixtures/reference/adjusted-p.json)', () => {
  it('with the number of comparisons known', () => {
    expect(ref.sets).toHaveLength(100);
    for (const s of ref.sets) {
      s.p.forEach((p, i) => {
        const at = { low: p, high: p };
        for (const method of ['fdr', 'holm', 'hochberg', 'bonferroni', 'sidak'] as const) {
          expect(within(s[method][i] as number, adjustedPRange(method, s.m, at))).toBe(true);
        }
      });
    }
  });
  it('with the number unknown (at least two)', () => {
    for (const s of ref.sets) {
      s.p.forEach((p, i) => {
        for (const method of ['fdr', 'holm', 'hochberg', 'bonferroni', 'sidak'] as const) {
          expect(within(s[method][i] as number, adjustedPRange(method, undefined, { low: p, high: p }))).toBe(true);
        }
      });
    }
  });
  it('is exactly the formula for Bonferroni and Šidák, and reaches its bounds for the others (m × p for Holm\'s smallest p, p for Hochberg\'s largest)', () => {
    const s = ref.sets.find((x) => x.m === 5) as (typeof ref.sets)[number];
    const smallest = s.p.indexOf(Math.min(...s.p));
    const r = adjustedPRange('holm', 5, { low: s.p[smallest] as number, high: s.p[smallest] as number });
    expect(r.high).toBeCloseTo(s.holm[smallest] as number, 15);
    expect(adjustedPRange('bonferroni', 3, { low: 0.01, high: 0.02 })).toEqual({ low: 0.03, high: 0.06 });
    // Šidák: the fixture's 1 − (1 − p)^m (computed in Python's own arithmetic) at both ends
    s.p.forEach((p, i) => {
      const r = adjustedPRange('sidak', 5, { low: p, high: p });
      expect(r.low).toBeCloseTo(s.sidak[i] as number, 14);
      expect(r.high).toBeCloseTo(s.sidak[i] as number, 14);
    });
    // the step procedures never give less than the p itself, and that bound is reached
    // (Holm's largest p, Hochberg's and BH's largest p, keep their own value when m × p ≥ 1 does not cap them)
    const largest = s.p.indexOf(Math.max(...s.p));
    expect(adjustedPRange('hochberg', 5, { low: s.p[largest] as number, high: s.p[largest] as number }).low).toBe(s.hochberg[largest]);
    expect(adjustedPRange('fdr', undefined, { low: 0.2, high: 0.3 })).toEqual({ low: 0.2, high: 1 });
    // unknown m: Bonferroni gives at least 2p, or 1
    expect(adjustedPRange('bonferroni', undefined, { low: 0.01, high: 0.02 })).toEqual({ low: 0.02, high: 1 });
  });
});
