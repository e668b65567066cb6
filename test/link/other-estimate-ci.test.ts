import { describe, expect, it } from 'vitest';
import { checkSource, type FileReport } from '../../src/engine/index.js';

/**
 * A CI printed right after another estimate than the test's (an ICC, κ, AUC, sensitivity, an SMD,
 * Glass's Δ) or in a table column headed by one ("ICC (95% CI)") is that estimate's, not the
 * interval of the difference the t tests, and is not held to the t. Invented numbers; by scipy
 * 1.17.1: a mean difference of 0.4 (SD 3.1, n = 40) gives paired t(39) = 0.816, p = .419 and 95% CI
 * −0.59 to 1.39 (scipy.stats.t.sf, scipy.stats.t.ppf); (11.2, 4.0, 55) against (13.1, 4.3, 56) give
 * t(109) = −2.41, p = .018 (scipy.stats.ttest_ind_from_stats). The ICC and SMD intervals are
 * invented beside them and need only not be centred on the difference.
 */
const run = (markdown: string): FileReport => checkSource('x.md', `${markdown}\n`);
const ci = (r: FileReport) => r.findings.filter((f) => f.ruleId === 'ci-agrees-with-result').map((f) => f.level);
const paired = 'Scores did not differ between sessions (mean difference 0.4, SD 3.1, n = 40), t(39) = 0.82, p = .419';

describe('an interval of another estimate in the sentence of a t', () => {
  it('after an ICC, κ or AUC is not the t\'s', () => {
    for (const other of ['ICC = 0.86 (95% CI 0.75 to 0.92)', 'κ = 0.73 (95% CI 0.53 to 0.93)', 'AUC 0.75 (95% CI 0.67 to 0.84)']) {
      const r = run(`## Results\n\n${paired}, and agreement was good, ${other}.`);
      expect(r.results[0]?.context.intervals ?? [], other).toEqual([]);
      expect(ci(r), other).toEqual([]);
    }
  });
  it('after an SMD is not the difference\'s', () => {
    expect(ci(run('## Results\n\nWorry was lower with the course (M = 11.2, SD = 4.0, n = 55) than with the waiting list (M = 13.1, SD = 4.3, n = 56), t(109) = −2.41, p = .018, SMD = −0.46 (95% CI −0.83 to −0.08).'))).toEqual([]);
  });
  it('words that may name the tested difference itself ("proportion correct", "slope", "effect size", "sensitivity") leave its CI the t\'s (review)', () => {
    // invented: a difference of 0.12 whose 95% CI 0.05 to 0.19 implies |t| ≈ 3.4, not 2.05 (by hand from the CI's half-width and t.ppf(.975, 58) = 2.00)
    expect(ci(run('## Results\n\nAccuracy was higher in the feedback group than in the control group (independent-samples t-test), t(58) = 2.05, p = .045; the difference in proportion correct was 0.12 (95% CI 0.05 to 0.19).'))).toEqual(['warning']);
  });
  it('the difference\'s own interval is still held to the t', () => {
    expect(ci(run(`## Results\n\n${paired}, 95% CI 2.75 to 3.92.`))).toEqual(['warning']);
    expect(ci(run(`## Results\n\n${paired}, 95% CI −0.59 to 1.39.`))).toEqual([]);
  });
});

describe('a table column headed by another estimate with its CI', () => {
  it('"ICC (95% CI)" holds the ICC and its interval, not the test\'s', () => {
    const table = '## Results\n\nTable 1. Test–retest agreement\n\n| Measure | Mean difference (SD) | t(39) | p | ICC (95% CI) |\n|---|---|---|---|---|\n| Grip strength (kg) | 0.40 (2.10) | 1.20 | .236 | 0.91 (0.84 to 0.95) |';
    const r = run(table);
    expect(r.results).toHaveLength(1);
    expect(r.results[0]?.context.intervals ?? []).toEqual([]);
    expect(ci(r)).toEqual([]);
  });
});
