import { describe, expect, it } from 'vitest';
import { statDense } from '../../bench/corpus.js';
import { checkSource, IncrementalChecker } from '../../src/engine/index.js';
import { digitEdit, edit, RICH, seeded, WITH_DEFINITIONS } from './edits.js';

/**
 * The incremental re-check (IncrementalChecker: one paragraph or table re-parsed alone, the
 * records of unchanged segments kept) must give exactly what a whole check gives, edit after
 * edit. The reference is the whole check itself (checkSource on the edited text); the edits are
 * random (seeded), so most fall back to the whole parse and many are re-read alone, and both
 * paths are compared.
 */
function follow(start: string, steps: number, seed: number, step: (t: string, r: () => number) => string, path = 'manuscript.md', alone = steps / 10): void {
  const random = seeded(seed);
  const checker = new IncrementalChecker();
  let text = start;
  expect(checker.check(path, text)).toEqual(checkSource(path, text));
  for (let i = 0; i < steps; i += 1) {
    text = step(text, random);
    const got = checker.check(path, text);
    // toStrictEqual: the same fields, also those left undefined, in every record
    expect(got, `edit ${i} (seed ${seed})`).toStrictEqual(checkSource(path, text));
    // the same text again (a save, a configuration change) reads from the same parse
    if (i % 10 === 0) expect(checker.check(path, text)).toStrictEqual(got);
  }
  // the comparison is worth something only if edits were read alone too
  expect(checker.rereadAlone).toBeGreaterThanOrEqual(alone);
}

describe('incremental re-check equals the whole check', () => {
  it('random edits of every kind to a manuscript with every kind of block', () => {
    follow(RICH, 100, 1, edit);
  });
  it('digit corrections in the same manuscript', () => {
    follow(RICH, 60, 2, digitEdit);
  });
  it('front matter and a reference definition: every edit parses the whole text', () => {
    follow(WITH_DEFINITIONS, 40, 6, digitEdit, 'manuscript.md', 0);
  });
  it('random edits read as R Markdown', () => {
    follow(RICH, 60, 3, edit, 'manuscript.Rmd');
  });
  it('digit corrections and random edits in a 50 KB generated manuscript (the bench corpus)', () => {
    const text = statDense(1);
    follow(text, 8, 4, digitEdit);
    follow(text, 5, 5, edit);
  });
});
