import { describe, expect, it } from 'vitest';
import { sentenceStarts } from '../../src/extract/numbers.js';
import { checkSource } from '../../src/engine/index.js';

/** Where sentences start decides which numbers share a sentence with a test (common practice, no source). */
const sentences = (text: string) => {
  const starts = sentenceStarts(text);
  return starts.map((a, i) => text.slice(a, starts[i + 1] ?? text.length).trim());
};

describe('sentence ends', () => {
  it('a full stop before a capital ends a sentence', () => {
    expect(sentences('Scores rose. The groups differed.')).toEqual(['Scores rose.', 'The groups differed.']);
  });
  it('a dotted abbreviation closing a bracket, or before one, ends no sentence', () => {
    expect(sentences('Marbles rose from 8.38 ± 3.43 to 12.50 ± 2.07 (mean ± s.d.) (repeated measures); t_7 = 2.25.')).toHaveLength(1);
    expect(sentences('Weights fell (mean ± s.e.m.) (n = 8 mice), t(7) = 2.25.')).toHaveLength(1);
    expect(sentences('Weights fell (values are mean ± S.D.) in all mice. The next test followed.')).toHaveLength(2);
  });
  it('a bracketed sentence still ends before a new one', () => {
    expect(sentences('Scores rose (see Table 2.) The groups differed.')).toHaveLength(2);
  });
});

describe('descriptives in a sentence with bracketed abbreviations stay in the test\'s sentence', () => {
  it('"(mean ± s.d.) (repeated measures …)" keeps the two means with their own paired test', () => {
    const r = checkSource('x.md', 'Marbles rose from 8.38 ± 3.43 (before) to 12.50 ± 2.07 (after) (n = 8 mice) (mean ± s.d.) (repeated measures on the same mice); t_7 = 2.25, P = 0.060. Food was higher with the wheel (8.03 ± 0.46, n = 6 mice) than without (3.50 ± 1.40, n = 9 mice); t10.36 = 8.99, P = 0.001.\n');
    expect(r.results.map((x) => x.context.descriptives?.groups.length)).toEqual([2, 2]);
    expect(r.results[0]?.context.descriptives?.scope).toBe('sentence');
  });
});
