import type { Segment } from '../parse/types.js';
import { readNumber, sentenceOf, sentenceStarts, sourceSpan, trimEndOf } from './numbers.js';
import { decimalsOf, starBound } from './stars.js';
import type { EffectSizeReport, EstimateReport, GroupSummary, IntervalReport, ReportedNumber, ReportedP, TableBlockRecord, TableRow, TTestReport } from './types.js';
import { OTHER_ESTIMATE_HEADER } from './otherEstimates.js';

/**
 * Results laid out in tables, read row by row. Columns are recognised by their header:
 * - wide layouts, one comparison per row: a column per group whose header names the group and
 *   says what its cells hold (`Walking (n = 36), mean (SD)`, `Mean ± SE`), then t (its df may
 *   stand in the header: `t(64)`, `Related t-value (df = 50)`, `Unrelated t-value (48)`), df, p (with stars or not), d and
 *   a CI (`Difference (95% CI)` cells such as `2.06 (0.78 to 3.35)`, or a `95% CI` column beside a
 *   `Difference` column; a header without a level takes the caption's, else 95% is assumed and
 *   said: `levelAssumed`);
 * - long layouts, one group per row: Group, n, M, SD (or SE) columns; the rows of one measure
 *   form a block (the measure's name in the first column, blank below it), whose test is printed
 *   in a row of its own, in prose after the table, or in a t column of the block's first row;
 * - cells labelled `t = 3.33` and `P = 0.010` in separate rows of one column, under a label that
 *   spans both rows (a layout of PDF conversions), the df in the caption (`df = 5`).
 * Cells holding a whole `t(28) = 2.10, p = .045` are read by the prose reader instead.
 */
export interface TableResults {
  tests: TTestReport[];
  summaries: GroupSummary[];
  effectSizes: EffectSizeReport[];
  intervals: IntervalReport[];
  estimates: EstimateReport[];
  blocks: TableBlock[];
}

type TableBlock = TableBlockRecord;

// Bounded building blocks (see test/regex-safety).
const NUM = String.raw`[-+]?(?:\d{1,9}(?:\.\d{1,12})?|\.\d{1,12})`;
/**
 * A df as the prose reader reads one (DF_NUM in tTests.ts): up to 400 digits, or grouped by
 * commas, an `e` exponent; a longer run is not read at all, never cut. One of ten digits and
 * more is read but no p is recomputed from it (evaluateP: a note).
 */
const DF = String.raw`[-+]?(?:\d{1,3}(?:,\d{3}){1,3}(?:\.\d{1,12})?|\d{1,400}(?:\.\d{1,12})?|\.\d{1,12})(?:[eE][-+]?\d{1,9})?`;
/** A t as the prose reader reads one (T_NUM in tTests.ts): up to 400 digits, an `e` exponent. */
const T_CELL_NUM = String.raw`[-+]?(?:\d{1,400}(?:\.\d{1,20})?|\.\d{1,20})(?:[eE][-+]?\d{1,9})?`;
const STARS = String.raw`(\*{1,4}|†)?`;
const T_HEADER = new RegExp(
  String.raw`^(?:(?:related|unrelated|paired|unpaired|dependent|independent|(?:paired|independent|related|one|two)[- ]samples?|welch['’]?s?|student['’]?s?) )?t(?:[- ]?(?:value|test|stat(?:istic)?))?(?: ?\( ?(?:df ?= ?)?(${DF}) ?\)| ?\((?:df)\))?$`,
  'iu',
);
const DF_HEADER = /^(?:df|d\.f\.|degrees of freedom)$/iu;
const P_HEADER = /^(?:p|p[- ]?values?|sig\.?|significance)(?: ?\((?:two|2|one|1)[- ]?(?:tailed|sided|t)\))?$|^sig\. \(2-tailed\)$|^pr\(>\|t\|\)$/iu;
const D_HEADER = /^(?:d|d_?z|d_?av|cohen['’]s d|hedges['’]? ?g|g|es|effect size|effect size \(d\))$/iu;
/** The header of a column of estimates: `Difference`, `Mean difference`, `MD`, `Estimate`. */
const ESTIMATE_HEADER = /^(?:(?:mean )?diff(?:erence|\.)?|md|estimate)$/iu;
/** A level of confidence intervals a table's caption prints: "(99% confidence intervals)", "95% CI". */
const CAPTION_CI_LEVEL = /(?<![\d.])(\d{2}(?:\.\d)?) ?% ?(?:CIs?|C\.I\.|confidence intervals?|confidence limits)(?![\p{L}])/iu;
const CI_HEADER = /(?:(\d{2}(?:\.\d)?) ?% ?(?:ci|c\.i\.|ki|ic|confidence interval)|^(?:ci|ki|confidence interval)$|\((?:ci|c\.i\.|confidence interval)\)$)/iu;
const MEAN_HEADER = /^(?:m|mean|means|avg|average|x̄)$/iu;
const SD_HEADER = /^(?:sd|s\.d\.|std\.? ?dev\.?|standard deviation)$/iu;
const SE_HEADER = /^(?:se|sem|s\.e\.|s\.e\.m\.|standard error)$/iu;
const N_HEADER = /^(?:n|count|size|sample size|participants)$/iu;
const GROUP_HEADER = /^(?:group|condition|arm|treatment|sample)$/iu;
/** The header of another statistic's column (`χ²(1)`, `F`, `z`, `r(48)`, `U`): a p beside it may be its p, not the t's. */
const OTHER_STAT_HEADER = /^(?:(?:χ|chi)[ -]?(?:\^ ?2|²|sq(?:uare)?d?)|[FzZrUWH])(?: ?\([^()]{0,20}\))?$/u;
/** A group's column: `Walking (n = 36), mean (SD)`, `Mean (SD)`, `M ± SE`. */
const GROUP_COLUMN = /(?:^|[\s,(])(?:m|mean|means)s? ?(?:\(\s?(sd|se|sem|s\.d\.|s\.e\.)\s?\)|± ?(sd|se|sem|s\.d\.|s\.e\.))\s?\)?$/iu;
const HEADER_N = /\(\s?n ?= ?(\d{1,6})\s?\)/iu;

