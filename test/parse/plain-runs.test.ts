import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseMarkdown, parseWithBulkRuns } from '../../src/parse/markdown.js';
import { findPlainRuns, isPlainLine } from '../../src/parse/plainRuns.js';

/**
 * Runs of plain paragraphs are read by plumbline instead of by the Markdown parser
 * (src/parse/plainRuns.ts). The reference is the parser itself (remark-parse with remark-gfm and
 * remark-math, from npm): with the plain reader on for any run of one or more paragraphs (the default), every
 * generated document must give exactly the segments, directives and notes it gives with it off.
 * Seeded, so that every run tests the same documents.
 */
const RUNS = Number(process.env.PLUMBLINE_PROPERTY_RUNS ?? 1_000);

const both = (doc: string) => ({
  // the bulk table reader on too: a table after a run is found by line numbers the run shifts
  plain: parseMarkdown('t.md', doc, { plainGroups: 1, bulkRows: 1 }),
  parser: parseMarkdown('t.md', doc, { plainGroups: Infinity, bulkRows: Infinity }),
});

// Lines: plain ones (statistics, words, non-ASCII, punctuation that opens nothing here) and near
// misses that may open markup or a block, at the start of a line or inside it.
const plainLine = fc.constantFrom(
  'a', 'x', 'Fatigue fell, t(23) = 2.47, p = .021.', 'M = 5.2, SD = 1.1', '12 (40%) of 30', '1', '2024 was long', 'é', '😀 ok', '\u200b a',
  'a < b and p < .05', 'a & b', 'wow!', 'Scores (n = 8) rose.', 'χ²(2) = 6.1', 'x # y', 'a - b', 'a > b', 'a = b', '3.5', 'a: b', 'a\u00a0b', 'a^2',
  'a \\| b', 'a\\*b\\*', '\\`x\\`', 'a \\q b', 'p \\< .05', 'a\\\\b', 'x \\[1\\] y', '\\&amp;', 'a\\\\', 'é\\_',
  // inline tags, character references and autolink literals, read by the plain reader too
  'a <b>x</b> c', '<b>Bold</b> start', '<span class="x" id=\'y\'>s</span> t', 'x<sup>2</sup> = 4', 'a<br>b', '<br/> after', 'H<sub>2</sub>O',
  '<em>t</em>(23) = 2.47', 'a <div> b', '<a href="x" title=\'<b>\'>l</a> t', '<a b = "c" d=e f>g', '<a/> b', '</b> c', '<B>up</B> x',
  'a <3 b', 'p <.05', '\\<b> not a tag', 'a\\<b>c', '<sup-x>s',
  '&amp; &lt; &#38; &#x26;', '&nosuch; &#0; &#1234567; &#x110000;', '&AMP; &amp', '&#12345678; &#x1234567;', '&#x;', '&#1; &#65534; &#128; &#xD800;', '&ThisIsAVeryLongNameOfThirtyTwoCh;',
  'a&#42;b', '&#10;x', '&copy 2024', 'é&eacute;',
  'www.a.b', 'see www.example.org/x.', 'http://a.b/c?d=e', 'mail a@b.co now', 'x@y', 'www.a.b<b>c</b>', '(www.a.b)', 'a www.', 'https://a.b&c',
);
const nearMiss = fc.constantFrom(
  '1. item', '2) item', '- item', '* item', '+ item', '> quote', '# Heading', '===', '---', '***', '    indented', '  two spaces', '\tTab',
  'a  ', 'a ', 'a\\', 'a \\* b', '`code`', '*em*', '_em_', '~~s~~', '$x$', '$$', '```', '~~~', '```js', '<div>', '<b>a</b>', '<!-- c',
  '-->', '<!-- plumbline quiet p-follows-from-t: checked -->', '&amp;', '&#38;', '[a]: b', '[^1]: note', '[l](u)', '![i](u)', 'www.a.b',
  'https://a.b', 'a@b.co', '| a | b |', '|---|---|', 'a | b', ':--', '<pre>', '</pre>', '<script>', '<?x', '?>', '<![CDATA[', ']]>',
  'Title\n===', 'x\n---', '  ```', '$$\nx\n$$', '```\ncode\n```',
  '<x:y>t', '<a_b>t', '<a href=x/y>t', '<a b="c"d>t', '<a b=`c`>t', '<1> a', '<div>x', '<p>', '<b>', '<b >  ', '<script>x', '</div> x', '<a b="c', '<a\nb>x', '<http://a.b>', '<a@b.co>', '<!-- c --> x', 'a <? x ?>',
  'a  ', 'a   ', 'x <b>  ', 'www.a.b\\_c', 'www.a.b&amp;c', 'a@b.co\\.', 'http://a.b\n&amp;', '<pre>x</pre> y', '<textarea> x', '<P class=x>y',
);
const line = fc.oneof({ weight: 10, arbitrary: plainLine }, { weight: 2, arbitrary: nearMiss });
const block = fc.array(line, { minLength: 1, maxLength: 3 }).map((ls) => ls.join('\n'));
const gap = fc.constantFrom('\n\n', '\n\n', '\n\n\n', '\n  \n', '\n', '\n\t\n');
const context = fc.constantFrom(
  (t: string) => t,
  (t: string) => `Text before.\n\n${t}`,
  (t: string) => `- item\n\n${t}`,
  (t: string) => `- item\n${t}`,
  (t: string) => `> quote\n${t}`,
  (t: string) => `> quote\n\n${t}`,
  (t: string) => `[^n]: a note\n\n${t}`,
  (t: string) => `\`\`\`\n${t}\n\`\`\``,
  (t: string) => `<div>\n${t}\n</div>`,
  (t: string) => `<!--\n\n${t}\n\n-->`,
  (t: string) => `---\ntitle: x\n---\n${t}`,
  (t: string) => `---\n${t}`,
  (t: string) => `| a | b |\n|---|---|\n| 1 | 2 |\n\n${t}`,
  (t: string) => `Heading\n===\n\n${t}`,
);
const TABLE = '| a | b |\n|---|---|\n| 1 | 2 |\n| t(3) = 2.5 | 4 |\n| 5 | 6 |\n| 7 | *8* |\n';
const after = fc.constantFrom('', '\n', `\n\n${TABLE}`, `\n\n${TABLE}\nx\n\ny\n\n${TABLE}`, '\n\n    code after\n', '\n\n- item after\n', '\n\n  indented after\n', '\n\n[a]: /u\n', '\n===\n', '\n\n```\n');

