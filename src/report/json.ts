import { CHUNK, jsonChunks } from './jsonChunks.js';
import { CAUTIONS, countRun, type RunReport } from './types.js';

/** Version of the JSON report's shape (schema/report.schema.json); bumped on any change. */
export const JSON_REPORT_VERSION = '1.6.0';

/**
 * The JSON report: every extracted result with its spans, printed and recomputed values,
 * and every finding as data. Stable key order; the source text itself is not repeated.
 * Written on one line, without indentation: it is read by programs, and indentation was about
 * half of a large report's bytes (a 60,000-result document: 435 MB indented, 228 MB not; bench
 * figure 14). Any JSON viewer shows it indented.
 */
export function formatJson(run: RunReport): string {
  return `${JSON.stringify(jsonBody(run), replacer)}\n`;
}

/**
 * The same text as formatJson, in chunks of about 64 KiB: the command line writes these, since a
 * report of some 200,000 results is longer than any one string can be.
 */
export function formatJsonChunks(run: RunReport): Iterable<string> {
  return jsonChunks(jsonBody(run), replacer, CHUNK, 0);
}

function jsonBody(run: RunReport) {
  return {
    reportVersion: JSON_REPORT_VERSION,
    tool: run.tool,
    summary: countRun(run),
    files: run.files.map(({ source: _source, ...file }) => file),
    failures: run.failures,
    // links a folder walk did not follow (they lead outside it); absent when there were none
    ...(run.skippedLinks !== undefined && run.skippedLinks.length > 0 ? { skippedLinks: run.skippedLinks } : {}),
    cautions: CAUTIONS,
  };
}

/** JSON has no Infinity: an unbounded end (t > 4.72 reaches p = 0) is written as null. */
function replacer(_key: string, value: unknown): unknown {
  return typeof value === 'number' && !Number.isFinite(value) ? null : value;
}
