import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { statDense } from '../../bench/corpus.js';
import { checkFiles } from '../../src/cli/runner.js';
import { fileChunks, formatJson } from '../../src/report/json.js';
import { wholeText } from '../../src/report/chunks.js';
import type { FileReport } from '../../src/engine/index.js';
import { cli } from './harness.js';

/**
 * The JSON report's files are laid out as the run gives them (src/cli/run.ts), not after the
 * last check: the report is the same bytes as the formatter writes from the whole run, with and
 * without --quiet; the files are given in input order, each the very object the report shows.
 * Every manuscript here is invented (bench/corpus.ts).
 */
function folder(): string {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-early-'));
  for (let i = 0; i < 6; i += 1) writeFileSync(join(dir, `d${i}.md`), statDense(70 + i, 4000));
  writeFileSync(join(dir, 'flagged.md'), 'Scores differed, t(20) = 2.10, p = .30.\n');
  return dir;
}

describe('JSON files laid out as they come in', () => {
  it.each([[[] as string[]], [['-q']]])('the report is the formatter’s bytes for the whole run (%j)', async (extra) => {
    const dir = folder();
    const out = await cli(['.', '-f', 'json', ...extra], { cwd: dir });
    const run = await checkFiles(['.'], { cwd: dir, errorsOnly: extra.includes('-q') });
    expect(out.stdout).toBe(formatJson(run.report));
    expect(out.code).toBe(1);
  });

  it('each file is given once, in input order, as the object the report shows', async () => {
    const dir = folder();
    const given: Array<[FileReport, number]> = [];
    const run = await checkFiles(['.'], { cwd: dir, errorsOnly: true, onFile: (f, i) => given.push([f, i]) });
    expect(given.map(([, i]) => i)).toEqual(run.report.files.map((_, i) => i));
    expect(given.every(([f, i]) => f === run.report.files[i])).toBe(true);
    expect(given.map(([f]) => f.path)).toEqual(['d0.md', 'd1.md', 'd2.md', 'd3.md', 'd4.md', 'd5.md', 'flagged.md']);
    // laid out early or late, a file's text is the same
    expect(given.map(([f]) => wholeText(fileChunks(f))).join(',')).toBe(run.report.files.map((f) => wholeText(fileChunks(f))).join(','));
  });

  it('with a baseline, files are not given early (the baseline is applied to all of them at the end)', async () => {
    const dir = folder();
    const given: FileReport[] = [];
    await checkFiles(['.'], { cwd: dir, baseline: { file: join(dir, 'b.json'), entries: [] }, onFile: (f) => given.push(f) });
    expect(given).toEqual([]);
  });
});
