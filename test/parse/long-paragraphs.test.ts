import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { expectLinearCheck, lines } from '../helpers.js';
import { LineIndex } from '../../src/parse/index.js';
import { parseMarkdown } from '../../src/parse/markdown.js';
import type { ParsedDocument } from '../../src/parse/types.js';
import { PARAGRAPH_LINE_LIMIT, joinLongParagraphs } from '../../src/parse/shapes.js';

/**
 * Long paragraphs have their line breaks read as spaces before the Markdown parser sees them
 * (src/parse/shapes.ts, joinLongParagraphs), since micromark's cost per paragraph grows with
 * the square of its lines. The reference is the parser itself (remark-parse and remark-gfm,
 * from npm): with every paragraph of two or more lines joined, each generated document must
 * give the segments, directives and notes it gives with nothing joined, character for
 * character at the same source offsets (runs of white space aside, since a joined line keeps
 * the indentation the parser would strip).
 */
const RUNS = Math.max(200, Math.round(Number(process.env.PLUMBLINE_PROPERTY_RUNS ?? 10_000) / 5));

/**
 * What a reading gives, white space aside: each segment's kind, place and visible characters
 * with the offsets they start at (where one ends can differ by the white space around it).
 */
function reading(doc: ParsedDocument) {
  return {
    segments: doc.segments.map((s) => {
      const chars: string[] = [];
      for (let i = 0; i < s.text.length; i++) if (!/\s/.test(s.text[i] ?? '')) chars.push(`${s.text[i]}@${s.starts[i]}`);
      return { kind: s.kind, block: s.block, table: s.table, section: s.section?.replace(/\s+/g, ' '), legendOf: s.legendOf, chars: chars.join(' ') };
    }),
    directives: doc.directives,
    frontMatter: doc.frontMatter,
    readNotes: doc.readNotes,
  };
}

const both = (doc: string) => ({
  joined: parseMarkdown('p.md', doc, { paragraphLines: 1 }),
  parser: parseMarkdown('p.md', doc, { paragraphLines: Infinity }),
});

// Lines: prose, results, and every start that may open a block of its own or end a paragraph.
const line = fc.oneof(
  { weight: 8, arbitrary: fc.constantFrom('Recall improved with the standing desk', 't(28) = 2.10, p = .045.', 'M = 4.2, SD = 1.1, n = 30', 'a & b', 'see [the method][m] and www.example.org', 'costs *rose* and _fell_', 'x \\* y', '&A0; &amp; &#124;', '_!_', '*a*', 'in `code` and $x$', 'ends with two spaces  ', 'ends with a backslash\\', 'word', '2. not a list after text', '#hashtag', '-5 degrees', '+ plus', 'tab\tinside', '\u00a0no-break', '“quoted”') },
  { weight: 3, arbitrary: fc.constantFrom('# Heading', '## Heading', '- item', '* item', '1. item', '1) item', '> quoted', '> > nested', '>', '===', '---', '***', '___', '- - -', '```', '~~~', '```r', '$$', '<div>', '</div>', '<!-- plumbline quiet p-follows-from-t: checked -->', '<!--', '-->', '<pre>', '</pre>', '<span>inline</span> html', '<!-->', '<?x?>', '<!DOCTYPE x>', '<div', '</p>', '<p>text', '<5 years', '<custom-tag>', '<script>', '</script>', '<a href="u">', '[m]: https://example.org/m', '[^1]: a note', '[^1]', '| a | b |', '|---|---|', 'a | b', '--- | ---', '    indented', '      deeper', '  two spaces', '   three', '\tTab', '') },
  { weight: 1, arbitrary: fc.string({ maxLength: 6 }) },
);
const prefix = fc.constantFrom('', '', '', '> ', '>', '> > ', '  ', '   ', '    ');
const block = fc.array(fc.tuple(prefix, line), { minLength: 1, maxLength: 8 }).map((ls) => ls.map(([p, l]) => p + l));
const context = fc.constantFrom(
  (t: string[]) => t,
  (t: string[]) => ['- item', ...t.map((l) => `  ${l}`)],
  (t: string[]) => ['1. item', ...t.map((l) => `   ${l}`)],
  (t: string[]) => t.map((l) => `> ${l}`),
  (t: string[]) => ['> start', ...t],
);
const document = fc.record({
  front: fc.constantFrom('', '---\ntitle: Desks\nalpha: 0.05\n---\n'),
  blocks: fc.array(fc.tuple(context, block, fc.constantFrom('\n', '\n\n', '\n\n\n')), { minLength: 1, maxLength: 5 }),
  eol: fc.constantFrom('\n', '\n', '\r\n', '\r'),
}).map(({ front, blocks, eol }) => (front + blocks.map(([ctx, b, gap]) => ctx(b).join('\n') + gap).join('')).replace(/\r?\n/g, eol));

