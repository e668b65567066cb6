import { describe, expect, it } from 'vitest';
import { MIN_CHARS_PER_WORKER, threadsFor } from '../../src/cli/pool.js';

/**
 * The default number of worker threads: one per MIN_CHARS_PER_WORKER of text, at least one, at
 * most one per core and one per document (our policy; its constant comes from figure 11 of
 * `npm run bench`, the cost of starting a worker, and that figure checks the margin).
 */
describe('threadsFor', () => {
  const M = MIN_CHARS_PER_WORKER;
  it.each([
    ['one small document', 1, 10_000, 8, 1],
    ['400 files of 10 KB on 2 cores', 400, 4_000_000, 2, 2],
    ['400 files of 10 KB on 64 cores: one per 1.5 MiB', 400, 4_000_000, 64, 2],
    ['6 MiB on 64 cores: four shares', 400, 6 * 1024 * 1024, 64, 4],
    ['less text than one worker’s share', 50, M - 1, 16, 1],
    ['exactly two shares', 50, 2 * M, 16, 2],
    ['one large document cannot be split', 1, 50 * M, 16, 1],
    ['three documents, much text', 3, 50 * M, 16, 3],
    ['no documents', 0, 0, 4, 1],
  ])('%s', (_name, documents, chars, cores, expected) => {
    expect(threadsFor(documents, chars, cores)).toBe(expected);
  });
});
