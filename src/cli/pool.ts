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
 * report. Figure 11 of `npm run bench` measures the start as the text checked in the same time:
 * some 30 KB on the 2-core machine of DEVELOPERS.md (a 0.5 s start on a busy machine), so 1 MiB
 * is some thirty starts; the figure's goal keeps that margin at ten or more.
 */
export const MIN_CHARS_PER_WORKER = 1024 * 1024;

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
 * Checks jobs and hands each outcome to `emit` in input order, as soon as it and every earlier
 * one are done, so output stays deterministic and only out-of-order outcomes are held. Documents
 * are checked on at most `threads` worker threads within `budget`, except a lone small document
 * given as a list, which is checked in this thread. `threads` 'auto' starts one worker and adds
 * one each time the text read so far gives every worker MIN_CHARS_PER_WORKER (a stream's size
 * is known only as it is read), up to the cores. Resolves when all are emitted.
 */
export async function checkAll(
  jobs: AsyncIterable<Job> | Iterable<Job>,
  threads: number | 'auto',
  emit: (o: Outcome, index: number) => void | Promise<void>,
  budget: Budget = DEFAULT_BUDGET,
): Promise<void> {
  const workerFile = WORKER_FILE;
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
  const flush = async () => {
    while (pending.has(nextToEmit)) {
      const o = pending.get(nextToEmit) as Outcome;
      pending.delete(nextToEmit);
      await emit(o, nextToEmit);
      nextToEmit += 1;
    }
  };
  try {
    await new Promise<void>((resolve, reject) => {
      const iterator = (Symbol.asyncIterator in Object(jobs) ? (jobs as AsyncIterable<Job>)[Symbol.asyncIterator]() : (jobs as Iterable<Job>)[Symbol.iterator]()) as AsyncIterator<Job> | Iterator<Job>;
      const done = () => exhausted && nextToEmit === submitted && pending.size === 0;
      const settle = (index: number, outcome: Outcome, slot: Slot) => {
        pending.set(index, outcome);
        flush()
          .then(() => (done() ? resolve() : feed(slot)))
          .catch(reject);
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
        if (head !== undefined) settle(head.index, { error: `not checked: ${why}` }, slot);
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
            settle(m.index, { error: m.error }, slot);
            return;
          }
          // the text is not sent back: it is the one sent
          const outcome = (): Outcome => ({ report: { ...receivedReport(m.bytes), source: head.job.source } });
          if (!exhausted || slot.queue.length > 0) {
            settle(m.index, outcome(), slot);
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
          if (slot.worker !== w) return;
          replace(slot, e.code === 'ERR_WORKER_OUT_OF_MEMORY' ? `needed more than the memory budget of ${budget.memoryMb} MB (--memory-budget)` : `the check stopped: ${e.message}`);
        });
      };
      const grow = () => {
        const wanted = threads === 'auto' ? Math.min(limit, Math.max(1, Math.floor(charsRead / MIN_CHARS_PER_WORKER))) : limit;
        while (slots.size < wanted) {
          const slot: Slot = { queue: [] };
          slots.add(slot);
          start(slot);
        }
      };
      const feed = async (slot: Slot): Promise<void> => {
        if (slot.pulling) return;
        slot.pulling = true;
        try {
          while (slot.ready && slot.queue.length < IN_FLIGHT_PER_WORKER && !exhausted) {
            const step = await iterator.next();
            if (step.done) {
              exhausted = true;
              if (done()) resolve();
              return;
            }
            const index = submitted;
            submitted += 1;
            if ('error' in step.value) {
              settle(index, { error: step.value.error }, slot);
              continue;
            }
            charsRead += step.value.source.length;
            slot.queue.push({ index, job: step.value });
            slot.worker?.postMessage({ index, ...step.value });
            if (slot.queue.length === 1) arm(slot);
            grow();
          }
        } finally {
          slot.pulling = false;
        }
      };
      grow();
    });
  } finally {
    for (const s of slots) clearTimeout(s.timer);
    await Promise.all([...slots].map((s) => s.worker?.terminate()));
  }
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

function checkHere(job: Job): Outcome {
  if ('error' in job) return { error: job.error };
  try {
    return { report: checkSource(job.path, job.source, job.options) };
  } catch (e) {
    return { error: e instanceof Error ? e.message : String(e) };
  }
}
