import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseMarkdown, parseWithBulkRuns } from '../../src/parse/markdown.js';
import { findBulkRuns, plainCells } from '../../src/parse/bulkTable.js';

/**
 * Long tables are read row by row by plumbline instead of by the Markdown parser
 * (src/parse/bulkTable.ts). The reference here is the parser itself (remark-gfm, from npm):
 * with the bulk reader on for any run of four or more rows, every generated document must give
 * exactly the segments, directives and notes it gives with the bulk reader off.
 */
const RUNS = Number(process.env.PLUMBLINE_PROPERTY_RUNS ?? 10_000);

// Segment maps are Int32Arrays; compared as plain arrays, which the matcher compares far faster.
const plainMaps = (doc: ReturnType<typeof parseMarkdown>) => ({ ...doc, segments: doc.segments.map((s) => ({ ...s, starts: Array.from(s.starts), ends: Array.from(s.ends) })) });
const both = (doc: string) => ({
  bulk: plainMaps(parseMarkdown('t.md', doc, { bulkRows: 1 })),
  parser: plainMaps(parseMarkdown('t.md', doc, { bulkRows: Infinity })),
});

// Cell text: plain pieces, numbers and everything that may change how a cell reads
// (escapes, code, emphasis, math, entities, raw HTML, links, no-break and other spaces).
const cellPiece = fc.oneof(
  { weight: 6, arbitrary: fc.constantFrom('1', '2.5', '-0.3', 'M', 'SD', 't(23) = 2.47', 'p = .021', '12 (4.1)', 'ward', 'é', '😀', ' ', '  ', '\t', '\u00a0', '.', ',', ':', '(', ')', '%', '±', '\u2212', '+', '=', '#', '>', '-', '1.', '2)', '^', '@', 'www.example.org', 'https://example.org') },
  { weight: 2, arbitrary: fc.constantFrom('\\|', '\\*', '\\\\', '\\`', 'a\\|b', '`x|y`', '`a`', '*b*', '**c**', '_d_', '~~e~~', '$x$', '&amp;', '&#124;', '<sup>2</sup>', '<br>', '<!-- plumbline quiet p-follows-from-t: checked -->', '[l](u)', '![i](u)', '[^1]', '\\', '*', '_', '<', '&', '[', ']', '!', '$', '`') },
  { weight: 1, arbitrary: fc.string({ maxLength: 4 }) },
);
const cell = fc.array(cellPiece, { maxLength: 3 }).map((ps) => ps.join(''));
const indent = fc.constantFrom('', '', '', ' ', '  ', '   ');
const row = fc.record({
  indent,
  lead: fc.constantFrom('|', '|', '|', ''),
  cells: fc.array(cell, { minLength: 1, maxLength: 4 }),
  trail: fc.constantFrom('|', '|', '', ' |', '| ', '||', ' \t'),
}).map(({ indent: i, lead, cells, trail }) => `${i}${lead}${cells.join('|')}${trail}`);
const head = fc.constantFrom('| a | b |\n|---|---|', 'a | b\n--- | ---', '| a | b | c |\n|:--|:-:|--:|', '| x |\n| - |', 'a|b\n-|-', '|a|\n|-|');
const context = fc.constantFrom(
  (t: string) => t,
  (t: string) => `Text before.\n\n${t}`,
  (t: string) => `Text right before\n${t}`,
  (t: string) => `- item\n\n${t.replace(/^/gm, '  ')}`,
  (t: string) => `1. item\n\n${t.replace(/^/gm, '   ')}`,
  (t: string) => `> ${t.replace(/\n/g, '\n> ')}`,
  (t: string) => `>${t.replace(/\n/g, '\n>')}`,
  (t: string) => `> > ${t.replace(/\n/g, '\n> > ')}`,
  (t: string) => `> - item\n>\n${t.replace(/^/gm, '>   ')}`,
  (t: string) => `- item\n\n  > ${t.replace(/\n/g, '\n  > ')}`,
  (t: string) => `1.  item\n\n${t.replace(/^/gm, '    ')}`,
  (t: string) => `> ${t.replace(/\n/g, '\n')}`,
  (t: string) => `\`\`\`\n${t}\n\`\`\``,
  (t: string) => `<div>\n${t}\n</div>`,
  (t: string) => `<!-- plumbline quiet result-is-complete: a table of counts -->\n${t}`,
  (t: string) => `---\ntitle: x\n---\n${t}`,
);
const after = fc.constantFrom('', '\n', '\n\nAfter, t(40) = 3.10, p = .20.\n', '\nnot blank after\n', '\n| other | table |\n|---|---|\n| 1 | 2 |\n', '\n    \n');

