import { spawn, spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { BIN } from './harness.js';
import { readReport } from '../helpers.js';

/**
 * One document never sinks the run: each is checked on a worker thread within a memory and a
 * time budget; a document over either is reported as not checked, with the reason, every other
 * document is still checked, and the exit status is 2. Standard input is read up to the size
 * limit and no further. Through the installed command (the worker is the compiled one).
 * Every manuscript here is invented.
 */
const main = BIN;
const GOOD = 'Recall improved with spacing, t(23) = 2.47, p = .021.\n';
/** About 5 MB and 120,000 results: checking it needs more than 64 MB and more than a second. */
const heavy = () => Array.from({ length: 120_000 }, (_, i) => `Item ${i} changed, t(40) = 3.10, p = .20.\n\n`).join('');

function corpus(): string {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-budget-'));
  writeFileSync(join(dir, 'a.md'), GOOD);
  writeFileSync(join(dir, 'big.md'), heavy());
  writeFileSync(join(dir, 'c.md'), GOOD);
  return dir;
}
type Report = { files: Array<{ path: string; results: unknown[] }>; failures: Array<{ path: string; message: string }> };

describe('per-document budgets', () => {
  it.each([
    ['memory', ['--memory-budget', '64'], 'not checked: needed more than the memory budget of 64 MB (--memory-budget)'],
    ['time', ['--time-budget', '1'], 'not checked: took longer than the time budget of 1 s (--time-budget)'],
  ])('a document over its %s budget is reported as not checked; the others are checked; exit 2', (_kind, args, message) => {
    const dir = corpus();
    const r = spawnSync(process.execPath, [main, 'a.md', 'big.md', 'c.md', '-f', 'json', ...args], { cwd: dir, encoding: 'utf8', maxBuffer: 1 << 26 });
    expect(r.status).toBe(2);
    const report = readReport(r.stdout) as Report;
    expect(report.files.map((f) => [f.path, f.results.length])).toEqual([
      ['a.md', 1],
      ['c.md', 1],
    ]);
    expect(report.failures).toEqual([{ path: 'big.md', message }]);
    expect(r.stderr).toBe(`plumbline: big.md: ${message}\n`);
    expect(r.stderr).not.toMatch(/\n\s+at /);
  }, 120_000);

  it('a document of one long line (issue 18: 50 MB in one line crashed the process) is reported as not checked, not a crash', () => {
    // the same shape, scaled to the test's memory budget: some 6 MB and 160,000 results, no line end
    // (checked by hand at 50 MB under the default 2,048 MB budget: not checked, the reason said, exit 2)
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-budget-line-'));
    writeFileSync(join(dir, 'a.md'), GOOD);
    writeFileSync(join(dir, 'line.md'), 'Item changed, t(40) = 3.10, p = .20. '.repeat(160_000));
    const r = spawnSync(process.execPath, [main, 'a.md', 'line.md', '-f', 'json', '--memory-budget', '64'], { cwd: dir, encoding: 'utf8', maxBuffer: 1 << 26 });
    expect(r.status).toBe(2);
    const report = readReport(r.stdout) as Report;
    expect(report.files.map((f) => [f.path, f.results.length])).toEqual([['a.md', 1]]);
    expect(report.failures).toEqual([{ path: 'line.md', message: 'not checked: needed more than the memory budget of 64 MB (--memory-budget)' }]);
    expect(r.stderr).not.toMatch(/\n\s+at /);
  }, 120_000);

  it('with one worker, the document queued behind one over its time budget goes to the new worker and is checked once', () => {
    const dir = corpus();
    const r = spawnSync(process.execPath, [main, 'a.md', 'big.md', 'c.md', '-f', 'json', '--jobs', '1', '--time-budget', '1'], { cwd: dir, encoding: 'utf8', maxBuffer: 1 << 26 });
    expect(r.status).toBe(2);
    const report = readReport(r.stdout) as Report;
    expect(report.files.map((f) => [f.path, f.results.length])).toEqual([
      ['a.md', 1],
      ['c.md', 1],
    ]);
    expect(report.failures).toEqual([{ path: 'big.md', message: 'not checked: took longer than the time budget of 1 s (--time-budget)' }]);
  }, 120_000);

  it('batch mode: the documents after one over budget still come back, one line each, in order', () => {
    const docs = [{ id: 'a', text: GOOD }, { id: 'big', text: heavy() }, { id: 'c', text: GOOD }].map((d) => JSON.stringify(d)).join('\n');
    const r = spawnSync(process.execPath, [main, 'batch', '--memory-budget', '64'], { input: docs, encoding: 'utf8', maxBuffer: 1 << 26 });
    expect(r.status).toBe(2);
    const lines = r.stdout.trim().split('\n').map((l) => readReport(l) as { id: string; error?: string; results?: unknown[] });
    expect(lines.map((l) => [l.id, l.error ?? l.results?.length])).toEqual([
      ['a', 1],
      ['big', 'not checked: needed more than the memory budget of 64 MB (--memory-budget)'],
      ['c', 1],
    ]);
  }, 120_000);

  it('standard input is read up to the size limit and no further: an endless stream ends the run', async () => {
    const child = spawn(process.execPath, [main, '-', '--max-file-bytes', '1000000'], { stdio: ['pipe', 'pipe', 'pipe'] });
    let stderr = '';
    child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
    const zeros = Buffer.alloc(64 * 1024);
    // an endless writer, like /dev/zero: it stops only when plumbline stops reading
    const pump = () => {
      while (child.stdin.writable && child.stdin.write(zeros));
    };
    child.stdin.on('drain', pump);
    child.stdin.on('error', () => {});
    pump();
    const code = await new Promise<number | null>((r) => child.on('close', r));
    expect(code).toBe(2);
    expect(stderr).toContain('stdin.md: skipped: longer than the limit of 1000000 bytes; reading stopped there (--max-file-bytes)');
  }, 60_000);

  it('the budgets are validated like every number', () => {
    const r = spawnSync(process.execPath, [main, 'x.md', '--memory-budget', '8'], { encoding: 'utf8' });
    expect([r.status, r.stderr]).toEqual([2, 'plumbline: --memory-budget must be a whole number of megabytes, 64 or more; got "8"\nRun "plumbline --help" for usage.\n']);
    const t = spawnSync(process.execPath, [main, 'x.md', '--time-budget', '0'], { encoding: 'utf8' });
    expect(t.status).toBe(2);
    expect(t.stderr).toContain('--time-budget must be a whole number of seconds, 1 or more; got "0"');
  });
});

describe('batch documents have the size limit of files, applied while reading', () => {
  it('an over-long line is skipped as it is read, said on its own output line; the lines after it are checked', () => {
    const long = JSON.stringify({ id: 'long', text: `${'Scores rose. '.repeat(20_000)}t(40) = 3.10, p = .20.` });
    const inline = JSON.stringify({ id: 'inline', text: 'x'.repeat(150_000) });
    const input = [JSON.stringify({ id: 'a', text: GOOD }), long, inline, JSON.stringify({ id: 'c', text: GOOD })].join('\n');
    const r = spawnSync(process.execPath, [main, 'batch', '--max-file-bytes', '100000'], { input, encoding: 'utf8' });
    expect(r.status).toBe(2);
    const lines = r.stdout.trim().split('\n').map((l) => readReport(l) as { id: string | null; error?: string; results?: unknown[] });
    expect(lines.map((l) => [l.id, l.error ?? l.results?.length])).toEqual([
      ['a', 1],
      [null, 'line 2: skipped: longer than 201024 characters; reading of it stopped there (the size limit, --max-file-bytes, is 100000 bytes)'],
      ['inline', 'skipped: 150000 bytes is over the limit of 100000 (maxFileBytes in the configuration, or --max-file-bytes)'],
      ['c', 1],
    ]);
  }, 60_000);
});
