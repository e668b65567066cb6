import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { describe, expect, it } from 'vitest';
import { statDense, statFree } from '../../bench/corpus.js';
import { checkSource } from '../../src/engine/index.js';
import { checkAll, HERE_MAX_CHARS, MIN_CHARS_PER_WORKER, type Job, type Outcome } from '../../src/cli/pool.js';
import { BIN } from './harness.js';

/**
 * The pool with this thread sharing the work (`here`, batch's default `--jobs`): outcomes come in
 * input order, each once, equal to a check in this thread; small documents are checked here,
 * one too large is handed to a worker (and this thread then gives its place back to a worker);
 * a worker that fails costs only its document. Run against the bundled worker `npm run build`
 * writes (the command's own). Every manuscript is invented (bench/corpus.ts).
 */
const WORKER = join(dirname(BIN), 'worker.js');
const small = (n: number): Job[] => Array.from({ length: n }, (_, i) => ({ path: `d${i}.md`, source: statDense(300 + i, 3000), options: {} }));
/** What a report says, as the JSON report would carry it (its text left out). */
const said = (o: Outcome) => ('report' in o ? JSON.stringify({ ...o.report, source: undefined }) : `error: ${o.error}`);

async function run(jobs: Job[], threads: number | 'auto', budget = { memoryMb: 2048, seconds: 120 }) {
  const order: number[] = [];
  const outcomes: Outcome[] = [];
  const here = new Set<number>();
  await checkAll(
    jobs,
    threads,
    (o, i) => {
      order.push(i);
      outcomes.push(o);
    },
    budget,
    { here: true, workerFile: WORKER, checkedHere: (i) => here.add(i) },
  );
  return { order, outcomes, here };
}

describe.runIf(existsSync(WORKER))('this thread checking beside the workers', () => {
  it('emits every outcome once, in input order, equal to a check here; errors keep their place', async () => {
    const jobs: Job[] = small(60);
    jobs.splice(7, 0, { path: 'gone.md', error: 'cannot read gone.md' });
    const { order, outcomes, here } = await run(jobs, 2);
    expect(order).toEqual(jobs.map((_, i) => i));
    expect(outcomes.map(said)).toEqual(jobs.map((j) => ('error' in j ? `error: ${j.error}` : said({ report: checkSource(j.path, j.source, j.options) }))));
    // this thread starts at once, while the worker loads
    expect(here.has(0)).toBe(true);
    expect(here.has(7)).toBe(false);
  }, 120_000);

  it('hands a document larger than its share to a worker, then gives its place to one more worker', async () => {
    const jobs = small(20);
    const large = statDense(42, HERE_MAX_CHARS + 10_000);
    jobs.splice(3, 0, { path: 'large.md', source: large, options: {} });
    const { order, outcomes, here } = await run(jobs, 2);
    expect(order).toEqual(jobs.map((_, i) => i));
    expect(said(outcomes[3] as Outcome)).toBe(said({ report: checkSource('large.md', large, {}) }));
    expect(here.has(3)).toBe(false);
    // after the large one, every document went to the workers
    expect([...here].every((i) => i < 3)).toBe(true);
  }, 120_000);

  it('under a budget tighter than the default every document goes to a worker; one out of memory costs only its document', async () => {
    const heavy = Array.from({ length: 120_000 }, (_, i) => `Item ${i} changed, t(40) = 3.10, p = .20.\n\n`).join('');
    const jobs = small(10);
    jobs.splice(2, 0, { path: 'heavy.md', source: heavy, options: {} });
    const { order, outcomes, here } = await run(jobs, 2, { memoryMb: 64, seconds: 120 });
    expect(here.size).toBe(0);
    expect(order).toEqual(jobs.map((_, i) => i));
    expect(outcomes.map((o) => ('error' in o ? o.error : o.report.path))).toEqual(jobs.map((j) => (j.path === 'heavy.md' ? 'not checked: needed more than the memory budget of 64 MB (--memory-budget)' : j.path)));
  }, 120_000);

  it('with one thread asked for, this thread checks nothing: budgets hold for every document', async () => {
    const { here, order } = await run(small(5), 1);
    expect(order).toEqual([0, 1, 2, 3, 4]);
    expect(here.size).toBe(0);
  }, 120_000);
});

/**
 * A worker script that ends its thread without an error: the command's own worker, preceded by a
 * listener that calls process.exit on a document holding `EXIT-NOW` (it is registered first, so
 * it runs before the worker's own), or, with `atLoad`, that exits before the worker loads.
 */
function exitingWorker(atLoad = false): string {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-exit-worker-'));
  const file = join(dir, 'worker.mjs');
  writeFileSync(
    file,
    atLoad
      ? 'process.exit(3);\n'
      : `import { parentPort } from 'node:worker_threads';\nparentPort.on('message', (job) => { if (typeof job.source === 'string' && job.source.includes('EXIT-NOW')) process.exit(3); });\nawait import(${JSON.stringify(pathToFileURL(WORKER).href)});\n`,
  );
  return file;
}

