import type { Segment } from '../parse/types.js';
import { readNumber, sourceSpan } from './numbers.js';
import type { ReportedNumber, ReportedP, TTestReport } from './types.js';

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
  const byTable = new Map<number, Segment[]>();
  for (const s of segments) {
    if (s.kind !== 'tableCell' || !s.table) continue;
    const list = byTable.get(s.table.table) ?? [];
    list.push(s);
    byTable.set(s.table.table, list);
  }
  const out: TTestReport[] = [];
  for (const cells of byTable.values()) {
    const header = cells.filter((c) => c.table?.row === 0);
    const col = (re: RegExp) => header.find((h) => re.test(h.text.trim()))?.table?.column;
    const tCol = col(T_HEADER);
    const pCol = col(P_HEADER);
    if (tCol === undefined || pCol === undefined) continue;
    const dfCol = col(DF_HEADER);
    const rows = new Map<number, Map<number, Segment>>();
    for (const c of cells) {
      if (!c.table || c.table.row === 0) continue;
      const r = rows.get(c.table.row) ?? new Map<number, Segment>();
      r.set(c.table.column, c);
      rows.set(c.table.row, r);
    }
    for (const row of rows.values()) {
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
