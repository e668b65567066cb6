import { wholeText } from './chunks.js';
import { encodeItem, expandFile, FileEncoder, STREAMED_MEMBERS } from './compact.js';
import { CAUTIONS, countRun, type RunReport } from './types.js';
import type { FileReport } from '../engine/types.js';

/**
 * Version of the JSON report's shape (schema/report.schema.json): a new optional field is a
 * minor change, anything else a major one. 2.0.0: compact places, shared texts and no repeated
 * defaults (src/report/compact.ts); `readJsonReport` gives back the 1.x shape.
 */
export const JSON_REPORT_VERSION = '2.1.0';

/**
 * The JSON report: every extracted result with its places, printed and recomputed values,
 * and every finding as data. Stable key order; the source text itself is not repeated.
 * Written on one line, without indentation: it is read by programs, and indentation was about
 * half of a large report's bytes. Any JSON viewer shows it indented.
 */
export function formatJson(run: RunReport): string {
  return wholeText(formatJsonChunks(run));
}

/**
 * The same text as formatJson, piece by piece: each result, statistic, finding and checklist
 * item is encoded and written on its own, so the report is never held whole, neither as one
 * string (some 200,000 results are longer than any string can be) nor as a second tree of
 * objects beside the run's.
 */
export function* formatJsonChunks(run: RunReport, made?: (file: FileReport) => string | undefined): Generator<string> {
  const counts = countRun(run);
  yield `{"reportVersion":${JSON.stringify(JSON_REPORT_VERSION)},"tool":${JSON.stringify(run.tool)},"summary":${JSON.stringify(counts)},"files":[`;
  for (const [i, file] of run.files.entries()) {
    if (i > 0) yield ',';
    // a file laid out already, while the run's later files were checked (`made`: its fileChunks, joined)
    const text = made?.(file);
    if (text !== undefined) yield text;
    else yield* fileChunks(file);
  }
  yield `],"failures":${JSON.stringify(run.failures)}`;
  // links a folder walk did not follow (they lead outside it); absent when there were none
  if (run.skippedLinks !== undefined && run.skippedLinks.length > 0) yield `,"skippedLinks":${JSON.stringify(run.skippedLinks)}`;
  yield `,"cautions":${JSON.stringify(CAUTIONS)}}\n`;
}

/** One file in the 2.x shape: its members in order, `lineStarts` after `format`, `texts` last (it is gathered while the rest is written). */
export function* fileChunks(file: FileReport): Generator<string> {
  const encoder = new FileEncoder(file.source);
  // a result whose alpha and sidedness are the file's leaves them out
  encoder.fileSettings = { alpha: JSON.stringify(encoder.encode(file.alpha, 'alpha')), sidedness: JSON.stringify(encoder.encode(file.sidedness, 'sidedness')) };
  const streamed = new Set<string>(STREAMED_MEMBERS);
  let first = true;
  const key = (k: string) => {
    const s = `${first ? '{' : ','}${JSON.stringify(k)}:`;
    first = false;
    return s;
  };
  for (const k of Object.keys(file)) {
    if (k === 'source') continue;
    const v = (file as unknown as Record<string, unknown>)[k];
    if (v === undefined) continue;
    if (streamed.has(k) && Array.isArray(v)) {
      yield `${key(k)}[`;
      for (const [n, item] of v.entries()) {
        const e = encodeItem(encoder, k, item);
        yield `${n > 0 ? ',' : ''}${JSON.stringify(e)}`;
      }
      yield ']';
    } else {
      const e = encoder.encode(v, k);
      if (e !== undefined) yield `${key(k)}${JSON.stringify(e)}`;
    }
    if (k === 'format') yield `${key('lineStarts')}${JSON.stringify(encoder.lineSteps())}`;
  }
  yield `${key('texts')}${JSON.stringify(encoder.texts)}}`;
}

/**
 * A JSON report, or a line of `plumbline batch` output, as a program reads it, in the 1.x shape
 * whatever its version: a 2.x file's places get their `span`, `start` and `end` back, its texts
 * are written out and its defaults filled in (src/report/compact.ts); a 1.x report or line is
 * given as it is. `reportVersion` stays as read.
 */
export function readJsonReport(report: unknown): Record<string, unknown> {
  if (typeof report !== 'object' || report === null || Array.isArray(report)) throw new TypeError('a JSON report is an object');
  const r = report as Record<string, unknown>;
  const [major, minor] = typeof r.reportVersion === 'string' ? r.reportVersion.split('.').map(Number) : [NaN, NaN];
  if (!((major ?? NaN) >= 2)) return r;
  // a later major version counts as the latest minor this reader knows
  const known = major === 2 ? (minor ?? 0) : Number.POSITIVE_INFINITY;
  const file = (f: unknown) => (typeof f === 'object' && f !== null && Array.isArray((f as Record<string, unknown>).results) ? expandFile(f as Record<string, unknown>, known) : f);
  // a batch line: one file, with the files it includes
  if (Array.isArray(r.results)) {
    // each included file has texts of its own: the line's are not theirs
    const { included, ...main } = r;
    return { ...(file(main) as Record<string, unknown>), ...(Array.isArray(included) ? { included: included.map(file) } : {}) };
  }
  if (!Array.isArray(r.files)) return r;
  return { ...r, files: r.files.map(file) };
}
