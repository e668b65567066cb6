/**
 * The HTML report's pictures, as inline SVG (no script, no external reference).
 *
 * Layout only: every number drawn comes from the report (a result's printed and recomputed p, a
 * finding's `figure`); here numbers become positions. Without a browser there are no font
 * metrics, so label widths are estimated from their characters, on the generous side, and every
 * picture leaves room for its widest label at both ends.
 *
 * p pictures share one axis per report (`pAxisFor`), so strips can be compared down the page; the
 * reported p and the recomputed range sit in lanes of their own, so neither hides the other. A
 * finding about another quantity gets a picture on that quantity's own scale, or none.
 */
import type { Finding, ResultRecord, StatisticRecord } from '../engine/types.js';
import type { CorrelationFigure, DfFigure, IntervalFigure, LatticeFigure, ValueRange } from '../rule-api/types.js';
import { escapeHtml, shortNumber } from './escape.js';

/** The labels' font size in px (REPORT_CSS sets `svg text` to it). */
export const LABEL_PX = 11;

const NARROW = new Set([...'.,:;|!il1jft()[] \'']);
const WIDE = new Set([...'mwMW—%@']);
const SIGNS = new Set([...'−–+=<>±×']);
const SUPERSCRIPT = '⁰¹²³⁴⁵⁶⁷⁸⁹⁻';

/**
 * An upper estimate of a label's width in px at LABEL_PX in a sans-serif face: per character,
 * 0.42 em for narrow ones, 0.45 em for superscripts, 0.66 em for digits and lower case, 0.78 em
 * for capitals, 0.88 em for signs and 1.0 em for the widest letters. (Sans-serif digits are about
 * 0.55–0.64 em and the minus sign about 0.58–0.84 em: common practice, no source; the browser test
 * measures the drawn labels.)
 */
export function labelWidth(s: string): number {
  let em = 0;
  for (const c of s) {
    if (SUPERSCRIPT.includes(c)) em += 0.45;
    else if (NARROW.has(c) && c !== '1') em += 0.42;
    else if (WIDE.has(c)) em += 1.0;
    else if (SIGNS.has(c)) em += 0.88;
    else if (c >= 'A' && c <= 'Z') em += 0.78;
    else em += 0.66;
  }
  return em * LABEL_PX;
}

const f1 = (x: number) => (Math.round(x * 10) / 10).toString();

// ---- the p axis: log scale from 10^min to 1 --------------------------------------------------

/** The p axis every p picture of a report shares: its left bound is 10^min (min a whole number, −12 ≤ min ≤ −3). */
export interface PAxis {
  min: number;
}

/**
 * One p on the axis: the reported p, the recomputed range of the reading that applies, and alpha.
 * A t result gives the range its tails select; an F or χ² its upper tail; a z or r the first
 * reading that reproduces the reported p, else its two-tailed one (the report chose and computed
 * them; this only picks which to draw).
 */
export interface PRow {
  line: number;
  start: number;
  printed: string;
  p: NonNullable<ResultRecord['p']> & { number: NonNullable<NonNullable<ResultRecord['p']>['number']> };
  alpha: number;
  range: ValueRange;
  /** What the range is, for its title: "two-tailed p", "p (upper tail of F)". */
  rangeName: string;
  fits: boolean;
}

/** A t result's row, when its p was recomputed and a numeric p was printed. */
export function resultRow(r: ResultRecord): PRow | undefined {
  if (!r.recomputed || !r.p?.number) return undefined;
  const one = r.sidedness.value === 'one';
  return {
    line: r.start.line, start: r.span.start, printed: r.printed, p: { ...r.p, number: r.p.number }, alpha: r.alpha.value,
    range: one ? r.recomputed.oneTailed : r.recomputed.twoTailed, rangeName: `${one ? 'one' : 'two'}-tailed p`, fits: r.recomputed.standing === 'consistent',
  };
}

