import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import { checkSource, type CheckOptions, type FileReport } from '../engine/index.js';

/** A document to check, or one that could not be read (kept in order, reported as such). */
export type Job = { path: string; source: string; options: CheckOptions } | { path: string; error: string };

export type Outcome = { report: FileReport } | { error: string };

/**
 * What one document may cost. A document over either budget is reported as not checked, with
 * the reason, and every other document is still checked: each is checked on a worker thread
 * whose heap is limited to `memoryMb`, and a worker that runs past `seconds` is stopped and
 * replaced.
 */
export interface Budget {
  memoryMb: number;
  seconds: number;
}

export const DEFAULT_BUDGET: Budget = { memoryMb: 2048, seconds: 120 };

/**
 * A single document up to this size is checked in this thread, without a worker's start-up
 * cost (a module load): every step of a check is linear in the text (the benchmark's hostile
 * figures keep it so), so such a document finishes in about a second and within memory far
 * below the budget.
 */
export const IN_THREAD_MAX_CHARS = 1024 * 1024;

/**
 * Checks jobs and hands each outcome to `emit` in input order, as soon as it and every earlier
 * one are done, so output stays deterministic and only out-of-order outcomes are held. Documents
 * are checked on `threads` worker threads (at least one) within `budget`, except a lone small
 * document given as a list, which is checked in this thread. Resolves when all are emitted.
 */
export async function checkAll(
  jobs: AsyncIterable<Job> | Iterable<Job>,
  threads: number,
  emit: (o: Outcome, index: number) => void | Promise<void>,
  budget: Budget = DEFAULT_BUDGET,
): Promise<void> {
  const workerFile = fileURLToPath(new URL('./worker.js', import.meta.url));
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
  const size = Math.max(1, Math.min(threads, availableParallelism(), list?.length ?? Number.POSITIVE_INFINITY));
  const pending = new Map<number, Outcome>();
  let nextToEmit = 0;
  let submitted = 0;
  let exhausted = false;
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
      /** A worker for a slot, replaced after it is stopped or runs out of memory. */
      const start = (slot: Slot) => {
        const w = new Worker(workerFile, { resourceLimits: { maxOldGenerationSizeMb: budget.memoryMb, maxYoungGenerationSizeMb: 64 } });
        slot.worker = w;
        slot.ready = false;
        w.on('message', (m: { ready?: boolean; index: number; report?: FileReport; error?: string }) => {
          if (slot.worker !== w) return;
          if (m.ready) {
            slot.ready = true;
            feed(slot).catch(reject);
            return;
          }
          if (slot.job === undefined || m.index !== slot.job) return;
          clearTimeout(slot.timer);
          slot.job = undefined;
          settle(m.index, m.report ? { report: m.report } : { error: m.error ?? 'unknown error' }, slot);
        });
        w.on('error', (e: Error & { code?: string }) => {
          if (slot.worker !== w) return;
          const index = slot.job;
          clearTimeout(slot.timer);
          slot.job = undefined;
          void w.terminate();
          start(slot);
          if (index === undefined) return; // the new worker asks for work when it is ready
          const why = e.code === 'ERR_WORKER_OUT_OF_MEMORY' ? `needed more than the memory budget of ${budget.memoryMb} MB (--memory-budget)` : `the check stopped: ${e.message}`;
          settle(index, { error: `not checked: ${why}` }, slot);
        });
      };
      const feed = async (slot: Slot): Promise<void> => {
        if (!slot.ready || slot.job !== undefined || exhausted) return;
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
          return;
        }
        slot.job = index;
        slot.timer = setTimeout(() => {
          if (slot.job !== index) return;
          slot.job = undefined;
          const old = slot.worker;
          start(slot);
          void old?.terminate();
          settle(index, { error: `not checked: took longer than the time budget of ${budget.seconds} s (--time-budget)` }, slot);
        }, budget.seconds * 1000);
        slot.worker?.postMessage({ index, ...step.value });
      };
      for (let i = 0; i < size; i++) {
        const slot: Slot = {};
        slots.add(slot);
        start(slot); // it asks for work when it is ready
      }
    });
  } finally {
    for (const s of slots) clearTimeout(s.timer);
    await Promise.all([...slots].map((s) => s.worker?.terminate()));
  }
}

interface Slot {
  worker?: Worker;
  /** Its worker has loaded and can take a document. */
  ready?: boolean;
  /** The index of the document it is checking. */
  job?: number;
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
