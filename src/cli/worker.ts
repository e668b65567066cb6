import { parentPort } from 'node:worker_threads';
import { checkSource, IncrementalChecker, type CheckOptions } from '../engine/index.js';
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
  /** Set by the language server: the document's key, whose last parse is kept for its next check. */
  session?: string;
}

/** The language server's documents, each with its last parse (IncrementalChecker), the most recent last. */
const sessions = new Map<string, IncrementalChecker>();
/** Documents kept at most: an editor's open manuscripts, not a whole folder. */
const SESSIONS = 16;

function checkIn(session: string, job: Job) {
  const checker = sessions.get(session) ?? new IncrementalChecker();
  sessions.delete(session);
  sessions.set(session, checker);
  if (sessions.size > SESSIONS) sessions.delete(sessions.keys().next().value as string);
  return checker.check(job.path, job.source, job.options);
}

// loaded: the time budget of a document starts only now, not while modules load
parentPort?.postMessage({ ready: true });

parentPort?.on('message', (job: Job | { forget: string }) => {
  if ('forget' in job) {
    sessions.delete(job.forget);
    return;
  }
  try {
    const { source: _source, ...report } = job.session === undefined ? checkSource(job.path, job.source, job.options) : checkIn(job.session, job);
    // as bytes the receiver rebuilds when it chooses (src/cli/transfer.ts)
    postReport((m, transfer) => parentPort?.postMessage(m, transfer), job.index, report);
  } catch (e) {
    parentPort?.postMessage({ index: job.index, error: e instanceof Error ? e.message : String(e) });
  }
});
