import { describe, expect, it } from 'vitest';
import { checkSource, type FileReport } from '../../src/engine/index.js';

/**
 * Change scores with their SDs ("fell by 6.1 (SD of change 5.0, n = 50)"), and a d standardised by
 * an SD the text names but does not print beside the result (the pooled baseline SD). Invented
 * trial; numbers by scipy 1.17.1: (6.1, 5.0, 50) against (2.3, 5.4, 50) give Student's
 * t(98) = 3.651, p = .0004 (scipy.stats.ttest_ind_from_stats). Standardised by a baseline SD of
 * 12.0, d = 3.8 / 12.0 = 0.32 (by hand); by the groups' pooled SD it would be 0.73.
 */
const run = (markdown: string): FileReport => checkSource('x.md', `${markdown}\n`);
const levels = (r: FileReport, rule: string) => r.findings.filter((f) => f.ruleId === rule).map((f) => f.level);
const result = 'LDL fell by 6.1 mg/dL (SD of change 5.0, n = 50) with counselling and by 2.3 mg/dL (SD 5.4, n = 50) with usual care, t(98) = -3.65, p < .001, d = -0.32.';

describe('an SD of change', () => {
  it('is the group\'s SD: both groups are read, and their sizes give the df', () => {
    const r = run(`## Results\n\n${result}`);
    expect(r.results[0]?.context.descriptives?.groups).toHaveLength(2);
    expect(levels(r, 'df-follows-from-n')).toEqual([]);
    expect(levels(r, 't-follows-from-descriptives')).toEqual([]);
  });
});

describe('an SD of change from baseline, and an SD of the differences (review)', () => {
  it('"SD of change from baseline" is the group\'s SD too', () => {
    const r = run(`## Results\n\n${result.replace('SD of change 5.0', 'SD of change from baseline 5.0')}`);
    expect(r.results[0]?.context.descriptives?.groups).toHaveLength(2);
    expect(levels(r, 'df-follows-from-n')).toEqual([]);
  });
  it('"SD of the differences" of a paired design is no third group', () => {
    // pre (20.1, 4.0) and post (22.3, 4.2), n = 30; 2.2 / (3.1 / √30) = 3.89, p < .001 (scipy.stats.t.sf)
    const r = run('## Results\n\nScores rose from the pre-test (M = 20.1, SD = 4.0) to the post-test (M = 22.3, SD = 4.2), n = 30; the mean difference was 2.2 (SD of the differences = 3.1), t(29) = 3.89, p < .001.');
    expect(levels(r, 'descriptives-link-is-unambiguous')).toEqual([]);
  });
});

describe('a d standardised by another SD than the groups\'', () => {
  it('said in the Methods, makes the d finding a note that names the words', () => {
    const r = run(`## Methods\n\nEffect sizes were standardised by the pooled baseline SD (12.0 mg/dL).\n\n## Results\n\n${result}`);
    expect(levels(r, 'effect-size-follows')).toEqual(['note']);
    expect(r.findings.find((f) => f.ruleId === 'effect-size-follows')?.message).toContain('("standardised by the pooled baseline SD")');
  });
  it('written as a formula in the result\'s paragraph, too', () => {
    expect(levels(run(`## Results\n\n${result} Here d is the difference in change ÷ pooled baseline SD.`), 'effect-size-follows')).toEqual(['note']);
  });
  it('not said, or said of other trials in the Discussion, leaves the warning', () => {
    expect(levels(run(`## Results\n\n${result}`), 'effect-size-follows')).toEqual(['warning']);
    expect(levels(run(`## Results\n\n${result}\n\n## Discussion\n\nEarlier trials standardised effect sizes by the pooled baseline SD.`), 'effect-size-follows')).toEqual(['warning']);
    // words of a baseline SD that are not about an effect size
    expect(levels(run(`## Methods\n\nWeight change was compared with the baseline SD of the cohort.\n\n## Results\n\n${result}`), 'effect-size-follows')).toEqual(['warning']);
  });
});

describe('words that define no standardiser of this report\'s d (review)', () => {
  // (24.1, 5.0, 30) against (21.0, 5.2, 30): Student's t(58) = 2.354, p = .022, pooled-SD d = 0.61
  // (scipy.stats.ttest_ind_from_stats; d by hand), so d = 0.91 is wrong
  const memory = 'Memory scores were higher after training (M = 24.1, SD = 5.0, n = 30) than after the control task (M = 21.0, SD = 5.2, n = 30), t(58) = 2.35, p = .022, d = 0.91.';
  it('a power calculation, a T-score conversion, days written "d", another trial: the wrong d is still a warning', () => {
    for (const methods of [
      'Using the population standard deviation of 15 points, a difference of 7.5 points corresponds to an effect size of d = 0.50; 30 participants per group gave 80% power at alpha .05.',
      "Raw scores were converted to T-scores using the normative SD, and Cohen's d was computed from the two groups' pooled SD.",
      'Weight change over 14 d was divided by the baseline SD of the colony to flag outlying animals.',
      'The sample size was based on an earlier trial that reported effect sizes standardised by the pooled baseline SD (d = 0.75).',
    ]) expect(levels(run(`## Methods\n\n${methods}\n\n## Results\n\n${memory}`), 'effect-size-follows'), methods).toEqual(['warning']);
  });
  it('"Cohen\'s d was computed using the pooled baseline SD" is a standardiser (second review)', () => {
    expect(levels(run(`## Methods\n\nCohen's d was computed using the pooled baseline SD of the two arms.\n\n## Results\n\n${result}`), 'effect-size-follows')).toEqual(['note']);
  });
  it('"divided by the SD of all participants at baseline" is a standardiser too', () => {
    expect(levels(run(`## Methods\n\nEffect sizes were computed as the difference in change divided by the SD of all participants at baseline (12.0 mg/dL).\n\n## Results\n\n${result}`), 'effect-size-follows')).toEqual(['note']);
  });
});
