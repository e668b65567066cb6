import { parentPort } from 'node:worker_threads';
import { checkSource, type CheckOptions } from '../engine/index.js';
import { postReport } from './transfer.js';

/**
 * A worker of the pool (src/cli/pool.ts): checks one document per message, in the order sent
 * (the pool keeps at most two waiting), and answers with the report without its text, which
 * the pool already holds: a 10 KB document's text is a good part of what would be copied back.
 */
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
    const { source: _source, ...report } = checkSource(job.path, job.source, job.options);
    // as bytes the receiver rebuilds when it chooses (src/cli/transfer.ts)
    postReport((m, transfer) => parentPort?.postMessage(m, transfer), job.index, report);
  } catch (e) {
    parentPort?.postMessage({ index: job.index, error: e instanceof Error ? e.message : String(e) });
  }
});
