import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { parseLatex } from '../../src/parse/latex.js';

/**
 * Commands a LaTeX manuscript defines: a command without arguments whose body is plain text is
 * read as that text where it is used, every character placed at the command (TeX prints the
 * body in place of the command: common practice, no source); any other defined command is left
 * as it was (it prints nothing here) with a read note at its first use. Invented text.
 */
const doc = (preamble: string, body: string) => `\\documentclass{article}\n${preamble}\n\\begin{document}\n${body}\n\\end{document}\n`;
const prose = (src: string) => parseLatex('m.tex', src).segments.filter((s) => s.kind === 'paragraph').map((s) => s.text.trim());

describe('\\newcommand expanded where used', () => {
  it('in prose: the value read, placed at the command', () => {
    const src = doc('\\newcommand{\\tval}{2.10}\n\\newcommand\\pval{.042}', 'Scores rose, \\textit{t}(28) = \\tval{}, \\textit{p} = \\pval.');
    expect(prose(src)).toEqual(['Scores rose, t(28) = 2.10, p = .042.']);
    const seg = parseLatex('m.tex', src).segments[0];
    const at = seg?.text.indexOf('2.10') as number;
    const use = src.indexOf('\\tval{}');
    for (let k = 0; k < 4; k += 1) expect([seg?.starts[at + k], seg?.ends[at + k]]).toEqual([use, use + '\\tval'.length]);
  });

  it('in math, and a finding on the value lands on the command', () => {
    const src = doc('\\newcommand{\\tval}{5.90}\\newcommand{\\pval}{.000}', 'Scores rose, $t(23) = \\tval$, $p = \\pval$.');
    const report = checkSource('m.tex', src);
    expect(report.results.map((r) => r.t.printed)).toEqual(['5.90']);
    const zero = report.findings.find((f) => f.ruleId === 'zero-p-is-a-bound');
    expect(zero && src.slice(zero.span.start, zero.span.end)).toContain('\\pval');
  });

  it('the definition in force where it is used: a later \\renewcommand applies after it only', () => {
    const src = doc('\\newcommand{\\tval}{2.10}', 'First, t(28) = \\tval, p = .042.\n\n\\renewcommand{\\tval}{3.30}\nThen, t(28) = \\tval, p = .002.');
    expect(prose(src)).toEqual(['First, t(28) = 2.10, p = .042.', 'Then, t(28) = 3.30, p = .002.']);
  });

  it('a definition in a comment defines nothing', () => {
    const src = doc('% \\newcommand{\\tval}{2.10}', 'Scores rose, t(28) = \\tval, p = .042.');
    expect(prose(src)).toEqual(['Scores rose, t(28) = , p = .042.']);
    expect(parseLatex('m.tex', src).readNotes).toBeUndefined();
  });
});

describe('defined commands left unexpanded, with a note', () => {
  it('a command with an argument: not expanded, its first use named', () => {
    const src = doc('\\newcommand{\\stat}[1]{t = #1}', 'Scores rose, \\stat{2.10}, p = .042. Again \\stat{1.00}.');
    const parsed = parseLatex('m.tex', src);
    expect(parsed.readNotes).toHaveLength(1);
    expect(parsed.readNotes?.[0]).toMatchObject({ kind: 'macro-not-expanded', span: { start: src.indexOf('\\stat{2.10}'), end: src.indexOf('\\stat{2.10}') + '\\stat'.length } });
    expect(parsed.readNotes?.[0]?.message).toContain('takes arguments');
    const notes = checkSource('m.tex', src).findings.filter((f) => f.ruleId === 'input-is-readable');
    expect(notes.map((f) => f.message)).toEqual([expect.stringContaining('A command this LaTeX manuscript defines was not expanded')]);
  });

  it('a body with markup: not expanded', () => {
    const src = doc('\\newcommand{\\tres}{$t(28) = 2.10$}', 'Scores rose, \\tres, p = .042.');
    expect(parseLatex('m.tex', src).readNotes?.[0]?.message).toContain('not plain text');
  });
});
