import { CAUTIONS, countRun, type RunReport } from './types.js';

/** Version of the JSON report's shape (schema/report.schema.json); bumped on any change. */
export const JSON_REPORT_VERSION = '1.3.0';

/**
 * The JSON report: every extracted result with its spans, printed and recomputed values,
 * and every finding as data. Stable key order; the source text itself is not repeated.
 */
export function formatJson(run: RunReport): string {
  const body = {
    reportVersion: JSON_REPORT_VERSION,
    tool: run.tool,
    summary: countRun(run),
    files: run.files.map(({ source: _source, ...file }) => file),
    failures: run.failures,
    cautions: CAUTIONS,
  };
  return `${JSON.stringify(body, replacer, 2)}\n`;
}

/** JSON has no Infinity: an unbounded end (t > 4.72 reaches p = 0) is written as null. */
function replacer(_key: string, value: unknown): unknown {
  return typeof value === 'number' && !Number.isFinite(value) ? null : value;
}
