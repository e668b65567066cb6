import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { LineIndex, parseDocument } from '../../src/parse/index.js';

/** Every character of every segment maps back to a source range that produces it. */
function expectMapsBack(source: string, path = 'x.md') {
  const doc = parseDocument(path, source);
  for (const seg of doc.segments) {
    expect(seg.starts).toHaveLength(seg.text.length);
    for (let i = 0; i < seg.text.length; i += 1) {
      const a = seg.starts[i] as number;
      const b = seg.ends[i] as number;
      expect(a).toBeGreaterThanOrEqual(0);
      expect(b).toBeLessThanOrEqual(source.length);
      expect(b).toBeGreaterThanOrEqual(a);
    }
  }
  return doc;
}

const first = (source: string, path = 'x.md') => {
  const r = checkSource(path, source);
  expect(r.results.length, `no result in ${JSON.stringify(source)}`).toBeGreaterThan(0);
  const res = r.results[0]!;
  return { res, text: source.slice(res.span.start, res.span.end), lines: new LineIndex(source) };
};

describe('source positions (line and column are exact)', () => {
  const cases: Array<{ name: string; source: string; text: string; line: number; column: number }> = [
    { name: 'plain sentence', source: 'Recall improved, t(28) = 2.10, p = .045.\n', text: 't(28) = 2.10, p = .045', line: 1, column: 18 },
    { name: 'emphasis around t and p', source: 'Recall improved, *t*(28) = 2.10, *p* = .045.\n', text: 't*(28) = 2.10, *p* = .045', line: 1, column: 19 },
    { name: 'strong emphasis', source: 'So **t**(28) = 2.10, **p** = .045.\n', text: 't**(28) = 2.10, **p** = .045', line: 1, column: 6 },
    { name: 'inline math', source: 'As before, $t(28) = 2.10, p = .045$.\n', text: 't(28) = 2.10, p = .045', line: 1, column: 13 },
    { name: 'CRLF line ends, second line', source: 'Intro line.\r\n\r\nRecall improved, t(28) = 2.10, p = .045.\r\n', text: 't(28) = 2.10, p = .045', line: 3, column: 18 },
    { name: 'a BOM before the first line (not a column)', source: '\uFEFFRecall improved, t(28) = 2.10, p = .045.\n', text: 't(28) = 2.10, p = .045', line: 1, column: 18 },
    { name: 'tab before the result (one column)', source: 'Recall\timproved, t(28) = 2.10, p = .045.\n', text: 't(28) = 2.10, p = .045', line: 1, column: 18 },
    { name: 'inside a link', source: 'See [the result t(28) = 2.10, p = .045](https://example.org).\n', text: 't(28) = 2.10, p = .045', line: 1, column: 17 },
    { name: 'after a footnote reference', source: 'Recall improved[^1], t(28) = 2.10, p = .045.\n\n[^1]: A note.\n', text: 't(28) = 2.10, p = .045', line: 1, column: 22 },
    { name: 'wrapped across lines in a block quote', source: '> Recall improved, t(28) =\n> 2.10, p = .045.\n', text: 't(28) =\n> 2.10, p = .045', line: 1, column: 20 },
    // GFM's autolink transform makes the text around a `www.` link that follows a non-space
    // without positions; the text is found in the source all the same (it was lost before).
    { name: 'before a www. link glued to a parenthesis', source: 'Recall improved, t(28) = 2.10, p = .045 (see:www.example.org).\n', text: 't(28) = 2.10, p = .045', line: 1, column: 18 },
    { name: 'after a www. link glued to a parenthesis', source: 'Data (x)www.example.org show t(28) = 2.10, p = .045.\n', text: 't(28) = 2.10, p = .045', line: 1, column: 30 },
    { name: 'in a list item', source: '- first\n- Recall improved, t(28) = 2.10, p = .045.\n', text: 't(28) = 2.10, p = .045', line: 2, column: 20 },
    { name: 'Unicode minus and HTML superscript', source: 'Fell, t(40) = \u22125.02, p = 1.1 × 10<sup>\u22125</sup>.\n', text: 't(40) = \u22125.02, p = 1.1 × 10<sup>\u22125', line: 1, column: 7 },
    { name: 'escaped less-than', source: 'Fell, t(40) = 5.02, p \\< .001.\n', text: 't(40) = 5.02, p \\< .001', line: 1, column: 7 },
    { name: 'character reference for less-than', source: 'Fell, t(40) = 5.02, p &lt; .001.\n', text: 't(40) = 5.02, p &lt; .001', line: 1, column: 7 },
    { name: 'table cell', source: '| Test | Result |\n|---|---|\n| A | t(28) = 2.10, p = .045 |\n', text: 't(28) = 2.10, p = .045', line: 3, column: 7 },
  ];
  it.each(cases)('$name', ({ source, text, line, column }) => {
    expectMapsBack(source);
    const { res, text: got } = first(source);
    expect(got).toBe(text);
    expect(res.start).toEqual({ line, column });
  });

  it('a CRLF file and its LF twin give the same findings at the same lines and columns', () => {
    const lf = 'Intro.\n\nAlertness rose, t(23) = 1.12, p = .42.\n\nMore, t(46) = 0.84, p = .04.\n';
    const crlf = lf.replace(/\n/g, '\r\n');
    const a = checkSource('a.md', lf).findings.map((f) => [f.ruleId, f.start, f.end]);
    const b = checkSource('b.md', crlf).findings.map((f) => [f.ruleId, f.start, f.end]);
    expect(a.length).toBe(2);
    expect(b).toEqual(a);
  });
});

