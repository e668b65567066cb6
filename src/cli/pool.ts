import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import type { Worker } from 'node:worker_threads';
import { checkSource, type CheckOptions, type FileReport } from '../engine/index.js';
import { DEFAULT_BUDGET, type Budget } from './defaults.js';
import { receivedReport, type ReportMessage } from './transfer.js';

/** A document to check, or one that could not be read (kept in order, reported as such). */
export type Job = { path: string; source: string; options: CheckOptions } | { path: string; error: string };

export type Outcome = { report: FileReport } | { error: string };

export { DEFAULT_BUDGET, type Budget } from './defaults.js';

/**
 * A single document up to this size is checked in this thread, without a worker's start-up
 * cost (a module load): every step of a check is linear in the text (the benchmark's hostile
 * figures keep it so), so such a document finishes in about a second and within memory far
 * below the budget.
 */
export const IN_THREAD_MAX_CHARS = 1024 * 1024;

/**
 * Documents a worker holds at once: the one it checks and the next, so it never waits for this
 * thread between two documents (a reply, the next message). Each document still has its own
 * time budget, started when the one before it is done.
 */
export const IN_FLIGHT_PER_WORKER = 2;

/**
 * Text each worker thread should have to check before another one is started. A worker costs
 * its start (loading the bundled checker) and then runs its code cold for a while, and on a
 * machine with few cores it competes with this thread, which reads the files and writes the
 * report. Figure 11 of `npm run bench` measures the start as the text checked in the same time,
 * and its goal keeps this share at ten such starts or more. On the 2-core machine of
 * DEVELOPERS.md, since checking reached 0.9–1.2 MB/s, figure 11 has put a start (77–151 ms) at
 * 88–138 KB of text (Dec 4, five runs): 1 MiB was 7.6 starts in one whole bench run, 1.5 MiB is
 * 11.4 at the most measured. It still gives 400 files of 10 KB two workers on two cores, which
 * took 0.89–1.03 of the time `--jobs 1` took in those runs (figure 3's detail): no slower.
 */
export const MIN_CHARS_PER_WORKER = 1.5 * 1024 * 1024;

/**
 * The worker threads a run starts for `chars` characters of text in `documents` documents, on
 * `cores` cores: one per MIN_CHARS_PER_WORKER of text, at least one, at most one per core and
 * one per document. So a few or small files are checked by one worker, as fast as `--jobs 1`.
 */
export function threadsFor(documents: number, chars: number, cores = availableParallelism()): number {
  return Math.max(1, Math.min(cores, documents, Math.floor(chars / MIN_CHARS_PER_WORKER)));
}

/**
 * node:worker_threads, loaded when the first worker starts: a lone document checked in this
 * thread never loads it (it costs a few milliseconds of every start-up otherwise).
 */
const requireBuiltin = createRequire(import.meta.url);
let workerThreads: typeof import('node:worker_threads') | undefined;
const threadsModule = () => (workerThreads ??= requireBuiltin('node:worker_threads') as typeof import('node:worker_threads'));

/**
 * The worker thread's script. It sits beside this module both when compiled by tsc
 * (dist/src/cli/) and in the bundle (dist/bin/, beside the chunk holding this code), so the
 * language server finds it here too rather than by a path of its own.
 */
export const WORKER_FILE = fileURLToPath(new URL('./worker.js', import.meta.url));

/**
 * The largest document this thread checks itself when it shares the work with the workers
 * (`checkAll`'s `here`). A document that large is checked in some 0.3 s, so the workers are fed
 * and the report written between two such checks; its garbage keeps this thread's heap small; and
 * a larger one goes to a worker, where the memory and time budgets hold.
 */
export const HERE_MAX_CHARS = 256 * 1024;

/**
 * Documents this thread's share may run ahead of the output (submitted, not yet emitted): a
 * worker's document that takes long holds every later outcome, which is then kept in memory.
 */
export const HERE_AHEAD = 16;

