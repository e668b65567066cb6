import { describe, expect, it } from 'vitest';
import { partialEtaSquaredFromF, partialEtaSquaredRange } from '../../src/stats/index.js';
import { ruleTable } from './table.js';

// η²p = F·df1 / (F·df1 + df2) (common practice, no source); the values quoted were computed by hand
// in python3: 4.21·1 / (4.21·1 + 38) = 0.0997; 3.10·2 / (3.10·2 + 57) = 0.0981.
ruleTable('eta-squared-follows-from-f', [
  { name: 'partial η² that follows', markdown: 'x, F(1, 38) = 4.21, p = .047, ηp2 = .10.', expect: [] },
  { name: 'partial η² that does not follow', markdown: 'x, F(1, 38) = 4.21, p = .047, ηp2 = .20.', expect: [{ at: 'ηp2', id: 'mismatch' }] },
  { name: '"partial η²" spelt out', markdown: 'x, F(2, 57) = 3.10, p = .053, partial η² = .15.', expect: [{ at: 'partial', id: 'mismatch' }] },
  { name: 'η² before the p is still the F’s', markdown: 'x, F(2, 57) = 3.10, ηp2 = .10, p = .053.', expect: [] },
  { name: 'a bound that holds (F(1, 80) = 0.17 gives .0021)', markdown: 'x, F(1, 80) = 0.17, p = .683, ηp2 < .01.', expect: [] },
  { name: 'a bound that fails', markdown: 'x, F(1, 80) = 14.45, p < .001, ηp2 < .10.', expect: [{ at: 'ηp2', id: 'mismatch' }] },
  { name: 'a plain η² is not checked (several effects make it smaller)', markdown: 'x, F(1, 38) = 4.21, p = .047, η2 = .04.', expect: [] },
  { name: 'ω² is not η²', markdown: 'x, F(1, 38) = 4.21, p = .047, ω2 = .30.', expect: [] },
  { name: 'the rounding of F reaches the printed value (F = 4.2 is 4.15 to 4.25: .0985 to .1006 rounds to .10)', markdown: 'x, F(1, 38) = 4.2, p = .047, ηp2 = .10.', expect: [] },
]);

describe('partial η² from F', () => {
  it('is SS_effect/(SS_effect + SS_error) for an invented one-way layout (common practice, no source)', () => {
    // three groups of 4: SS_between = 8 (means 1, 2, 3 around 2: 4·(1 + 0 + 1)), SS_within = 18 on 9 df
    const f = (8 / 2) / (18 / 9);
    expect(partialEtaSquaredFromF(f, 2, 9)).toBeCloseTo(8 / (8 + 18), 14);
  });
  it('the range holds the corners', () => {
    const r = partialEtaSquaredRange(4.205, 4.215, 1, 1, 38, 38);
    expect(r.low).toBeCloseTo(4.205 / 42.205, 14);
    expect(r.high).toBeCloseTo(4.215 / 42.215, 14);
  });
});
