import { mkdirSync, mkdtempSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { checkSource, checkWithIncludes, folderIncludeReader, type IncludeReader } from '../../src/index.js';

// Invented manuscripts. p values: scipy.stats.t.sf(t, df) doubled (scipy 1.x): t(40) = 4.75 gives
// .00003 (printed p < .001), t(28) = 2.10 gives .0449 (printed .045).

/** A reader over an in-memory folder, recording what it was asked for. */
function memory(files: Record<string, string>): IncludeReader & { asked: string[] } {
  const asked: string[] = [];
  return {
    asked,
    read(name) {
      asked.push(name);
      return files[name];
    },
  };
}

const MAIN = [
  '\\documentclass{article}',
  '\\begin{document}',
  'Naps helped, $t(28) = 2.10$, $p = .045$.',
  '\\input{parts/methods}',
  '\\include{results}',
  '\\input{../outside}',
  '\\input{/etc/hostname}',
  '\\input{missing}',
  '\\input{plot.pgf}',
  '\\end{document}',
  '',
].join('\n');

describe('checkWithIncludes (the library follows \\input and \\include)', () => {
  it('checks each included file as a report of its own, right after the file that includes it, placed in that file', () => {
    const reader = memory({
      'parts/methods.tex': 'Reading sped up, $t(40) = 4.75$, $p < .001$.\n\\input{parts/deeper}\n',
      'parts/deeper.tex': 'Deeper text.\n\\input{main}\n',
      'results.tex': 'Nothing new here.\n\\input{parts/methods}\n',
      'plot.pgf': '\\draw (0,0) -- (1,1); t(9) = 9.99',
    });
    const reports = checkWithIncludes('paper/main.tex', MAIN, { includes: reader });
    expect(reports.map((r) => r.path)).toEqual(['paper/main.tex', 'paper/parts/methods.tex', 'paper/parts/deeper.tex', 'paper/results.tex']);
    const methods = reports[1];
    const methodsText = 'Reading sped up, $t(40) = 4.75$, $p < .001$.';
    expect(methods?.results.map((r) => [r.t.printed, r.t.start.line, r.t.start.column])).toEqual([['4.75', 1, methodsText.indexOf('4.75') + 1]]);
    expect(reports[0]?.results.map((r) => r.t.printed)).toEqual(['2.10']);
    // names outside the folder are refused before the reader is asked; a missing file is named
    expect(reader.asked).not.toContain('../outside.tex');
    expect(reader.asked.some((n) => n.includes('etc'))).toBe(false);
    const notes = (i: number) => reports[i]?.findings.filter((f) => f.messageId === 'include-not-read').map((f) => [f.start.line, f.message]) ?? [];
    const inMain = notes(0);
    expect(inMain.map(([line]) => line)).toEqual([6, 7, 8]);
    expect(String(inMain[0]?.[1])).toMatch(/climbs out of the manuscript's folder/);
    expect(String(inMain[1]?.[1])).toMatch(/absolute path/);
    expect(String(inMain[2]?.[1])).toMatch(/looked for missing\.tex and missing/);
    // deeper.tex includes main.tex, which is on its chain: a cycle
    expect(notes(2).map(([line]) => line)).toEqual([2]);
    expect(String(notes(2)[0]?.[1])).toMatch(/cycle/);
    // results.tex includes methods.tex again: read once, no note
    expect(notes(3)).toEqual([]);
    // drawing code is not read as a manuscript
    expect(JSON.stringify(reports)).not.toContain('9.99');
  });

  it('gives what checkSource gives when there is nothing to follow, or the source is not LaTeX', () => {
    const src = 'Naps helped, $t(28) = 2.10$, $p = .045$.\n';
    const reader = memory({});
    expect(checkWithIncludes('a.tex', src, { includes: reader })).toEqual([checkSource('a.tex', src)]);
    expect(checkWithIncludes('a.md', '\\input{x}\n', { includes: reader })).toEqual([checkSource('a.md', '\\input{x}\n')]);
    expect(reader.asked).toEqual([]);
  });

  it('stops a chain more than 8 includes deep', () => {
    const files: Record<string, string> = {};
    for (let k = 1; k <= 12; k += 1) files[`f${k}.tex`] = `Level ${k}.\n\\input{f${k + 1}}\n`;
    const reports = checkWithIncludes('main.tex', '\\input{f1}\n', { includes: memory(files) });
    expect(reports.map((r) => r.path)).toEqual(['main.tex', 'f1.tex', 'f2.tex', 'f3.tex', 'f4.tex', 'f5.tex', 'f6.tex', 'f7.tex', 'f8.tex']);
    const last = reports.at(-1)?.findings.find((f) => f.messageId === 'include-not-read');
    expect(last?.message).toMatch(/more than 8 deep/);
  });
});

describe('folderIncludeReader (the same folder guard on disk)', () => {
  const root = mkdtempSync(join(tmpdir(), 'plumbline-includes-'));
  afterAll(() => rmSync(root, { recursive: true, force: true }));

  it('reads files in the folder, and refuses a symbolic link that leads out of it', () => {
    const dir = join(root, 'paper');
    mkdirSync(join(dir, 'parts'), { recursive: true });
    writeFileSync(join(root, 'secret.tex'), 'Hidden, $t(9) = 7.77$.\n');
    writeFileSync(join(dir, 'parts', 'methods.tex'), 'Reading sped up, $t(40) = 4.75$, $p < .001$.\n');
    symlinkSync(join(root, 'secret.tex'), join(dir, 'link.tex'));
    const main = 'Intro.\n\\input{parts/methods}\n\\input{link}\n';
    const reports = checkWithIncludes(join(dir, 'main.tex'), main, { includes: folderIncludeReader(dir) });
    expect(reports.map((r) => r.path)).toEqual([join(dir, 'main.tex'), `${dir}/parts/methods.tex`]);
    expect(reports[1]?.results.map((r) => r.t.printed)).toEqual(['4.75']);
    const note = reports[0]?.findings.find((f) => f.messageId === 'include-not-read');
    expect(note?.start.line).toBe(3);
    expect(note?.message).toMatch(/leads outside the manuscript's folder \(through a symbolic link\)/);
    expect(JSON.stringify(reports)).not.toContain('7.77');
  });
});
