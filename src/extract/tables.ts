import type { Segment } from '../parse/types.js';
import { readNumber, sourceSpan } from './numbers.js';
import type { GroupSummary, ReportedNumber, ReportedP, TTestReport } from './types.js';

const T_HEADER = /^(?:t|t[- ]?(?:value|stat(?:istic)?)|t-test|t statistic)$/iu;
const DF_HEADER = /^(?:df|d\.f\.|degrees of freedom)$/iu;
const P_HEADER = /^(?:p|p[- ]?value|sig\.?|sig\. \(2-tailed\)|p \(two-tailed\)|p \(2-tailed\)|pr\(>\|t\|\))$/iu;
const CELL_NUMBER = /^ ?([-+]? ?(?:\d{1,9}(?:\.\d{1,20})?|\.\d{1,20})) ?$/u;
const CELL_P = /^ ?(<=|>=|≤|≥|<|>|=)? ?(\d{1,12}(?:\.\d{1,20})?|\.\d{1,20})(?: ?(?:[eE] ?([-+]?\d{1,3})|[×xX*·] ?10 ?\^? ?([-+]?\d{1,3})))? ?$/u;

/**
 * Results laid out as table columns: a header row naming t, df and p (in any order) and
 * one result per body row. Cells that hold a whole `t(28) = 2.10` are read by the prose
 * scanner instead; this covers the bare-number layout.
 */
export function findTableTests(segments: Segment[]): TTestReport[] {
  const out: TTestReport[] = [];
  for (const cells of tablesOf(segments).values()) {
    const header = cells.filter((c) => c.table?.row === 0);
    const col = (re: RegExp) => header.find((h) => re.test(h.text.trim()))?.table?.column;
    const tCol = col(T_HEADER);
    const pCol = col(P_HEADER);
    if (tCol === undefined || pCol === undefined) continue;
    const dfCol = col(DF_HEADER);
    for (const row of rowsOf(cells).values()) {
      const tCell = row.get(tCol);
      const pCell = row.get(pCol);
      if (!tCell || !pCell) continue;
      const t = cellNumber(tCell);
      const p = cellP(pCell);
      if (!t || !p) continue;
      const dfCell = dfCol === undefined ? undefined : row.get(dfCol);
      const df = dfCell ? cellNumber(dfCell) : undefined;
      const last = [tCell, pCell, dfCell].filter((c): c is Segment => c !== undefined).sort((a, b) => (a.ends.at(-1) as number) - (b.ends.at(-1) as number)).at(-1) as Segment;
      const span = { start: Math.min(t.span.start, p.span.start, df?.span.start ?? Infinity), end: last.ends.at(-1) as number };
      out.push({
        id: `${tCell.id}:0`,
        segment: tCell.id,
        block: tCell.block,
        sentence: 0,
        span,
        printed: [tCell.text.trim(), df?.printed, p.printed].filter(Boolean).join(' | '),
        style: 'table-columns',
        plural: false,
        inCode: false,
        tOp: '=',
        t,
        ...(df ? { df } : {}),
        p,
      });
    }
  }
  return out;
}

function cellNumber(seg: Segment): ReportedNumber | undefined {
  const m = CELL_NUMBER.exec(seg.text);
  if (!m) return undefined;
  const a = seg.text.indexOf(m[1] as string);
  return readNumber(seg, a, a + (m[1] as string).length);
}

function cellP(seg: Segment): ReportedP | undefined {
  const m = CELL_P.exec(seg.text);
  if (!m) return undefined;
  const lead = seg.text.length - seg.text.trimStart().length;
  const numStart = seg.text.indexOf(m[2] as string, lead);
  const numEnd = seg.text.trimEnd().length;
  const exponent = Number(m[3] ?? m[4] ?? 0);
  const number = readNumber(seg, numStart, numEnd, exponent, numStart + (m[2] as string).length);
  if (!number) return undefined;
  const op = m[1] === '<' ? '<' : m[1] === '>' ? '>' : m[1] === '<=' || m[1] === '≤' ? '<=' : m[1] === '>=' || m[1] === '≥' ? '>=' : '=';
  return { kind: 'value', op, number, span: sourceSpan(seg, lead, numEnd), printed: seg.text.slice(lead, numEnd) };
}