/**
 * Checks jobs and hands each outcome to `emit` in input order, as soon as it and every earlier
 * one are done, so output stays deterministic and only out-of-order outcomes are held. Documents
 * are checked on at most `threads` worker threads within `budget`, except a lone small document
 * given as a list, which is checked in this thread. `threads` 'auto' starts one worker and adds
 * one each time the text read so far gives every worker MIN_CHARS_PER_WORKER (a stream's size
 * is known only as it is read), up to the cores. With `here` (batch's default `--jobs`), this thread
 * takes the place of one of two or more workers: it checks documents up to HERE_MAX_CHARS
 * itself, between feeding the workers and emitting, and hands larger ones to a worker. On two
 * cores that is one worker's start, one heap and the transfer of half the reports saved, and
 * this thread, which would wait for the workers, checks instead. Resolves when all are emitted.
 */
export async function checkAll(
  jobs: AsyncIterable<Job> | Iterable<Job>,
  threads: number | 'auto',
  emit: (o: Outcome, index: number) => void | Promise<void>,
  budget: Budget = DEFAULT_BUDGET,
  how: PoolOptions = {},
): Promise<void> {
  // a budget tighter than the default is held for every document: each is checked on a worker
  const here = (how.here ?? false) && budget.memoryMb >= DEFAULT_BUDGET.memoryMb && budget.seconds >= DEFAULT_BUDGET.seconds;
  const workerFile = how.workerFile ?? WORKER_FILE;
  const list = Array.isArray(jobs) ? (jobs as Job[]) : undefined;
  const lone = list !== undefined && list.length <= 1 && list.every((j) => !('source' in j) || j.source.length <= IN_THREAD_MAX_CHARS);
  // without the compiled worker (running from sources under a test runner) documents are checked here
  if (lone || !existsSync(workerFile)) {
    let i = 0;
    for await (const job of jobs) {
      await emit(checkHere(job), i);
      i += 1;
    }
    return;
  }
  const cores = availableParallelism();
  const limit = Math.max(1, Math.min(threads === 'auto' ? cores : threads, list?.length ?? Number.POSITIVE_INFINITY));
  const pending = new Map<number, Outcome>();
  let nextToEmit = 0;
  let submitted = 0;
  let exhausted = false;
  let charsRead = 0;
  const slots = new Set<Slot>();
  /** The run is over (or failed): the workers are being stopped, and their exits are not failures. */
  let closing = false;
  /** This thread checks documents too (`here`), from when two or more threads are wanted. */
  let checkingHere = false;
  /** This thread met a document too large for it and gave its place to a worker. */
  let retired = false;
  /** Wakes this thread's share when an outcome is emitted (it waits while too far ahead). */
  let advanced: (() => void) | undefined;
  const flush = async () => {
    while (pending.has(nextToEmit)) {
      const o = pending.get(nextToEmit) as Outcome;
      pending.delete(nextToEmit);
      await emit(o, nextToEmit);
      nextToEmit += 1;
      advanced?.();
    }
  };
  try {
    await new Promise<void>((resolve, reject) => {
      const iterator = (Symbol.asyncIterator in Object(jobs) ? (jobs as AsyncIterable<Job>)[Symbol.asyncIterator]() : (jobs as Iterable<Job>)[Symbol.iterator]()) as AsyncIterator<Job> | Iterator<Job>;
      const done = () => exhausted && nextToEmit === submitted && pending.size === 0;
      /** The next job with its index in the input; undefined once the input is over (the run ends there if all is emitted). */
      const take = async (): Promise<{ index: number; job: Job } | undefined> => {
        const step = await iterator.next();
        if (step.done) {
          exhausted = true;
          if (done()) resolve();
          return undefined;
        }
        const index = submitted;
        submitted += 1;
        return { index, job: step.value };
      };
      const settle = (index: number, outcome: Outcome, slot?: Slot): Promise<void> => {
        // the run is over (it failed): nothing more is emitted
        if (closing) return Promise.resolve();
        pending.set(index, outcome);
        const flushed = flush().then(() => (done() ? resolve() : slot && feed(slot)));
        flushed.catch(reject);
        return flushed.catch(() => undefined);
      };
      /** The time budget of the slot's first document, which its worker is checking now. */
      const arm = (slot: Slot) => {
        clearTimeout(slot.timer);
        const head = slot.queue[0];
        if (head === undefined) return;
        slot.timer = setTimeout(() => {
          if (slot.queue[0] !== head) return;
          replace(slot, `took longer than the time budget of ${budget.seconds} s (--time-budget)`);
        }, budget.seconds * 1000);
      };
      /**
       * The slot's worker stopped on its first document (out of memory, over time, crashed):
       * that document is reported as not checked and the documents queued behind it go to a
       * new worker, so none is lost or checked twice.
       */
      const replace = (slot: Slot, why: string) => {
        clearTimeout(slot.timer);
        const head = slot.queue.shift();
        const old = slot.worker;
        start(slot);
        void old?.terminate();
        if (head !== undefined) void settle(head.index, { error: `not checked: ${why}` }, slot);
      };
      /** A worker for a slot; it asks for work when it has loaded (the time budgets start only then). */
      const start = (slot: Slot) => {
        const w = new (threadsModule().Worker)(workerFile, { resourceLimits: { maxOldGenerationSizeMb: budget.memoryMb, maxYoungGenerationSizeMb: 64 } });
        slot.worker = w;
        slot.ready = false;
        w.on('message', (m: { ready: true } | ReportMessage) => {
          if (slot.worker !== w) return;
          if ('ready' in m) {
            slot.ready = true;
            // documents left by a worker that was replaced go first, in their order
            for (const q of slot.queue) w.postMessage({ index: q.index, ...q.job });
            arm(slot);
            feed(slot).catch(reject);
            return;
          }
          const head = slot.queue[0];
          if (head === undefined || m.index !== head.index) return;
          slot.queue.shift();
          arm(slot);
          if ('error' in m) {
            void settle(m.index, { error: m.error }, slot);
            return;
          }
          // the text is not sent back: it is the one sent
          const outcome = (): Outcome => ({ report: { ...receivedReport(m.parts), source: head.job.source } });
          if (!exhausted || slot.queue.length > 0) {
            void settle(m.index, outcome(), slot);
            return;
          }
          // the worker's last document: the worker is stopped, its heap given back, before the
          // report is rebuilt here (src/cli/transfer.ts); the slot stays, without a worker
          clearTimeout(slot.timer);
          slot.worker = undefined;
          w.terminate()
            .catch(() => undefined)
            .then(() => settle(m.index, outcome(), slot))
            .catch(reject);
        });
        w.on('error', (e: Error & { code?: string }) => {
          if (slot.worker !== w || closing) return;
          // before it loaded no document was sent to it: the fault is the worker's script, and a
          // new worker would fail the same way, so the run stops with the reason
          if (!slot.ready) reject(new Error(`a worker thread could not start: ${e.message}`));
          else replace(slot, e.code === 'ERR_WORKER_OUT_OF_MEMORY' ? `needed more than the memory budget of ${budget.memoryMb} MB (--memory-budget)` : `the check stopped: ${e.message}`);
        });
        // a worker that ends without an error (its code exited, the thread was stopped from
        // outside) would otherwise leave its documents unanswered and the run waiting for them
        w.on('exit', (code: number) => {
          if (slot.worker !== w || closing) return;
          if (!slot.ready) reject(new Error(`a worker thread stopped while loading (exit code ${code})`));
          else if (slot.queue.length > 0) replace(slot, `the check stopped: its worker thread exited (exit code ${code})`);
          else if (!exhausted) start(slot);
          else slot.worker = undefined;
        });
      };
      const grow = () => {
        let wanted = threads === 'auto' ? Math.min(limit, Math.max(1, Math.floor(charsRead / MIN_CHARS_PER_WORKER))) : limit;
        if (retired) {
          // this thread has handed its place back to a worker
        } else if (here && wanted >= 2) {
          // this thread is one of them
          wanted -= 1;
          if (!checkingHere) {
            checkingHere = true;
            checkHereLoop().catch(reject);
          }
        }
        while (slots.size < wanted) {
          const slot: Slot = { queue: [] };
          slots.add(slot);
          start(slot);
        }
      };
      /** Gives a document to the worker with the fewest (this thread's share is too large for it). */
      const handOver = (item: { index: number; job: { path: string; source: string; options: CheckOptions } }) => {
        let slot: Slot | undefined;
        for (const s of slots) if (slot === undefined || s.queue.length < slot.queue.length) slot = s;
        if (slot === undefined) throw new Error('no worker to hand a document to');
        slot.queue.push(item);
        // a worker still loading is sent its queue when it is ready
        if (slot.ready) {
          slot.worker?.postMessage({ index: item.index, ...item.job });
          if (slot.queue.length === 1) arm(slot);
        }
      };
      /**
       * This thread's share: the next document, checked here when small, else handed to a
       * worker, and then, if fewer workers run than asked for, one more is started and this
       * thread stops checking (a run with large documents is checked as without `here`); after each, its outcome is emitted (waiting for the output as a worker's feed
       * does) and the event loop turns, so workers' reports and requests are served in between.
       */
      const checkHereLoop = async (): Promise<void> => {
        while (!exhausted && !closing) {
          // no further ahead of the output than HERE_AHEAD documents: they are held until emitted
          while (submitted - nextToEmit >= HERE_AHEAD) await new Promise<void>((wake) => (advanced = wake));
          advanced = undefined;
          if (exhausted || closing) return;
          const next = await take();
          if (next === undefined || closing) return;
          const { index, job } = next;
          if ('error' in job) {
            await settle(index, { error: job.error });
            continue;
          }
          charsRead += job.source.length;
          grow();
          if (job.source.length > HERE_MAX_CHARS) {
            handOver({ index, job });
            // large documents are in the run: the workers take them all, as many as asked for
            if (slots.size < limit) {
              retired = true;
              const slot: Slot = { queue: [] };
              slots.add(slot);
              start(slot);
              return;
            }
            continue;
          }
          how.checkedHere?.(index);
          await settle(index, checkHere(job));
          await new Promise<void>((turn) => setImmediate(turn));
        }
      };
      const feed = async (slot: Slot): Promise<void> => {
        if (slot.pulling) return;
        slot.pulling = true;
        try {
          while (slot.ready && slot.queue.length < IN_FLIGHT_PER_WORKER && !exhausted) {
            const next = await take();
            if (next === undefined) return;
            const { index, job } = next;
            if ('error' in job) {
              void settle(index, { error: job.error }, slot);
              continue;
            }
            charsRead += job.source.length;
            slot.queue.push({ index, job });
            // its worker may have been replaced while the input was read: a new one is sent its
            // whole queue when it has loaded, so the job is posted only to a worker that is ready
            if (slot.ready) {
              slot.worker?.postMessage({ index, ...job });
              if (slot.queue.length === 1) arm(slot);
            }
            grow();
          }
        } finally {
          slot.pulling = false;
        }
      };
      grow();
    });
  } finally {
    closing = true;
    for (const s of slots) clearTimeout(s.timer);
    await Promise.all([...slots].map((s) => s.worker?.terminate()));
  }
}

