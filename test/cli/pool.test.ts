import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
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

describe('batch mode with this thread sharing the work', () => {
  it('writes one line per input line, in order, the same bytes as --jobs 1, once the text read calls for two threads', () => {
    // stat-free documents are cheap to check (the pre-filter skips their parse): some 2.5 MiB of
    // them bring in the second thread; documents with results, blank and broken lines are among them
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
