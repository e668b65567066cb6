import { describe, expect, it } from 'vitest';
import { extract } from '../../src/extract/index.js';
import { parseDocument } from '../../src/parse/index.js';

/** The counts of people or units a text prints: value, and whether spelled out. */
const counts = (text: string) => extract(parseDocument('x.md', `${text}\n`)).unitCounts.map((c) => [c.value, c.worded]);

// Number words and the rule that a sentence opens with a spelled-out number (common practice, no source): invented sentences.
describe('counts of people or units', () => {
  it('are read in words, as a sentence must open, up to ninety-nine, with one word before the noun at most', () => {
    expect(counts('Forty participants took part.')).toEqual([[40, true]]);
    expect(counts('Twenty-four registered nurses and thirteen wards took part.')).toEqual([[24, true], [13, true]]);
    expect(counts('Ninety nine residents answered.')).toEqual([[99, true]]);
  });
  it('and in digits, whatever their scope: a kind of unit beside another is kept here too', () => {
    expect(counts('In all, 12 wards with N = 240 patients took part; 4 participants were excluded.')).toEqual([[12, false], [240, false], [4, false]]);
  });
  it('are not words that only end like a number, nor a number before other words', () => {
    expect(counts('The often-seen participants returned; someone ten years older did not; two of the wards closed.')).toEqual([]);
  });
});