/** An F, χ², r or z result's row, when its p was recomputed and a numeric p was printed. */
export function statisticRow(s: StatisticRecord): PRow | undefined {
  const first = s.recomputed?.readings[0];
  if (!s.recomputed || !first || !s.p?.number) return undefined;
  const reading = s.recomputed.readings.find((r) => r.fits) ?? first;
  return {
    line: s.start.line, start: s.span.start, printed: s.printed, p: { ...s.p, number: s.p.number }, alpha: s.alpha.value,
    range: { low: reading.low, high: reading.high }, rangeName: reading.name, fits: s.recomputed.fits,
  };
}

/** Every drawable p of a file in reading order: t results and F, χ², r and z results together, with each one's place in its own list. */
export function pRowsOf(results: readonly ResultRecord[], statistics: readonly StatisticRecord[] = []): Array<{ row: PRow; source: 'result' | 'statistic'; n: number }> {
  const out: Array<{ row: PRow; source: 'result' | 'statistic'; n: number }> = [];
  results.forEach((r, n) => {
    const row = resultRow(r);
    if (row) out.push({ row, source: 'result', n });
  });
  statistics.forEach((st, n) => {
    const row = statisticRow(st);
    if (row) out.push({ row, source: 'statistic', n });
  });
  return out.sort((a, b) => a.row.start - b.row.start);
}

/** A result can be drawn on the p axis when its p was recomputed and a numeric p was printed. */
export function plottable(r: ResultRecord): boolean {
  return resultRow(r) !== undefined;
}

/** One axis for all these results: down to the decade of the smallest p drawn, at least 10⁻³, at most 10⁻¹². */
export function pAxisFor(rows: Iterable<PRow>): PAxis {
  // a loop, not Math.min(...values): a spread of 45,000 results' values overflowed the stack
  let lowest = Infinity;
  for (const r of rows) {
    for (const v of [r.range.low, r.p.number.value, r.alpha]) if (v > 0 && Number.isFinite(v) && v < lowest) lowest = v;
  }
  if (lowest === Infinity) lowest = 1e-3;
  return { min: Math.max(-12, Math.min(-3, Math.floor(Math.log10(lowest) + 1e-9))) };
}

const SUP_DIGITS = '⁰¹²³⁴⁵⁶⁷⁸⁹';
/** A decade's label: 1, 0.1, 0.01, 0.001, then 10⁻⁴ and on. */
function decadeLabel(e: number): string {
  if (e === 0) return '1';
  if (e >= -3) return (10 ** e).toFixed(-e);
  return `10⁻${[...String(-e)].map((d) => SUP_DIGITS[Number(d)]).join('')}`;
}

interface PLayout {
  min: number;
  x0: number;
  width: number;
}

/** Below the axis bound (or zero): drawn at the bound. */
const belowBound = (a: PLayout, p: number) => !(p > 0) || Math.log10(p) < a.min;

const pX = (a: PLayout, p: number) => a.x0 + ((belowBound(a, p) ? a.min : Math.min(0, Math.log10(p))) - a.min) / -a.min * a.width;

/** Room a p axis needs left and right of its drawn length: half its end labels, and the bound marks. */
function pPads(axis: PAxis): { left: number; right: number } {
  return { left: Math.max(12, labelWidth(decadeLabel(axis.min)) / 2 + 3), right: Math.max(10, labelWidth('1') / 2 + 3) };
}

/**
 * The decades that get a label: 1 and the bound always, and every k-th decade from 1 for the
 * smallest k whose labels keep 6 px apart (one next to the bound gives way to it).
 */
function labelledDecades(a: PLayout): number[] {
  const gap = (e1: number, e2: number) => Math.abs(pX(a, 10 ** e1) - pX(a, 10 ** e2)) - (labelWidth(decadeLabel(e1)) + labelWidth(decadeLabel(e2))) / 2;
  for (let k = 1; k < -a.min; k++) {
    const regular: number[] = [];
    for (let e = 0; e > a.min; e -= k) regular.push(e);
    const kept = regular.filter((e) => e === 0 || gap(e, a.min) >= 6);
    if (kept.every((e, i) => i === 0 || gap(kept[i - 1] as number, e) >= 6)) return [...kept, a.min];
  }
  return [0, a.min];
}

