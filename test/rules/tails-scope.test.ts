import { describe, expect, it } from 'vitest';
import { checkSource, type FileReport } from '../../src/engine/index.js';

/**
 * Words about one-tailed tests that declare nothing of this study's tests: said of other studies
 * in an introduction or discussion, or denied ("We did not use one-tailed tests"). Invented study;
 * (5.3, 1.6, 50) against (4.7, 1.7, 50) give Student's t(98) = 1.817, two-tailed p = .072
 * (scipy 1.17.1, scipy.stats.ttest_ind_from_stats); t(98) = 1.82 gives one-tailed p = .036
 * (scipy.stats.t.sf).
 */
const run = (markdown: string): FileReport => checkSource('x.md', `${markdown}\n`);
const spoken = (r: FileReport) => r.findings.filter((f) => f.level !== 'note').map((f) => `${f.level} ${f.ruleId}`);
const result = (p: string) => `## Results\n\nHope was higher after writing (M = 5.3, SD = 1.6, n = 50) than after control (M = 4.7, SD = 1.7, n = 50), t(98) = 1.82, p = ${p}.`;

describe('tails said of other studies', () => {
  it('in an introduction or discussion, they set no tails for this study', () => {
    const r = run(`## Introduction\n\nEarlier trials often relied on one-tailed tests.\n\n${result('.072')}`);
    expect(r.results[0]?.sidedness.basis).toBe('default');
    expect(spoken(r)).toEqual([]);
    expect(spoken(run(`${result('.072')}\n\n## Discussion\n\nOne-tailed tests are sometimes justified when effects are directional.`))).toEqual([]);
  });
  it('in words of the authors\' own work there, they do', () => {
    const r = run(`## Discussion\n\nWe used one-tailed tests because the hypotheses were directional.\n\n${result('.036')}`);
    expect(r.results[0]?.sidedness.value).toBe('one');
    expect(spoken(r)).toEqual([]);
  });
});

describe('tails denied', () => {
  it('"did not use", "No … were used", "avoided" declare no one tail', () => {
    for (const words of ['We did not use one-tailed tests.', 'No one-tailed tests were used.', 'Although the hypotheses were directional, we avoided one-tailed tests.', 'One-tailed tests were not used.']) {
      const r = run(`## Methods\n\n${words}\n\n${result('.072')}`);
      expect(r.results[0]?.sidedness.value, words).toBe('two');
      expect(spoken(r), words).toEqual([]);
    }
  });
  it('a declaration that is not denied still holds', () => {
    expect(run(`## Methods\n\nOne-tailed tests were used throughout.\n\n${result('.036')}`).results[0]?.sidedness.value).toBe('one');
  });
});