const CELL_NUMBER = new RegExp(String.raw`^ ?(${NUM}) ?${STARS} ?$`, 'u');
/** A df cell (see DF). */
const CELL_DF = new RegExp(String.raw`^ ?(${DF}) ?${STARS} ?$`, 'u');
/** A t cell: a number, or one in R's scientific form (`3.4e+01`, `2e1000`: beyond a double, read as its log10). */
const CELL_T = new RegExp(String.raw`^ ?(${T_CELL_NUM}) ?${STARS} ?$`, 'u');
/** A t cell under a `t (df)` header: the t, then its df in brackets (`20.86 (99)`), stars after either. */
const CELL_T_DF = new RegExp(String.raw`^ ?(${NUM}) ?${STARS} ?\( ?(${DF}) ?\) ?(\*{1,4}|†)? ?$`, 'u');
/** A `t (df)` header: the cells print the df in brackets after t. */
const T_DF_HEADER = /\( ?df ?\)$/iu;
/**
 * A p cell. A minus sign is read (`-.05`, `-0`; a Unicode minus is folded to it before), so that
 * values-are-possible can say it cannot be, as for a p in prose; an exponent of up to 400 digits
 * is read whole (`1e-4000`, `1e-12345678901`, below a double, as its log10).
 */
const CELL_P = new RegExp(String.raw`^ ?(<=|>=|≤|≥|<|>|=)? ?(-)?(\d{1,12}(?:\.\d{1,20})?|\.\d{1,20})(?: ?(?:[eE] ?([-+]?\d{1,400})|[×xX*·] ?10 ?\^? ?([-+]?\d{1,400})))? ?(\*{1,4}|†)? ?$`, 'u');
const CELL_MEAN_SPREAD = new RegExp(String.raw`^ ?(${NUM}) ?(?:\( ?(${NUM}) ?\)|± ?(${NUM})) ?$`, 'u');
/**
 * A CI cell: its limits, after the estimate when the cell prints one (`2.06 (0.78 to 3.35)`). The
 * estimate ends at a space or an opening bracket, so a lower limit is never split at its point
 * (`-8.2 to 0.6` is the interval, not the estimate −8 and the limits .2 and 0.6).
 */
const CELL_CI = new RegExp(String.raw`^ ?(?:(${NUM})(?= |[(\[]) ?)?[(\[]? ?(${NUM}) ?(?:,|;|to|–|—| - |-(?=[.\d])) ?(${NUM}) ?[)\]]? ?$`, 'u');
const LABELLED_T = new RegExp(String.raw`^ ?[tT] ?= ?(${NUM}) ?$`, 'u');
const LABELLED_P = new RegExp(String.raw`^ ?[pP] ?(<=|>=|≤|≥|<|>|=) ?(\d{1,12}(?:\.\d{1,20})?|\.\d{1,20}) ?$`, 'u');
const CAPTION_DF = /(?<![\p{L}])(?:df|d\.f\.) ?= ?(\d{1,400})(?![\d.])/u;