describe('long paragraphs are read with their line breaks as spaces, exactly as the parser reads them', () => {
  it('every generated document gives the same segments, offsets, directives and notes either way', () => {
    fc.assert(
      fc.property(document, (doc) => {
        const { joined, parser } = both(doc);
        expect(reading(joined)).toEqual(reading(parser));
      }),
      { numRuns: RUNS, seed: Number(process.env.PLUMBLINE_PROPERTY_SEED ?? 20261203) },
    );
  }, 300_000);

  it('ordinary documents are never touched: the join starts past the limit, and only inside paragraphs', () => {
    const para = Array.from({ length: PARAGRAPH_LINE_LIMIT }, (_, i) => `line ${i} of a paragraph`).join('\n');
    expect(joinLongParagraphs(para)).toBeUndefined();
    const longer = `${para}\nand one more`;
    const out = joinLongParagraphs(longer);
    expect(out).toBe(longer.replace(/\n/g, ' '));
    // a list after it, a fence, a table and front matter keep their line breaks
    const mixed = `---\n${Array.from({ length: 150 }, (_, i) => `k${i}: ${i}`).join('\n')}\n---\n\n${longer}\n- item\n\n\`\`\`\n${para}\n\`\`\`\n\n| a | b |\n|---|---|\n${Array.from({ length: 150 }, () => '| 1 | 2 |').join('\n')}\n`;
    const joined = joinLongParagraphs(mixed) ?? '';
    expect(joined.length).toBe(mixed.length);
    const changed = [...mixed].flatMap((c, i) => (joined[i] === c ? [] : [i]));
    const from = mixed.indexOf('line 0 of');
    const to = mixed.indexOf('and one more');
    expect(changed.length).toBe(PARAGRAPH_LINE_LIMIT);
    expect(changed.every((i) => i > from && i < to && mixed[i] === '\n')).toBe(true);
  });

  it('inside a block quote, the `>` of each continued line is replaced by a space, one for one', () => {
    const quote = Array.from({ length: PARAGRAPH_LINE_LIMIT + 1 }, (_, i) => `> quoted line ${i}`).join('\r\n');
    const out = joinLongParagraphs(quote) ?? '';
    expect(out.length).toBe(quote.length);
    expect(out).toBe(quote.replace(/\r\n>/g, '   '));
    expect(parseMarkdown('q.md', quote).segments.map((s) => s.kind)).toEqual(['paragraph']);
  });

  const shapes: Record<string, (n: number) => string> = {
    'one paragraph of words and numbers': (n) => lines(n, (i) => `line ${i} of the same paragraph`),
    'one paragraph of lines holding an ampersand': (n) => lines(n, (i) => `cost & benefit ${i}`),
    'one block quote of quoted lines': (n) => lines(n, (i) => `> quoted line ${i}`),
    'one list item of indented lines': (n) => `- start\n${lines(n, (i) => `  indented line ${i}`)}`,
  };
  const RESULT = 'Recall improved, t(28) = 2.10, p = .045.';
  for (const [name, make] of Object.entries(shapes)) {
    it(`${name}: linear in its lines (micromark alone is quadratic there), the result inside found at its exact place`, () => {
      const withResult = (n: number) => {
        const text = make(n).split('\n');
        text[n >> 1] = text[n >> 1]?.replace(/(line|benefit) (\d+)/, `$1 $2 ${RESULT}`) ?? '';
        return text.join('\n');
      };
      const n = 4000;
      expectLinearCheck(name, withResult, n);
      const source = withResult(n);
      const report = checkSource('x.md', source);
      expect(report.results).toHaveLength(1);
      const res = report.results[0]!;
      expect(source.slice(res.span.start, res.span.end)).toBe('t(28) = 2.10, p = .045');
      expect(new LineIndex(source).position(res.span.start).line).toBe((n >> 1) + 1);
    }, 120_000);
  }
});
