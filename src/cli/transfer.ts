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
 * structured clone that postMessage performs itself), made in the worker in parts (SLICE_ITEMS)
 * and moved, not copied.
 * The receiver then chooses when to rebuild the objects. The pool stops a worker that has nothing
 * left to check before it rebuilds that worker's last report, so the worker's heap (a large
 * document's parse, records and links, some 1.2 GB for 60,000 results) is given back before the
 * report's objects (some 0.4 GB) are made again on this side: until then both were held at once,
 * the peak of a large document's run (bench figure 13). Transport only: nothing is computed here.
 */

/** The report without its text (the receiver holds the text it sent). */
export type SentReport = Omit<FileReport, 'source'>;

/**
 * Items of one top-level array member of a report (results, findings, statistics, checklist)
 * serialised together at most. One call over a whole large report made one buffer that V8 grows
 * by copying as it writes: 200 MB of bytes for 60,000 results cost some 400 MB at its peak, on
 * top of the worker's heap (bench figure 13). Slices of this many results or findings are some 5
 * MB each. A report with no longer top-level array crosses as one part, as before; arrays nested
 * deeper (a Word or PDF file's `original.lines`) always cross whole, in the first part.
 */
export const SLICE_ITEMS = 2000;

/**
 * One part of a report as bytes: the report with each long array member empty (`member`
 * absent), or a slice of the items of the array member named `member`, in order.
 */
export interface ReportPart {
  member?: string;
  bytes: Uint8Array;
}

/** The message a worker answers a document with. */
export type ReportMessage = { index: number; parts: ReportPart[] } | { index: number; error: string };

/** V8's bytes of `value`, and the buffer to move when it is theirs alone (a slice of a shared pool is copied). */
function serialised(value: unknown): { bytes: Uint8Array; own?: ArrayBuffer } {
  const bytes = v8Module().serialize(value);
  const own = bytes.byteOffset === 0 && bytes.byteLength === bytes.buffer.byteLength && bytes.buffer instanceof ArrayBuffer;
  return own ? { bytes, own: bytes.buffer as ArrayBuffer } : { bytes };
}

/**
 * Posts `report` as bytes, their buffers moved to the receiver: the report with its arrays of
 * more than `slice` items left empty, then those arrays' items, `slice` at a time. Each
 * slice is its own serialisation, so objects shared between items of different slices arrive
 * as equal copies (the report's items share none that a reader tells apart: it is data).
 */
export function postReport(post: (message: ReportMessage, transfer: ArrayBuffer[]) => void, index: number, report: SentReport, slice = SLICE_ITEMS): void {
  const head: Record<string, unknown> = {};
  const long: Array<[string, unknown[]]> = [];
  for (const [key, value] of Object.entries(report)) {
    if (Array.isArray(value) && value.length > slice) {
      long.push([key, value]);
      head[key] = [];
    } else head[key] = value;
  }
  const parts: ReportPart[] = [];
  const transfer: ArrayBuffer[] = [];
  const add = (value: unknown, member?: string) => {
    const { bytes, own } = serialised(value);
    parts.push(member === undefined ? { bytes } : { member, bytes });
    if (own) transfer.push(own);
  };
  add(head);
  for (const [member, items] of long) for (let i = 0; i < items.length; i += slice) add(items.slice(i, i + slice), member);
  post({ index, parts }, transfer);
}

/**
 * The report a worker sent, rebuilt part by part; each part is let go once read (`parts` is
 * emptied), so its bytes need not outlive the objects made from them.
 */
export function receivedReport(parts: ReportPart[]): SentReport {
  const first = parts.shift();
  if (first === undefined || first.member !== undefined) throw new Error('a report sent as parts starts with its head');
  const report = v8Module().deserialize(first.bytes) as Record<string, unknown>;
  for (let part = parts.shift(); part !== undefined; part = parts.shift()) {
    const into = report[part.member ?? ''];
    if (!Array.isArray(into)) throw new Error(`a report part names no array member: ${String(part.member)}`);
    for (const item of v8Module().deserialize(part.bytes) as unknown[]) into.push(item);
  }
  return report as SentReport;
}
