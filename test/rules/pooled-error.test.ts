import { describe, expect, it } from 'vitest';
import { checkSource, type FileReport } from '../../src/engine/index.js';
import { extract } from '../../src/extract/index.js';
import { link } from '../../src/link/index.js';
import { parseDocument } from '../../src/parse/index.js';

/**
 * A t that may be a comparison within a larger analysis of variance takes that analysis's pooled
 * error term: its df is N − k and its SE comes from the mean square error of every group (common
 * practice, no source). Invented three-group study, n = 30 each: groups (12.1, 3.0), (10.2, 3.2)
 * and (11.0, 6.0). Numbers with scipy 1.17.1: MSE = (3.0² + 3.2² + 6.0²) / 3 = 18.41, the
 * contrast of the first two t(87) = 1.9 / √(18.41 · 2/30) = 1.715, p = .090
 * (scipy.stats.t.sf); F(2, 87) = 1.48, p = .233 (scipy.stats.f.sf); the two groups alone give
 * Student's t(58) = 2.37 (scipy.stats.ttest_ind_from_stats).
 */
const run = (markdown: string): FileReport => checkSource('x.md', `${markdown}\n`);
const said = (r: FileReport, rule: string) => r.findings.filter((f) => f.ruleId === rule).map((f) => f.level);
const pooled = (markdown: string) => {
  const doc = parseDocument('x.md', `${markdown}\n`);
  return link(extract(doc), doc.directives).results.map((r) => r.pooledError?.printed);
};
const anova = 'A one-way ANOVA compared the three groups, F(2, 87) = 1.48, p = .233.';
const contrast = 'The mindfulness group (M = 12.1, SD = 3.0, n = 30) and the control group (M = 10.2, SD = 3.2, n = 30) differed little, t(87) = 1.72, p = .090.';

describe('a t whose df is the error df of an F in its paragraph, or beside words of contrasts', () => {
  it('is tied to the F of its own paragraph with that error df, or to words of contrasts or post hoc comparisons', () => {
    expect(pooled(`${anova} ${contrast}`)).toEqual(['F(2, 87) = 1.48']);
    expect(pooled(`${anova}\n\n${contrast}`)).toEqual([undefined]);
    expect(pooled(`Planned contrasts compared each group with the controls. ${contrast}`)).toEqual(['Planned contrasts']);
    expect(pooled(`Post hoc comparisons used Tukey's HSD. ${contrast}`)).toEqual(['Post hoc comparisons']);
    // "in contrast" is a connective, not a comparison
    expect(pooled(`In contrast, sleep did not change. ${contrast}`)).toEqual([undefined]);
  });
  it('makes the df and the t from two groups\' descriptives notes, and implies no number analysed', () => {
    const r = run(`## Methods\n\nWe recruited 90 participants.\n\n## Results\n\n${anova} ${contrast}`);
    expect(said(r, 'df-follows-from-n')).toEqual(['note']);
    expect(said(r, 't-follows-from-descriptives')).toEqual(['note']);
    expect(said(r, 'sample-size-agrees-with-df')).toEqual([]);
    const note = r.findings.find((f) => f.ruleId === 'df-follows-from-n');
    expect(note?.message).toContain('an F with the same error df is reported ("F(2, 87) = 1.48")');
    expect(note?.related?.map((x) => x.message)).toContain('the F with the same error df');
  });
  it('without such a sign, the same numbers are warnings', () => {
    // (the F in another paragraph, and not said to compare three groups: that would say a t compares part of the sample)
    const r = run(`## Methods\n\nWe recruited 90 participants.\n\n## Results\n\nA one-way ANOVA compared the conditions, F(2, 87) = 1.48, p = .233.\n\n${contrast}`);
    expect(said(r, 'df-follows-from-n')).toEqual(['warning']);
    expect(said(r, 't-follows-from-descriptives')).toEqual(['warning']);
    expect(said(r, 'sample-size-agrees-with-df')).toEqual(['warning']);
  });
  it('a df below what the two groups give is wrong whatever the error term: still a warning', () => {
    // t(40) = 2.37: p = .023 (scipy.stats.t.sf)
    const r = run(`Planned contrasts compared each group with the controls. The mindfulness group (M = 12.1, SD = 3.0, n = 30) scored higher than the control group (M = 10.2, SD = 3.2, n = 30), t(40) = 2.37, p = .023.`);
    expect(said(r, 'df-follows-from-n')).toEqual(['warning']);
  });
  it("Welch's test named with the t pools nothing: the sign does not speak for it", () => {
    const r = run(`${anova} The mindfulness group (M = 12.1, SD = 3.0, n = 30) and the control group (M = 10.2, SD = 3.2, n = 30) differed, Welch's t(87) = 2.37, p = .020.`);
    expect(said(r, 'df-follows-from-n')).toEqual(['warning']);
  });
});
