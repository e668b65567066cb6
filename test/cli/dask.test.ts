/**
 * scripts/dask-batch.py on a real Dask distributed engine (Debian's python3-distributed, run by
 * /usr/bin/python3), every process on loopback: a scheduler and two worker processes over 1,000
 * generated documents, one worker killed in the middle of the run, and a local cluster
 * (--workers N). The output must be byte for byte that of one `plumbline batch` run.
 *
 * .ci/run installs python3-distributed and sets PLUMBLINE_REQUIRE_DASK=1, so CI always runs these;
 * elsewhere they are skipped when Dask is missing, with the reason in their names.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { statDense } from '../../bench/corpus.js';
import { BIN } from './harness.js';

const PYTHON = '/usr/bin/python3';
const SCRIPT = join(process.cwd(), 'scripts/dask-batch.py');
/** The plumbline command, in one place: the built CLI of this checkout (package.json's bin). */
const CLI = [process.execPath, BIN];
const PLUMBLINE = CLI.map((w) => `'${w}'`).join(' ');

const hasDask = spawnSync(PYTHON, ['-c', 'import distributed'], { encoding: 'utf8' }).status === 0;
const required = process.env.PLUMBLINE_REQUIRE_DASK === '1';

/** Small invented documents (1 to 3 results each), with what batch must keep apart: paths, id-less documents, a blank line, broken JSON. */
function corpus(n: number): string {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-dask-'));
  const lines: string[] = [];
  for (let i = 0; i < n; i += 1) {
    if (i % 211 === 7) lines.push('');
    else if (i % 307 === 9) lines.push('{broken');
    else if (i % 101 === 3) lines.push(JSON.stringify({ text: statDense(500 + i, 600) }));
    else if (i % 53 === 11) {
      const p = join(dir, `doc${i}.md`);
      writeFileSync(p, statDense(500 + i, 600));
      lines.push(p);
    } else lines.push(JSON.stringify({ id: i % 2 === 0 ? `doc-${i}` : i, text: statDense(500 + i, 600) }));
  }
  return `${lines.join('\n')}\n`;
}

function single(input: string) {
  return spawnSync(CLI[0] as string, [CLI[1] as string, 'batch', '--jobs', '1'], { input, encoding: 'utf8', maxBuffer: 1 << 28 });
}

const started: ChildProcess[] = [];
afterEach(() => {
  for (const p of started.splice(0)) if (p.exitCode === null && p.signalCode === null) p.kill('SIGKILL');
});

/** Runs a process, gathering its output; resolves when it exits. */
function launch(cmd: string, args: string[], input?: string) {
  const child = spawn(cmd, args, { stdio: ['pipe', 'pipe', 'pipe'] });
  started.push(child);
  const out = { stdout: '', stderr: '', code: null as number | null, done: undefined as unknown as Promise<void> };
  child.stdout.setEncoding('utf8').on('data', (s: string) => (out.stdout += s));
  child.stderr.setEncoding('utf8').on('data', (s: string) => (out.stderr += s));
  out.done = new Promise((resolve) => child.on('close', (code) => resolve(void (out.code = code))));
  if (input !== undefined) child.stdin.end(input);
  else child.stdin.end();
  return { child, out };
}

