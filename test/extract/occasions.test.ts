import { describe, expect, it } from 'vitest';
import { extract } from '../../src/extract/index.js';
import { parseDocument } from '../../src/parse/index.js';

/** The occasions of the groups a sentence prints, in order. */
const occasions = (text: string) => extract(parseDocument('x.md', `${text}\n`)).summaries.map((g) => g.occasion);

// Wordings of repeated measurement (common practice, no source): invented sentences.
describe('the occasion a group was measured on', () => {
  it('is read from the words that end its label', () => {
    expect(occasions('Pain fell from baseline (M = 18.2, SD = 5.1) to week 8 (M = 15.6, SD = 4.8).')).toEqual(['baseline', 'week8']);
    expect(occasions('Scores rose from pre-test (M = 3.1, SD = 0.9) to post-test (M = 3.6, SD = 0.8).')).toEqual(['pretest', 'posttest']);
    expect(occasions('Weight at T1 (M = 81.0, SD = 9.2) and at T2 (M = 79.4, SD = 9.0).')).toEqual(['t1', 't2']);
    expect(occasions('Sleep at admission (M = 5.1, SD = 1.2) and at the 6-month follow-up (M = 6.0, SD = 1.1).')).toEqual(['admission', '6monthfollowup']);
  });
  it('or from the words right after its numbers', () => {
    expect(occasions('Pain fell from a mean of 18.2 (SD = 5.1) at baseline to a mean of 15.6 (SD = 4.8) at week 8.')).toEqual(['baseline', 'week8']);
  });
  it('is none where the label ends in other words, or an occasion is a word\'s part', () => {
    expect(occasions('At week 8, the yoga arm (M = 15.6, SD = 4.8) and usual care (M = 18.2, SD = 5.1) differed.')).toEqual([undefined, undefined]);
    expect(occasions('Baseline scores (M = 18.2, SD = 5.1) were high; the pre-registered outcome (M = 2.0, SD = 1.0) was not.')).toEqual([undefined, undefined]);
    expect(occasions('Those who compare (M = 2.2, SD = 1.0) and those who do not (M = 2.0, SD = 1.0).')).toEqual([undefined, undefined]);
  });
});