/** Grid lines at every decade, tick marks under the axis, and the labels that fit. */
function pTicks(a: PLayout, yTop: number, yAxis: number): string {
  const labelled = new Set(labelledDecades(a));
  const out: string[] = [];
  for (let e = 0; e >= a.min; e--) {
    const x = f1(pX(a, 10 ** e));
    out.push(`<line class="grid" x1="${x}" y1="${yTop}" x2="${x}" y2="${yAxis}"/><line class="axis" x1="${x}" y1="${yAxis}" x2="${x}" y2="${yAxis + 4}"/>`);
    if (labelled.has(e)) out.push(`<text class="tick" x="${x}" y="${yAxis + 15}" text-anchor="middle">${decadeLabel(e)}</text>`);
  }
  return out.join('');
}

/**
 * The reported p in its lane: a circle for "=", a triangle pointing the way of a bound ("<", ">").
 * A p printed as zero, or below the axis bound, is drawn at the bound as a bound: a bar at the
 * bound with a triangle pointing at it.
 */
function pMarker(r: PRow, a: PLayout, y: number): string {
  const op = r.p.op;
  const value = r.p.number.value;
  const printed = `${op} ${r.p.number.printed}`;
  if (belowBound(a, value)) {
    const x = a.x0;
    const title = value > 0 ? `reported p ${printed}: below ${decadeLabel(a.min)}, drawn at the axis bound` : `reported p ${printed}: a p printed as zero stands for a bound (a small p rounded down), drawn at the axis bound ${decadeLabel(a.min)}`;
    return `<path class="reported bound" d="M${f1(x)},${y - 7} L${f1(x)},${y + 7} M${f1(x + 1.5)},${y} L${f1(x + 10)},${y - 5} L${f1(x + 10)},${y + 5} Z"><title>${escapeHtml(title)}</title></path>`;
  }
  const x = pX(a, value);
  const title = `<title>reported p ${escapeHtml(printed)}</title>`;
  if (op === '<' || op === '<=') return `<path class="reported" d="M${f1(x - 7)},${y} L${f1(x + 2)},${y - 5} L${f1(x + 2)},${y + 5} Z">${title}</path>`;
  if (op === '>' || op === '>=') return `<path class="reported" d="M${f1(x + 7)},${y} L${f1(x - 2)},${y - 5} L${f1(x - 2)},${y + 5} Z">${title}</path>`;
  return `<circle class="reported" cx="${f1(x)}" cy="${y}" r="4.5">${title}</circle>`;
}

/** The recomputed p range in its lane, at least 3 px wide; a range reaching below the bound gets an arrow there. */
function pRange(r: PRow, a: PLayout, y: number, h: number): string {
  const { low, high } = r.range;
  let x1 = pX(a, low);
  let x2 = pX(a, high);
  if (x2 - x1 < 3) {
    const c = Math.max(a.x0 + 1.5, (x1 + x2) / 2);
    x1 = c - 1.5;
    x2 = c + 1.5;
  }
  const fits = r.fits;
  const off = belowBound(a, low);
  const title = `recomputed ${escapeHtml(r.rangeName)} ${shortNumber(low)} to ${shortNumber(high)}${off ? `, reaching below the axis bound ${decadeLabel(a.min)}` : ''}`;
  const arrow = off ? `<path class="range off" d="M${f1(a.x0 - 6)},${y} L${f1(a.x0 - 1)},${y - h / 2} L${f1(a.x0 - 1)},${y + h / 2} Z"><title>${title}</title></path>` : '';
  return `${arrow}<rect class="range${fits ? ' fits' : ''}" x="${f1(x1)}" y="${y - h / 2}" width="${f1(x2 - x1)}" height="${h}"><title>${title}</title></rect>`;
}

/** Width of every p strip (cards and the results list), so they line up down the page. */
export const STRIP_WIDTH = 300;
const STRIP_HEIGHT = 54;

