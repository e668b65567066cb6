import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { statDense, statFree } from '../../bench/corpus.js';
import { checkSource } from '../../src/engine/index.js';
import { mayHoldStatistics } from '../../src/parse/index.js';

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((n) => {
    const p = join(dir, n);
    return statSync(p).isDirectory() ? files(p) : /\.(md|txt|Rmd|qmd)$/.test(n) ? [p] : [];
  });
}

/** Every fenced markdown example on the rule pages. */
const pageExamples = readdirSync('rules')
  .filter((f) => f.endsWith('.md'))
  .flatMap((f) => [...readFileSync(join('rules', f), 'utf8').matchAll(/```markdown\n([\s\S]*?)```/g)].map((m) => m[1] as string));

const documents: Array<[string, string]> = [
  ...files('fixtures').map((f) => [f, readFileSync(f, 'utf8')] as [string, string]),
  ...pageExamples.map((t, i) => [`page-example-${i}.md`, t] as [string, string]),
  ...Array.from({ length: 4 }, (_, i) => [`dense-${i}.md`, statDense(100 + i, 20_000)] as [string, string]),
  ...Array.from({ length: 4 }, (_, i) => [`free-${i}.md`, statFree(200 + i, 20_000)] as [string, string]),
];

describe('the pre-filter changes nothing but speed', () => {
  it('covers fixtures, rule-page examples and both benchmark corpora', () => {
    expect(documents.length).toBeGreaterThan(100);
  });
  it.each(documents)('%s: identical results and findings with and without it', (path, text) => {
    for (const checklist of [false, true]) {
      const withFilter = checkSource(path, text, { checklist });
      const without = checkSource(path, text, { checklist, prefilter: false });
      expect(JSON.stringify(withFilter)).toBe(JSON.stringify(without));
    }
  });
  it('skips the stat-free corpus and keeps the stat-dense one', () => {
    for (let i = 0; i < 20; i += 1) expect(mayHoldStatistics(statFree(300 + i))).toBe(false);
    for (let i = 0; i < 20; i += 1) expect(mayHoldStatistics(statDense(300 + i))).toBe(true);
  });
});
