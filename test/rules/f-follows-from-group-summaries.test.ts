import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { ruleTable } from './table.js';

// The three groups of five of the NIST/SEMATECH e-Handbook one-way ANOVA example (section 7.4.3,
// from memory): means 5.34, 7.72, 8.56, SDs 1.117, 1.103, 1.378, F(2, 12) = 9.59;
// scipy.stats.f_oneway on the raw scores gives 9.5911 (see test/stats/oneWayAnova.test.ts). With
// the means and SDs printed to two decimals the F may lie between 9.436 and 9.723 (this rule's
// own range, bounded in that test against random points of the box).
const nist = (f: string, df = '2, 12') =>
  `The three rooms differed in recall (quiet: M = 5.34, SD = 1.12, n = 5; music: M = 7.72, SD = 1.10, n = 5; noise: M = 8.56, SD = 1.38, n = 5), F(${df}) = ${f}, p = .003.`;
// The same with SEs (SD / √5: 0.50, 0.49, 0.62 by hand in python3).
const nistSe = (f: string) =>
  `The three rooms differed in recall (quiet: M = 5.34, SE = 0.50, n = 5; music: M = 7.72, SE = 0.49, n = 5; noise: M = 8.56, SE = 0.62, n = 5), F(2, 12) = ${f}, p = .003.`;
// Four invented groups; F from the printed summaries 3.587 (by hand in python3), p = .017 (scipy.stats.f.sf).
const fourGroups = (f: string, df = '3, 86') =>
  `Scores were 12.4 ± 3.1 in the first cohort (n = 22), 14.1 ± 2.8 in the second (n = 25), 13.0 ± 3.5 in the third (n = 20) and 15.2 ± 3.0 in the fourth (n = 23). A one-way ANOVA showed that the cohorts differed, F(${df}) = ${f}, p = .017.`;