/** Where the reported p sits against the recomputed p range, for one test, on the report's shared axis. */
export function pStrip(r: PRow, axis: PAxis): string {
  const pads = pPads(axis);
  const a: PLayout = { min: axis.min, x0: pads.left, width: STRIP_WIDTH - pads.left - pads.right };
  const yAxis = 33;
  const alphaX = f1(pX(a, r.alpha));
  const { low, high } = r.range;
  return `<svg class="pstrip" role="img" width="${STRIP_WIDTH}" height="${STRIP_HEIGHT}" viewBox="0 0 ${STRIP_WIDTH} ${STRIP_HEIGHT}" data-axis-min="${axis.min}" aria-label="reported p ${escapeHtml(r.p.op)} ${escapeHtml(r.p.number.printed)} against recomputed range ${shortNumber(low)} to ${shortNumber(high)}">
${pTicks(a, 2, yAxis)}<line class="axis" x1="${f1(a.x0)}" y1="${yAxis}" x2="${f1(a.x0 + a.width)}" y2="${yAxis}"/>
<line class="alpha" x1="${alphaX}" y1="2" x2="${alphaX}" y2="${yAxis}"><title>alpha ${escapeHtml(String(r.alpha))}</title></line>
${pRange(r, a, 23, 8)}${pMarker(r, a, 9)}</svg>`;
}

/** One row's label in the overview, cut to fit its column. */
function rowLabel(text: string, room: number): string {
  if (labelWidth(text) <= room) return text;
  let cut = text;
  while (cut.length > 1 && labelWidth(`${cut}…`) > room) cut = cut.slice(0, -1);
  return `${cut}…`;
}

/**
 * Every drawable test in reading order on the report's shared axis: the reported p above, the
 * recomputed range below it, alpha across. `link(item)` is the anchor an item's row leads to;
 * `mark(item)` the severity symbol of its worst finding, if any. Written piece by piece, a row
 * per test, so a paper of any length fits no one string.
 */
export function* pOverviewChunks<T extends { row: PRow }>(items: readonly T[], axis: PAxis, link: (item: T) => string, mark: (item: T) => { symbol: string; level: string } | undefined): Generator<string> {
  const rows = items.map((item) => ({ r: item.row, item }));
  const labelRoom = 220;
  const labelCol = 16 + labelRoom + 10;
  const pads = pPads(axis);
  const a: PLayout = { min: axis.min, x0: labelCol + pads.left, width: 460 };
  const width = a.x0 + a.width + pads.right;
  const rowH = 26;
  const top = 22;
  const yAxis = top + rows.length * rowH;
  const height = yAxis + 22;
  const row = ({ r, item }: (typeof rows)[number], k: number) => {
    const y = top + k * rowH + rowH / 2;
    const flagged = mark(item);
    const sym = flagged ? `<text x="2" y="${y + 4}" class="lvl-${flagged.level}" style="fill: var(--c)">${flagged.symbol}</text>` : '';
    const text = rowLabel(`L${r.line} ${r.printed}`, labelRoom);
    return `<a href="#${link(item)}"><rect class="row" x="0" y="${y - rowH / 2}" width="${width}" height="${rowH}" fill="transparent"/>${sym}<text class="rowlabel" x="16" y="${y + 4}">${escapeHtml(text)}</text>${pMarker(r, a, y - 6)}${pRange(r, a, y + 6, 7)}</a>`;
  };
  // one label per alpha, left out where it would crowd another (its line keeps a title)
  const placed: Array<[number, number]> = [];
  const alphaLines = [...new Set(rows.map(({ r }) => r.alpha))]
    .map((al) => {
      const x = pX(a, al);
      const text = `α = ${al}`;
      const w = labelWidth(text);
      const cx = Math.min(Math.max(x, w / 2 + 2), width - w / 2 - 2);
      const free = placed.every(([l, rt]) => cx + w / 2 + 4 < l || cx - w / 2 - 4 > rt);
      if (free) placed.push([cx - w / 2, cx + w / 2]);
      return `<line class="alpha" x1="${f1(x)}" y1="${top - 6}" x2="${f1(x)}" y2="${yAxis}"><title>alpha ${al}</title></line>${free ? `<text class="alphalabel" x="${f1(cx)}" y="${top - 9}" text-anchor="middle">${escapeHtml(text)}</text>` : ''}`;
    })
    .join('');
  yield `<svg class="forest" role="img" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" data-axis-min="${axis.min}" aria-label="recomputed p ranges and reported p values for ${rows.length} tests">
${pTicks(a, top - 4, yAxis)}<line class="axis" x1="${f1(a.x0)}" y1="${yAxis}" x2="${f1(a.x0 + a.width)}" y2="${yAxis}"/>
${alphaLines}
`;
  for (let k = 0; k < rows.length; k++) yield `${k > 0 ? '\n' : ''}${row(rows[k] as (typeof rows)[number], k)}`;
  yield `
</svg>
<p class="legend">Each row: the reported p above (circle: a value; triangle: a bound such as p &lt; .001; bar with triangle at the left end: a p printed as zero, or below ${decadeLabel(axis.min)}, drawn at the axis bound), and below it the p values the statistic and its df allow within rounding (light when the reported p lies among them; an arrow where they reach below the axis). Dashed line: alpha. Every p picture in this report uses this axis. Each row links to its result.</p>`;
}

