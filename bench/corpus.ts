/**
 * Deterministic invented manuscripts for the benchmark (no real study, person or data):
 * stat-dense documents (~50 KB, ~40 reported results in sentences and tables) and stat-free
 * prose of similar size. A small seeded generator (mulberry32) makes every run identical.
 */
export function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const WORDS = ('the office staff worked standing afternoons fatigue rated scale weeks desks seated ward nurses prompt poster audit compliance ' +
  'observed outcome measure pilot study invented fictional hours minutes shift session rating lower higher similar across both groups ' +
  'protocol analysis planned sample recruited consented completed period baseline follow-up comparison reported table figure').split(' ');

function sentence(next: () => number, words: number): string {
  const out: string[] = [];
  for (let i = 0; i < words; i += 1) out.push(WORDS[Math.floor(next() * WORDS.length)] as string);
  const s = out.join(' ');
  return `${s[0]?.toUpperCase()}${s.slice(1)}.`;
}

function result(next: () => number): string {
  const df = 10 + Math.floor(next() * 80);
  const t = (next() * 4).toFixed(2);
  const p = (next() * 0.5 + 0.001).toFixed(3).replace(/^0/, '');
  const m1 = (40 + next() * 10).toFixed(1);
  const m2 = (40 + next() * 10).toFixed(1);
  const sd1 = (5 + next() * 5).toFixed(1);
  const sd2 = (5 + next() * 5).toFixed(1);
  const n = Math.floor(df / 2) + 1;
  const forms = [
    `Fatigue differed between desks (M = ${m1}, SD = ${sd1}, n = ${n}; M = ${m2}, SD = ${sd2}, n = ${df + 2 - n}), *t*(${df}) = ${t}, *p* = ${p}, d = 0.${Math.floor(next() * 90 + 10)}.`,
    `Alertness changed, t(${df}) = ${t}, p = ${p}, 95% CI [${(next() * 2).toFixed(2)}, ${(2 + next() * 3).toFixed(2)}].`,
    `The ward audit gave $t(${df}) = ${t}$, $p = ${p}$.`,
    `Ratings were ${m1} ± ${sd1} (SD) and ${m2} ± ${sd2} (SD), t = ${t}, df = ${df}, p-value = ${p}.`,
  ];
  return forms[Math.floor(next() * forms.length)] as string;
}

function table(next: () => number): string {
  const rows = ['| Outcome | t | df | p |', '|---|---|---|---|'];
  for (let i = 0; i < 4; i += 1) rows.push(`| Measure ${i + 1} | ${(next() * 3).toFixed(2)} | ${20 + Math.floor(next() * 40)} | ${(next() * 0.5 + 0.01).toFixed(3).replace(/^0/, '')} |`);
  return rows.join('\n');
}

/** A stat-dense manuscript of about `bytes` characters with results every few sentences. */
export function statDense(seed: number, bytes = 50_000): string {
  const next = rng(seed);
  const parts = [`# Invented pilot ${seed}\n`, '## Methods\n', `${sentence(next, 30)} Significance was set at α = .05.\n`, '## Results\n'];
  let size = parts.join('\n').length;
  let k = 0;
  while (size < bytes) {
    const para = k % 9 === 8 ? table(next) : k % 5 === 0 ? `${sentence(next, 18)} ${result(next)} ${sentence(next, 12)}` : `${sentence(next, 30)} ${sentence(next, 24)} ${sentence(next, 20)}`;
    parts.push(para, '');
    size += para.length + 2;
    k += 1;
  }
  return parts.join('\n');
}

