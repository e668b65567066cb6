import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { checkLog10PAgainstLog10T, log10TwoSidedPFromLog10T, log10TwoSidedPFromT, twoSidedPFromT } from '../../src/stats/index.js';

interface Row { t: string; df: string; log10p: string; method: string }
interface BeyondRow extends Row { log10t: string }
const golden = JSON.parse(readFileSync(new URL('../../fixtures/reference/t-log-tail.json', import.meta.url), 'utf8')) as { source: string; rows: Row[]; beyondDoubleRows: BeyondRow[] };

describe('log10 of the two-tailed p against mpmath (fixtures/reference/t-log-tail.json, scripts/make_t_log_reference.py)', () => {
  it('the fixture reaches far below the double range', () => {
    // the point of the function: most rows have a p no double can hold
    expect(golden.rows.filter((r) => Number(r.log10p) < -324).length).toBeGreaterThan(15);
  });
  for (const row of golden.rows) {
    it(`t = ${row.t}, df = ${row.df}: log10 p = ${Number(row.log10p).toFixed(3)} (mpmath, 60 digits)`, () => {
      const got = log10TwoSidedPFromT(Number(row.t), Number(row.df));
      // 1e-9 in log10 (a relative 2.3e-9 in p): far below any printed p's rounding
      expect(Math.abs(got - Number(row.log10p))).toBeLessThan(1e-9);
    });
  }
});

describe('log10TwoSidedPFromT at its edges', () => {
  it('agrees with log10 of twoSidedPFromT where the p is a normal double (same function, two routes)', () => {
    for (const [t, df] of [[2.1, 28], [8, 10], [30, 1000]] as const) {
      expect(log10TwoSidedPFromT(t, df)).toBeCloseTo(Math.log10(twoSidedPFromT(t, df)), 12);
    }
  });
  it('t = 0 gives log10 1 = 0, an infinite t gives −Infinity, a df outside (0, Infinity) gives NaN', () => {
    expect(log10TwoSidedPFromT(0, 10)).toBe(0);
    expect(log10TwoSidedPFromT(Infinity, 10)).toBe(-Infinity);
    expect(log10TwoSidedPFromT(-Infinity, 10)).toBe(-Infinity);
    expect(log10TwoSidedPFromT(3, 0)).toBeNaN();
    expect(log10TwoSidedPFromT(NaN, 10)).toBeNaN();
  });
  it('is symmetric in the sign of t and falls as |t| grows (common practice, no source)', () => {
    expect(log10TwoSidedPFromT(-50, 1000)).toBe(log10TwoSidedPFromT(50, 1000));
    let last = 0;
    for (const t of [10, 40, 60, 1e3, 1e10, 1e100, 1e300]) {
      const v = log10TwoSidedPFromT(t, 1000);
      expect(v).toBeLessThan(last);
      last = v;
    }
  });
});

describe('log10 of the two-tailed p for a t beyond the double range, against mpmath (beyondDoubleRows of fixtures/reference/t-log-tail.json)', () => {
  it('every such t is beyond a double (the rows test what they claim to)', () => {
    expect(golden.beyondDoubleRows.length).toBeGreaterThan(5);
    for (const row of golden.beyondDoubleRows) expect(Number(row.t)).toBe(Infinity);
  });
  for (const row of golden.beyondDoubleRows) {
    it(`t = ${row.t}, df = ${row.df}: log10 p = ${Number(row.log10p).toFixed(3)} (mpmath, 60 digits)`, () => {
      const got = log10TwoSidedPFromLog10T(Number(row.log10t), Number(row.df));
      // the same bar as above: 1e-9 in log10
      expect(Math.abs(got - Number(row.log10p))).toBeLessThan(1e-9);
    });
  }
  it('agrees with log10TwoSidedPFromT below 1e300, where both apply (same function, two routes)', () => {
    for (const [t, df] of [[2.1, 28], [1e30, 10], [1e250, 17.8]] as const) expect(log10TwoSidedPFromLog10T(Math.log10(t), df)).toBeCloseTo(log10TwoSidedPFromT(t, df), 9);
  });
  it('NaN for a df outside (0, Infinity) or a NaN t; an infinite t gives −Infinity', () => {
    expect(log10TwoSidedPFromLog10T(1000, Infinity)).toBeNaN();
    expect(log10TwoSidedPFromLog10T(1000, 0)).toBeNaN();
    expect(log10TwoSidedPFromLog10T(NaN, 10)).toBeNaN();
    expect(log10TwoSidedPFromLog10T(Infinity, 10)).toBe(-Infinity);
  });
  it('checkLog10PAgainstLog10T: t = 2e1000 (1.5e1000 to 2.5e1000), df = 28 fits p = 1e-27990 and not p = 1e-4000 (mpmath rows above)', () => {
    const box = { log10AbsTLow: Math.log10(1.5) + 1000, log10AbsTHigh: Math.log10(2.5) + 1000, dfLow: 28, dfHigh: 28 };
    const point = (x: number) => ({ low: x, high: x, lowOpen: false, highOpen: false });
    expect(checkLog10PAgainstLog10T({ ...box, reported: point(-27990) }).fitsTwoSided).toBe(true);
    expect(checkLog10PAgainstLog10T({ ...box, reported: point(-4000) }).fitsTwoSided).toBe(false);
  });
});