// ---- pictures on a finding's own scale --------------------------------------------------------

interface Lane {
  label: string;
  /** The lane's marks, given the value-to-x function and the lane's middle. */
  draw: (x: (v: number) => number, y: number) => string;
}

/** A number as a tick label: as many decimals as the step has, with a true minus sign. */
function tickLabel(v: number, step: number): string {
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
  const s = (Math.abs(v) < step / 2 ? 0 : v).toFixed(decimals);
  return s.replace('-', '−');
}

/** The densest round step (1, 2 or 5 × 10^k, at least minStep) whose labels do not touch, and its ticks. */
function linearTicks(lo: number, hi: number, widthPx: number, minStep: number): Array<{ value: number; label: string }> {
  const span = hi - lo;
  const top = Math.floor(Math.log10(span)) + 1;
  let last: Array<{ value: number; label: string }> = [];
  for (let e = top - 3; e <= top + 1; e++) {
    for (const m of [1, 2, 5]) {
      const step = m * 10 ** e;
      if (step < minStep) continue;
      const ticks: Array<{ value: number; label: string }> = [];
      for (let k = Math.ceil(lo / step - 1e-9); k * step <= hi + 1e-9 * step; k++) ticks.push({ value: k * step, label: tickLabel(k * step, step) });
      if (ticks.length === 0) continue;
      last = ticks;
      const widest = Math.max(...ticks.map((t) => labelWidth(t.label)));
      if ((step / span) * widthPx >= widest + 8) return ticks;
    }
  }
  return last;
}

/** Width of every picture on a finding's own scale (the same as a p strip). */
const PICTURE_WIDTH = STRIP_WIDTH;

/**
 * A picture on a linear scale: one lane per drawn quantity with its label at the left, an axis
 * with round ticks under them, and vertical reference lines. Values outside [lo, hi] are drawn at
 * the edge (the caller adds an arrow where that happens).
 */
