import fc from 'fast-check';
import type { Root } from 'mdast';
import remarkFrontmatter from 'remark-frontmatter';
import remarkGfm from 'remark-gfm';
import remarkMath from 'remark-math';
import remarkParse from 'remark-parse';
import { unified, type Processor } from 'unified';
import { describe, expect, it } from 'vitest';
import { LabelList, withDefinedLabels } from '../../src/parse/definedLabels.js';
import { markdownProcessors } from '../../src/parse/markdown.js';
import { definedLabels, guessLabels } from '../../src/parse/pieces.js';

/**
 * micromark keeps defined labels in arrays it asks with `includes` (link reference definitions in
 * `parser.defined`, GFM footnotes in `parser.gfmFootnotes`): n definitions with n uses cost n².
 * src/parse/definedLabels.ts puts a Set-backed list in their place. These tests check that it is
 * exact (the tree is the one micromark gives without it) and that it takes effect (the parsers of
 * src/parse/markdown.ts hold LabelLists, and the cost is linear), so an update of micromark that
 * renames or reshapes these arrays fails here rather than turning quadratic unseen.
 */

const RUNS = Number(process.env.PLUMBLINE_PROPERTY_RUNS ?? 500);
const SEED = Number(process.env.PLUMBLINE_PROPERTY_SEED ?? 20261204);

// the parse layer's parsers, and the same chains without the hook
const hooked = markdownProcessors;
const bare = {
  processor: unified().use(remarkParse).use(remarkGfm).use(remarkFrontmatter, ['yaml']).use(remarkMath),
  withoutFrontMatter: unified().use(remarkParse).use(remarkGfm).use(remarkMath),
};

/**
 * Labels that CommonMark matches by case folding and whitespace collapsing (micromark's
 * normalizeIdentifier: inner runs of whitespace to one space, trimmed, then lower- and
 * upper-cased), and near misses that must stay apart. The pairs are facts of the trade
 * (CommonMark spec 0.31, "link label" matching; Unicode case folding: ẞ/ß/ss, ſ/s, the sigmas,
 * K/K), common practice, no source.
 */
const LABELS = [
  'a', 'A', 'ref 1', 'Ref  1', 'REF\t1', ' ref 1 ', 'ref\n1', 'ref1',
  'Straße', 'STRASSE', 'strasse', 'ẞ', 'ß', 'ss', 'ſ', 's', 'ΣΑΣ', 'σας', 'σασ', 'K', 'k', 'K',
  'İ', 'i̇', 'ǅ', 'ǆ', 'x\\]y', 'x]y', '1', '01', 'a-b', 'a_b', '*a*', 'é', 'é',
];
const label = fc.constantFrom(...LABELS);
const footLabel = fc.constantFrom('1', 'a', 'A', 'note', 'Note', 'NOTE', 'ß', 'ss', 'x y', 'x', 'σ', 'Σ');
const words = fc.constantFrom('Recall improved', 'see', 'the desk group', 't(28) = 2.10, p = .045', 'as noted', '');

/** Inline content: prose with references of every form (full, collapsed, shortcut, images, footnote calls). */
const inline = fc.array(
  fc.oneof(
    words,
    label.map((l) => `[${l}]`),
    fc.tuple(words, label).map(([w, l]) => `[${w || 'text'}][${l}]`),
    label.map((l) => `[${l}][]`),
    label.map((l) => `![${l}]`),
    footLabel.map((l) => `[^${l}]`),
    footLabel.map((l) => `![^${l}]`),
    fc.constant('[inline](https://example.org/x)'),
  ),
  { minLength: 1, maxLength: 6 },
).map((parts) => parts.join(' '));