/** Stat-free prose (notes, READMEs) of about `bytes` characters: headings, lists, links, code. */
export function statFree(seed: number, bytes = 50_000): string {
  const next = rng(seed);
  const parts = [`# Notes ${seed}\n`];
  let size = parts[0]?.length ?? 0;
  let k = 0;
  while (size < bytes) {
    const kind = k % 5;
    const para = kind === 0 ? `## Section ${k}\n` : kind === 1 ? `- ${sentence(next, 8)}\n- ${sentence(next, 6)} [link](https://example.org/${k})\n` : kind === 2 ? '```\nnpm install\nnpm run build\n```\n' : `${sentence(next, 40)} ${sentence(next, 25)}\n`;
    parts.push(para);
    size += para.length + 1;
    k += 1;
  }
  return parts.join('\n');
}

/**
 * Adversarial documents of about `bytes` characters: one run of a pattern that stresses a
 * scanner (our regular expressions, or the Markdown parser), between two ordinary reported
 * results so the pre-filter cannot skip the document.
 */
export const ADVERSARIAL: Record<string, (bytes: number) => string> = {
  't(': (n) => 't('.repeat(n / 2),
  'p = .': (n) => 'p = .'.repeat(n / 5),
  '±': (n) => '±'.repeat(n),
  '1 ± ': (n) => '1 ± '.repeat(n / 4),
  digits: (n) => '1234567890'.repeat(n / 10),
  '*a': (n) => '*a'.repeat(n / 2),
  '**': (n) => '*'.repeat(n / 2) + 'x' + '*'.repeat(n / 2),
  $: (n) => '$x'.repeat(n / 2),
  '| pipes': (n) => '|'.repeat(n),
  'table rows': (n) => `| a | b |\n|---|---|\n${'| 1 | 2 |\n'.repeat(n / 10)}`,
  'rows, no outer pipes': (n) => `a | b\n--- | ---\n${'1 | 2\n'.repeat(n / 6)}`,
  'rows with markup': (n) => `| a | b |\n|---|---|\n${'| *1* | \\|2 |\n'.repeat(n / 14)}`,
  'quoted rows': (n) => `> | a | b |\n> |---|---|\n${'> | 1 | 2 |\n'.repeat(n / 12)}`,
  '![': (n) => '!['.repeat(n / 6) + 'x' + '](u)'.repeat(n / 6),
  'nested >': (n) => '>'.repeat(n),
};

/**
 * Further hostile runs, beyond the patterns the hostile-input goal names: markup the density
 * guard does not set aside (HTML tags, entities, escapes, backslashes, autolinks) because it
 * carries meaning, code spans and strike-through (set aside when dense), and a paragraph of
 * one-character lines; prose patterns the extractor once read in quadratic time; and block
 * shapes micromark reads in quadratic time (setext headings, block quotes, lazy lines: set aside
 * past a limit by src/parse/shapes.ts), with front matter left open and many definitions.
 */
export const FURTHER_HOSTILE: Record<string, (bytes: number) => string> = {
  'code spans': (n) => '`1` '.repeat(n / 4),
  '~~ strike': (n) => '~~a~~ '.repeat(n / 6),
  'html tags': (n) => '<b>a</b> '.repeat(n / 9),
  entities: (n) => '&amp; '.repeat(n / 6),
  'escapes \\|': (n) => '\\| '.repeat(n / 3),
  backslashes: (n) => '\\'.repeat(n),
  autolinks: (n) => 'www.a.b '.repeat(n / 8),
  'short lines': (n) => 'a\n'.repeat(n / 2),
  // prose patterns the extractor once read in quadratic time (issue 18)
  'pre-test ': (n) => 'pre-test '.repeat(n / 9),
  'randomly assigned to ': (n) => 'randomly assigned to '.repeat(n / 21),
  // block shapes micromark reads in quadratic time (issue 18; src/parse/shapes.ts)
  'setext headings': (n) => 'Heading\n===\n'.repeat(n / 12),
  'block quotes': (n) => '> a\n\n'.repeat(n / 5),
  'lazy quote lines': (n) => `> a\n${'lazy\n'.repeat(n / 5)}`,
  'lazy list lines': (n) => `- a\n${'lazy\n'.repeat(n / 5)}`,
  // one paragraph of many lines, each split by micromark: line breaks read as spaces past a limit
  'paragraph of word lines': (n) => 'cost and benefit 1\n'.repeat(n / 19),
  'paragraph of & lines': (n) => 'a & b\n'.repeat(n / 6),
  'one long quote': (n) => '> a b\n'.repeat(n / 6),
  'unclosed front matter': (n) => `---\n${'key: value\n'.repeat(n / 11)}`,
  'reference definitions': (n) => '[a]: b\n'.repeat(n / 7),
  'footnote definitions': (n) => '[^a]: b\n'.repeat(n / 8),
  // many labels, each defined and used, in prose thin enough in brackets that the density guard
  // leaves them to micromark (its lists of defined labels: src/parse/definedLabels.ts)
  'definitions, each used': (n) => citedDefinitions(n, false),
  'footnotes, each called': (n) => citedDefinitions(n, true),
};