describe('the plain-run reader reads plain paragraphs exactly as the Markdown parser does', () => {
  it('same segments, directives and notes for generated documents in every context', () => {
    let cases = 0;
    let sampled = 0;
    let read = 0;
    fc.assert(
      fc.property(fc.array(fc.tuple(block, gap), { minLength: 1, maxLength: 8 }), context, after, fc.boolean(), fc.boolean(), (parts, wrap, tail, crlf, bom) => {
        let doc = wrap(parts.map(([b, g]) => b + g).join('')) + tail;
        if (crlf) doc = doc.replace(/\n/g, '\r\n');
        if (bom) doc = `\ufeff${doc}`;
        const { plain, parser } = both(doc);
        expect(plain.segments).toEqual(parser.segments);
        expect(plain.directives).toEqual(parser.directives);
        expect(plain.readNotes).toEqual(parser.readNotes);
        expect(plain.frontMatter).toEqual(parser.frontMatter);
        if (cases++ % 10 === 0) {
          sampled += 1;
          if (parseWithBulkRuns(doc.replace(/^\ufeff/, ''), Infinity, undefined, 1).plain.size > 0) read += 1;
        }
      }),
      { numRuns: RUNS, seed: Number(process.env.PLUMBLINE_PROPERTY_SEED ?? 20261203) },
    );
    // the property says something only if the plain reader really read runs in many documents
    expect(read / sampled).toBeGreaterThan(0.15);
  }, 300_000);

  it('reads a long run of tiny paragraphs (the hostile shape) with its stand-in confirmed', () => {
    const doc = `Fatigue fell, t(23) = 2.47, p = .021.\n\n${'a\n\n'.repeat(500)}Errors rose, t(40) = 3.10, p = .20.\n`;
    const { plain, runs } = parseWithBulkRuns(doc, Infinity);
    expect(runs.size).toBe(0);
    expect([...plain.values()].map((r) => r.groups.length)).toEqual([502]);
    const a = parseMarkdown('t.md', doc);
    const b = parseMarkdown('t.md', doc, { plainGroups: Infinity });
    expect(a.segments).toEqual(b.segments);
    expect(a.segments).toHaveLength(502);
  });

  it('one long paragraph of escapes (the hostile shape) is a run by its size alone', () => {
    const doc = `Fatigue fell, t(23) = 2.47, p = .021.\n\n${'\\| '.repeat(30_000).trimEnd()}\n\nErrors rose, t(40) = 3.10, p = .20.\n`;
    const { plain } = parseWithBulkRuns(doc, Infinity);
    expect([...plain.values()].map((r) => r.groups.length)).toEqual([3]);
    expect(parseMarkdown('t.md', doc).segments).toEqual(parseMarkdown('t.md', doc, { plainGroups: Infinity }).segments);
  });

  it('one long line of tags, references or autolink literals, with a trailing space (hostile shapes of bench figure 7), is a run', () => {
    for (const run of ['<b>a</b> ', '&amp; ', 'www.a.b ', '<sup>2</sup> x&#42; ']) {
      const doc = `Fatigue fell, t(23) = 2.47, p = .021.\n\n${run.repeat(Math.ceil(70_000 / run.length))}\n\nErrors rose, t(40) = 3.10, p = .20.\n`;
      const { plain } = parseWithBulkRuns(doc, Infinity);
      expect([...plain.values()].map((r) => r.groups.length), run).toEqual([3]);
      expect(parseMarkdown('t.md', doc).segments, run).toEqual(parseMarkdown('t.md', doc, { plainGroups: Infinity }).segments);
    }
  });

  it('a long table after a run is still read by the bulk table reader (line numbers past the run kept)', () => {
    const rows = Array.from({ length: 80 }, (_, i) => `| ${i} | t(3) = 2.5 |`).join('\n');
    const doc = `${'a\n\n'.repeat(100)}| x | y |\n|---|---|\n${rows}\n\nAfter.\n`;
    const { plain, runs } = parseWithBulkRuns(doc, 64);
    // the run of 100 before the table, and the paragraph after it
    expect([...plain.values()].map((r) => r.groups.length)).toEqual([100, 1]);
    expect(runs.size).toBe(1);
    expect(parseMarkdown('t.md', doc).segments).toEqual(parseMarkdown('t.md', doc, { plainGroups: Infinity, bulkRows: Infinity }).segments);
  });

  it('takes a paragraph whose last line ends in spaces, without them, and none with spaces inside', () => {
    const doc = `First line.\nlast line, t(23) = 2.47, p = .021.   \n\nA hard  \nbreak.\n\n${'\\| '.repeat(30_000)}\n`;
    const runs = findPlainRuns(doc, 1);
    expect(runs.flatMap((r) => r.groups).map((g) => g.lines.map((l) => doc.slice(l.start, l.end)))).toEqual([['First line.', 'last line, t(23) = 2.47, p = .021.'], ['\\| '.repeat(30_000).trimEnd()]]);
    expect(parseMarkdown('t.md', doc).segments).toEqual(parseMarkdown('t.md', doc, { plainGroups: Infinity }).segments);
  });

  it('takes no line inside a fence, math or raw HTML that runs across blank lines', () => {
    const inner = 'a\n\n'.repeat(80);
    for (const doc of [`\`\`\`\n\n${inner}\`\`\`\n`, `~~~~\n\n${inner}~~~~\n`, `$$\n\n${inner}$$\n`, `<!--\n\n${inner}-->\n`, `<pre>\n\n${inner}</pre>\n`]) {
      expect(findPlainRuns(doc, 2)).toEqual([]);
    }
  });

  it('plain lines: what may open markup is never plain', () => {
    for (const l of ['a', 'a < b', 'a & b', 'wow!', '12 (40%)', 'é', 'a \\| b', 'a \\q', 'a \\*b\\*', '\\| a', '\\# b', '&amp;', 'www.a.b', 'a://b', 'a@b', 'a <b>x</b>', '<i>x</i> y']) expect(isPlainLine(l, 0, l.length), l).toBe(true);
    for (const l of ['1. x', ' a', 'a ', 'a\\', 'a*b', '<b>', 'a <b', 'a <!-- c -->', '<div>x', '<pre>x', '<http://a.b>', 'a ![i]', 'a|b', 'a\tb', '# h', '- x']) expect(isPlainLine(l, 0, l.length), l).toBe(false);
  });
});
