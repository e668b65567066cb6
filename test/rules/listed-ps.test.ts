import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { findingsOf } from './table.js';

// Two-tailed p from scipy.stats.t.sf (Debian python3-scipy 1.17.1): t(29) = 4.10 gives .0003,
// t(29) = 1.20 gives .2399; t(51) = 3.02, 2.21, 1.10 give .0039, .0316, .2765; t(38) = 2.35 and
// 0.88 give .0241 and .3844. The manuscripts are invented.
const pOf = (markdown: string) => checkSource('x.md', `${markdown}\n`).results.map((r) => `${r.printed} → ${r.p?.printed ?? 'no p'}`);
const flagged = (markdown: string) => checkSource('x.md', `${markdown}\n`).findings.filter((f) => f.level !== 'note').map((f) => `${f.ruleId}@${f.reported ?? ''}`);

describe('a list of p values after a list of t values: each t takes its p in order', () => {
  it('ties the p values by position, with or without "respectively", in brackets or after a semicolon', () => {
    expect(pOf('Walking improved in both groups, t(29) = 4.10 and t(29) = 1.20, p < .001 and p = .24, respectively.')).toEqual([
      't(29) = 4.10 → p < .001',
      't(29) = 1.20, p < .001 and p = .24 → p = .24',
    ]);
    for (const markdown of [
      'Sleep quality and length changed, t(38) = 2.35 and t(38) = 0.88 (p = .024 and p = .38).',
      'The statistics were t(38) = 2.35 and t(38) = 0.88; p = .024 and p = .38.',
      'Waiting fell at three desks, t(51) = 3.02, t(51) = 2.21 and t(51) = 1.10, with p = .004, p = .032 and p = .28, respectively.',
    ]) {
      expect(flagged(markdown)).toEqual([]);
      expect(checkSource('x.md', markdown).results.every((r) => r.p !== undefined)).toBe(true);
    }
  });
  it('still checks each p against its own t', () => {
    // .02 is not .2399: the second t's p is wrong
    expect(flagged('Walking improved in both groups, t(29) = 4.10 and t(29) = 1.20, p < .001 and p = .02, respectively.')).toEqual(['significance-follows-from-t@t(29) = 1.20, p < .001 and p = .02']);
  });
  it('ties none where the p values are not as many as the t values, and says so in a note', () => {
    const markdown = 'Sleep improved (t = 2.35) but its length did not (t = 0.88), both df = 38, with p = .024 and p = .38 respectively.';
    expect(flagged(markdown)).toEqual([]);
    const [f, ...rest] = findingsOf(markdown, 'result-is-complete');
    expect(rest).toEqual([]);
    expect(f?.messageId).toBe('p-untied');
    expect(f?.message).toBe('Reported t = 0.88), both df = 38, then 2 p values listed "respectively" (p = .024 and p = .38) for the 1 t value read here: which p is this test\'s cannot be told, so its p was not checked.');
  });
  it('leaves a p list that is not a list of the t values alone: the first p stays the t\'s (second review)', () => {
    // t(58) = 0.50 gives .62 (scipy.stats.t.sf): p = .015 is its p, and wrong; .021 is another analysis's
    expect(flagged('Pain fell in the intention-to-treat analysis, t(58) = 0.50, p = .015, and p = .021 in the per-protocol analysis.')).toEqual(['significance-follows-from-t@t(58) = 0.50, p = .015']);
    // 0.40 has no p; 2.50 (.0152) keeps .015, and .030 is the completers'
    expect(pOf('Baseline pain did not differ, t(58) = 0.40, and pain fell by week 6, t(58) = 2.50, p = .015 and p = .030 in completers.')).toEqual(['t(58) = 0.40 → no p', 't(58) = 2.50, p = .015 → p = .015']);
  });
  it('leaves a t with its own p, and a p with its adjusted value, alone', () => {
    expect(pOf('Sleep improved, t(38) = 2.35, p = .024, and its length did not, t(38) = 0.88, p = .38.')).toEqual(['t(38) = 2.35, p = .024 → p = .024', 't(38) = 0.88, p = .38 → p = .38']);
    expect(pOf('Sleep improved, t(38) = 2.35, p = .024 and p_adj = .048.')).toEqual(['t(38) = 2.35, p = .024 and p_adj = .048 → p = .024']);
  });
});