async function until(what: string, ok: () => boolean, seconds: number): Promise<void> {
  const end = Date.now() + seconds * 1000;
  while (!ok()) {
    if (Date.now() > end) throw new Error(`gave up waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** The processes a process started, from any of its threads (Linux /proc: a task runs in a worker's thread pool). */
function children(pid: number): number[] {
  try {
    return readdirSync(`/proc/${pid}/task`).flatMap((tid) => readFileSync(`/proc/${pid}/task/${tid}/children`, 'utf8').split(/\s+/).filter(Boolean).map(Number));
  } catch {
    return [];
  }
}

const ids = (ndjson: string) => ndjson.split('\n').filter(Boolean).map((l) => (JSON.parse(l) as { id: unknown }).id);

describe('scripts/dask-batch.py on Dask distributed', () => {
  it('Dask distributed is present where it is required', () => {
    if (required) expect(hasDask, 'python3-distributed is required (Debian: apt-get install python3-distributed)').toBe(true);
  });

  it.skipIf(!hasDask && !required)('a scheduler and two workers on loopback, 1,000 documents, one worker killed mid-run: output identical to one batch run, nothing lost, nothing twice (skipped without python3-distributed)', async () => {
    const input = corpus(1000);
    const expected = single(input);
    expect(expected.stdout.split('\n').filter(Boolean)).toHaveLength(1000);

    const dir = mkdtempSync(join(tmpdir(), 'plumbline-dask-cluster-'));
    const schedulerFile = join(dir, 'scheduler.json');
    const scheduler = launch('/usr/bin/dask-scheduler', ['--host', '127.0.0.1', '--port', '0', '--no-dashboard', '--scheduler-file', schedulerFile]);
    await until('the scheduler', () => existsSync(schedulerFile) && readFileSync(schedulerFile, 'utf8').includes('address'), 60);
    const address = (JSON.parse(readFileSync(schedulerFile, 'utf8')) as { address: string }).address;
    expect(address).toMatch(/^tcp:\/\/127\.0\.0\.1:\d+$/);
    // no nanny: a killed worker stays dead, and its partitions must go to the other one
    const workerArgs = [address, '--host', '127.0.0.1', '--nthreads', '1', '--no-nanny', '--no-dashboard'];
    const victim = launch('/usr/bin/dask-worker', workerArgs);
    const survivor = launch('/usr/bin/dask-worker', workerArgs);
    await until('two workers to register', () => (scheduler.out.stderr.match(/Register worker/g) ?? []).length >= 2, 60);

    const run = launch(PYTHON, [SCRIPT, '--scheduler', address, '--plumbline', PLUMBLINE, '--partition-lines', '100', '--progress-seconds', '0'], input);
    // kill the victim while it is checking a partition (its plumbline process is running) and
    // after some partitions were written, so the run is truly in its middle
    let killedWith: number[] = [];
    await until(
      'a worker in the middle of a partition',
      () => {
        const done = /plumbline dask: (\d+)( of \d+)? documents/.exec(run.out.stderr.split('\n').filter((l) => l.startsWith('plumbline dask: ')).at(-1) ?? '');
        const inFlight = children(victim.child.pid as number);
        if (done && Number(done[1]) > 0 && Number(done[1]) < 800 && inFlight.length > 0) {
          killedWith = inFlight;
          victim.child.kill('SIGKILL');
          return true;
        }
        if (run.out.code !== null) throw new Error(`the run ended before a worker could be killed: ${run.out.stderr}`);
        return false;
      },
      240,
    );
    expect(killedWith.length).toBeGreaterThan(0);
    await run.out.done;
    for (const pid of killedWith) {
      try {
        process.kill(pid, 'SIGKILL');
      } catch {
        // already gone
      }
    }
    expect(run.out.stderr).not.toContain('stopped');
    expect(run.out.stdout).toBe(expected.stdout);
    // every input line answered once, in order: ids as batch gives them (null for blank, broken and id-less lines)
    expect(ids(run.out.stdout)).toEqual(ids(expected.stdout));
    const summary = (s: string) => s.split('\n').filter((l) => l.startsWith('plumbline batch: '));
    expect(summary(run.out.stderr)).toEqual(summary(expected.stderr));
    expect(summary(run.out.stderr)).toHaveLength(1);
    expect(run.out.code).toBe(expected.status);
    expect(run.out.stderr).toMatch(/plumbline dask: 1000 of 1000 documents, [\d.]+ documents\/s, [\d.]+ s in all/);
    // the scheduler saw the worker go (its connection dropped): Dask's liveness, not ours
    await until('the scheduler to note the lost worker', () => /Remove worker/.test(scheduler.out.stderr), 30);
    expect(survivor.out.code).toBeNull();
  }, 300_000);

  it.skipIf(!hasDask && !required)('--workers N starts a local cluster on loopback with the same output (skipped without python3-distributed)', async () => {
    const input = corpus(150);
    const expected = single(input);
    const run = launch(PYTHON, [SCRIPT, '--workers', '2', '--plumbline', PLUMBLINE, '--partition-lines', '50'], input);
    await run.out.done;
    expect(run.out.stdout).toBe(expected.stdout);
    expect(run.out.code).toBe(expected.status);
    expect(run.out.stderr).toContain(expected.stderr.split('\n').find((l) => l.startsWith('plumbline batch: ')));
  }, 180_000);

  it.skipIf(!hasDask && !required)('a plumbline command the workers cannot run stops the run before any output, exit 2 (skipped without python3-distributed)', async () => {
    const run = launch(PYTHON, [SCRIPT, '--workers', '1', '--plumbline', '/nonexistent/plumbline'], '{"id": 1, "text": "x"}\n');
    await run.out.done;
    expect(run.out.stdout).toBe('');
    expect(run.out.stderr).toContain('the workers must all run the same plumbline');
    expect(run.out.stderr).toContain('cannot run /nonexistent/plumbline');
    expect(run.out.code).toBe(2);
  }, 120_000);
});
