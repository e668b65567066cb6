import { describe, expect, it } from 'vitest';
import { checkSource, type FileReport, type NumberRecord } from '../../src/engine/index.js';
import { formatForPath, parseDocument, readLatexIncludes } from '../../src/parse/index.js';
import { expectSegments, type SegmentCase } from './segments.js';

// Invented manuscripts (a sleep, a reading and a plant study of our own), written the way LaTeX
// authors write results. The expected readings follow from how TeX prints the source (common
// practice, no source): what TeX does not print is not read.

const cases: SegmentCase[] = [
  {
    name: 'a comment is not read; \\% is a percent sign, not a comment',
    path: 'x.tex',
    source: 'Naps helped, 45\\% of them % t(28) = 2.10, p = .90 was the pilot\nsaid so.\n',
    expect: [{ kind: 'paragraph', text: 'Naps helped, 45% of them said so.', spans: { '45%': '45\\%' } }],
  },
  {
    name: 'the preamble is not read; the body starts after \\begin{document} and ends at \\end{document}',
    path: 'x.tex',
    source: '\\documentclass{article}\n\\title{Naps t(9) = 9.99}\n% \\begin{document} in a comment\n\\begin{document}\nNaps helped.\n\\end{document}\nAfter the end, t(8) = 1.00.\n',
    expect: [{ kind: 'paragraph', text: 'Naps helped.', at: 'Naps helped.' }],
  },
  {
    name: 'sections are headings and name the section of what follows; a blank line ends a paragraph',
    path: 'x.tex',
    source: '\\section{Results}\\label{sec:res}\nFirst part\ngoes on.\n\n\\subsection*{Reading}\nSecond part.\n',
    expect: [
      { kind: 'heading', text: 'Results', at: 'Results' },
      { kind: 'paragraph', text: 'First part goes on.', section: 'Results' },
      { kind: 'heading', text: 'Reading', section: undefined },
      { kind: 'paragraph', text: 'Second part.', section: 'Reading' },
    ],
  },
  {
    name: 'font commands print their argument; $…$ and \\(…\\) are read as math; ~ and \\, are spaces',
    path: 'x.tex',
    source: 'Sleep rose, \\textit{t}(28)~=~2.10, \\emph{p}\\,=\\,.045, and \\(t(30) = 1.20\\), $p < .001$.\n',
    expect: [
      {
        kind: 'paragraph',
        text: 'Sleep rose, t(28) = 2.10, p = .045, and t(30) = 1.20, p < .001.',
        spans: { 't(28)': 't}(28)', '2.10': '2.10', '.045': '.045', 't(30)': 't(30)', '.001': '.001' },
      },
    ],
  },
  {
    name: 'descriptives in math and text, a minus in math, χ², dashes and quotes',
    path: 'x.tex',
    source: 'Scores ($M = 4.2$, $SD = 1.1$; \\textit{SD} = 0.9) fell by $-2.1$ --- a ``drop\'\' --- and $\\chi^2(2) = 6.1$ in 3--4 weeks.\n',
    expect: [
      {
        kind: 'paragraph',
        text: 'Scores (M = 4.2, SD = 1.1; SD = 0.9) fell by -2.1 — a “drop” — and χ^2(2) = 6.1 in 3–4 weeks.',
        spans: { '-2.1': '-2.1', χ: '\\chi', '—': '---', '–': '--', '“': '``' },
      },
    ],
  },
  {
    name: 'commands that print nothing are dropped with their arguments (\\ref is dropped, not read as its key)',
    path: 'x.tex',
    source: '\\usepackage{x}\\newcommand{\\two}[1]{t(2) = #1}\nAs Table~\\ref{tab:2} shows\\cite[p.~3]{Doe2020}\\vspace{2pt}, naps\\footnote{Short ones.} helped.\n',
    // a footnote is a paragraph of its own, read when it closes; the sentence reads on around it
    expect: [
      { kind: 'paragraph', text: 'Short ones.', at: 'Short ones.' },
      { kind: 'paragraph', text: 'As Table  shows, naps helped.' },
    ],
  },
  {
    name: 'a tabular is a table: cells at &, rows at \\\\, rules skipped, \\multicolumn spans; a caption in its float is its caption',
    path: 'x.tex',
    source: [
      '\\begin{table}[htbp]',
      '\\caption{Sleep by group}',
      '\\begin{tabular}{lcc}',
      '\\toprule',
      'Group & \\multicolumn{2}{c}{Night} \\\\',
      '\\midrule',
      'Nap & $4.2$ & 1.1 \\\\',
      'Rest & 3.9 & \\textit{0.8} \\\\',
      '\\bottomrule',
      '\\end{tabular}',
      '\\end{table}',
      '',
    ].join('\n'),
    expect: [
      { kind: 'paragraph', text: 'Sleep by group', legendOf: { table: 0, role: 'caption' } },
      { kind: 'tableCell', text: 'Group', table: { table: 0, row: 0, column: 0 } },
      { kind: 'tableCell', text: 'Night', table: { table: 0, row: 0, column: 1, colSpan: 2 } },
      { kind: 'tableCell', text: 'Nap', table: { table: 0, row: 1, column: 0 } },
      { kind: 'tableCell', text: '4.2', table: { table: 0, row: 1, column: 1 }, at: '4.2' },
      { kind: 'tableCell', text: '1.1', table: { table: 0, row: 1, column: 2 } },
      { kind: 'tableCell', text: 'Rest', table: { table: 0, row: 2, column: 0 } },
      { kind: 'tableCell', text: '3.9', table: { table: 0, row: 2, column: 1 } },
      { kind: 'tableCell', text: '0.8', table: { table: 0, row: 2, column: 2 }, at: '0.8' },
    ],
  },
  {
    name: 'a one-column tabular inside a cell is that cell\'s text, its lines a space apart',
    path: 'x.tex',
    source: [
      '\\begin{tabular}{lc}',
      'Group & \\begin{tabular}[c]{@{}c@{}}Hours\\\\(\\textit{SD})\\end{tabular} \\\\',
      'Nap & 4.2 (1.1) \\\\',
      'Rest & \\begin{tabular}{c}3.9\\\\(0.8)\\end{tabular} \\\\',
      '\\end{tabular}',
      '',
    ].join('\n'),
    expect: [
      { kind: 'tableCell', text: 'Group', table: { table: 0, row: 0, column: 0 } },
      { kind: 'tableCell', text: 'Hours (SD)', table: { table: 0, row: 0, column: 1 }, spans: { Hours: 'Hours', SD: 'SD' } },
      { kind: 'tableCell', text: 'Nap', table: { table: 0, row: 1, column: 0 } },
      { kind: 'tableCell', text: '4.2 (1.1)', table: { table: 0, row: 1, column: 1 } },
      { kind: 'tableCell', text: 'Rest', table: { table: 0, row: 2, column: 0 } },
      { kind: 'tableCell', text: '3.9 (0.8)', table: { table: 0, row: 2, column: 1 }, spans: { '3.9': '3.9', '(0.8)': '(0.8)' } },
    ],
  },
  {
    name: 'a tabular of several columns inside a cell is a table of its own; the outer table reads on after it',
    path: 'x.tex',
    source: [
      '\\begin{tabular}{ll}',
      'Study & Test \\\\',
      'Reading & see \\begin{tabular}{*{2}{c}} $t(28)$ & $p$ \\\\ 2.10 & .045 \\end{tabular} below \\\\',
      'Plants & none \\\\',
      '\\end{tabular}',
      'After.',
      '',
    ].join('\n'),
    expect: [
      { kind: 'tableCell', text: 'Study', table: { table: 0, row: 0, column: 0 } },
      { kind: 'tableCell', text: 'Test', table: { table: 0, row: 0, column: 1 } },
      { kind: 'tableCell', text: 'Reading', table: { table: 0, row: 1, column: 0 } },
      // the inner table's cells, as they end; the outer cell is read when it ends, around them
      { kind: 'tableCell', text: 't(28)', table: { table: 1, row: 0, column: 0 }, at: 't(28)' },
      { kind: 'tableCell', text: 'p', table: { table: 1, row: 0, column: 1 } },
      { kind: 'tableCell', text: '2.10', table: { table: 1, row: 1, column: 0 }, at: '2.10' },
      { kind: 'tableCell', text: '.045', table: { table: 1, row: 1, column: 1 }, at: '.045' },
      // the spaces on both sides of the inner table stay (TeX prints both)
      { kind: 'tableCell', text: 'see  below', table: { table: 0, row: 1, column: 1 }, spans: { see: 'see', below: 'below' } },
      { kind: 'tableCell', text: 'Plants', table: { table: 0, row: 2, column: 0 } },
      { kind: 'tableCell', text: 'none', table: { table: 0, row: 2, column: 1 } },
      { kind: 'paragraph', text: 'After.' },
    ],
  },
  {
    name: 'display math is a math segment; verbatim is code; the comment environment is not read',
    path: 'x.tex',
    source: 'Before.\n\\[ t(12) = 3.00 \\]\nAfter.\n\\begin{equation}\nF(1, 20) = 4.5\n\\end{equation}\n\\begin{verbatim}\nt.test(x)\n\\end{verbatim}\n\\begin{comment}\nt(5) = 9.99\n\\end{comment}\nEnd.\n',
    expect: [
      { kind: 'paragraph', text: 'Before.' },
      { kind: 'math', text: 't(12) = 3.00', at: 't(12) = 3.00' },
      { kind: 'paragraph', text: 'After.' },
      { kind: 'math', text: 'F(1, 20) = 4.5', at: 'F(1, 20) = 4.5' },
      { kind: 'code', text: 't.test(x)', at: 't.test(x)' },
      { kind: 'paragraph', text: 'End.' },
    ],
  },
];