const MEAN_HEADER = /^(?:m|mean|means|avg|average|x̄)$/iu;
const SD_HEADER = /^(?:sd|s\.d\.|std\.? ?dev\.?|standard deviation)$/iu;
const SE_HEADER = /^(?:se|sem|s\.e\.|s\.e\.m\.|standard error)$/iu;
const N_HEADER = /^(?:n|count|size|sample size|participants)$/iu;
const COMBINED_HEADER = /^(?:m|mean)s? ?(?:\((sd|se|sem)\)|± ?(sd|se|sem))$/iu;
const COMBINED_CELL = /^ ?([-+]?\d{1,12}(?:\.\d{1,12})?) ?(?:\( ?(\d{1,12}(?:\.\d{1,12})?) ?\)|± ?(\d{1,12}(?:\.\d{1,12})?)) ?$/u;

/**
 * Descriptives laid out as a table whose rows are groups or conditions: columns for the mean,
 * SD or SE, and n (header words vary), or one "Mean (SD)" / "Mean ± SD" column.
 */
export function findTableSummaries(segments: Segment[]): GroupSummary[] {
  const out: GroupSummary[] = [];
  for (const cells of tablesOf(segments).values()) {
    const header = cells.filter((c) => c.table?.row === 0);
    const col = (re: RegExp) => header.find((h) => re.test(h.text.trim()))?.table?.column;
    const meanCol = col(MEAN_HEADER);
    const sdCol = col(SD_HEADER);
    const seCol = col(SE_HEADER);
    const nCol = col(N_HEADER);
    const combinedHeader = header.find((h) => COMBINED_HEADER.test(h.text.trim()));
    const combinedKind = combinedHeader ? (COMBINED_HEADER.exec(combinedHeader.text.trim())?.slice(1).find(Boolean) ?? '') : '';
    if (meanCol === undefined && !combinedHeader) continue;
    for (const [row, byCol] of rowsOf(cells)) {
      const labelCell = byCol.get(0);
      let mean: ReportedNumber | undefined;
      let spread: GroupSummary['spread'];
      if (combinedHeader?.table) {
        const cell = byCol.get(combinedHeader.table.column);
        const m = cell ? COMBINED_CELL.exec(cell.text) : null;
        if (cell && m) {
          const lead = cell.text.indexOf(m[1] as string);
          mean = readNumber(cell, lead, lead + (m[1] as string).length);
          const sp = (m[2] ?? m[3]) as string;
          const at = cell.text.indexOf(sp, lead + (m[1] as string).length);
          const n = readNumber(cell, at, at + sp.length);
          if (n) spread = { number: n, kind: /sd/i.test(combinedKind) ? 'SD' : 'SE', printedKind: combinedKind };
        }
      } else if (meanCol !== undefined) {
        const cell = byCol.get(meanCol);
        mean = cell ? cellNumber(cell) : undefined;
        const spreadCol = sdCol ?? seCol;
        const sCell = spreadCol !== undefined ? byCol.get(spreadCol) : undefined;
        const sNum = sCell ? cellNumber(sCell) : undefined;
        if (sNum) spread = { number: sNum, kind: sdCol !== undefined ? 'SD' : 'SE', printedKind: header.find((h) => h.table?.column === spreadCol)?.text.trim() ?? '' };
      }
      if (!mean) continue;
      const nCell = nCol !== undefined ? byCol.get(nCol) : undefined;
      const n = nCell ? cellNumber(nCell) : undefined;
      const parts = [mean.span, spread?.number.span, n?.span].filter((s): s is { start: number; end: number } => s !== undefined);
      const first = byCol.values().next().value as Segment;
      out.push({
        id: `${first.id}:row`,
        segment: first.id,
        block: first.block,
        sentence: 0,
        span: { start: Math.min(...parts.map((p) => p.start)), end: Math.max(...parts.map((p) => p.end)) },
        printed: [labelCell?.text.trim(), mean.printed, spread?.number.printed, n?.printed].filter(Boolean).join(' | '),
        mean,
        ...(spread ? { spread } : {}),
        ...(n ? { n } : {}),
        ...(labelCell ? { label: labelCell.text.trim() } : {}),
        percent: false,
        table: { table: first.table?.table ?? 0, row },
      });
    }
  }
  return out;
}

function tablesOf(segments: Segment[]): Map<number, Segment[]> {
  const byTable = new Map<number, Segment[]>();
  for (const s of segments) {
    if (s.kind !== 'tableCell' || !s.table) continue;
    const list = byTable.get(s.table.table) ?? [];
    list.push(s);
    byTable.set(s.table.table, list);
  }
  return byTable;
}

function rowsOf(cells: Segment[]): Map<number, Map<number, Segment>> {
  const rows = new Map<number, Map<number, Segment>>();
  for (const c of cells) {
    if (!c.table || c.table.row === 0) continue;
    const r = rows.get(c.table.row) ?? new Map<number, Segment>();
    r.set(c.table.column, c);
    rows.set(c.table.row, r);
  }
  return rows;
}
