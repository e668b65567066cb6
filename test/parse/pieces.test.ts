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

// Lines that open, continue or close blocks across blank lines, and ordinary prose.
const line = fc.constantFrom(
  'Fatigue fell, t(23) = 2.47, p = .021.', 'a', 'Words and *emphasis* here', 'x <b>tag</b> y', 'a  ', 'a\t', 'a\\', '  two spaces', '    indented code',
  '\tTab', '- item', '* item', '1. item', '2) item', '   continued item text', '> quote', '>', 'lazy line', '# Heading', 'Title', '===', '---', '***',
  '```', '```js', '~~~', '$$', '$x$ math', '<div>', '</div>', '<!-- open', '-->', '<pre>', '</pre>', '<script>', '</script>', '| a | b |', '|---|---|',
  '| 1 | 2 |', 'x\u00a0y', '\ufeffbom', '---\ntitle: x\n---', '<!-- plumbline quiet p-follows-from-t: checked -->', '[l](u) and ![i](u)', 'www.a.b',
  '[a] or [a][b] or [^1]', '<?x', '?>', '<![CDATA[', ']]>', '<textarea>', '</textarea>', '  - nested', '10. item', '$$ inline $$ here',
  // blocks opened inside a block quote, which a blank line closes with the quote
  '> ```', '> $$', '> - item', '> <div>', '> <!-- open', '> > nested', '> ', '>\t', '> # Heading', '> | a | b |', '> |---|---|', '>     code', '> a  ', '> - item\n>\n>   more',
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

  it('parses a text that defines a label anywhere whole: a reference before the definition is a link', () => {
    const doc = `See [the protocol][p] and a note[^1].\n\n${'Plain prose here.\n\n'.repeat(50)}[p]: https://example.org\n\n[^1]: The note.\n`;
    const c = counting(processor);
    const tree = parseInPieces(c, doc, 16);
    expect(c.seen.parses).toBe(1);
    expect(plainTree(tree)).toEqual(plainTree(processor.parse(doc)));
    expect(JSON.stringify(tree)).toContain('"linkReference"');
  });

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
    // every Markdown fixture one after another, as one long document, without the one that defines labels
    const texts = readdirSync('fixtures', { recursive: true, encoding: 'utf8' })
      .filter((f) => f.endsWith('.md'))
      .sort()
      .map((f) => readFileSync(`fixtures/${f}`, 'utf8'))
      .filter((t) => !t.includes(']:'));
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