describe('LaTeX segments', () => {
  for (const c of cases) it(c.name, () => expectSegments(c));
});

/** Numbers of every t result and statistic, with the offset each was read at. */
function numbers(report: FileReport): Array<{ printed: string; start: number; end: number }> {
  const out: NumberRecord[] = [];
  for (const r of report.results) {
    out.push(r.t);
    if (r.df) out.push(r.df);
    if (r.p?.number) out.push(r.p.number);
  }
  for (const s of report.statistics ?? []) {
    out.push(s.value, ...(s.dfs ?? []));
    if (s.p?.number) out.push(s.p.number);
  }
  return out.map((n) => ({ printed: n.printed, start: n.span.start, end: n.span.end })).sort((a, b) => a.start - b.start);
}

/** What the extractor read, without places: the same for a LaTeX source and its Markdown twin. */
function readings(report: FileReport): unknown {
  return {
    results: report.results.map((r) => ({ t: [r.t.printed, r.t.op], df: r.df?.printed, p: r.p ? [r.p.op, r.p.printed] : undefined })),
    statistics: (report.statistics ?? []).map((s) => ({ kind: s.kind, value: s.value.printed, dfs: s.dfs?.map((d) => d.printed), p: s.p ? [s.p.op, s.p.printed] : undefined })),
  };
}

