import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { expectLinearCheck } from '../helpers.js';

/**
 * Thousands of coefficients, same-comparison Fs, stated table sizes and χ² with φ or V in one
 * paragraph cost time in proportion to their number: the SE after a coefficient is read on a
 * few characters, the t before an F and the φ or V after a χ² are found by binary search, and
 * table sizes are counted once per sentence and paragraph. Invented text; the values vary.
 */
const unit = (i: number) => {
  const t = (2 + (i % 200) / 100).toFixed(2);
  return `b = 0.${String(30 + (i % 60)).padStart(2, '0')}, SE = 0.15, t(96) = ${t} (equivalently F(1, 96) = ${(Number(t) ** 2).toFixed(2)}), and in a 2 × 3 table χ2(2, N = ${100 + (i % 400)}) = ${(5 + (i % 50) / 10).toFixed(1)}, V = .${10 + (i % 80)}`;
};
const oneSentence = (n: number) => `# Results\n\n${Array.from({ length: n }, (_, i) => unit(i)).join('; ')}.\n`;
const sentences = (n: number) => `# Results\n\n${Array.from({ length: n }, (_, i) => `${unit(i)}.`).join(' ')}\n`;

describe('many coefficients, Fs and χ² with sizes in one paragraph', () => {
  for (const [name, make] of Object.entries({ 'one sentence': oneSentence, 'one paragraph of sentences': sentences })) {
    it(`${name}: checking twice as many costs less than three times as much`, () => {
      expectLinearCheck(name, make, 1000);
      // every coefficient's t is read (the shape is not empty)
      expect(checkSource('x.md', make(50)).results).toHaveLength(50);
    }, 120_000);
  }
});

/**
 * Thousands of Fs naming a table, in one sentence or a paragraph of sentences, beside a table of
 * groups: the table a sentence or paragraph names, the labels a sentence names and the caption
 * words it shares are found once each, not once per F. Invented text; the values vary.
 */
const table = `Table 1. Recall by room.

| Room | n | M | SD |
|---|---|---|---|
| Quiet | 5 | 5.34 | 1.12 |
| Music | 5 | 7.72 | 1.10 |
| Noise | 5 | 8.56 | 1.38 |
`;
const fUnit = (i: number) => `recall in block ${i} differed by room (Table 1), F(2, 12) = ${(9 + (i % 90) / 100).toFixed(2)}`;
const fSentence = (n: number) => `# Results\n\n${table}\n${Array.from({ length: n }, (_, i) => fUnit(i)).join('; ')}.\n`;
const fSentences = (n: number) => `# Results\n\n${table}\nTable 1 gives the recall of each room. ${Array.from({ length: n }, (_, i) => `In block ${i} recall differed by room, F(2, 12) = ${(9 + (i % 90) / 100).toFixed(2)}.`).join(' ')}\n`;

describe('many Fs naming a table of groups', () => {
  for (const [name, make] of Object.entries({ 'one sentence': fSentence, 'one paragraph of sentences': fSentences })) {
    it(`${name}: checking twice as many costs less than three times as much`, () => {
      // 2,000 and 4,000: at 1,000 and 2,000 a scan of the sentence per F (since made linear) gave
      // 3.0-3.1, too near the bound to fail for certain; at twice those sizes it gave 3.3-3.6
      expectLinearCheck(name, make, 2000);
      // every F is read (the shape is not empty)
      expect(checkSource('x.md', make(50)).statistics?.filter((s) => s.kind === 'F')).toHaveLength(50);
    }, 120_000);
  }
});
