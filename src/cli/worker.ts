import { parentPort } from 'node:worker_threads';
import { checkSource, type CheckOptions } from '../engine/index.js';

/** A worker of the batch pool: checks one document per message, in the order asked. */
interface Job {
  index: number;
  path: string;
  source: string;
  options: CheckOptions;
}

// loaded: the time budget of a document starts only now, not while modules load
parentPort?.postMessage({ ready: true });

parentPort?.on('message', (job: Job) => {
  try {
    parentPort?.postMessage({ index: job.index, report: checkSource(job.path, job.source, job.options) });
  } catch (e) {
    parentPort?.postMessage({ index: job.index, error: e instanceof Error ? e.message : String(e) });
  }
});
