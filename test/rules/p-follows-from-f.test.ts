import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { showLastDigitUnits } from '../../src/rule-api/format.js';
import { ruleTable } from './table.js';

// Recomputed p values quoted in names were computed with scipy.stats.f.sf (Debian python3-scipy).
ruleTable('p-follows-from-f', [
  { name: 'exact p that follows (F(1, 38) = 4.21 gives .0470 to .0472)', markdown: 'x, F(1, 38) = 4.21, p = .047.', expect: [] },
  { name: 'p that misses without crossing alpha', markdown: 'x, F(1, 38) = 4.21, p = .03.', expect: ['1:4 mismatch'] },
  { name: 'attached dfs F1,38 read like bracketed ones', markdown: 'x, F1,38 = 4.21, p = .03.', expect: ['1:4 mismatch'] },
  { name: 'p one unit of the last digit away (F(2, 57) = 3.10 gives .0525 to .0530)', markdown: 'x, F(2, 57) = 3.10, p = .06.', expect: ['1:4 mismatch'] },
  { name: 'p rounded to two decimals that follows', markdown: 'x, F(2, 57) = 3.10, p = .05.', expect: [] },
  { name: 'Greenhouse–Geisser dfs read within their rounding (F(1.45, 57.3) = 3.10 gives .0681)', markdown: 'With Greenhouse–Geisser correction, F(1.45, 57.3) = 3.10, MSE = 2.1, p = .068.', expect: [] },
  { name: 'an η² between F and p does not end the clause', markdown: 'x, F(1, 38) = 4.21, η2 = .10, p = .03.', expect: ['1:4 mismatch'] },
  { name: 'F < 1 without dfs is not checked', markdown: 'The groups did not differ, F < 1, p = .02.', expect: [] },
  { name: 'a bound that holds (F(3, 120) = 2.95 gives .0355)', markdown: 'x, F(3, 120) = 2.95, p < .05.', expect: [] },
  { name: 'a bound that fails without crossing alpha', markdown: 'x, F(3, 120) = 2.95, p < .01.', expect: ['1:4 mismatch'] },
  { name: 'never a one-tailed reading: half of .0470 is not accepted', markdown: 'x, F(1, 38) = 4.21, p = .0235.', expect: ['1:4 mismatch'] },
  { name: 'an adjusted p is not compared', markdown: 'x, F(1, 38) = 4.21, p_adj = .03.', expect: [] },
  { name: 'a p after other prose belongs to another statement', markdown: 'x, F(1, 38) = 4.21, which the second experiment did not replicate at all, p = .03.', expect: [] },
  { name: 'a flip of significance belongs to significance-follows-from-statistic', markdown: 'x, F(1, 38) = 2.10, p = .03.', expect: [] },
  { name: 'a t in the same sentence keeps its own p', markdown: 'x, t(38) = 2.05, p = .047, and F(1, 38) = 4.21, p = .047.', expect: [] },
  { name: 'quieted with a reason', markdown: '<!-- plumbline quiet p-follows-from-f: permutation p -->\nx, F(1, 38) = 4.21, p = .03.', expect: [] },
]);

describe('a gap just over half a unit reads as more than the half unit rounding allows', () => {
  // F(2, 28) = 0.001 is read as 0.0005 to 0.0015; scipy.stats.f.sf(0.0015, 2, 28) = 0.9985012
  // (Debian python3-scipy), so .998 misses by 0.5012 units of its last digit, not by "0.5".
  it('shows the units with the digits that tell them apart', () => {
    const report = checkSource('gap.md', 'x, F(2, 28) = 0.001, p = .998.');
    const finding = report.findings.find((f) => f.ruleId === 'p-follows-from-f');
    expect(finding?.message).toContain('(0.501 units of the last printed digit; rounding allows 0.5 units)');
  });
  it('keeps one decimal where one is enough', () => {
    expect(showLastDigitUnits(0.6)).toBe('0.6');
    expect(showLastDigitUnits(0.5)).toBe('0.5');
    expect(showLastDigitUnits(0.50012)).toBe('0.5001');
    expect(showLastDigitUnits(0.500001)).toBe('0.5000');
    expect(showLastDigitUnits(12.34)).toBe('12.3');
  });
});