ruleTable('f-follows-from-group-summaries', [
  { name: 'the handbook example as printed', markdown: nist('9.59'), expect: [] },
  { name: 'an F within the range the rounding allows (9.70)', markdown: nist('9.70'), expect: [] },
  { name: 'an F the summaries cannot give', markdown: nist('12.59'), expect: [{ at: 'F(2', id: 'mismatch' }] },
  { name: 'an F just past the upper end (9.75)', markdown: nist('9.75'), expect: [{ at: 'F(2', id: 'mismatch' }] },
  { name: 'a df2 that is not N − k', markdown: nist('9.59', '2, 15'), expect: [{ at: 'F(2', id: 'df' }] },
  { name: 'spreads labelled SE are read as SD / √n', markdown: nistSe('9.59'), expect: [] },
  { name: 'an F that SEs cannot give either', markdown: nistSe('4.10'), expect: [{ at: 'F(2', id: 'mismatch' }] },
  { name: '± spreads of unstated kind in another sentence of the paragraph, which has no other test', markdown: fourGroups('3.59'), expect: [] },
  { name: 'the same with a wrong F: neither as SDs nor as SEs', markdown: fourGroups('5.12'), expect: [{ at: 'F(3', id: 'mismatch' }] },
  { name: 'F < 1 when the summaries give an F below 1', markdown: 'Recall was alike (quiet: M = 5.3, SD = 1.1, n = 20; music: M = 5.4, SD = 1.2, n = 20; noise: M = 5.2, SD = 1.0, n = 20), F(2, 57) < 1.', expect: [] },
  { name: 'F < 1 when they give far more', markdown: nist('1', '2, 12').replace('= 1,', '< 1,'), expect: [{ at: 'F(2', id: 'mismatch' }] },
  { name: 'the groups in the paragraph right before, which reports nothing else, of the cohorts the F\'s lead names: tied', markdown: fourGroups('5.12').replace('. A one-way', '.\n\nA one-way'), expect: [{ at: 'F(3', id: 'mismatch' }] },
  { name: 'the same with the F they give', markdown: fourGroups('3.59').replace('. A one-way', '.\n\nA one-way'), expect: [] },
  { name: 'the groups of a paragraph before a heading are not tied', markdown: fourGroups('5.12').replace('. A one-way', '.\n\n## Cohorts\n\nA one-way'), expect: [] },
  { name: 'the F\'s lead names a time the groups\' sentence does not: not tied', markdown: fourGroups('5.12').replace('. A one-way ANOVA showed that the cohorts differed', '.\n\nAt the second visit the cohorts differed'), expect: [] },
  { name: 'the F\'s dfs are not (k − 1, N − k) of the groups before: not tied', markdown: fourGroups('5.12', '3, 80').replace('. A one-way', '.\n\nA one-way'), expect: [] },
  { name: 'the paragraph before reports a test of its own: not tied', markdown: fourGroups('5.12').replace(' in the fourth (n = 23).', ' in the fourth (n = 23), t(44) = 1.95, p = .058.').replace('. A one-way', '.\n\nA one-way'), expect: [] },
  { name: 'the paragraph before says the means are adjusted: not tied', markdown: fourGroups('5.12').replace('Scores were', 'Scores adjusted for age were').replace('. A one-way', '.\n\nA one-way'), expect: [] },
  { name: 'the F\'s paragraph reports another statistic: not tied', markdown: fourGroups('5.12').replace('. A one-way', '.\n\nA one-way').replace(', p = .017.', ', p = .017, and age did not, F(3, 86) = 0.40, p = .75.'), expect: [] },
  { name: 'the groups stand in two sentences of the paragraph before: not tied', markdown: fourGroups('5.12').replace(' and 15.2', '. The fourth cohort scored 15.2').replace('. A one-way', '.\n\nA one-way'), expect: [] },
  { name: 'a fractional df2 (Welch): not the classic F, not checked', markdown: nist('12.59', '2, 7.9'), expect: [] },
  { name: 'two tests of means in the sentence: the groups are tied to neither', markdown: nist('12.59').replace(', p = .003.', ', p = .003, and F(2, 12) = 3.10 for the delayed test.'), expect: [] },
  { name: 'one group only: nothing to compare', markdown: 'Recall was high (M = 5.34, SD = 1.12, n = 5), F(2, 12) = 12.59, p = .001.', expect: [] },
  { name: 'a group without its n: not checked', markdown: 'The rooms differed (quiet: M = 5.34, SD = 1.12; music: M = 7.72, SD = 1.10, n = 5; noise: M = 8.56, SD = 1.38, n = 5), F(2, 12) = 12.59, p = .001.', expect: [] },
  { name: 'an F said to equal a t² is that rule\'s', markdown: 'Recall differed (quiet: M = 5.34, SD = 1.12, n = 5; music: M = 7.72, SD = 1.10, n = 5), t(8) = 3.39, p = .009 (equivalently F(1, 8) = 30.0).', expect: [] },
]);

describe('f-follows-from-group-summaries speaks as a note where a tie or the analysis is not certain', () => {
  const level = (markdown: string) => checkSource('case.md', markdown, {}).findings.filter((f) => f.ruleId === 'f-follows-from-group-summaries').map((f) => `${f.level} ${f.messageId}`);
  it('warns when the groups are in the F\'s sentence and its dfs are (k − 1, N − k)', () => {
    expect(level(nist('12.59'))).toEqual(['warning mismatch']);
    expect(level(nist('9.59', '2, 15'))).toEqual(['warning df']);
  });
  it('notes a repeated-measures F: its groups are the same units', () => {
    expect(level(nist('12.59').replace('The three rooms', 'In the repeated-measures analysis the three rooms'))).toEqual(['note mismatch']);
  });
  it('notes an F printed without its dfs', () => {
    expect(level(nist('12.59').replace('F(2, 12)', 'F'))).toEqual(['note mismatch']);
  });
  it('notes a df1 that counts other groups than those printed', () => {
    expect(level(nist('9.59', '3, 12'))).toEqual(['note df']);
  });
  it('notes groups spread over several sentences of the paragraph', () => {
    const md = 'The quiet room gave M = 5.34, SD = 1.12, n = 5. Music gave M = 7.72, SD = 1.10, n = 5, and noise M = 8.56, SD = 1.38, n = 5. Recall differed by room, F(2, 12) = 12.59, p = .001.';
    // the F's own sentence prints no groups, so the paragraph's are taken, from two sentences
    expect(level(md)).toEqual(['note mismatch']);
  });
});