const block = fc.oneof(
  { weight: 3, arbitrary: fc.tuple(label, fc.constantFrom('https://example.org/a', '<https://example.org/b c>', '/local', ''), fc.constantFrom('', ' "T"', " 'T2'", ' (T3)')).map(([l, d, t]) => `[${l}]: ${d}${t}`) },
  { weight: 2, arbitrary: fc.tuple(footLabel, words).map(([l, w]) => `[^${l}]: ${w || 'A note.'}`) },
  { weight: 4, arbitrary: inline },
  { weight: 1, arbitrary: fc.tuple(fc.constantFrom('> ', '- ', '1. ', '   '), fc.oneof(inline, label.map((l) => `[${l}]: /q`), footLabel.map((l) => `[^${l}]: quoted`))).map(([m, b]) => `${m}${b}`) },
);
const doc = fc.tuple(fc.array(block, { minLength: 1, maxLength: 12 }), fc.array(fc.constantFrom('\n', '\n\n'), { minLength: 12, maxLength: 12 }))
  .map(([blocks, seps]) => blocks.map((b, i) => `${b}${seps[i]}`).join(''));

function count(tree: Root, type: string): number {
  let n = 0;
  const visit = (node: { type: string; children?: unknown[] }): void => {
    if (node.type === type) n += 1;
    for (const child of node.children ?? []) visit(child as { type: string; children?: unknown[] });
  };
  visit(tree);
  return n;
}