/**
 * A row's cells by column: an array with holes, not a Map (a table of 170,000 rows made as many
 * Maps, and their garbage was much of the time it took to read).
 */
type Row = Array<Segment | undefined>;

interface Grid {
  table: number;
  header: Map<number, Segment>;
  /** Rows by number, in the order their first cell came. */
  rows: Map<number, Row>;
  caption?: Segment;
}

/** Every table of the document read as results, groups, effect sizes and intervals by row. */
export function readTables(segments: readonly Segment[]): TableResults {
  const out: TableResults = { tests: [], summaries: [], effectSizes: [], intervals: [], estimates: [], blocks: [] };
  for (const grid of gridsOf(segments)) readGrid(grid, out);
  return out;
}

/** The block holding a row (blocks in row order, not overlapping). */
export function blockAt(blocks: readonly TableBlockRecord[], row: number): TableBlockRecord | undefined {
  let lo = 0;
  let hi = blocks.length - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    const b = blocks[mid] as TableBlockRecord;
    if (row < b.firstRow) hi = mid - 1;
    else if (row > b.lastRow) lo = mid + 1;
    else return b;
  }
  return undefined;
}

/** A caption's own number: "Table 2", "Table S1", "Table IV". */
export const CAPTION_NUMBER = /^\s?(?:Table|TABLE|Tab\.)[ \u00A0]{0,2}([A-Z]?\d{1,3}|[IVXLC]{1,7})(?![\p{L}\p{N}])/u;

/**
 * Gives each result printed in a table the words a reader finds it by: the table's name (the
 * number its caption gives it, else its place among the document's tables) and the row's label
 * (the measure named in the first column, or above it in a block of rows).
 */
export function nameTableRows(tests: readonly TTestReport[], segments: readonly Segment[], blocks: readonly TableBlockRecord[]): void {
  if (!tests.some((t) => t.table)) return;
  const names = new Map<number, string>();
  for (const s of segments) {
    if (s.legendOf?.role !== 'caption' || names.has(s.legendOf.table)) continue;
    const m = CAPTION_NUMBER.exec(s.text);
    if (m) names.set(s.legendOf.table, `Table ${m[1] as string}`);
  }
  const blocksOf = new Map<number, TableBlockRecord[]>();
  for (const b of blocks) {
    const list = blocksOf.get(b.table);
    if (list) list.push(b);
    else blocksOf.set(b.table, [b]);
  }
  for (const t of tests) {
    if (!t.table) continue;
    const { table, row } = t.table;
    const label = blockAt(blocksOf.get(table) ?? [], row)?.label;
    t.table = { ...t.table, name: names.get(table) ?? `Table ${table + 1}`, ...(label && /\p{L}/u.test(label) ? { rowLabel: label } : {}) };
  }
}

function gridsOf(segments: readonly Segment[]): Grid[] {
  const grids = new Map<number, Grid>();
  for (const s of segments) {
    if (s.legendOf?.role === 'caption') {
      const g = grids.get(s.legendOf.table) ?? newGrid(s.legendOf.table);
      g.caption = s;
      grids.set(s.legendOf.table, g);
    }
    if (s.kind !== 'tableCell' || !s.table) continue;
    const g = grids.get(s.table.table) ?? newGrid(s.table.table);
    grids.set(s.table.table, g);
    if (s.table.row === 0) g.header.set(s.table.column, s);
    else {
      const row = g.rows.get(s.table.row);
      if (row) row[s.table.column] = s;
      else {
        const fresh: Row = [];
        fresh[s.table.column] = s;
        g.rows.set(s.table.row, fresh);
      }
    }
  }
  return [...grids.values()];
}

function newGrid(table: number): Grid {
  return { table, header: new Map(), rows: new Map() };
}

interface Columns {
  t?: { column: number; df?: ReportedNumber; dfInCell?: boolean };
  df?: number;
  p?: number;
  d?: { column: number; kind: EffectSizeReport['kind'] };
  ci?: { column: number; level: number; levelAssumed?: true; of?: string };
  /** A column of the estimates the CI column's intervals are of (`Difference`, `MD`), beside it. */
  estimate?: number;
  groups: Array<{ column: number; kind: 'SD' | 'SE'; printedKind: string; label: string; n?: ReportedNumber }>;
  mean?: number;
  spread?: { column: number; kind: 'SD' | 'SE'; printed: string };
  n?: number;
  group?: number;
  /** The one `M (SD)` column of a long layout (a group per row, its n in the n column). */
  longCell?: number;
}

