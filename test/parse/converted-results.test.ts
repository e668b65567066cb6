import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';

/**
 * End to end: a result in each converted-manuscript form is extracted from the same segments as
 * ordinary text, with its values and at its exact source place. All text is invented.
 */
const numbered = Array.from({ length: 12 }, (_, i) => `${String(i + 1).padStart(3)}  ${i === 6 ? 'Recall improved, t(28) = 2.10, p = .045.' : 'The invented ward was calm that day.'}`).join('\n');

const cases: Array<{ name: string; path: string; source: string; at: string; line: number; column: number; t: number; df: number; p: number }> = [
  {
    name: 'spaced digits in PDF-converted math, t and p in two math spans',
    path: 'a.md',
    source: 'Haze raised ratings ( $t ( 8 2 ) = 3 . 0 3$ ， $p = . 0 0 3$ ）.\n',
    at: 't ( 8 2 ) = 3 . 0 3$ ， $p = . 0 0 3',
    line: 1,
    column: 24,
    t: 3.03,
    df: 82,
    p: 0.003,
  },
  {
    name: 'a whole result in an HTML table cell',
    path: 'a.md',
    source: 'Intro.\n\n<html><body><table><tr><td>Recall</td><td>t(28) = 2.10, p = .045</td></tr></table></body></html>\n',
    at: 't(28) = 2.10, p = .045',
    line: 3,
    column: 43,
    t: 2.1,
    df: 28,
    p: 0.045,
  },
  {
    name: 'an HTML table with t, df and p columns',
    path: 'a.md',
    source: '<table><tr><th>Measure</th><th>t</th><th>df</th><th>p</th></tr><tr><td>Recall</td><td>2.10</td><td>28</td><td>.045</td></tr></table>\n',
    at: '2.10</td><td>28</td><td>.045',
    line: 1,
    column: 87,
    t: 2.1,
    df: 28,
    p: 0.045,
  },
  {
    name: 'a plain-text " | " table with t, df and p columns',
    path: 'a.txt',
    source: 'Measure | t | df | p\nRecall | 2.10 | 28 | .045\n',
    at: '2.10 | 28 | .045',
    line: 2,
    column: 10,
    t: 2.1,
    df: 28,
    p: 0.045,
  },
  {
    name: 'a plain-text table of aligned columns',
    path: 'a.txt',
    source: 'Measure        t      df     p\nRecall      2.10      28  .045\nSpeed         —      41   .31\n',
    at: '2.10      28  .045',
    line: 2,
    column: 13,
    t: 2.1,
    df: 28,
    p: 0.045,
  },
  {
    name: 'a paragraph on one long line of converted text',
    path: 'a.txt',
    source: 'Results\nForty invented nurses used standing desks for four weeks and rated their afternoon fatigue on a ten-point scale; ratings fell in the second week, t(39) = 2.41, p = .021, as planned.\nNext.\n',
    at: 't(39) = 2.41, p = .021',
    line: 2,
    column: 147,
    t: 2.41,
    df: 39,
    p: 0.021,
  },
  {
    name: 'a line-numbered manuscript',
    path: 'a.txt',
    source: numbered,
    at: 't(28) = 2.10, p = .045',
    line: 7,
    column: 23,
    t: 2.1,
    df: 28,
    p: 0.045,
  },
  {
    name: 'a result cut by a page break and a running head',
    path: 'a.txt',
    source: 'The second week brought a clear change, t(39) =\n\nInvented Desks 4\n\n2.41, p = .021.\n\nInvented Desks 5\n\nwent on.\n\nInvented Desks 6\n\nwent on.\n',
    at: 't(39) =\n\nInvented Desks 4\n\n2.41, p = .021',
    line: 1,
    column: 41,
    t: 2.41,
    df: 39,
    p: 0.021,
  },
  {
    name: 'inline R calls with literal numbers in R Markdown',
    path: 'a.Rmd',
    source: 'Recall improved, t(28) = `r apa_num(2.10)`, p = `r printnum(.045)`.\n',
    at: 't(28) = `r apa_num(2.10)`, p = `r printnum(.045',
    line: 1,
    column: 18,
    t: 2.1,
    df: 28,
    p: 0.045,
  },
];

describe('results in converted manuscripts are extracted at their exact place', () => {
  it.each(cases)('$name', ({ path, source, at, line, column, t, df, p }) => {
    const r = checkSource(path, source);
    expect(r.results).toHaveLength(1);
    const res = r.results[0]!;
    expect(source.slice(res.span.start, res.span.end)).toBe(at);
    expect(res.start).toEqual({ line, column });
    expect([res.t.value, res.df?.value, res.p?.kind === 'value' ? res.p.number?.value : undefined]).toEqual([t, df, p]);
  });
});

describe('the pre-filter lets every converted form through', () => {
  const more: Array<[string, string]> = [
    ['a.md', 'So $\\boldsymbol { t } ( 2 8 ) = 2 . 1 0$ , $p = . 0 4 5$ .\n'],
    ['a.md', 'So ${ t } ( 2 8 ) = 2 . 1 0 , p = . 0 4 5$ .\n'],
    ['a.md', 'So $t$ $( 2 8 ) = 2 . 1 0 , p = . 0 4 5$ .\n'],
    ['a.md', 'So $t { = } 2 . 1 0 , d f = 2 8 , p = . 0 4 5$ .\n'],
    ['a.md', '<table><tr><th>t</th><th>df</th><th>p</th></tr><tr><td>2.10</td><td>28</td><td>.045</td></tr></table>\n'],
    ['a.txt', 'Measure    t     df    p\nRecall  2.10     28  .045\nSpeed   1.03     41  .310\n'],
  ];
  it.each([...cases.map((c) => [c.path, c.source] as [string, string]), ...more])('%s %j', (path, source) => {
    const withFilter = checkSource(path, source);
    expect(withFilter.results.length).toBeGreaterThan(0);
    expect(JSON.stringify(withFilter)).toBe(JSON.stringify(checkSource(path, source, { prefilter: false })));
  });
});