describe('label lists in place of micromark\'s arrays of defined labels', () => {
  it('the tree is the one micromark gives without them, over generated documents of definitions and references', () => {
    // the documents must meet what the lists decide: references that resolve (micromark drops
    // an unresolved one to text) and footnote calls that name a definition
    const seen = { linkReference: 0, imageReference: 0, footnoteReference: 0, definition: 0, footnoteDefinition: 0 };
    fc.assert(
      fc.property(doc, (source) => {
        for (const name of ['processor', 'withoutFrontMatter'] as const) {
          const want = bare[name].parse(source);
          const got = hooked[name].parse(source);
          expect(got).toEqual(want);
          if (name === 'processor') for (const type of Object.keys(seen) as Array<keyof typeof seen>) seen[type] += count(got, type);
        }
      }),
      { numRuns: RUNS, seed: SEED },
    );
    for (const [type, n] of Object.entries(seen)) expect(n, type).toBeGreaterThan(RUNS / 20);
  }, 300_000);

  it('labels equal after folding and collapsing resolve as in micromark without the lists', () => {
    // hand-picked: each pair is one label to CommonMark (common practice, no source); each tree is compared whole
    const source = [
      'Cited [REF  1], [Straße], [ΣΑΣ], [K], [i̇], [note][ǅ] and [x\\]y], with a call.[^NOTE] And ![ss].',
      '',
      '[ref 1]: /one',
      '[STRASSE]: /two',
      '[σας]: /three',
      '[k]: /four',
      '[İ]: /five',
      '[ǆ]: /six',
      '[x\\]y]: /seven',
      '[ẞ]: /eight',
      '',
      '[^note]: A note.',
      '',
    ].join('\n');
    const want = bare.processor.parse(source);
    expect(hooked.processor.parse(source)).toEqual(want);
    // the references that resolve here, so that the comparison covers matching, not only misses
    expect(count(want, 'linkReference')).toBeGreaterThanOrEqual(5);
    expect(count(want, 'footnoteReference')).toBe(1);
  });

  it('the parse layer\'s parsers hold label lists by the time any reference is read', () => {
    // a test extension, tried first at every `]` of inline text (after every definition has
    // been read: micromark reads inline text last), looks at the parser's lists
    for (const name of ['processor', 'withoutFrontMatter'] as const) {
      const lists: Array<{ defined: unknown; gfmFootnotes: unknown }> = [];
      const looker = function (this: Processor): undefined {
        (this.data().micromarkExtensions ??= []).push({
          text: {
            93: {
              partial: true,
              tokenize(_effects, _ok, nok) {
                const parser = this.parser as unknown as { defined: unknown; gfmFootnotes?: unknown };
                lists.push({ defined: parser.defined, gfmFootnotes: parser.gfmFootnotes });
                return nok;
              },
            },
          },
        });
        return undefined;
      };
      const copy = hooked[name]().use(looker);
      const tree = copy.parse('[a]: /x\n[^b]: note\n\nSee [A] and [^b].\n') as Root;
      expect(count(tree, 'linkReference')).toBe(1);
      expect(count(tree, 'footnoteReference')).toBe(1);
      expect(lists.length).toBeGreaterThan(0);
      for (const seen of lists) {
        expect(seen.defined, name).toBeInstanceOf(LabelList);
        expect(seen.gfmFootnotes, name).toBeInstanceOf(LabelList);
        expect([...(seen.defined as string[])]).toEqual(['A']);
        expect([...(seen.gfmFootnotes as string[])]).toEqual(['B']);
      }
    }
  });

  it('a text parsed with the labels another defines reads its references as one text holding both', () => {
    // the references first, the definitions after a blank line: the first part's blocks keep
    // their places in the whole, and parsed alone with the whole's labels they must be the same
    // blocks; micromark without the lists (`bare`) parses the whole
    const seen = { linkReference: 0, imageReference: 0, footnoteReference: 0 };
    const definitionLine = fc.oneof(
      fc.tuple(label, fc.constantFrom('/a', '<https://example.org/b c>')).map(([l, d]) => `[${l}]: ${d}`),
      footLabel.map((l) => `[^${l}]: A note.`),
    );
    fc.assert(
      fc.property(fc.array(inline, { minLength: 1, maxLength: 6 }), fc.array(definitionLine, { minLength: 1, maxLength: 10 }), (paragraphs, definitions) => {
        const uses = paragraphs.map((p) => p.trim() || 'text').join('\n\n');
        const whole = `${uses}\n\n${definitions.join('\n\n')}\n`;
        const want = bare.processor.parse(whole);
        const labels = definedLabels(want.children, whole);
        if (labels === undefined) {
          // only a label across lines is not read from the text (inside a container its marks would be in it)
          expect(definitions.some((d) => /^\[[^\]]*\n/.test(d))).toBe(true);
          return;
        }
        const got = withDefinedLabels(labels, () => hooked.processor.parse(uses) as Root);
        expect(got.children).toEqual(want.children.slice(0, got.children.length));
        for (const type of Object.keys(seen) as Array<keyof typeof seen>) seen[type] += count(got, type);
        // without the labels the same text reads none of them (no definition of its own)
        expect(count(hooked.processor.parse(uses) as Root, 'linkReference') + count(hooked.processor.parse(uses) as Root, 'footnoteReference')).toBe(0);
        // the definitions one a line at the margin: a look at the lines finds the labels the tree defines
        const guessed = guessLabels(whole);
        expect(guessed.links).toEqual(labels.links);
        expect(guessed.footnotes).toEqual(labels.footnotes);
      }),
      { numRuns: RUNS, seed: SEED },
    );
    for (const [type, n] of Object.entries(seen)) expect(n, type).toBeGreaterThan(RUNS / 20);
  }, 300_000);

  it('a seed holds for one parse only', () => {
    const seed = { links: new Set(['A']), footnotes: new Set(['N']) };
    const inside = withDefinedLabels(seed, () => hooked.processor.parse('See [a] and [^n].') as Root);
    expect(count(inside, 'linkReference')).toBe(1);
    expect(count(inside, 'footnoteReference')).toBe(1);
    const after = hooked.processor.parse('See [a] and [^n].') as Root;
    expect(count(after, 'linkReference') + count(after, 'footnoteReference')).toBe(0);
    // also when the parse throws
    expect(() => withDefinedLabels(seed, () => { throw new Error('stop'); })).toThrow('stop');
    expect(count(hooked.processor.parse('See [a].') as Root, 'linkReference')).toBe(0);
  });

  it('a label list answers includes as an array does, also once changed by something other than push', () => {
    const list = LabelList.holding(['a', 'B', 'a']);
    expect(list.includes('a')).toBe(true);
    expect(list.includes('b')).toBe(false);
    expect(list.includes('a', 1)).toBe(true);
    expect(list.includes('B', 2)).toBe(false);
    expect(Array.isArray(list)).toBe(true);
    expect(list.slice(1)).not.toBeInstanceOf(LabelList);
    list.pop();
    list.pop();
    // the Set still holds 'B': the list now answers by scanning
    expect(list.includes('B')).toBe(false);
    expect(list.includes('a')).toBe(true);
    // a seed answers as if it opened the list, and is shared, not copied into it
    const labels = new Set(['Y']);
    const seeded = LabelList.holding(['x']);
    seeded.seed(labels);
    seeded.push('w');
    expect(seeded.includes('Y')).toBe(true);
    expect(seeded.includes('x')).toBe(true);
    expect(seeded.includes('w')).toBe(true);
    expect(seeded.includes('z')).toBe(false);
    expect([...seeded]).toEqual(['x', 'w']);
    labels.add('Z');
    expect(seeded.includes('Z')).toBe(true);
  });
});

