/**
 * The corpus summary (src/corpus/summary.ts) as CSV (RFC 4180: comma-separated, CRLF line ends,
 * fields with a comma, quote or line break quoted, quotes doubled). Layout only: every number
 * comes from the summary. A text field that a spreadsheet would read as a formula (starting with
 * = + - @, a tab or a CR) gets a leading apostrophe (common practice, no source).
 */
import type { CorpusSummary, DocumentRow, GapBin } from '../corpus/summary.js';

const EOL = '\r\n';
/** First characters that make a spreadsheet read a cell as a formula. */
const FORMULA_STARTS = '=+-@\t\r';
/** Characters that make RFC 4180 quote a field. */
const QUOTED_IF = '",\r\n';

function field(v: string | number | boolean | null | undefined): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : '';
  if (typeof v === 'boolean') return v ? 'true' : 'false';
  // plain string tests, no regular expression: nothing here can backtrack
  const text = v !== '' && FORMULA_STARTS.includes(v.charAt(0)) ? `'${v}` : v;
  return [...QUOTED_IF].some((c) => text.includes(c)) ? `"${text.split('"').join('""')}"` : text;
}

const row = (fields: Array<string | number | boolean | null | undefined>) => `${fields.map(field).join(',')}${EOL}`;

/** Rates as printed: at most four decimals, trailing zeros dropped. */
const rate = (x: number | null) => (x === null ? null : Number(x.toFixed(4)));

export const DOCUMENTS_CSV_HEADER = row(['line', 'id', 'status', 'results', 'findings', 'errors', 'warnings', 'notes', 'reason_not_checked']);

/** One document's row, for writing as the results file is read. */
export function documentCsvRow(d: DocumentRow): string {
  const checked = d.status === 'checked';
  return row([d.line, d.id, d.status, checked ? d.results : null, checked ? d.findings : null, checked ? d.byLevel.error : null, checked ? d.byLevel.warning : null, checked ? d.byLevel.note : null, d.reason]);
}

/** One row per rule with findings: counts by level, documents with one, and the rate per 100 results. */
export function rulesCsv(s: CorpusSummary): string {
  const out = [row(['rule', 'findings', 'errors', 'warnings', 'notes', 'documents_with_finding', 'per_100_results'])];
  for (const r of s.rules) out.push(row([r.ruleId, r.findings, r.byLevel.error, r.byLevel.warning, r.byLevel.note, r.documents, rate(r.per100Results)]));
  return out.join('');
}

export const binLabel = (b: GapBin) => (b.high === null ? `${b.low} or more` : `${b.low} to under ${b.high}`);

/** The distribution of gaps, long form: one row per rule and bin, then the findings without a gap in digit units. */
export function gapsCsv(s: CorpusSummary): string {
  const out = [row(['rule', 'gap_last_digit_units', 'from', 'below', 'findings'])];
  for (const g of s.gaps) {
    s.gapBins.forEach((b, i) => out.push(row([g.ruleId, binLabel(b), b.low, b.high, g.counts[i] ?? 0])));
    out.push(row([g.ruleId, 'no gap in digit units', null, null, g.withoutUnits]));
  }
  return out.join('');
}