describe('LaTeX results read as their Markdown forms, at their offsets in the .tex source', () => {
  const pairs: Array<{ name: string; tex: string; md: string; count: number }> = [
    { name: '\\textit and \\emph', tex: 'Naps helped, \\textit{t}(28) = 2.10, \\emph{p} = .045.\n', md: 'Naps helped, *t*(28) = 2.10, *p* = .045.\n', count: 1 },
    { name: 'inline $…$', tex: 'Naps helped, $t(28) = 2.10$, $p = .045$.\n', md: 'Naps helped, $t(28) = 2.10$, $p = .045$.\n', count: 1 },
    { name: '\\(…\\) and p < .001', tex: 'Reading sped up, \\(t(40) = 4.75\\), $p < .001$.\n', md: 'Reading sped up, $t(40) = 4.75$, $p < .001$.\n', count: 1 },
    // scipy.stats.chi2.sf(8.10, 3) = 0.0440
    { name: 'χ² in math', tex: 'Choice differed, $\\chi^2(3) = 8.10$, $p = .044$.\n', md: 'Choice differed, $\\chi^2(3) = 8.10$, $p = .044$.\n', count: 1 },
    { name: 'a negative t in math with ~ and \\, spacing', tex: 'Leaves shrank, $t(18) = -2.10$,~\\textit{p}\\,=\\,.050.\n', md: 'Leaves shrank, $t(18) = -2.10$, *p* = .050.\n', count: 1 },
  ];
  for (const { name, tex, md, count } of pairs) {
    it(name, () => {
      const fromTex = checkSource('paper.tex', tex);
      const fromMd = checkSource('paper.md', md);
      expect(fromTex.format).toBe('latex');
      expect(fromTex.results.length + (fromTex.statistics ?? []).length).toBe(count);
      expect(readings(fromTex)).toEqual(readings(fromMd));
      let from = 0;
      for (const n of numbers(fromTex)) {
        // each number sits in the .tex file exactly where the report says, in reading order
        const at = tex.indexOf(n.printed, from);
        expect({ printed: n.printed, start: n.start, end: n.end }).toEqual({ printed: n.printed, start: at, end: at + n.printed.length });
        from = at + n.printed.length;
      }
    });
  }

  it('a result in a comment is not read as LaTeX (Markdown would read it)', () => {
    const src = 'Naps helped. % t(28) = 2.10, p = .90\n';
    expect(checkSource('paper.tex', src).results).toHaveLength(0);
    expect(checkSource('paper.md', src).results).toHaveLength(1);
  });

  it('a result in the preamble is not read; one in the body is, at its offset', () => {
    const src = '\\documentclass{article}\n\\newcommand{\\res}{t(9) = 9.99}\n\\begin{document}\nNaps helped, $t(28) = 2.10$, $p = .045$.\n\\end{document}\n';
    const report = checkSource('paper.tex', src);
    expect(report.results.map((r) => [r.t.printed, r.t.span.start])).toEqual([['2.10', src.indexOf('2.10')]]);
  });

  it('a table of descriptives in a tabular is read as the Markdown table is', () => {
    const tex = '\\begin{tabular}{lll}\n\\hline\nGroup & $M$ & $SD$ \\\\\n\\hline\nNap & 4.20 & 1.10 \\\\\nRest & 3.90 & 0.80 \\\\\n\\hline\n\\end{tabular}\n';
    const md = '| Group | *M* | *SD* |\n|---|---|---|\n| Nap | 4.20 | 1.10 |\n| Rest | 3.90 | 0.80 |\n';
    const cells = (path: string, s: string) => parseDocument(path, s).segments.filter((g) => g.kind === 'tableCell').map((g) => [g.text.trim(), g.table]);
    expect(cells('t.tex', tex)).toEqual(cells('t.md', md));
  });

  it('a result in a table inside a table cell is read at its offsets, and the rows after it stay rows', () => {
    // t(28) = 2.10 gives p = .0449 (scipy.stats.t.sf(2.10, 28) doubled, scipy 1.x): consistent
    const src = [
      '\\begin{tabular}{ll}',
      'Study & Result \\\\',
      'Reading & \\begin{tabular}{lll} $t$ & $df$ & $p$ \\\\ 2.10 & 28 & .045 \\end{tabular} \\\\',
      'Sleep & \\begin{tabular}{@{}l@{}}$t(30) = 1.20$,\\\\ $p = .24$\\end{tabular} \\\\',
      '\\end{tabular}',
      '',
    ].join('\n');
    const report = checkSource('paper.tex', src);
    expect(report.results.map((r) => [r.t.printed, r.t.span.start, r.df?.printed, r.p?.number?.printed])).toEqual([
      ['2.10', src.indexOf('2.10'), '28', '.045'],
      ['1.20', src.indexOf('1.20'), '30', '.24'],
    ]);
    expect(report.findings.filter((f) => f.level !== 'note')).toEqual([]);
    const doc = parseDocument('paper.tex', src);
    expect(doc.segments.filter((g) => g.table?.table === 0).map((g) => [g.text, g.table?.row, g.table?.column])).toEqual([
      ['Study', 0, 0],
      ['Result', 0, 1],
      ['Reading', 1, 0],
      ['Sleep', 2, 0],
      ['t(30) = 1.20, p = .24', 2, 1],
    ]);
  });

  it('.tex paths are read as LaTeX', () => {
    expect(formatForPath('paper.TEX')).toBe('latex');
    expect(formatForPath('paper.md')).toBe('markdown');
  });
});

