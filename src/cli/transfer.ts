import { createRequire } from 'node:module';
import type { FileReport } from '../engine/index.js';

/**
 * node:v8, loaded when a report first crosses between threads: a run that checks in its own
 * thread never loads it (it costs a few milliseconds of every start-up otherwise).
 */
const requireBuiltin = createRequire(import.meta.url);
let v8: typeof import('node:v8') | undefined;
const v8Module = () => (v8 ??= requireBuiltin('node:v8') as typeof import('node:v8'));

/**
 * A worker's report crosses to the thread that asked for it as bytes: V8's serialisation (the
 * structured clone that postMessage performs itself), made in the worker and moved, not copied.
 * The receiver then chooses when to rebuild the objects. The pool stops a worker that has nothing
 * left to check before it rebuilds that worker's last report, so the worker's heap (a large
 * document's parse, records and links, some 1.2 GB for 60,000 results) is given back before the
 * report's objects (some 0.4 GB) are made again on this side: until then both were held at once,
 * the peak of a large document's run (bench figure 13). Transport only: nothing is computed here.
 */

/** The report without its text (the receiver holds the text it sent). */
export type SentReport = Omit<FileReport, 'source'>;

/** The message a worker answers a document with. */
export type ReportMessage = { index: number; bytes: Uint8Array } | { index: number; error: string };

/** Posts `report` as bytes, their buffer moved to the receiver. */
export function postReport(post: (message: ReportMessage, transfer: ArrayBuffer[]) => void, index: number, report: SentReport): void {
  const bytes = v8Module().serialize(report);
  // a buffer of its own (not a slice of a shared pool) can be moved; otherwise it is copied
  const own = bytes.byteOffset === 0 && bytes.byteLength === bytes.buffer.byteLength && bytes.buffer instanceof ArrayBuffer;
  post({ index, bytes }, own ? [bytes.buffer as ArrayBuffer] : []);
}

/** The report a worker sent, rebuilt. */
export function receivedReport(bytes: Uint8Array): SentReport {
  return v8Module().deserialize(bytes) as SentReport;
}
