import { describe, expect, it } from 'vitest';
import { checkSource, type FileReport } from '../../src/engine/index.js';
import { extract } from '../../src/extract/index.js';
import { link } from '../../src/link/index.js';
import { parseDocument } from '../../src/parse/index.js';
import { evaluateDescriptives } from '../../src/rule-api/index.js';

/**
 * A sample tested against a published reference whose mean and SD are printed but no n: with the
 * one-sample df (n − 1), the t may be a one-sample test of the sample against the reference mean,
 * and t-follows-from-descriptives tries that reading beside the two-group ones. Invented numbers;
 * by scipy 1.17.1 and by hand: (16.8, 3.1, 40) against 21.5 gives t(39) = (16.8 − 21.5) / (3.1 / √40)
 * = −9.589, p < .001 (scipy.stats.t.sf). −12.59 is no reading's: read as one group measured twice, the
 * SD of the differences would have to be 4.7·√40 / 12.59 = 2.36, below |3.1 − 7.0| (by hand).
 */
const run = (markdown: string): FileReport => checkSource('x.md', `${markdown}\n`);
const levels = (r: FileReport, rule: string) => r.findings.filter((f) => f.ruleId === rule).map((f) => f.level);
const sentence = (t: string) => `## Results\n\nGrip strength in our sample (M = 16.8 kg, SD = 3.1, n = 40) was lower than the published reference (M = 21.5 kg, SD = 7.0), t(39) = ${t}, p < .001.`;

describe('a group not named as a reference (review)', () => {
  it('a control group\'s mean taken as a fixed value is still a warning, and so where the text says independent samples', () => {
    const control = '## Results\n\nPatients had lower grip strength (M = 16.8 kg, SD = 3.1, n = 40) than healthy controls (M = 21.5 kg, SD = 7.0), t(39) = -9.59, p < .001.';
    expect(levels(run(control), 't-follows-from-descriptives')).toEqual(['warning']);
    expect(levels(run(control.replace('## Results\n\n', '## Results\n\nGrip strength was compared between the two independent groups with an independent-samples t-test. ')), 't-follows-from-descriptives')).toEqual(['warning']);
  });
  it('a reference named before words that qualify it ("the published reference for women aged 70–79")', () => {
    expect(levels(run('## Results\n\nGrip strength in our sample (M = 16.8 kg, SD = 3.1, n = 40) was lower than the published reference for women aged 70–79 (M = 21.5 kg, SD = 7.0), t(39) = -9.59, p < .001.'), 't-follows-from-descriptives')).toEqual([]);
  });
  it('controls "drawn from the national registry" are a control group, not a reference (second review)', () => {
    const r = run('## Results\n\nPatients had lower grip strength (M = 16.8, SD = 3.1, n = 40) than controls drawn from the national registry (M = 21.5, SD = 7.0, n = 55), t(39) = -9.59, p < .001.');
    expect(levels(r, 't-follows-from-descriptives')).toEqual(['warning']);
  });
  it('a published norm printed with its own N is a reference: its df is the sample\'s n − 1', () => {
    const r = run('## Results\n\nGrip strength in our sample (M = 16.8 kg, SD = 3.1, n = 40) was lower than the published norm (M = 21.5 kg, SD = 7.0, N = 1200), t(39) = -9.59, p < .001.');
    expect(r.findings.filter((f) => f.level !== 'note')).toEqual([]);
  });
});

describe('a reference printed with a mean and SD but no n', () => {
  it('the one-sample reading against its mean gives the t: nothing to say', () => {
    expect(levels(run(sentence('-9.59')), 't-follows-from-descriptives')).toEqual([]);
  });
  it('a t that no reading gives is still a warning, and names the one-sample reading', () => {
    const r = run(sentence('-12.59'));
    expect(levels(r, 't-follows-from-descriptives')).toEqual(['warning']);
    expect(r.findings.find((f) => f.ruleId === 't-follows-from-descriptives')?.message).toContain("against the reference's mean as a test value");
  });
  it('is tried only with the one-sample df, not with one that two groups give', () => {
    const variants = (text: string) => {
      const doc = link(extract(parseDocument('x.md', `${text}\n`)), []);
      return evaluateDescriptives(doc.results[0]!)?.attempts.map((a) => a.variant);
    };
    expect(variants(sentence('-9.59'))).toContain('one-sample');
    expect(variants(sentence('-9.59').replace('t(39)', 't(78)'))).not.toContain('one-sample');
  });
});
