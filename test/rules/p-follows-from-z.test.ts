import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { ruleTable } from './table.js';

// Recomputed p values quoted in names: scipy.stats.norm.sf (Debian python3-scipy).
ruleTable('p-follows-from-z', [
  { name: 'p that follows (z = 2.31 gives .0206 to .0212)', markdown: 'x, z = 2.31, p = .021.', expect: [] },
  { name: 'negative z (z = −3.10 gives .0019)', markdown: 'x, z = −3.10, p = .002.', expect: [] },
  { name: 'p that misses without crossing alpha', markdown: 'x, z = 3.10, p = .02.', expect: ['1:4 mismatch'] },
  { name: 'upper-case Z', markdown: 'x, Z = 3.10, p = .02.', expect: ['1:4 mismatch'] },
  { name: 'a one-tailed p is not taken for an error (z = 3.10 gives .00097 one-tailed)', markdown: 'x, z = 3.10, p = .001.', expect: [] },
  { name: 'a z after a Mann–Whitney U is read', markdown: 'A Mann–Whitney test, U = 120, z = 3.10, p = .02.', expect: ['1:31 mismatch'] },
]);

describe('certainty: a rank test before z makes the finding a note', () => {
  it('a Mann–Whitney z whose p may be exact', () => {
    const f = checkSource('x.md', 'A Mann–Whitney test, U = 120, z = 3.10, p = .02.\n').findings.find((x) => x.ruleId === 'p-follows-from-z');
    expect(f?.level).toBe('note');
    expect(f?.message).toMatch(/^Not checked with certainty \(a rank test is named before z/);
  });
  it('a plain z test is a warning', () => {
    const f = checkSource('x.md', 'The indirect effect held, z = 3.10, p = .02.\n').findings.find((x) => x.ruleId === 'p-follows-from-z');
    expect(f?.level).toBe('warning');
  });
});