describe('the bulk table reader reads long tables exactly as the Markdown parser does', () => {
  it('same segments, directives and notes for generated tables in every context', () => {
    let cases = 0;
    let sampled = 0;
    let read = 0;
    fc.assert(
      fc.property(head, fc.array(row, { minLength: 2, maxLength: 8 }), context, after, fc.boolean(), fc.boolean(), (h, rows, wrap, tail, crlf, bom) => {
        let doc = wrap(`${h}\n${rows.join('\n')}`) + tail;
        if (crlf) doc = doc.replace(/\n/g, '\r\n');
        if (bom) doc = `\ufeff${doc}`;
        const { bulk, parser } = both(doc);
        expect(bulk.segments).toEqual(parser.segments);
        expect(bulk.directives).toEqual(parser.directives);
        expect(bulk.readNotes).toEqual(parser.readNotes);
        if (cases++ % 10 === 0) {
          sampled += 1;
          if (parseWithBulkRuns(doc.replace(/^\ufeff/, ''), 1).runs.size > 0) read += 1;
        }
      }),
      // seeded, so that the share read below is the same on every run (unseeded, it once came to 0.149)
      { numRuns: RUNS, seed: Number(process.env.PLUMBLINE_PROPERTY_SEED ?? 20261203) },
    );
    // The property says something only if the bulk reader really read many of the tables.
    // About 1 in 7 (0.143 with this seed; 0.149 to 0.2 seen unseeded): contexts such as fenced
    // blocks and raw HTML are never read. A tenth is still over a thousand tables at the default runs.
    expect(read / sampled).toBeGreaterThan(0.1);
  }, 300_000);

  it('reads a run across chunk boundaries, with markup rows between plain ones', () => {
    const rows: string[] = [];
    for (let i = 0; i < 1_000; i += 1) rows.push(i % 97 === 0 ? `| *${i}* | \`c|d\` |` : `| ${i} | ${(i / 7).toFixed(2)} |`);
    const doc = `| n | v |\n|---|---|\n${rows.join('\n')}\n\nAfter.\n`;
    const { bulk, parser } = both(doc);
    expect(bulk.segments.length).toBeGreaterThan(2_000);
    expect(bulk.segments).toEqual(parser.segments);
  });

  it('reads long tables after other long tables and plain runs, where the parser counts fewer lines', () => {
    // each run's rows reach the parser as one blank line, so every table after it ends on a line
    // the parser numbers lower than the text does; all the runs must still be confirmed and read
    const table = (n: number, prefix = '') => `${prefix}| a | b |\n${prefix}|---|---|\n${Array.from({ length: n }, (_, i) => `${prefix}| ${i} | ${i + 1} |`).join('\n')}\n`;
    const plain = Array.from({ length: 40 }, (_, i) => `Plain paragraph ${i}.`).join('\n\n');
    const docs = [
      `${table(30)}\n${table(12)}\n${plain}\n\n${table(25)}\nAfter, t(40) = 3.10, p = .20.\n`,
      `> ${table(20, '> ').slice(2)}\n${table(30)}\n- item\n\n${table(15, '  ')}`,
      `${table(20)}\n${table(20)}`.replace(/\n/g, '\r\n'),
    ];
    for (const doc of docs) {
      const runs = parseWithBulkRuns(doc, 1).runs;
      expect(runs.size).toBe(findBulkRuns(doc, 1).length);
      expect(runs.size).toBeGreaterThanOrEqual(2);
      const { bulk, parser } = both(doc);
      expect(bulk.segments).toEqual(parser.segments);
    }
  });

  it('the default threshold leaves short tables to the parser and takes long ones', () => {
    const long = `| a | b |\n|---|---|\n${'| 1 | 2 |\n'.repeat(200)}`;
    expect(findBulkRuns(long)).toHaveLength(1);
    expect(findBulkRuns(long)[0]?.rows).toHaveLength(199); // header, delimiter and the first row are parsed
    expect(findBulkRuns(`| a | b |\n|---|---|\n${'| 1 | 2 |\n'.repeat(20)}`)).toHaveLength(0);
    // a run that ends on a line that is not blank would have continued the table: not taken
    expect(findBulkRuns(`${long}not blank\n`)).toHaveLength(0);
    // lines that start an ordered list, a bullet or a quote are not rows
    expect(findBulkRuns(`| a |\n|---|\n${'1. x | y\n'.repeat(200)}`)).toHaveLength(0);
    expect(findBulkRuns(`| a |\n|---|\n${'1.5 | y\n'.repeat(200)}`)).toHaveLength(1);
  });

  it('splits a plain row as GFM does and leaves rows with markup to the parser', () => {
    const cells = (s: string) => plainCells(s, 0, s.length)?.map((c) => c.value);
    expect(cells('| 1 | 2 |')).toEqual(['1', '2']);
    expect(cells('  1 | 2')).toEqual(['1', '2']);
    expect(cells('| a ||')).toEqual(['a', '']);
    expect(cells('|')).toEqual(['']);
    expect(cells('| *a* |')).toBeUndefined();
    // backslash escapes (CommonMark 2.4): an escaped pipe does not split and reads as a pipe
    expect(cells('| a \\| b |')).toEqual(['a | b']);
    expect(cells('| a \\\\| b |')).toEqual(['a \\', 'b']);
    expect(cells('| a \\|')).toEqual(['a |']);
    expect(cells('| \\*1\\* |')).toEqual(['*1*']);
    expect(cells('| a \\b |')).toBeUndefined();
  });
});
