import { mkdirSync, mkdtempSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cli } from './harness.js';
import { readReport } from '../helpers.js';

// Invented manuscripts of our own. p = .045 is what t(28) = 2.10 gives two-sided (scipy.stats.t.sf(2.10, 28) * 2 = 0.0449…).

interface JsonReport {
  files: Array<{ path: string; format: string; results: Array<{ t: { printed: string; start: { line: number } } }>; findings: Array<{ ruleId: string; messageId: string; message: string; start: { line: number } }> }>;
  failures: Array<{ path: string; message: string }>;
}

const json = (stdout: string) => readReport(stdout) as JsonReport;

describe('LaTeX on the command line', () => {
  it('--stdin-name x.tex reads standard input as LaTeX: a result in a comment is not read', async () => {
    const text = '\\begin{document}\nNaps helped, $t(28) = 2.10$, $p = .045$. % t(28) = 2.10, p = .90\n\\end{document}\n';
    const out = await cli(['-', '--stdin-name', 'paper.tex', '--format', 'json'], { stdin: text });
    const report = json(out.stdout);
    expect(report.files.map((f) => [f.path, f.format, f.results.length])).toEqual([['paper.tex', 'latex', 1]]);
    expect(report.files[0]?.findings.filter((f) => f.ruleId === 'p-follows-from-t')).toEqual([]);
    // read as Markdown, the comment's p = .90 is a second result, and it does not follow from t
    const asMarkdown = json((await cli(['-', '--stdin-name', 'paper.md', '--format', 'json'], { stdin: text })).stdout);
    expect(asMarkdown.files[0]?.results.length).toBe(2);
  });

  it('a folder walk picks up .tex files', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-tex-walk-'));
    writeFileSync(join(dir, 'paper.tex'), 'Naps helped, $t(28) = 2.10$, $p = .045$.\n');
    writeFileSync(join(dir, 'notes.log'), 'Naps helped, t(28) = 2.10, p = .90.\n');
    const report = json((await cli(['--format', 'json', '.'], { cwd: dir })).stdout);
    expect(report.files.map((f) => f.path)).toEqual(['paper.tex']);
  });

  it('follows \\input and \\include inside the folder, refuses a name outside it, a link leaving it and a cycle, with notes', async () => {
    const root = mkdtempSync(join(tmpdir(), 'plumbline-tex-inc-'));
    const dir = join(root, 'paper');
    mkdirSync(join(dir, 'parts'), { recursive: true });
    writeFileSync(join(root, 'secret.tex'), 'Outside, $t(10) = 7.77$, $p = .34$.\n');
    symlinkSync(join(root, 'secret.tex'), join(dir, 'alias.tex'));
    const main = [
      '\\documentclass{article}',
      '\\begin{document}',
      '\\section{Results}',
      '\\input{parts/methods}',
      '\\input{../secret}',
      '\\input{alias}',
      '\\include{parts/loop}',
      '\\input{/etc/hostname}',
      '\\end{document}',
      '',
    ].join('\n');
    writeFileSync(join(dir, 'main.tex'), main);
    writeFileSync(join(dir, 'parts', 'methods.tex'), 'Reading sped up, $t(40) = 4.75$, $p < .001$.\n');
    writeFileSync(join(dir, 'parts', 'loop.tex'), 'Back again.\n\\input{main}\n');
    const out = await cli(['--format', 'json', 'paper/main.tex'], { cwd: root });
    const report = json(out.stdout);
    expect(report.failures).toEqual([]);
    expect(report.files.map((f) => f.path)).toEqual(['paper/main.tex', join('paper', 'parts/methods.tex'), join('paper', 'parts/loop.tex')]);
    const methods = report.files[1];
    // the included file's result is placed in that file
    expect(methods?.results.map((r) => [r.t.printed, r.t.start.line])).toEqual([['4.75', 1]]);
    const notes = (path: string) => report.files.find((f) => f.path === path)?.findings.filter((f) => f.messageId === 'include-not-read').map((f) => [f.start.line, f.message]) ?? [];
    const inMain = notes('paper/main.tex');
    expect(inMain.map(([line]) => line)).toEqual([5, 6, 8]);
    expect(String(inMain[0]?.[1])).toMatch(/\.\./);
    expect(String(inMain[1]?.[1])).toMatch(/outside the manuscript's folder/);
    expect(String(inMain[2]?.[1])).toMatch(/absolute path/);
    const inLoop = notes(join('paper', 'parts/loop.tex'));
    expect(inLoop.map(([line]) => line)).toEqual([2]);
    expect(String(inLoop[0]?.[1])).toMatch(/cycle/);
    // nothing from outside the folder was read
    expect(out.stdout).not.toContain('7.77');
  });
});