describe.runIf(existsSync(WORKER))('a worker thread that exits without an error', () => {
  it('costs only the document it was checking: the documents queued behind it go to a new worker, each answered once, in order', async () => {
    const jobs = small(8);
    jobs.splice(2, 0, { path: 'exits.md', source: 'EXIT-NOW: the worker checking this ends its thread, t(20) = 2.10, p = .048.\n', options: {} });
    const order: number[] = [];
    const outcomes: Outcome[] = [];
    const workerFile = exitingWorker();
    await checkAll(
      jobs,
      1,
      (o, i) => {
        order.push(i);
        outcomes.push(o);
      },
      { memoryMb: 2048, seconds: 120 },
      { workerFile },
    );
    expect(order).toEqual(jobs.map((_, i) => i));
    expect(outcomes.map((o) => ('error' in o ? o.error : o.report.path))).toEqual(jobs.map((j) => (j.path === 'exits.md' ? 'not checked: the check stopped: its worker thread exited (exit code 3)' : j.path)));
    expect(outcomes.map(said)).toEqual(jobs.map((j) => ('error' in j || j.path === 'exits.md' ? expect.any(String) : said({ report: checkSource(j.path, j.source, j.options) }))));
  }, 120_000);

  it('a document read while its worker is being replaced is sent to the new worker once', async () => {
    // the first worker exits on the first document; its replacement takes 1.5 s to load, and the
    // second document arrives from the input while it loads; the worker script logs every job it is sent
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-resend-'));
    const log = join(dir, 'log.txt');
    const workerFile = join(dir, 'worker.mjs');
    writeFileSync(
      workerFile,
      [
        "import { parentPort } from 'node:worker_threads';",
        "import { appendFileSync, readFileSync } from 'node:fs';",
        `const log = ${JSON.stringify(log)};`,
        "appendFileSync(log, 'start\\n');",
        "const starts = readFileSync(log, 'utf8').split('\\n').filter((l) => l === 'start').length;",
        "parentPort.on('message', (job) => { appendFileSync(log, `job ${job.index}\\n`); if (String(job.source).includes('EXIT-NOW')) process.exit(3); });",
        'if (starts > 1) await new Promise((wake) => setTimeout(wake, 1500));',
        `await import(${JSON.stringify(pathToFileURL(WORKER).href)});`,
        '',
      ].join('\n'),
    );
    const second = { path: 'b.md', source: 'Recall improved, t(23) = 2.47, p = .021.\n', options: {} };
    async function* input(): AsyncGenerator<Job> {
      yield { path: 'a.md', source: 'EXIT-NOW, t(20) = 2.10, p = .048.\n', options: {} };
      await new Promise((wake) => setTimeout(wake, 1000));
      yield second;
    }
    const outcomes: Outcome[] = [];
    await checkAll(input(), 1, (o) => void outcomes.push(o), { memoryMb: 2048, seconds: 120 }, { workerFile });
    expect(outcomes.map((o) => ('error' in o ? o.error : o.report.path))).toEqual(['not checked: the check stopped: its worker thread exited (exit code 3)', 'b.md']);
    const lines = readFileSync(log, 'utf8').split('\n').filter(Boolean);
    expect(lines.filter((l) => l === 'start')).toHaveLength(2);
    expect(lines.filter((l) => l === 'job 1')).toHaveLength(1);
  }, 120_000);

  it('when the run stops so, this thread stops checking and emitting too', async () => {
    const workerFile = exitingWorker(true);
    const emitted: number[] = [];
    const run = checkAll(small(200), 2, (_o, i) => void emitted.push(i), { memoryMb: 2048, seconds: 120 }, { here: true, workerFile });
    await expect(run).rejects.toThrow('a worker thread stopped while loading (exit code 3)');
    const atFailure = emitted.length;
    await new Promise((wake) => setTimeout(wake, 1500));
    expect(emitted.length).toBe(atFailure);
    expect(atFailure).toBeLessThan(200);
  }, 120_000);

  it('one that exits while loading stops the run with the reason, rather than leaving it waiting', async () => {
    const workerFile = exitingWorker(true);
    await expect(checkAll(small(3), 2, () => undefined, { memoryMb: 2048, seconds: 120 }, { workerFile })).rejects.toThrow('a worker thread stopped while loading (exit code 3)');
  }, 120_000);
});

describe('batch mode with this thread sharing the work', () => {
  it('writes one line per input line, in order, the same bytes as --jobs 1, once the text read calls for two threads', () => {
    // stat-free documents are cheap to check (the pre-filter skips their parse): two and a half
    // workers' shares of them (MIN_CHARS_PER_WORKER) bring in the second thread; documents with
    // results, blank and broken lines are among them
    const docs: string[] = [];
    for (let i = 0; docs.join('\n').length < 2.5 * MIN_CHARS_PER_WORKER; i += 1) {
      if (i % 50 === 7) docs.push('');
      else if (i % 50 === 19) docs.push('{broken');
      else if (i % 5 === 0) docs.push(JSON.stringify({ id: `s${i}`, text: statDense(900 + i, 2000) }));
      else docs.push(JSON.stringify({ id: i, text: statFree(900 + i, 20_000) }));
    }
    const input = `${docs.join('\n')}\n`;
    const shared = spawnSync(process.execPath, [BIN, 'batch'], { input, encoding: 'utf8', maxBuffer: 1 << 28 });
    const alone = spawnSync(process.execPath, [BIN, 'batch', '--jobs', '1'], { input, encoding: 'utf8', maxBuffer: 1 << 28 });
    expect(shared.status).toBe(2);
    const lines = shared.stdout.split('\n').slice(0, -1);
    expect(lines).toHaveLength(docs.length);
    expect(lines.map((l) => (JSON.parse(l) as { id: unknown }).id)).toEqual(docs.map((d, i) => (d.startsWith('{"') ? (JSON.parse(d) as { id: unknown }).id : (void i, null))));
    expect(shared.stdout).toBe(alone.stdout);
    expect(shared.stderr).toBe(alone.stderr);
  }, 300_000);
});