/**
 * About `bytes` characters of paragraphs each citing a label of its own (`[ref12]`, or a footnote
 * call `[^n12]`), then the definitions of all of them, one a line.
 */
function citedDefinitions(bytes: number, footnotes: boolean): string {
  const count = Math.floor(bytes / 165);
  const uses: string[] = [];
  const definitions: string[] = [];
  for (let i = 0; i < count; i += 1) {
    uses.push(footnotes ? `Fatigue fell over the weeks of the invented trial, as note ${i} says.[^n${i}]` : `As an invented study reported [ref${i}], fatigue fell over the weeks.`);
    definitions.push(footnotes ? `[^n${i}]: An invented note on the trial and its desks, number ${i}.` : `[ref${i}]: https://example.org/invented/works/${i} "An invented work"`);
  }
  return `${uses.join('\n\n')}\n\n${definitions.join('\n')}`;
}

export function adversarial(kind: string, bytes = 1_000_000): string {
  const run = ADVERSARIAL[kind] ?? FURTHER_HOSTILE[kind];
  if (!run) throw new Error(`no adversarial input "${kind}"`);
  // front matter only opens on line 1
  if (kind === 'unclosed front matter') return `${run(bytes)}\nFatigue fell after the session, t(23) = 2.47, p = .021.\n\nErrors rose, t(40) = 3.10, p = .20.\n`;
  return `Fatigue fell after the session, t(23) = 2.47, p = .021.\n\n${run(bytes)}\n\nErrors rose, t(40) = 3.10, p = .20.\n`;
}

/**
 * One paragraph of `count` reported results, five to a sentence (`… t(28) = 2.10, p = .045, and
 * t(30) = …`), and nothing else: the shape where a per-result step that rescans its sentence or
 * paragraph shows as quadratic time.
 */
export function resultsParagraph(count: number, seed = 17): string {
  const next = rng(seed);
  const sentences: string[] = [];
  for (let i = 0; i < count; i += 5) {
    const results: string[] = [];
    for (let k = i; k < Math.min(count, i + 5); k += 1) results.push(`t(${10 + Math.floor(next() * 80)}) = ${(next() * 4).toFixed(2)}, p = ${(next() * 0.5 + 0.001).toFixed(3).replace(/^0/, '')}`);
    sentences.push(`Scores differed, ${results.join(', and ')}.`);
  }
  return `# Invented results\n\n${sentences.join(' ')}\n`;
}

/**
 * A long manuscript of about `count` results in paragraphs of five, in the stat-dense forms
 * (descriptives, intervals, effect sizes, TeX, `t = …, df = …`) with a sentence of prose
 * before each paragraph: what a whole report's memory and JSON size grow with.
 */
export function manyResults(count: number, seed = 23): string {
  const next = rng(seed);
  const parts = ['# Invented pilot series\n', '## Results\n'];
  for (let i = 0; i < count; i += 5) {
    const results: string[] = [];
    for (let k = i; k < Math.min(count, i + 5); k += 1) results.push(result(next));
    parts.push(`${sentence(next, 8)} ${results.join(' ')}`, '');
  }
  return parts.join('\n');
}