describe('LaTeX includes', () => {
  it('lists \\input and \\include of the body with their places; not those in comments or the preamble', () => {
    const src = '\\input{macros}\n\\begin{document}\n\\input{methods}\n% \\input{old}\n\\include{results/main} \\input tables\n\\end{document}\n\\input{after}\n';
    expect(readLatexIncludes(src)).toEqual([
      { command: 'input', name: 'methods', span: { start: src.indexOf('\\input{methods}'), end: src.indexOf('\\input{methods}') + '\\input{methods}'.length } },
      { command: 'include', name: 'results/main', span: { start: src.indexOf('\\include'), end: src.indexOf('\\include') + '\\include{results/main}'.length } },
      { command: 'input', name: 'tables', span: { start: src.indexOf('\\input tables'), end: src.indexOf('\\input tables') + '\\input tables'.length } },
    ]);
  });
});

describe('LaTeX directives', () => {
  it('% plumbline quiet …: reason is a directive for the next block', () => {
    // t(28) = 2.10 gives p = .045 two-sided (scipy.stats.t.sf(2.10, 28) * 2 = 0.0449): p = .020 does not follow
    const src = 'Intro.\n\n% plumbline quiet p-follows-from-t: the pilot\nNaps helped, $t(28) = 2.10$, $p = .020$.\n';
    const doc = parseDocument('x.tex', src);
    expect(doc.directives.map((d) => ({ verb: d.verb, ruleIds: d.ruleIds, reason: d.reason, block: d.appliesToBlock }))).toEqual([
      { verb: 'quiet', ruleIds: ['p-follows-from-t'], reason: 'the pilot', block: doc.segments[1]?.block },
    ]);
    expect(checkSource('x.tex', src).findings.filter((f) => f.ruleId === 'p-follows-from-t')).toHaveLength(0);
    expect(checkSource('x.tex', src.replace('% plumbline', '% nothing')).findings.filter((f) => f.ruleId === 'p-follows-from-t').length).toBeGreaterThan(0);
  });
});
