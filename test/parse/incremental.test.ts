import { describe, expect, it } from 'vitest';
import { statDense } from '../../bench/corpus.js';
import { parseDocument, reparseDocument, type InputFormat } from '../../src/parse/index.js';
import { digitEdit, edit, RICH, seeded, WITH_DEFINITIONS } from '../engine/edits.js';

/**
 * reparseDocument (one top-level paragraph or table read again alone) against parseDocument of
 * the whole edited text, segment by segment, field by field: the reference is the whole parse.
 * Edits accumulate, each re-read from the previous reading (re-read alone or whole).
 */
function follow(start: string, steps: number, seed: number, step: (t: string, r: () => number) => string, format: InputFormat = 'markdown'): number {
  const random = seeded(seed);
  const path = format === 'rmarkdown' ? 'm.Rmd' : 'm.md';
  let text = start;
  let prev = parseDocument(path, text);
  let alone = 0;
  for (let i = 0; i < steps; i += 1) {
    text = step(text, random);
    const whole = parseDocument(path, text);
    const re = reparseDocument(prev, text, format);
    if (re) {
      alone += 1;
      expect(re, `edit ${i} (seed ${seed}) at ${JSON.stringify(text.slice(0, 40))}…`).toStrictEqual(whole);
    }
    prev = re ?? whole;
  }
  return alone;
}

describe('a paragraph or table re-read alone reads as the whole text does', () => {
  it('random edits of every kind', () => {
    expect(follow(RICH, 300, 11, edit)).toBeGreaterThan(30);
  });
  it('digit corrections', () => {
    expect(follow(RICH, 200, 12, digitEdit)).toBeGreaterThan(30);
  });
  it('R Markdown', () => {
    expect(follow(RICH, 150, 13, edit, 'rmarkdown')).toBeGreaterThan(15);
  });
  it('front matter or a link reference definition: never re-read alone', () => {
    expect(follow(WITH_DEFINITIONS, 100, 14, digitEdit)).toBe(0);
  });
  it('the 50 KB bench manuscript', () => {
    expect(follow(statDense(1), 15, 15, digitEdit)).toBeGreaterThan(5);
  });
});