function linearPicture(o: { cls: string; aria: string; domain: [number, number]; lanes: Lane[]; minStep?: number; lines?: Array<{ value: number; title: string }> }): string {
  let [lo, hi] = o.domain;
  const span0 = hi - lo;
  const padV = span0 > 0 ? 0.08 * span0 : Math.max(Math.abs(lo) * 0.1, 1);
  lo -= padV;
  hi += padV;
  const labelCol = Math.ceil(Math.max(...o.lanes.map((l) => labelWidth(l.label)))) + 12;
  // the axis' ends leave half the widest tick label free; two passes settle ticks and room
  const room = (ticks: Array<{ label: string }>) => Math.max(10, Math.ceil(Math.max(0, ...ticks.map((t) => labelWidth(t.label))) / 2) + 3);
  let pad = 24;
  let ticks = linearTicks(lo, hi, PICTURE_WIDTH - labelCol - 2 * pad, o.minStep ?? 0);
  for (let pass = 0; pass < 3 && room(ticks) !== pad; pass++) {
    // after the first pass the room only grows, so the passes settle
    pad = pass === 0 ? room(ticks) : Math.max(pad, room(ticks));
    ticks = linearTicks(lo, hi, PICTURE_WIDTH - labelCol - 2 * pad, o.minStep ?? 0);
  }
  pad = Math.max(pad, room(ticks));
  const x0 = labelCol + pad;
  const width = PICTURE_WIDTH - x0 - pad;
  const x = (v: number) => x0 + ((Math.min(Math.max(v, lo), hi) - lo) / (hi - lo)) * width;
  const laneH = 18;
  const top = 4;
  const yAxis = top + o.lanes.length * laneH + 4;
  const height = yAxis + 20;
  const grid = ticks.map((t) => `<line class="grid" x1="${f1(x(t.value))}" y1="${top}" x2="${f1(x(t.value))}" y2="${yAxis}"/><line class="axis" x1="${f1(x(t.value))}" y1="${yAxis}" x2="${f1(x(t.value))}" y2="${yAxis + 4}"/><text class="tick" x="${f1(x(t.value))}" y="${yAxis + 15}" text-anchor="middle">${t.label}</text>`).join('');
  const lines = (o.lines ?? []).map((l) => `<line class="refline" x1="${f1(x(l.value))}" y1="${top}" x2="${f1(x(l.value))}" y2="${yAxis}"><title>${escapeHtml(l.title)}</title></line>`).join('');
  const lanes = o.lanes.map((l, i) => {
    const y = top + i * laneH + laneH / 2;
    // from the left edge, so a label wider than estimated runs toward the plot, never off the picture
    return `<text class="lane" x="2" y="${y + 4}">${escapeHtml(l.label)}</text>${l.draw(x, y)}`;
  });
  return `<svg class="${o.cls}" role="img" width="${PICTURE_WIDTH}" height="${height}" viewBox="0 0 ${PICTURE_WIDTH} ${height}" data-domain="${lo} ${hi}" aria-label="${escapeHtml(o.aria)}">
${grid}<line class="axis" x1="${f1(x0)}" y1="${yAxis}" x2="${f1(x0 + width)}" y2="${yAxis}"/>${lines}
${lanes.join('\n')}
</svg>`;
}

/** A horizontal bar from a to b (at least 3 px wide), in a lane. */
function hbar(x: (v: number) => number, a: number, b: number, y: number, h: number, cls: string, title: string): string {
  let x1 = x(Math.min(a, b));
  let x2 = x(Math.max(a, b));
  if (x2 - x1 < 3) {
    const c = (x1 + x2) / 2;
    x1 = c - 1.5;
    x2 = c + 1.5;
  }
  return `<rect class="${cls}" x="${f1(x1)}" y="${y - h / 2}" width="${f1(x2 - x1)}" height="${h}"><title>${escapeHtml(title)}</title></rect>`;
}

/** A diamond at the middle of a range (a point value, or the rounding interval of one). */
function diamond(x: (v: number) => number, r: ValueRange, y: number, cls: string, title: string): string {
  const c = (x(r.low) + x(r.high)) / 2;
  return `<path class="${cls}" d="M${f1(c)},${y - 5.5} L${f1(c + 5.5)},${y} L${f1(c)},${y + 5.5} L${f1(c - 5.5)},${y} Z"><title>${escapeHtml(title)}</title></path>`;
}

const between = (r: ValueRange) => (r.low === r.high ? shortNumber(r.low) : `${shortNumber(r.low)} to ${shortNumber(r.high)}`);

