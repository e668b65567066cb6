import { readFileSync, readdirSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { markdownProcessors, parseMarkdown } from '../../src/parse/markdown.js';
import { cutAt, nextCut, parseInPieces } from '../../src/parse/pieces.js';

/**
 * A long Markdown text is parsed in pieces (src/parse/pieces.ts). The reference is the parser
 * itself (remark-parse with remark-gfm, remark-frontmatter and remark-math, from npm) on the
 * whole text: for every generated document and every piece size, the tree made of pieces must
 * be the whole text's, every place included. Seeded, so that every run tests the same documents.
 */
const RUNS = Number(process.env.PLUMBLINE_PROPERTY_RUNS ?? 1_000);
const SEED = Number(process.env.PLUMBLINE_PROPERTY_SEED ?? 20261204);
const { processor, withoutFrontMatter } = markdownProcessors;

/** A parser that counts its parses and the characters it read. */
function counting(parser: { parse(text: string): unknown }) {
  const seen = { parses: 0, chars: 0 };
  return { seen, parse: (text: string) => ((seen.parses += 1), (seen.chars += text.length), parser.parse(text)) };
}

/** The tree as JSON sees it (no undefined members). */
const plainTree = (tree: unknown) => JSON.parse(JSON.stringify(tree)) as unknown;

/**
 * Link reference definitions and footnote definitions, whole and in parts (a title or
 * destination on the next line, a footnote's indented continuation), inside containers and
 * code, with labels that normalise alike (case, ẞ and ss, escapes) or are no labels at all, and
 * the references and calls that name them.
 */
const DEFINITION_LINES = [
  '[a]: /u', '[A]: /u "t"', '[b]: <x y>', '[a]:', '/u', '"title"', "'t'", '(t)', '[c]: /u "open', 'close"', '[ss]: /s', '[ẞ]: /sharp', '[a\\]]: /e', '[ e  f ]: /w',
  '[^1]: A note.', '[^1]:', '[^n]: Note n.', '[^a b]: no', '[^N]: Upper.', '[^2]: Note\n    continued', '    indented more', '[^3]:\n    ```', '[^4]: > quoted',
  '[a] and [A] and [b][] and [x][a]', '![a] and [ẞ] and [SS]', '[^1] [^n] [^N] [^2] [^9]', '[e  f] [a\\]]', '> [a]: /quoted', '- [d]: /listed', '   [b]: /indented', '    [z]: /code',
  '[a]: /u\n[^5]: five\n[g]: /g', '[h]: /h\n| - |', '[i] | j\n- | -',
  // a footnote whose text opens like a list item, which a line interrupting content may not open
  '[^y]: 2019. Data were collected.', '[^z]: -', '[^w]: 3) x', '[^v]: > 2. x', '[^u]: 1.', '[^t]: - 2. x', '[^s]: 2. [x]: /x',
];

// Lines that open, continue or close blocks across blank lines, and ordinary prose.
const line = fc.constantFrom(
  'Fatigue fell, t(23) = 2.47, p = .021.', 'a', 'Words and *emphasis* here', 'x <b>tag</b> y', 'a  ', 'a\t', 'a\\', '  two spaces', '    indented code',
  '\tTab', '- item', '* item', '1. item', '2) item', '   continued item text', '> quote', '>', 'lazy line', '# Heading', 'Title', '===', '---', '***',
  '```', '```js', '~~~', '$$', '$x$ math', '<div>', '</div>', '<!-- open', '-->', '<pre>', '</pre>', '<script>', '</script>', '| a | b |', '|---|---|',
  '| 1 | 2 |', 'x\u00a0y', '\ufeffbom', '---\ntitle: x\n---', '<!-- plumbline quiet p-follows-from-t: checked -->', '[l](u) and ![i](u)', 'www.a.b',
  '[a] or [a][b] or [^1]', '<?x', '?>', '<![CDATA[', ']]>', '<textarea>', '</textarea>', '  - nested', '10. item', '$$ inline $$ here',
  // blocks opened inside a block quote, which a blank line closes with the quote
  '> ```', '> $$', '> - item', '> <div>', '> <!-- open', '> > nested', '> ', '>\t', '> # Heading', '> | a | b |', '> |---|---|', '>     code', '> a  ', '> - item\n>\n>   more',
  // definitions, references to them and footnotes: the labels a text defines cross every piece
  ...DEFINITION_LINES,
);
const gap = fc.constantFrom('\n', '\n\n', '\n\n', '\n\n\n', '\n  \n', '\n\t\n');
const ending = fc.constantFrom('\n', '\r\n', '\r');

describe('a text parsed in pieces gives the tree of one parse of the whole', () => {
  it('same tree, every place included, for generated documents and piece sizes, with either parser', () => {
    let cases = 0;
    let pieced = 0;
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.array(line, { minLength: 1, maxLength: 3 }), gap), { minLength: 1, maxLength: 24 }), ending, fc.integer({ min: 1, max: 48 }), fc.boolean(), (blocks, eol, size, front) => {
        const doc = blocks.map(([ls, g]) => ls.join('\n') + g).join('').replace(/\n/g, eol);
        const parser = front ? processor : withoutFrontMatter;
        const whole = plainTree(parser.parse(doc));
        const c = counting(parser);
        expect(plainTree(parseInPieces(c, doc, size, front))).toEqual(whole);
        cases += 1;
        if (c.seen.parses > 1) pieced += 1;
      }),
      { numRuns: RUNS, seed: SEED },
    );
    // the property says something only if most documents were really cut
    expect(pieced / cases).toBeGreaterThan(0.5);
  }, 300_000);

  it('gives each piece the labels the whole text defines: a reference before its definition, pieces away, is a link', () => {
    const doc = `See [the protocol][p] and a note[^1].\n\n${'Plain prose here.\n\n'.repeat(50)}[p]: https://example.org\n\n[^1]: The note.\n`;
    const c = counting(processor);
    const tree = parseInPieces(c, doc, 16);
    expect(c.seen.parses).toBeGreaterThan(10);
    // the labels the lines show are the ones the tree defines: one reading
    expect(c.seen.chars).toBeLessThan(1.2 * doc.length);
    expect(plainTree(tree)).toEqual(plainTree(processor.parse(doc)));
    expect(JSON.stringify(tree)).toContain('"linkReference"');
    expect(JSON.stringify(tree)).toContain('"footnoteReference"');
  });

  it('reads again with the labels the tree defines when the lines suggest others', () => {
    // `[q]:` in a fence defines nothing: the reference to it stays text; the definition inside
    // a block quote across lines cannot be read from the lines: the text is parsed whole
    const fenced = `[q] and [p].\n\n${'Plain prose here.\n\n'.repeat(50)}\`\`\`\n[q]: /not-a-definition\n\`\`\`\n\n[p]: /p\n`;
    const c = counting(processor);
    expect(plainTree(parseInPieces(c, fenced, 16))).toEqual(plainTree(processor.parse(fenced)));
    // read twice: with the labels the lines suggest, then with those the tree defines
    expect(c.seen.chars).toBeGreaterThan(1.5 * fenced.length);
    expect(c.seen.chars).toBeLessThan(2.5 * fenced.length);
    const across = `[long label] here.\n\n${'Plain prose here.\n\n'.repeat(50)}> [long\n> label]: /l\n`;
    const d = counting(processor);
    expect(plainTree(parseInPieces(d, across, 16))).toEqual(plainTree(processor.parse(across)));
    expect(JSON.stringify(processor.parse(across))).toContain('"linkReference"');
  });

  it('ends pieces inside a run of definitions: each line that opens one may start a piece', () => {
    const uses = Array.from({ length: 300 }, (_, i) => `An invented study [r${i}] and a note.[^n${i}]`).join('\n\n');
    const links = Array.from({ length: 300 }, (_, i) => `[r${i}]: https://example.org/${i} "Work ${i}"`).join('\n');
    const notes = Array.from({ length: 300 }, (_, i) => `[^n${i}]: Note ${i} on the invented trial.`).join('\n');
    for (const doc of [`${uses}\n\n${links}\n\n${notes}\n`, `${uses}\n\n${links}\n${notes}\n`, `${links}\n${notes}\n\n${uses}`]) {
      const c = counting(processor);
      expect(plainTree(parseInPieces(c, doc, 512))).toEqual(plainTree(processor.parse(doc)));
      expect(c.seen.parses).toBeGreaterThan(40);
      expect(c.seen.chars).toBeLessThan(1.3 * doc.length);
    }
  });

  it('does not end a piece inside definitions whose content a setext underline makes a heading', () => {
    // micromark starts such a heading where the content starts, at its first definition (found
    // by the property test below); a line that is no whole definition keeps the run uncut
    for (const tail of ['[a]:\n---', 'Title\n===', 'Title\n---', '[c]: /c\nTitle\n===']) {
      const doc = `${Array.from({ length: 40 }, (_, i) => `[d${i}]: /d${i}`).join('\n')}\n${tail}\nFatigue fell, t(23) = 2.47, p = .021.\n`;
      for (const size of [1, 16, 64]) expect(plainTree(parseInPieces(processor, doc, size))).toEqual(plainTree(processor.parse(doc)));
    }
    // a run of whole definitions up to a blank line is cut
    const run = `${Array.from({ length: 400 }, (_, i) => `[d${i}]: https://example.org/${i} "Work ${i}"`).join('\n')}\n\nTitle\n===\n`;
    const c = counting(processor);
    expect(plainTree(parseInPieces(c, run, 256))).toEqual(plainTree(processor.parse(run)));
    expect(c.seen.parses).toBeGreaterThan(20);
  });

  it('does not end a piece between a link definition and a footnote definition on the next line, nor at a label past 999 characters', () => {
    // found in review: opened on a line that interrupts the definitions' content, the footnote's
    // text may not open an ordered list from 2019 (nor an empty item); a piece opening at it
    // would read one, and with `[x]:` in it would define a label the text does not
    const texts = [
      'Intro.\n\n[r]: /r\n[^b]: 2019. Data were collected in spring.\n\nEnd.\n',
      'See the appendix [x] and the note.[^b]\n\n[r]: https://example.org/r\n[^b]: 2. [x]: https://example.org/x\n',
      'Intro.\n\n[r]: /r\n[^b]: -\n[^c]: 3) x\n[^d]: > 2. x\n\nEnd.\n',
    ];
    // a label of 500 escapes is 1,000 characters, past micromark's 999: no footnote, no definition
    const long = `[^${'\\]'.repeat(500)}]: y`;
    texts.push(
      `Lead paragraph one.\n\nLead paragraph two.\n\n[^a]: x\n${long}\n\nA call[^a].\n`,
      `Lead paragraph one.\n\nLead paragraph two.\n\n[a]: /u\n${long}\n===\n\nA use [a].\n`,
      `Lead paragraph one.\n\nLead paragraph two.\n\n[a]: /u\n[b]: /v\n${long}\n===\n\nA use [a].\n`,
      `Lead paragraph one.\n\n[a]: /u\n[${'a'.repeat(998)}\\]]: /v\n===\n`,
    );
    for (const doc of texts) {
      for (const [p, front] of [[processor, true], [withoutFrontMatter, false]] as const) {
        for (const size of [1, 4, 8, 16, 48]) expect(plainTree(parseInPieces(p, doc, size, front))).toEqual(plainTree(p.parse(doc)));
      }
    }
  });

  it('does not end a piece after a footnote definition whose next line goes on it', () => {
    // lazy and indented lines belong to the footnote above; `[q]: /q` right after a footnote is a lazy line of it
    const notes = Array.from({ length: 200 }, (_, i) => [`[^n${i}]: Note ${i}.`, `[q${i}]: /q`, 'lazy line', `    indented ${i}`][i % 4]).join('\n');
    const doc = `A call.[^n0] and [q1]\n\n${notes}\n`;
    const c = counting(processor);
    expect(plainTree(parseInPieces(c, doc, 256))).toEqual(plainTree(processor.parse(doc)));
  });

  it('a run of definition lines, generated, gives the tree of one parse of the whole', () => {
    const part = fc.constantFrom(...DEFINITION_LINES, 'Prose [a] here.', '[^1]: x', '[^n]: y', '[k]: /k', '[m]: <m n> "t"', '| a |', '|---|', '', '> q', 'Title', '===', '---', `[^${'\\]'.repeat(500)}]: y`, `[^${'\\]'.repeat(499)}]: y`, `[${'b'.repeat(999)}]: /b`, `[${'b'.repeat(1000)}]: /b`);
    fc.assert(
      fc.property(fc.array(part, { minLength: 4, maxLength: 60 }), fc.integer({ min: 1, max: 40 }), (parts, size) => {
        const doc = parts.join('\n');
        expect(plainTree(parseInPieces(processor, doc, size))).toEqual(plainTree(processor.parse(doc)));
      }),
      { numRuns: RUNS, seed: SEED + 1 },
    );
  }, 300_000);

  it('does not start a piece with front matter, a byte-order mark or a line of spaces after trailing spaces', () => {
    const text = 'Para one.\n\n---\ntitle: x\n---\n\nPara two.  \n\nPara three.\n\n\ufeffPara four.\n';
    // after "Para one.": the next line is `---`, front matter on a first line
    expect(cutAt(text, text.indexOf('\n'), false)).toBeUndefined();
    // after "Para two.  ": trailing spaces, allowed only where more of the piece follows
    const two = text.indexOf('Para two.') + 'Para two.'.length;
    expect(cutAt(text, two, false)).toBeUndefined();
    expect(cutAt(text, two, true)).toEqual({ end: two, next: text.indexOf('Para three.') });
    // after "Para three.": the next line opens with U+FEFF
    expect(cutAt(text, text.indexOf('Para three.') + 'Para three.'.length, false)).toBeUndefined();
    // a piece is first cut at the end of a line with no trailing space or tab: after front matter's closing line
    expect(nextCut(text, 0)).toEqual({ end: text.indexOf('\n\nPara two'), next: text.indexOf('Para two') });
    expect(nextCut('a\n\nb  \n\nc\n\nd', 0)).toEqual({ end: 1, next: 3 });
    expect(nextCut('a\n\nb  \n\nc\n\nd', 2)).toEqual({ end: 9, next: 11 });
    for (const size of [1, 4, 12]) for (const p of [processor, withoutFrontMatter]) expect(plainTree(parseInPieces(p, text, size))).toEqual(plainTree(p.parse(text)));
  });

  it('cuts a text that opens with a rule, not front matter, when the parser reads none', () => {
    // an opening `---` with a blank line below it, and a later `---` line: the processor without
    // front matter reads both as rules, and the text is cut like any other
    const doc = `---\n\n${'Plain prose here, t(12) = 2.1.\n\n'.repeat(400)}---\n\nEnd.\n`;
    const c = counting(withoutFrontMatter);
    expect(plainTree(parseInPieces(c, doc, 256, false))).toEqual(plainTree(withoutFrontMatter.parse(doc)));
    expect(c.seen.parses).toBeGreaterThan(20);
    expect(c.seen.chars).toBeLessThan(1.2 * doc.length);
    // the processor that reads front matter: the first piece must reach past the later `---`
    const d = counting(processor);
    expect(plainTree(parseInPieces(d, doc, 256))).toEqual(plainTree(processor.parse(doc)));
  });

  it('keeps a list, block quote, fence, raw HTML or math block whole where it runs across blank lines', () => {
    const inner = 'Text, t(3) = 2.5.\n\n'.repeat(40);
    for (const doc of [
      `Intro.\n\n- item\n\n  ${inner.replace(/\n\n/g, '\n\n  ')}After.\n`,
      `Intro.\n\n> ${inner.replace(/\n\n/g, '\n>\n> ')}\nAfter.\n`,
      `Intro.\n\n\`\`\`\n${inner}\`\`\`\n\nAfter.\n`,
      `Intro.\n\n<div>\n${inner.replace(/\n\n/g, '\n')}</div>\n\nAfter.\n`,
      `Intro.\n\n<!--\n${inner}-->\n\nAfter.\n`,
      `Intro.\n\n$$\n${inner}$$\n\nAfter.\n`,
      `Intro.\n\n\`\`\`\n${inner}`,
    ]) {
      for (const size of [8, 64, 200]) expect(plainTree(parseInPieces(processor, doc, size))).toEqual(plainTree(processor.parse(doc)));
    }
  });

  it('reads each character about once: a piece is kept up to its last block that closes, and one block throughout doubles the piece', () => {
    // paragraphs, lists, fences and headings in turn: most pieces end in a list or a fence
    const mixed = Array.from({ length: 400 }, (_, i) => ['Prose, t(12) = 2.1, p = .06.', '- a\n- b', '```\ncode\n```', '## Section', '> quoted'][i % 5]).join('\n\n');
    const c = counting(processor);
    expect(plainTree(parseInPieces(c, mixed, 256))).toEqual(plainTree(processor.parse(mixed)));
    expect(c.seen.parses).toBeGreaterThan(20);
    expect(c.seen.chars).toBeLessThan(1.2 * mixed.length);
    // one list throughout: every piece is parsed again twice as long, so at most about twice the text
    const list = Array.from({ length: 2_000 }, (_, i) => `- item ${i}, t(12) = 2.1`).join('\n\n');
    const d = counting(processor);
    expect(plainTree(parseInPieces(d, list, 256))).toEqual(plainTree(processor.parse(list)));
    expect(d.seen.chars).toBeLessThan(3 * list.length);
    // a long block with no blank line in it (so no place to cut inside), after one paragraph and
    // before a few: the first cut lies far past the piece size, and a piece that ends there is not
    // parsed again to that same cut at each doubling
    for (const block of ['> a b\n'.repeat(8_000), `- item\n${'  more of it\n'.repeat(4_000)}`]) {
      const doc = `Fatigue fell, t(23) = 2.47, p = .021.\n\n${block}\nErrors rose, t(40) = 3.10.\n\nMore.\n\nEnd.\n`;
      const e = counting(processor);
      expect(plainTree(parseInPieces(e, doc, 256))).toEqual(plainTree(processor.parse(doc)));
      expect(e.seen.chars).toBeLessThan(3 * doc.length);
    }
  });

  it('gives the same segments, directives and notes for long manuscripts in pieces as whole', () => {
    // every Markdown fixture one after another, as one long document, those that define labels included
    const texts = readdirSync('fixtures', { recursive: true, encoding: 'utf8' })
      .filter((f) => f.endsWith('.md'))
      .sort()
      .map((f) => readFileSync(`fixtures/${f}`, 'utf8'));
    expect(texts.some((t) => t.includes(']:'))).toBe(true);
    expect(texts.length).toBeGreaterThan(10);
    const doc = texts.join('\n\n');
    for (const size of [2_048]) {
      const a = parseMarkdown('t.md', doc, { pieceChars: size });
      const b = parseMarkdown('t.md', doc, { pieceChars: Infinity });
      expect(a.segments).toEqual(b.segments);
      expect(a.directives).toEqual(b.directives);
      expect(a.readNotes).toEqual(b.readNotes);
      expect(a.frontMatter).toEqual(b.frontMatter);
    }
  });
});