/** The name and n of the group a long layout's row prints. */
function longCellGroup(row: Row, cols: Columns): { label?: string; n?: ReportedNumber } {
  const nCell = cols.n !== undefined ? row[cols.n] : undefined;
  const n = nCell ? cellNumber(nCell) : undefined;
  const label = row[cols.group ?? 0]?.text.trim();
  return { ...(label ? { label } : {}), ...(n ? { n } : {}) };
}

function columnsOf(grid: Grid): Columns {
  const c: Columns = { groups: [] };
  const others: number[] = [];
  for (const [column, seg] of [...grid.header].sort((a, b) => a[0] - b[0])) {
    const text = seg.text.trim();
    const t = T_HEADER.exec(text);
    const groupColumn = GROUP_COLUMN.exec(text);
    if (t && c.t === undefined) {
      const dfText = t[1];
      const at = dfText ? seg.text.indexOf(dfText) : -1;
      const df = dfText && at >= 0 ? readNumber(seg, at, at + dfText.length) : undefined;
      c.t = { column, ...(df ? { df } : {}), ...(T_DF_HEADER.test(text) ? { dfInCell: true } : {}) };
    } else if (DF_HEADER.test(text)) c.df ??= column;
    else if (P_HEADER.test(text)) c.p ??= column;
    else if (D_HEADER.test(text)) {
      const k = text.toLowerCase().replace(/[_{}]/g, '');
      c.d ??= { column, kind: k === 'dz' ? 'dz' : k === 'dav' ? 'dav' : /g$/.test(k) ? 'g' : 'd' };
    } else if (groupColumn) {
      const kindWord = (groupColumn[1] ?? groupColumn[2] ?? '') as string;
      const n = HEADER_N.exec(text);
      const nAt = n ? seg.text.indexOf(n[1] as string, seg.text.search(/\(\s?n ?=/iu)) : -1;
      const label = trimEndOf(text.slice(0, groupColumn.index).replace(HEADER_N, ''), ',;:').trim();
      const nNumber = n && nAt >= 0 ? readNumber(seg, nAt, nAt + (n[1] as string).length) : undefined;
      c.groups.push({ column, kind: /^s\.?d/i.test(kindWord) ? 'SD' : 'SE', printedKind: kindWord, label, ...(nNumber ? { n: nNumber } : {}) });
    } else if (CI_HEADER.test(text)) {
      // the level the header prints, else the caption's ("99% confidence intervals"), else 95% assumed
      const printed = CI_HEADER.exec(text)?.[1] ?? (grid.caption ? CAPTION_CI_LEVEL.exec(grid.caption.text)?.[1] : undefined);
      // "ICC (95% CI)", "AUC [95% CI]": the column's estimates and intervals are another statistic's
      const of = OTHER_ESTIMATE_HEADER.exec(text)?.[1];
      c.ci ??= Object.assign(printed !== undefined ? { column, level: Number(printed) / 100 } : { column, level: 0.95, levelAssumed: true as const }, of ? { of } : {});
    } else if (ESTIMATE_HEADER.test(text)) c.estimate ??= column;
    else if (MEAN_HEADER.test(text)) c.mean ??= column;
    else if (SD_HEADER.test(text)) c.spread ??= { column, kind: 'SD', printed: text };
    else if (SE_HEADER.test(text)) c.spread ??= { column, kind: 'SE', printed: text };
    else if (N_HEADER.test(text)) c.n ??= column;
    else if (GROUP_HEADER.test(text)) c.group ??= column;
    else if (OTHER_STAT_HEADER.test(text)) others.push(column);
  }
  // one group column without a name or n (`M (SD)`) beside an n column: a long layout whose
  // cells print mean and spread together, one group per row
  const only = c.groups[0];
  if (c.groups.length === 1 && only && only.label === '' && !only.n && c.n !== undefined && c.mean === undefined) c.longCell = only.column;
  // a p column is the t's only when no other statistic's column is as near to it or between them
  // (a table of a χ² with its p and then a t, `χ²(1) | p | … | t(81)`: the p is the χ²'s)
  if (c.p !== undefined && c.t !== undefined && others.length > 0) {
    const p = c.p;
    const t = c.t.column;
    if (others.some((o) => Math.abs(o - p) <= Math.abs(t - p) || (o - p) * (o - t) < 0)) delete c.p;
  }
  return c;
}

function readGrid(grid: Grid, out: TableResults): void {
  const cols = columnsOf(grid);
  const captionDf = grid.caption ? captionDfOf(grid.caption) : undefined;
  const rows = [...grid.rows.keys()].sort((a, b) => a - b);
  // long layout: the measure named in the first column, blank in the rows below it
  let block: TableBlock | undefined;
  for (const r of rows) {
    const row = grid.rows.get(r) as Row;
    const where = { table: grid.table, row: r };
    const label = row[0]?.text.trim() ?? '';
    if (label !== '' && !LABELLED_T.test(label) && !/^[tT] ?[(=]/.test(label)) {
      block = { table: grid.table, label, firstRow: r, lastRow: r };
      out.blocks.push(block);
    } else if (block) block.lastRow = r;
    // wide layout: one group per group column
    for (const g of cols.groups) {
      const cell = row[g.column];
      const m = cell ? CELL_MEAN_SPREAD.exec(cell.text) : null;
      if (!cell || !m) continue;
      const mean = numberAt(cell, m[1] as string, 0);
      const spreadText = (m[2] ?? m[3]) as string;
      const spread = mean ? numberAt(cell, spreadText, cell.text.indexOf(m[1] as string) + (m[1] as string).length) : undefined;
      if (!mean || !spread) continue;
      // a long layout printing mean and spread in one cell (`Group | n | M (SD)`): the row is the
      // group, its name in the group column (else the first) and its n in the n column
      const rowGroup = cols.longCell !== undefined && g.column === cols.longCell ? longCellGroup(row, cols) : undefined;
      const label = rowGroup ? rowGroup.label : g.label;
      const n = rowGroup ? rowGroup.n : g.n;
      out.summaries.push({
        id: `${cell.id}:row`,
        segment: cell.id,
        block: cell.block,
        sentence: 0,
        span: { start: Math.min(mean.span.start, n && rowGroup ? n.span.start : Infinity), end: Math.max(spread.span.end, n && rowGroup ? n.span.end : -Infinity) },
        printed: rowGroup ? [label, cell.text.trim(), n?.printed].filter(Boolean).join(' | ') : `${label ? `${label}: ` : ''}${cell.text.trim()}`,
        mean,
        spread: { number: spread, kind: g.kind, printedKind: g.printedKind },
        ...(n ? { n } : {}),
        ...(label ? { label } : {}),
        percent: false,
        table: where,
      });
    }
    // long layout: the row is a group
    if (cols.mean !== undefined) {
      const meanCell = row[cols.mean];
      const mean = meanCell ? cellNumber(meanCell) : undefined;
      if (meanCell && mean) {
        const spreadCell = cols.spread ? row[cols.spread.column] : undefined;
        const spread = spreadCell ? cellNumber(spreadCell) : undefined;
        const nCell = cols.n !== undefined ? row[cols.n] : undefined;
        const n = nCell ? cellNumber(nCell) : undefined;
        const labelCell = row[cols.group ?? 0];
        const parts = [mean.span, spread?.span, n?.span].filter((s): s is { start: number; end: number } => s !== undefined);
        out.summaries.push({
          id: `${meanCell.id}:row`,
          segment: meanCell.id,
          block: meanCell.block,
          sentence: 0,
          span: { start: Math.min(...parts.map((p) => p.start)), end: Math.max(...parts.map((p) => p.end)) },
          printed: [labelCell?.text.trim(), mean.printed, spread?.printed, n?.printed].filter(Boolean).join(' | '),
          mean,
          ...(spread && cols.spread ? { spread: { number: spread, kind: cols.spread.kind, printedKind: cols.spread.printed } } : {}),
          ...(n ? { n } : {}),
          ...(labelCell?.text.trim() ? { label: labelCell.text.trim() } : {}),
          percent: false,
          table: where,
        });
      }
    }
    // the row's test
    const tCell = cols.t ? row[cols.t.column] : undefined;
    if (tCell) {
      // under a `t (df)` header a cell may print its df in brackets after t (`20.86 (99)`)
      const withDf = cols.t?.dfInCell ? CELL_T_DF.exec(tCell.text) : null;
      const m = withDf ?? CELL_T.exec(tCell.text);
      const t = m ? numberAt(tCell, m[1] as string, 0) : undefined;
      if (t && m) {
        const dfCell = cols.df !== undefined ? row[cols.df] : undefined;
        const inCell = withDf ? numberAt(tCell, withDf[3] as string, tCell.text.indexOf('(', tCell.text.indexOf(withDf[1] as string) + (withDf[1] as string).length)) : undefined;
        const df = inCell ?? (dfCell ? cellDf(dfCell) : undefined) ?? cols.t?.df ?? captionDf;
        const pCell = cols.p !== undefined ? row[cols.p] : undefined;
        const stars = m[2] ?? (withDf ? withDf[4] : undefined);
        const p = (pCell ? cellP(pCell) : undefined) ?? (stars ? starP(tCell, stars) : undefined);
        if (p || df) out.tests.push(tableTest(tCell, t, df, p, [tCell, dfCell, pCell], where));
      }
    }
    const dCell = cols.d ? row[cols.d.column] : undefined;
    const d = dCell ? cellNumber(dCell) : undefined;
    if (dCell && d && cols.d) out.effectSizes.push({ segment: dCell.id, block: dCell.block, sentence: 0, span: d.span, printed: `${grid.header.get(cols.d.column)?.text.trim() ?? 'd'} = ${d.printed}`, kind: cols.d.kind, value: d, table: where });
    const ciCell = cols.ci ? row[cols.ci.column] : undefined;
    if (ciCell && cols.ci) {
      const before = out.estimates.length;
      const read = readIntervalCell(ciCell, cols.ci, where, out);
      // the estimate of its own column (`Difference | 95% CI`), when the CI cell prints none
      const estimateCell = cols.estimate !== undefined && read && out.estimates.length === before ? row[cols.estimate] : undefined;
      const estimate = estimateCell ? cellNumber(estimateCell) : undefined;
      if (estimateCell && estimate) out.estimates.push({ segment: estimateCell.id, block: estimateCell.block, sentence: 0, span: estimate.span, printed: `estimate = ${estimate.printed}`, value: estimate, table: where });
    }
  }
  readLabelledCells(grid, captionDf, out);
}

/** A cell `2.06 (0.78 to 3.35)` is an estimate with its interval; `(−3.4 to 2.1)` an interval alone. */
function readIntervalCell(cell: Segment, { level, levelAssumed, of }: { level: number; levelAssumed?: true; of?: string }, where: TableRow, out: TableResults): boolean {
  const m = CELL_CI.exec(cell.text);
  if (!m) return false;
  let from = 0;
  const estimate = m[1] ? numberAt(cell, m[1], from) : undefined;
  if (estimate) from = cell.text.indexOf(m[1] as string) + (m[1] as string).length;
  const low = numberAt(cell, m[2] as string, from);
  const high = low ? numberAt(cell, m[3] as string, cell.text.indexOf(m[2] as string, from) + (m[2] as string).length) : undefined;
  if (!low || !high || low.value > high.value) return false;
  // (another statistic's estimate, an ICC or an AUC, is not the estimate of the row's test)
  if (estimate && of === undefined) out.estimates.push({ segment: cell.id, block: cell.block, sentence: 0, span: estimate.span, printed: `estimate = ${estimate.printed}`, value: estimate, table: where });
  out.intervals.push({ segment: cell.id, block: cell.block, sentence: 0, level, low, high, span: { start: low.span.start, end: high.span.end }, printed: `${Math.round(level * 100)}% CI ${cell.text.trim()}`, table: where, ...(levelAssumed ? { levelAssumed } : {}), ...(of !== undefined ? { ofOther: of } : {}) });
  return true;
}

/**
 * `t = 3.33` and `P = 0.010` in cells of their own: the p is the one labelled cell of the row,
 * else the labelled cell next to it in the same column when a label in the first column spans
 * both rows.
 */
function readLabelledCells(grid: Grid, captionDf: ReportedNumber | undefined, out: TableResults): void {
  const spans = new Map<number, number>();
  for (const [r, row] of grid.rows) {
    const label = row[0];
    if (label?.table?.rowSpan && label.table.rowSpan > 1) for (let k = 0; k < label.table.rowSpan; k += 1) spans.set(r + k, r);
  }
  for (const [r, row] of grid.rows) {
    // (forEach skips a row's holes)
    row.forEach((cell, c) => {
      if (!cell) return;
      const t = LABELLED_T.exec(cell.text);
      if (!t) return;
      const ps = row.filter((x): x is Segment => x !== undefined && LABELLED_P.test(x.text));
      let pCell = ps.length === 1 ? ps[0] : undefined;
      if (!pCell && spans.has(r)) {
        for (const other of [r - 1, r + 1]) {
          const candidate = spans.get(other) === spans.get(r) ? grid.rows.get(other)?.[c] : undefined;
          if (candidate && LABELLED_P.test(candidate.text)) pCell = candidate;
        }
      }
      const tNumber = numberAt(cell, t[1] as string, 0);
      const p = pCell ? labelledP(pCell) : undefined;
      if (tNumber && p) out.tests.push(tableTest(cell, tNumber, captionDf, p, [cell, pCell], { table: grid.table, row: r }));
    });
  }
}

function tableTest(tCell: Segment, t: ReportedNumber, df: ReportedNumber | undefined, p: ReportedP | undefined, cells: Array<Segment | undefined>, where: TableRow): TTestReport {
  const present = cells.filter((c): c is Segment => c !== undefined);
  const last = present.sort((a, b) => (a.ends.at(-1) as number) - (b.ends.at(-1) as number)).at(-1) as Segment;
  return {
    id: `${tCell.id}:0`,
    segment: tCell.id,
    block: tCell.block,
    sentence: 0,
    span: { start: Math.min(t.span.start, p?.span.start ?? Infinity, df && df.span.start > t.span.start ? df.span.start : Infinity), end: Math.max(last.ends.at(-1) as number, t.span.end) },
    printed: tablePrinted(tCell, df, p),
    style: 'table-columns',
    plural: false,
    inCode: false,
    tOp: '=',
    t,
    ...(df ? { df } : {}),
    ...(p ? { p } : {}),
    table: where,
  };
}

/**
 * How a table's result reads in a message: `t(13) = 1.63***` for a bare t cell under a `t(13)`
 * header, `2.10 | df = 28 | p = .045` for cells in t, df and p columns; what a cell printed is
 * never repeated (stars read as the p are already in the t cell).
 */
function tablePrinted(tCell: Segment, df: ReportedNumber | undefined, p: ReportedP | undefined): string {
  const text = tCell.text.trim();
  const inCell = (span: { start: number } | undefined) => span !== undefined && span.start >= (tCell.starts[0] as number) && span.start < (tCell.ends.at(-1) as number);
  const bare = /^[-+]?(?:\d|\.\d)/.test(text);
  const dfOutside = df && !inCell(df.span);
  const head = bare ? `t${dfOutside ? `(${df.printed})` : ''} = ${text}` : text;
  const parts = [head];
  if (dfOutside && !bare) parts.push(`df = ${df.printed}`);
  if (p && !inCell(p.span)) parts.push(/^[<>≤≥=]/.test(p.printed.trim()) ? `p ${p.printed.trim()}` : /^[-+]?(?:\d|\.\d)/.test(p.printed.trim()) ? `p = ${p.printed.trim()}` : p.printed.trim());
  return parts.join(', ');
}

function captionDfOf(caption: Segment): ReportedNumber | undefined {
  const m = CAPTION_DF.exec(caption.text);
  if (!m) return undefined;
  const at = m.index + m[0].length - (m[1] as string).length;
  return readNumber(caption, at, at + (m[1] as string).length);
}

/** The number `text` at its first place in the cell at or after `from`. */
function numberAt(cell: Segment, text: string, from: number): ReportedNumber | undefined {
  const at = cell.text.indexOf(text, from);
  return at < 0 ? undefined : readNumber(cell, at, at + text.length);
}

function cellNumber(seg: Segment): ReportedNumber | undefined {
  const m = CELL_NUMBER.exec(seg.text);
  return m ? numberAt(seg, m[1] as string, 0) : undefined;
}

function cellDf(seg: Segment): ReportedNumber | undefined {
  const m = CELL_DF.exec(seg.text);
  return m ? numberAt(seg, m[1] as string, 0) : undefined;
}

function cellP(seg: Segment): ReportedP | undefined {
  const m = CELL_P.exec(seg.text);
  if (!m) return undefined;
  const lead = seg.text.length - seg.text.trimStart().length;
  const mantissaStart = seg.text.indexOf(m[3] as string, lead);
  // the sign stands right before the digits and is part of the number read
  const numStart = m[2] !== undefined ? mantissaStart - 1 : mantissaStart;
  const mantissaEnd = mantissaStart + (m[3] as string).length;
  const stars = m[6];
  const numEnd = stars ? seg.text.lastIndexOf(stars) : seg.text.trimEnd().length;
  let end = numEnd;
  while (end > mantissaEnd && seg.text[end - 1] === ' ') end -= 1;
  const exponent = Number(m[4] ?? m[5] ?? 0);
  const number = readNumber(seg, numStart, end, exponent, mantissaEnd);
  if (!number) return undefined;
  return { kind: 'value', op: comparison(m[1]), number, span: sourceSpan(seg, lead, end), printed: seg.text.slice(lead, end) };
}

function labelledP(seg: Segment): ReportedP | undefined {
  const m = LABELLED_P.exec(seg.text);
  if (!m) return undefined;
  const at = seg.text.indexOf(m[2] as string);
  const number = readNumber(seg, at, at + (m[2] as string).length);
  if (!number) return undefined;
  const lead = seg.text.length - seg.text.trimStart().length;
  return { kind: 'value', op: comparison(m[1]), number, span: sourceSpan(seg, lead, at + (m[2] as string).length), printed: seg.text.trim() };
}

/** Stars after a t in its cell, read as a p bound (the legend applies later, as for prose). */
function starP(cell: Segment, symbol: string): ReportedP | undefined {
  const bound = starBound(symbol);
  if (bound === undefined) return undefined;
  const a = cell.text.lastIndexOf(symbol);
  const span = sourceSpan(cell, a, a + symbol.length);
  const number: ReportedNumber = { printed: symbol, value: bound, decimals: decimalsOf(bound), exponent: 0, span };
  return { kind: 'value', op: '<', number, span, printed: symbol, stars: { count: symbol === '†' ? 0 : symbol.length, symbol, basis: 'lenient-convention' } };
}

function comparison(op: string | undefined): ReportedP['op'] {
  switch (op) {
    case '<':
      return '<';
    case '>':
      return '>';
    case '<=':
    case '≤':
      return '<=';
    case '>=':
    case '≥':
      return '>=';
    default:
      return '=';
  }
}

/**
 * Sentences near a table (its own blocks, and a few paragraphs either side) that name a
 * measure of its long layout ("Job satisfaction was higher in the amber-glasses group,
 * t(57.3) = 4.04"). The link layer decides whether the mention ties the sentence to a block.
 */
export function findTableMentions(segments: readonly Segment[], blocks: readonly TableBlock[], tables: ReadonlyArray<{ table: number; firstBlock: number; lastBlock: number }>): Array<{ table: number; label: string; segment: number; sentence: number }> {
  const out: Array<{ table: number; label: string; segment: number; sentence: number }> = [];
  if (blocks.length === 0) return out;
  const labels = new Map<number, Map<string, number>>();
  for (const b of blocks) {
    const m = labels.get(b.table) ?? new Map<string, number>();
    const key = b.label.toLowerCase();
    m.set(key, (m.get(key) ?? 0) + 1);
    labels.set(b.table, m);
  }
  for (const t of tables) {
    // every label, repeated ones too: a sentence naming a measure printed twice is no tie,
    // and the link layer must see that it names it
    const names = [...(labels.get(t.table) ?? new Map<string, number>())].filter(([name]) => name.length >= 3).map(([name]) => name);
    if (names.length === 0) continue;
    for (const seg of segments) {
      if (seg.table || seg.kind === 'code' || seg.block < t.firstBlock - MENTION_REACH || seg.block > t.lastBlock + MENTION_REACH) continue;
      labelsNamedIn(seg, t.table, names, out);
    }
  }
  return out;
}

/**
 * Each sentence of a segment that names one of a table's labels (lower case) as whole words,
 * once per label and sentence. `/\p{L}/` decides what a whole word is; callers that need a
 * digit to join too check their labels' own edges.
 */
export function labelsNamedIn(seg: Segment, table: number, names: Iterable<string>, out: Array<{ table: number; label: string; segment: number; sentence: number }>, joins: RegExp = LETTER): void {
  const lower = seg.text.toLowerCase();
  let starts: number[] | undefined;
  const seen = new Set<string>();
  for (const name of names) {
    for (let at = lower.indexOf(name); at >= 0; at = lower.indexOf(name, at + 1)) {
      if (joins.test(lower[at - 1] ?? '') || joins.test(lower[at + name.length] ?? '')) continue;
      starts ??= sentenceStarts(seg.text);
      const sentence = sentenceOf(starts, at);
      if (seen.has(`${sentence}:${name}`)) continue;
      seen.add(`${sentence}:${name}`);
      out.push({ table, label: name, segment: seg.id, sentence });
    }
  }
}

const LETTER = /\p{L}/u;

/** How many blocks (paragraphs, captions) before or after a table a sentence may name its measures from. */
const MENTION_REACH = 4;

