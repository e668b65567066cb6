import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { quotientRange } from '../../src/stats/index.js';
import { ruleTable } from './table.js';

// t = b / SE for a coefficient of a linear model (common practice, no source). The ranges quoted
// in the names are b / SE over the corners of the rounding box, computed by hand in python3:
// b = 0.42, SE = 0.15 gives 0.415/0.155 = 2.677 to 0.425/0.145 = 2.931.
ruleTable('t-follows-from-coefficient', [
  { name: 'a t that follows (b = 0.42, SE = 0.15 give 2.677 to 2.931)', markdown: 'Sleep predicted recall, b = 0.42, SE = 0.15, t(96) = 2.80, p = .006.', expect: [] },
  { name: 'a t that does not follow', markdown: 'Sleep predicted recall, b = 0.42, SE = 0.15, t(96) = 3.80, p < .001.', expect: [{ at: 't(96)', id: 'mismatch' }] },
  { name: 'the rounding of b and SE reaches t = 2.93 (2.925 meets 2.931)', markdown: 'Sleep predicted recall, b = 0.42, SE = 0.15, t(96) = 2.93, p = .004.', expect: [] },
  { name: 'just past the rounding: t = 2.95 (2.945 against 2.931)', markdown: 'Sleep predicted recall, b = 0.42, SE = 0.15, t(96) = 2.95, p = .004.', expect: [{ at: 't(96)', id: 'mismatch' }] },
  { name: 'B with its SE in brackets', markdown: 'Sleep predicted recall, B = 0.42 (SE = 0.15), t(96) = 3.80, p < .001.', expect: [{ at: 't(96)', id: 'mismatch' }] },
  { name: 'β with its SE', markdown: 'Sleep predicted recall, β = 0.21, SE = 0.08, t(96) = 4.10, p < .001.', expect: [{ at: 't(96)', id: 'mismatch' }] },
  { name: 'β with an SE that gives its t (2.412 to 2.867)', markdown: 'Sleep predicted recall, β = 0.21, SE = 0.08, t(96) = 2.60, p = .011.', expect: [] },
  { name: 'the coefficient and SE after the t, in its clause', markdown: 'Sleep predicted recall, t(96) = 3.80, b = 0.42, SE = 0.15, p < .001.', expect: [{ at: 't(96)', id: 'mismatch' }] },
  { name: 'a negative coefficient with |t| printed is accepted', markdown: 'Noise predicted recall, b = -0.42, SE = 0.15, t(96) = 2.80, p = .006.', expect: [] },
  { name: 'a negative coefficient with its negative t', markdown: 'Noise predicted recall, b = -0.42, SE = 0.15, t(96) = -2.80, p = .006.', expect: [] },
  { name: 'a β without an SE is only read', markdown: 'Sleep predicted recall, β = 0.21, t(96) = 3.80, p < .001.', expect: [] },
  { name: 'a coefficient in another sentence is not the t’s', markdown: 'The coefficient was b = 0.42 (SE = 0.15). The model fit well, t(96) = 3.80, p < .001.', expect: [] },
  { name: 'a coefficient before another statistic is not the t’s', markdown: 'Sleep predicted recall, b = 0.42, SE = 0.15, r = .27, and the slopes differed, t(96) = 3.80, p < .001.', expect: [] },
  { name: 'an SE printed as 0.00 allows any t', markdown: 'Sleep predicted recall, b = 0.01, SE = 0.00, t(960) = 3.80, p < .001.', expect: [] },
  { name: 'a bound on t is not compared', markdown: 'Sleep predicted recall, b = 0.42, SE = 0.15, t(96) > 3.80, p < .001.', expect: [] },
  { name: 'quieted with a reason', markdown: '<!-- plumbline quiet t-follows-from-coefficient: robust SE -->\nSleep predicted recall, b = 0.42, SE = 0.15, t(96) = 3.80, p < .001.', expect: [] },
]);

describe('certainty of the coefficient’s tie', () => {
  const levels = (markdown: string) => checkSource('case.md', markdown).findings.filter((f) => f.ruleId === 't-follows-from-coefficient').map((f) => f.level);
  it('warns when b, SE and t share one clause', () => {
    expect(levels('Sleep predicted recall, b = 0.42, SE = 0.15, t(96) = 3.80, p < .001.')).toEqual(['warning']);
  });
  it('only notes when a second coefficient in the clause may own the SE', () => {
    expect(levels('Sleep predicted recall, t(96) = 3.80, β = .30, b = 0.42, SE = 0.15, p < .001.')).toEqual(['note']);
  });
  it('says what was recomputed from which inputs', () => {
    const f = checkSource('case.md', 'Sleep predicted recall, b = 0.42, SE = 0.15, t(96) = 3.80, p < .001.').findings.find((x) => x.ruleId === 't-follows-from-coefficient');
    expect(f?.message).toContain('Recomputed t = b / SE from b = 0.42 (read as 0.415 to 0.425), SE = 0.15 (read as 0.145 to 0.155)');
  });
});

describe('quotientRange', () => {
  it('takes the corners of the box (values by hand in python3)', () => {
    const r = quotientRange(0.415, 0.425, 0.145, 0.155);
    expect(r.low).toBeCloseTo(0.415 / 0.155, 12);
    expect(r.high).toBeCloseTo(0.425 / 0.145, 12);
    const neg = quotientRange(-0.425, -0.415, 0.145, 0.155);
    expect(neg.low).toBeCloseTo(-0.425 / 0.145, 12);
    expect(neg.high).toBeCloseTo(-0.415 / 0.155, 12);
    const across = quotientRange(-0.005, 0.005, 0.145, 0.155);
    expect(across.low).toBeCloseTo(-0.005 / 0.145, 12);
    expect(across.high).toBeCloseTo(0.005 / 0.145, 12);
  });
  it('is NaN for a divisor whose interval reaches zero', () => {
    expect(Number.isNaN(quotientRange(0.1, 0.2, 0, 0.005).low)).toBe(true);
  });
});
