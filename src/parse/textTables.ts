/**
 * Tables in plain text: rows one per line with ` | ` between cells (text converted from XML or
 * LaTeX), or columns aligned with runs of spaces or tabs (text pulled from PDFs). Lines here
 * are the content of one source line each, `from`/`to` its trimmed extent and `start` where
 * the source line begins (columns are counted from there, so indentation is layout too).
 */
export interface TextLine {
  start: number;
  from: number;
  to: number;
  text: string;
}

/** One cell: its trimmed source range and place. */
export interface TextCell {
  from: number;
  to: number;
  row: number;
  column: number;
  colSpan?: number;
}

/** A pipe is a cell separator when a space, a tab or the line's edge is beside it (`Pr(>|t|)` keeps its bars). */
function separators(text: string): number[] {
  const out: number[] = [];
  for (let k = text.indexOf('|'); k >= 0; k = text.indexOf('|', k + 1)) {
    const before = k === 0 ? ' ' : text[k - 1];
    const after = k === text.length - 1 ? ' ' : text[k + 1];
    if (before === ' ' || before === '\t' || after === ' ' || after === '\t') out.push(k);
  }
  return out;
}

/** Whether a line is a ` | ` row: some separator has text on both sides. */
export function isPipeRow(text: string): boolean {
  if (!text.includes('|')) return false;
  let first = 0;
  while (first < text.length && (text[first] === ' ' || text[first] === '\t')) first += 1;
  let last = text.length - 1;
  while (last > first && (text[last] === ' ' || text[last] === '\t')) last -= 1;
  return separators(text).some((k) => k > first && k < last);
}

/** `|---|:--:|` or `-----+-----`: a rule between rows, not a row. */
const RULE_ROW = /^[-=:+| \t]{1,2000}$/;

/**
 * The ` | ` table starting at `lines[at]`, or undefined. Consecutive rows (the caller passes
 * lines without blank lines between them); a short line between two rows (a group label such
 * as `Study 2`) is a one-cell row of the table. A bar opening every row is a border, as is one
 * closing every row; otherwise a leading bar stands for an empty first cell.
 */
export function pipeTable(lines: readonly TextLine[], at: number): { end: number; cells: TextCell[] } | undefined {
  let end = at;
  let rows = 0;
  while (end < lines.length) {
    const line = lines[end] as TextLine;
    if (isPipeRow(line.text)) {
      rows += 1;
      end += 1;
    } else if (rows > 0 && RULE_ROW.test(line.text) && line.text.includes('-')) end += 1;
    else if (rows > 0 && line.text.length <= 80 && end + 1 < lines.length && isPipeRow((lines[end + 1] as TextLine).text)) end += 1;
    else break;
  }
  if (rows < 2) return undefined;
  while (end > at && !isPipeRow((lines[end - 1] as TextLine).text)) end -= 1;
  const block = lines.slice(at, end);
  const rowsOnly = block.filter((l) => isPipeRow(l.text));
  const borderStart = rowsOnly.every((l) => l.text.startsWith('|'));
  const borderEnd = rowsOnly.every((l) => l.text.endsWith('|'));
  const cells: TextCell[] = [];
  let row = 0;
  for (const line of block) {
    if (RULE_ROW.test(line.text) && line.text.includes('-')) continue;
    if (!isPipeRow(line.text)) {
      cells.push({ from: line.from, to: line.to, row, column: 0 });
      row += 1;
      continue;
    }
    const seps = separators(line.text);
    const bounds = [-1, ...seps, line.text.length];
    let column = 0;
    for (let k = 0; k + 1 < bounds.length; k += 1) {
      const a = (bounds[k] as number) + 1;
      const b = bounds[k + 1] as number;
      if (k === 0 && a === b && borderStart) continue;
      if (k === bounds.length - 2 && a === b && borderEnd) continue;
      const [s, e] = trimRange(line.text, a, b);
      if (e > s) cells.push({ from: line.from + s, to: line.from + e, row, column });
      column += 1;
    }
    row += 1;
  }
  return { end, cells };
}

/** A line with a gap of two or more spaces, or a tab, between two pieces of text. */
export function hasColumnGap(text: string): boolean {
  if (text.length > 300) return false;
  if (text.includes('\t')) return true;
  const gap = text.indexOf('  ');
  return gap > 0 && text.slice(gap).trim() !== '';
}

const DIGIT = /[0-9]/;
/** Tables of text cells are short per cell; aligned prose is not (average characters per cell). */
const MAX_MEAN_CELL = 25;

/**
 * A table of aligned columns made of `lines` (a header line and at least two body lines, all
 * with a column gap): columns are the stretches the body lines fill, separated by gutters at
 * least two characters wide that every body line leaves blank; a header word over several
 * columns spans them. Undefined when the lines do not line up, or when the cells beside the
 * row labels are mostly not numbers (prose typed with two spaces after each full stop).
 */