function intervalPicture(g: IntervalFigure): string {
  const pct = `${Math.round(g.level * 100)}%`;
  const values = [g.lower.low, g.upper.high, g.estimate.low, g.estimate.high, ...(g.fromT ? [g.fromT.lower.low, g.fromT.upper.high] : []), ...(g.reference ? [g.reference.value] : [])];
  const lanes: Lane[] = [
    {
      label: `printed ${pct} CI`,
      draw: (x, y) =>
        `${hbar(x, g.lower.low, g.upper.high, y, 8, 'ci', `printed interval ${between(g.lower)} to ${between(g.upper)}${g.shiftedBy !== undefined ? ` (limits minus the test value ${g.shiftedBy})` : ''}`)}` +
        `${hbar(x, g.midpoint.low, g.midpoint.high, y, 14, 'mid', `its midpoint ${between(g.midpoint)}`)}`,
    },
    { label: 'estimate', draw: (x, y) => diamond(x, g.estimate, y, 'estimate', `estimate ${between(g.estimate)} (${g.estimateSource})`) },
  ];
  const t = g.fromT;
  if (t) {
    lanes.push({
      label: 'CI that t implies',
      draw: (x, y) =>
        `${hbar(x, t.lower.high, t.upper.low, y, 8, 'implied', `the ${pct} interval the reported t implies: ${between(t.lower)} to ${between(t.upper)}`)}` +
        `${hbar(x, t.lower.low, t.lower.high, y, 8, 'implied loose', `its lower limit, over the rounding of the inputs: ${between(t.lower)}`)}` +
        `${hbar(x, t.upper.low, t.upper.high, y, 8, 'implied loose', `its upper limit, over the rounding of the inputs: ${between(t.upper)}`)}`,
    });
  }
  const svg = linearPicture({
    cls: 'figure interval',
    aria: `printed ${pct} interval ${between(g.lower)} to ${between(g.upper)} against the estimate ${between(g.estimate)}${t ? ` and the interval t implies, ${between(t.lower)} to ${between(t.upper)}` : ''}`,
    domain: [Math.min(...values), Math.max(...values)],
    lanes,
    ...(g.reference ? { lines: [{ value: g.reference.value, title: g.reference.label }] } : {}),
  });
  const shifted = g.shiftedBy !== undefined ? ` The printed limits minus the test value ${shortNumber(g.shiftedBy)}, read as the interval of the mean.` : '';
  return `${svg}<p class="figcap">The printed interval (its midpoint marked), the estimate (${escapeHtml(g.estimateSource)})${t ? ', and the interval the reported t implies around the estimate, estimate ± critical value × |estimate| / |t| (lighter ends: the rounding of the printed numbers)' : ''}.${g.reference ? ` Solid line: ${escapeHtml(g.reference.label)}.` : ''}${shifted}</p>`;
}

function dfPicture(g: DfFigure): string {
  const values = [g.reported.low, g.reported.high, ...g.allowed.flatMap((a) => [a.low, a.high])];
  const whole = values.every((v) => Number.isInteger(v));
  const lanes: Lane[] = [
    ...g.allowed.map((a): Lane => ({
      label: a.label,
      draw: (x, y) => (a.low === a.high ? diamond(x, a, y, 'allowed', `${a.label}: df ${shortNumber(a.low)}`) : hbar(x, a.low, a.high, y, 8, 'allowed', `${a.label}: df ${between(a)}`)),
    })),
    { label: 'printed df', draw: (x, y) => `${g.reported.low === g.reported.high ? '' : hbar(x, g.reported.low, g.reported.high, y, 8, 'ci', `printed df, within its rounding: ${between(g.reported)}`)}<circle class="reported" cx="${f1((x(g.reported.low) + x(g.reported.high)) / 2)}" cy="${y}" r="4.5"><title>printed df ${escapeHtml(between(g.reported))}</title></circle>` },
  ];
  const svg = linearPicture({ cls: 'figure df', aria: `printed df ${between(g.reported)} against the df the group sizes allow: ${g.allowed.map((a) => `${a.label} ${between(a)}`).join('; ')}`, domain: [Math.min(...values), Math.max(...values)], lanes, ...(whole ? { minStep: 1 } : {}) });
  return `${svg}<p class="figcap">Diamonds and bars: the df the group sizes allow; circle: the printed df.</p>`;
}