/** How `checkAll` shares the work. */
export interface PoolOptions {
  /**
   * This thread checks small documents too, in place of one of two or more workers (batch's
   * default `--jobs`, where this thread keeps no report once written); only under budgets no
   * tighter than DEFAULT_BUDGET, which such a document keeps.
   */
  here?: boolean;
  /** The worker's script (default WORKER_FILE, the compiled one beside this module). */
  workerFile?: string;
  /** Told the index of each document this thread checks itself (tests, diagnostics). */
  checkedHere?: (index: number) => void;
}

interface Slot {
  worker?: Worker;
  /** Its worker has loaded and can take documents. */
  ready?: boolean;
  /** The documents sent to its worker and not yet answered, in order: the first is being checked. */
  queue: Array<{ index: number; job: { path: string; source: string; options: CheckOptions } }>;
  /** A feed is waiting for the next job (one at a time per slot). */
  pulling?: boolean;
  timer?: NodeJS.Timeout;
}

/**
 * Results and statistics checked in this thread so far (checkHere): how much of the checker this
 * thread has run, which the code cache of the command line rests on (load.ts, codeCache.ts).
 */
let checkedHere = 0;
export const resultsCheckedHere = (): number => checkedHere;

function checkHere(job: Job): Outcome {
  if ('error' in job) return { error: job.error };
  try {
    const report = checkSource(job.path, job.source, job.options);
    checkedHere += report.results.length + (report.statistics?.length ?? 0);
    return { report };
  } catch (e) {
    return { error: e instanceof Error ? e.message : String(e) };
  }
}
