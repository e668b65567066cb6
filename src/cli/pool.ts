import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import { checkSource, type CheckOptions, type FileReport } from '../engine/index.js';

/** A document to check, or one that could not be read (kept in order, reported as such). */
export type Job = { path: string; source: string; options: CheckOptions } | { path: string; error: string };

export type Outcome = { report: FileReport } | { error: string };

/** Documents at which starting worker threads pays off (each costs a module load). */
const WORKERS_FROM = 8;

/**
 * Checks jobs on `jobs` worker threads (1: in this thread) and hands each outcome to `emit` in
 * input order, as soon as it and every earlier one are done, so output stays deterministic and
 * only out-of-order outcomes are held. Resolves when all are emitted.
 */
export async function checkAll(jobs: AsyncIterable<Job> | Iterable<Job>, threads: number, emit: (o: Outcome, index: number) => void | Promise<void>): Promise<void> {
  const workerFile = fileURLToPath(new URL('./worker.js', import.meta.url));
  const list = Array.isArray(jobs) ? (jobs as Job[]) : undefined;
  const useWorkers = threads > 1 && existsSync(workerFile) && (list === undefined || list.length >= WORKERS_FROM);
  if (!useWorkers) {
    let i = 0;
    for await (const job of jobs) {
      await emit(run(job), i);
      i += 1;
    }
    return;
  }
  // a larger young generation: checking allocates many short-lived objects, and the default
  // worker heap spends much of its time in scavenges
  const workers = Array.from({ length: Math.min(threads, availableParallelism()) }, () => new Worker(workerFile, { resourceLimits: { maxYoungGenerationSizeMb: 64 } }));
  const pending = new Map<number, Outcome>();
  let nextToEmit = 0;
  let submitted = 0;
  let finished = false;
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
      const feed = async (w: Worker) => {
        const step = await iterator.next();
        if (step.done) {
          finished = true;
          if (nextToEmit === submitted && pending.size === 0) resolve();
          return;
        }
        const index = submitted;
        submitted += 1;
        if ('error' in step.value) {
          pending.set(index, { error: step.value.error });
          await flush();
          await feed(w);
          return;
        }
        w.postMessage({ index, ...step.value });
      };
      for (const w of workers) {
        w.on('message', (m: { index: number; report?: FileReport; error?: string }) => {
          pending.set(m.index, m.report ? { report: m.report } : { error: m.error ?? 'unknown error' });
          flush()
            .then(() => (finished ? (nextToEmit === submitted ? resolve() : undefined) : feed(w)))
            .catch(reject);
        });
        w.on('error', reject);
        feed(w).catch(reject);
      }
    });
  } finally {
    await Promise.all(workers.map((w) => w.terminate()));
  }
}

function run(job: Job): Outcome {
  if ('error' in job) return { error: job.error };
  try {
    return { report: checkSource(job.path, job.source, job.options) };
  } catch (e) {
    return { error: e instanceof Error ? e.message : String(e) };
  }
}