/** Best seconds of `tries` parses of each, the two parsed in turn, so a busy spell of the machine slows both rather than one. */
function parseSeconds(small: () => unknown, large: () => unknown, tries: number): [number, number] {
  const seconds = (parse: () => unknown) => {
    const t0 = performance.now();
    parse();
    return (performance.now() - t0) / 1000;
  };
  let best: [number, number] = [Infinity, Infinity];
  for (let i = 0; i < tries; i += 1) best = [Math.min(best[0], seconds(small)), Math.min(best[1], seconds(large))];
  return best;
}

/**
 * `n` link reference (or footnote) definitions, each with its own label, then eight bracketed
 * labels per definition in paragraphs of twenty, one of each twenty a defined label and the rest
 * a label defined nowhere (numbered citations of a converted manuscript whose reference list is
 * made of definitions). Without the lists each closing `]` (each footnote call, each footnote
 * definition) scans the labels defined, all of them when the label is not there, so doubling n
 * quadruples that part of the time. Short lines, so that the scans weigh: the parse layer sets
 * such bracket-dense text aside before the parser (depth.ts), which is why these tests time the
 * parser itself. The scans cost a few nanoseconds a label against some microseconds of parsing a
 * bracket, so only thousands of definitions show them. Measured here with
 * PLUMBLINE_LABELS_PARSER=bare (load about 10): the footnote test failed, 4.75 s at 4,000 and
 * 15.7 s at 8,000 (ratio 3.3); the link test stays under 3 at these sizes (a footnote definition
 * scans too, a link reference definition does not), so for links it is the test above, of the
 * lists the parsers hold, that fails first when the lists stop taking effect.
 */
function definitionsAndUses(n: number, footnotes: boolean): string {
  const mark = footnotes ? '^' : '';
  const out: string[] = [];
  for (let i = 0; i < n; i += 1) out.push(`[${mark}d${i}]: ${footnotes ? 'a note' : '/x'}`);
  out.push('');
  for (let i = 0; i < 8 * n; i += 20) {
    const uses: string[] = [`[${mark}d${(i * 7919) % n}]`];
    for (let j = 1; j < 20; j += 1) uses.push(`[${mark}${j}]`);
    out.push(uses.join(' '), '');
  }
  return out.join('\n');
}

const LINEAR_N = Number(process.env.PLUMBLINE_LABELS_N ?? 4_000);
const PARSERS = { hooked: hooked.processor, bare: bare.processor };
/** PLUMBLINE_LABELS_PARSER=bare times the chain without the lists: the ratio it prints shows what these tests would see if the lists stopped taking effect. */
const TIMED = PARSERS[(process.env.PLUMBLINE_LABELS_PARSER ?? 'hooked') as keyof typeof PARSERS];

describe('many definitions, each used, cost the parser linear time', () => {
  // footnotes only: at these sizes the link case stays under 3 without the lists too (see
  // definitionsAndUses), so it could not fail for its reason; the test of the lists the parsers
  // hold covers links, and bench figure 7 ("definitions, each used") times them
  for (const footnotes of [true]) {
    const what = footnotes ? 'footnote definitions and calls' : 'link reference definitions and references';
    it(`${what}: doubling their number less than triples the parse time (best of three)`, () => {
      const n = LINEAR_N;
      const parse = (k: number) => {
        const source = definitionsAndUses(k, footnotes);
        return () => TIMED.parse(source);
      };
      parse(500)();
      const [small, large] = parseSeconds(parse(n), parse(2 * n), 3);
      expect(large / small, `${what}: ${small.toFixed(2)} s at ${n}, ${large.toFixed(2)} s at ${2 * n}`).toBeLessThan(3);
    }, 240_000);
  }
});