describe('a first line of --- that opens no front matter', () => {
  // CommonMark reads it as a thematic break; micromark's front-matter extension, failing to find
  // the closing fence, used to leave the lists and quotes after it read as paragraphs, and a
  // list item holding a fenced block then swallowed the rest of the file as code.
  it('lists, quotes and the results in them read as without it', () => {
    const body = '- ```\n  x\n  ```\n\n  Recall improved, t(28) = 2.10, p = .045.\n\n> Errors rose, t(40) = 3.10, p = .20.\n';
    for (const head of ['---\n\n', '---\ntitle: A study\n\n', '***\n\n']) {
      const doc = parseDocument('x.md', head + body);
      expect(doc.segments.filter((s) => s.kind !== 'code').map((s) => s.text)).toEqual([...(head.includes('title') ? ['title: A study'] : []), 'Recall improved, t(28) = 2.10, p = .045.', 'Errors rose, t(40) = 3.10, p = .20.']);
      expect(checkSource('x.md', head + body).results.map((r) => r.inCode)).toEqual([false, false]);
    }
  });

  // Pandoc's rule, common practice: front matter starts on the line right below the fence; and
  // what lies between two rules is settings only when it reads as a YAML mapping.
  it('a rule, a blank line and a later rule are not front matter; nor is prose between two rules', () => {
    for (const doc of ['---\n\nRecall improved, t(28) = 2.10, p = .045.\n\n---\n', '---\nRecall improved, t(28) = 2.10, p = .045.\n---\n', '---\n- t(28) = 2.10, p = .045\n---\n']) {
      const r = checkSource('x.md', doc);
      expect(r.results.map((x) => doc.slice(x.span.start, x.span.end))).toEqual(['t(28) = 2.10, p = .045']);
      expect(r.findings.map((f) => f.ruleId)).not.toContain('front-matter-is-readable');
    }
    // a mapping between the fences is front matter, its settings applied
    const fm = checkSource('x.md', '---\nplumbline:\n  alpha: 0.01\n---\n\nRecall improved, t(28) = 2.10, p = .045.\n');
    expect(fm.alpha.value).toBe(0.01);
  });
});

describe('what is not prose', () => {
  const skipped: Array<[string, string]> = [
    ['inline code', 'Use `t(28) = 2.10` to call it.\n'],
    ['fenced code without a p', '```\nt(28) = 2.10\n```\n'],
    ['an HTML comment', '<!-- t(28) = 2.10, p = .045 -->\n'],
    ['front matter', '---\nnote: t(28) = 2.10, p = .045\n---\n\nText.\n'],
    ['an R Markdown chunk', '```{r}\nt(28) = 2.10; p = .045\n```\n'],
  ];
  it.each(skipped)('%s', (_name, source) => {
    expect(checkSource('x.Rmd', source).results).toEqual([]);
  });

  it('reads a complete result in inline code or console output', () => {
    const r = checkSource('x.md', 'Output: `t(64) = 2.70, p = .007`.\n\n```\nt = 3.065, df = 13, p-value = 0.009039\n```\n');
    expect(r.results.map((x) => x.printed)).toEqual(['t(64) = 2.70, p = .007', 't = 3.065, df = 13, p-value = 0.009039']);
    expect(r.results.every((x) => x.inCode)).toBe(true);
  });
});

describe('plain text from a PDF', () => {
  it('joins hard wraps and undoes end-of-line hyphenation, keeping original lines', () => {
    const source = 'The effect was signifi-\ncant, t(28) = 2.10,\np = .045, as expected.\n\nNext paragraph.\n';
    const doc = expectMapsBack(source, 'paper.txt');
    expect(doc.segments[0]?.text).toBe('The effect was significant, t(28) = 2.10, p = .045, as expected.');
    const { res, lines } = first(source, 'paper.txt');
    expect(res.start).toEqual({ line: 2, column: 7 });
    expect(lines.position(res.p!.span.start)).toEqual({ line: 3, column: 1 });
  });
});