export function alignedTable(lines: readonly TextLine[]): TextCell[] | undefined {
  if (lines.length < 3) return undefined;
  if (lines.some((l) => l.text.includes('\t'))) return tabTable(lines);
  const body = lines.slice(1);
  const cols = lines.map(displayColumns);
  let width = 0;
  body.forEach((l, r) => {
    const c = cols[r + 1] as Int32Array;
    width = Math.max(width, (c[c.length - 1] ?? 0) + 1);
  });
  const filled = new Uint8Array(width);
  body.forEach((l, r) => {
    const c = cols[r + 1] as Int32Array;
    for (let i = 0; i < l.to - l.from; i += 1) if (l.text[i] !== ' ') for (let k = c[i] as number; k < (c[i + 1] as number); k += 1) filled[k] = 1;
  });
  const columns: Array<[number, number]> = [];
  for (let p = 0; p < width; ) {
    if (!filled[p]) {
      p += 1;
      continue;
    }
    let q = p;
    // a column runs on over gaps narrower than a gutter
    while (q < width && (filled[q] || (q + 1 < width && filled[q + 1] && q > p))) q += 1;
    columns.push([p, q]);
    p = q;
  }
  if (columns.length < 2) return undefined;
  const cells: TextCell[] = [];
  const header = lines[0] as TextLine;
  const headerCols = cols[0] as Int32Array;
  const headerColumns = new Set<number>();
  for (const [s, e] of words(header.text)) {
    const a = headerCols[s] as number;
    const b = headerCols[e] as number;
    let first = columns.findIndex(([, ce]) => ce > a);
    if (first < 0) first = columns.length - 1;
    let last = first;
    while (last + 1 < columns.length && (columns[last + 1] as [number, number])[0] < b) last += 1;
    headerColumns.add(first);
    cells.push({ from: header.from + s, to: header.from + e, row: 0, column: first, ...(last > first ? { colSpan: last - first + 1 } : {}) });
  }
  if (headerColumns.size < 2) return undefined;
  let bodyCells = 0;
  let characters = 0;
  let fullRows = 0;
  let valueCells = 0;
  let numbers = 0;
  body.forEach((l, r) => {
    const c = cols[r + 1] as Int32Array;
    let inRow = 0;
    let i = 0;
    const n = l.to - l.from;
    columns.forEach(([a, b], col) => {
      // the characters whose display columns start inside this column
      while (i < n && (c[i] as number) < a) i += 1;
      let j = i;
      while (j < n && (c[j] as number) < b) j += 1;
      const [s, e] = trimRange(l.text, i, j);
      i = j;
      if (e <= s) return;
      cells.push({ from: l.from + s, to: l.from + e, row: r + 1, column: col });
      inRow += 1;
      characters += e - s;
      if (col > 0) {
        valueCells += 1;
        if (DIGIT.test(l.text.slice(s, e))) numbers += 1;
      }
    });
    bodyCells += inRow;
    if (inRow >= 2) fullRows += 1;
  });
  // the tables worth reading hold numbers beside their row labels; aligned prose does not
  if (fullRows < 2 || characters > MAX_MEAN_CELL * bodyCells || numbers * 2 < valueCells) return undefined;
  return cells;
}

/** Ligatures as PDF text keeps them: one character standing for two or three letters' width. */
const LIGATURE_WIDTH: Readonly<Record<string, number>> = { '\uFB00': 2, '\uFB01': 2, '\uFB02': 2, '\uFB03': 3, '\uFB04': 3, '\uFB05': 2, '\uFB06': 2 };

/**
 * The display column where each character of a line starts (index i; index length is the
 * column after the last), counted from the source line's start: a ligature is as wide as the
 * letters it stands for, so columns after "eﬀort" line up with those of lines without one.
 */
function displayColumns(l: TextLine): Int32Array {
  const n = l.to - l.from;
  const out = new Int32Array(n + 1);
  let col = l.from - l.start;
  for (let i = 0; i < n; i += 1) {
    out[i] = col;
    col += LIGATURE_WIDTH[l.text[i] as string] ?? 1;
  }
  out[n] = col;
  return out;
}

/** Tab-separated lines: cells between runs of tabs. */
function tabTable(lines: readonly TextLine[]): TextCell[] | undefined {
  if (!lines.every((l) => l.text.includes('\t'))) return undefined;
  const cells: TextCell[] = [];
  let fullRows = 0;
  lines.forEach((l, row) => {
    let column = 0;
    let a = 0;
    for (let k = 0; k <= l.text.length; k += 1) {
      if (k < l.text.length && l.text[k] !== '\t') continue;
      const [s, e] = trimRange(l.text, a, k);
      if (e > s) cells.push({ from: l.from + s, to: l.from + e, row, column });
      column += 1;
      while (k + 1 < l.text.length && l.text[k + 1] === '\t') k += 1;
      a = k + 1;
    }
    if (row > 0 && column >= 2) fullRows += 1;
  });
  return fullRows >= 2 ? cells : undefined;
}

/** Pieces of a line separated by two or more spaces. */
function words(text: string): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  let k = 0;
  while (k < text.length) {
    while (k < text.length && text[k] === ' ') k += 1;
    if (k >= text.length) break;
    const s = k;
    while (k < text.length && !(text[k] === ' ' && (text[k + 1] === ' ' || k + 1 === text.length))) k += 1;
    out.push([s, k]);
  }
  return out;
}

function trimRange(text: string, a: number, b: number): [number, number] {
  let s = a;
  let e = b;
  while (s < e && (text[s] === ' ' || text[s] === '\t')) s += 1;
  while (e > s && (text[e - 1] === ' ' || text[e - 1] === '\t')) e -= 1;
  return [s, e];
}