function latticePicture(g: LatticeFigure): string {
  const lanes: Lane[] = [
    { label: 'possible means', draw: (x, y) => g.possible.map((m) => `<circle class="possible" cx="${f1(x(m))}" cy="${y}" r="3"><title>possible mean ${shortNumber(m)} (a multiple of 1/${g.denominator})</title></circle>`).join('') },
    { label: 'printed mean', draw: (x, y) => hbar(x, g.reported.low, g.reported.high, y, 10, 'reported-range', `values that round to the printed mean: ${between(g.reported)}`) },
  ];
  const svg = linearPicture({ cls: 'figure lattice', aria: `possible means ${g.possible.map(shortNumber).join(', ')} around the printed mean, which allows ${between(g.reported)}`, domain: [Math.min(...g.possible, g.reported.low), Math.max(...g.possible, g.reported.high)], lanes });
  return `${svg}<p class="figcap">Dots: means that whole-number scores can have here, the multiples of 1/${g.denominator} (GRIM). Bar: the values that round to the printed mean; no dot falls in it.</p>`;
}

/** How far beyond [−1, 1] a correlation picture reaches before it draws an arrow. */
const CORRELATION_REACH = 4;

function correlationPicture(g: CorrelationFigure): string {
  const lo = Math.min(-1, Math.max(g.implied.low, -CORRELATION_REACH));
  const hi = Math.max(1, Math.min(g.implied.high, CORRELATION_REACH));
  const offLow = !(g.implied.low >= lo);
  const offHigh = !(g.implied.high <= hi);
  const show = (v: number) => (Number.isFinite(v) ? shortNumber(v) : v > 0 ? 'unbounded' : '−unbounded');
  const title = `implied correlation ${show(g.implied.low)} to ${show(g.implied.high)}`;
  const lanes: Lane[] = [
    { label: 'possible r', draw: (x, y) => hbar(x, -1, 1, y, 8, 'feasible', 'correlations that exist: −1 to 1') },
    {
      label: 'implied r',
      draw: (x, y) =>
        `${hbar(x, Math.max(g.implied.low, lo - 1), Math.min(g.implied.high, hi + 1), y, 8, 'implied-r', title)}` +
        (offLow ? `<path class="implied-r off" d="M${f1(x(lo) - 7)},${y} L${f1(x(lo) - 1)},${y - 4} L${f1(x(lo) - 1)},${y + 4} Z"><title>${escapeHtml(title)}</title></path>` : '') +
        (offHigh ? `<path class="implied-r off" d="M${f1(x(hi) + 7)},${y} L${f1(x(hi) + 1)},${y - 4} L${f1(x(hi) + 1)},${y + 4} Z"><title>${escapeHtml(title)}</title></path>` : ''),
    },
  ];
  const svg = linearPicture({ cls: 'figure correlation', aria: `${title}, against the correlations that exist, −1 to 1`, domain: [lo, hi], lanes, lines: [{ value: -1, title: 'r = −1' }, { value: 1, title: 'r = 1' }] });
  return `${svg}<p class="figcap">Light bar: the correlations that exist, from −1 to 1. Dark bar: the correlation between the two measurements that the printed means, SDs, n and t imply${offLow || offHigh ? ' (an arrow: it reaches beyond the picture)' : ''}.</p>`;
}

/** The picture of one finding: the p strip for a finding about p, its own quantity's picture otherwise, or nothing. */
export function findingPicture(f: Finding, result: ResultRecord | StatisticRecord | undefined, axis: PAxis): string {
  const g = f.figure;
  if (!g) return '';
  switch (g.kind) {
    case 'p':
      {
        const row = result === undefined ? undefined : 'kind' in result ? statisticRow(result) : resultRow(result);
        return row ? `<div class="picture">${pStrip(row, axis)}</div>` : '';
      }
    case 'interval':
      return `<div class="picture">${intervalPicture(g)}</div>`;
    case 'df':
      return `<div class="picture">${dfPicture(g)}</div>`;
    case 'lattice':
      return `<div class="picture">${latticePicture(g)}</div>`;
    case 'correlation':
      return `<div class="picture">${correlationPicture(g)}</div>`;
  }
}
