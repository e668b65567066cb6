import { decodeNamedCharacterReference } from 'decode-named-character-reference';
import { MappedText } from './builder.js';
import type { TablePlace } from './types.js';

/** What the reader found: a cell at its place, or a table's `<caption>`. */
export type HtmlTablePart = { kind: 'cell'; text: MappedText; place: TablePlace } | { kind: 'caption'; text: MappedText; table: number };

interface OpenTable {
  index: number;
  row: number;
  /** Next free column of the current row. */
  column: number;
  /** For each column, the first row a cell spanning down from above no longer covers. */
  coveredUntil: number[];
  /** Column steps left for span bookkeeping (keeps hostile spans linear; then spans are ignored). */
  budget: number;
}

interface OpenText {
  text: MappedText;
  /** The last character written (reading it back from the growing string would copy it). */
  last: string;
  place?: TablePlace;
  table: number;
}

/** Longest attribute text read in a tag (a `<` without its `>` nearby is text). */
const MAX_ATTRIBUTES = 2000;
const CHARACTER_REFERENCE = /&(#[0-9]{1,7}|#[xX][0-9a-fA-F]{1,6}|[A-Za-z][A-Za-z0-9]{1,31});/y;
const SPAN_ATTRIBUTE = /\b(rowspan|colspan)[ \t\n]{0,5}=[ \t\n]{0,5}["']?[ \t]{0,5}([0-9]{1,6})/gi;
/** Tags inside a cell that change only the look of the text: no word boundary. */
const INLINE = new Set(['i', 'em', 'b', 'strong', 'span', 'sub', 'sup', 'a', 'font', 'u', 's', 'small', 'big', 'code', 'tt', 'strike', 'del', 'ins', 'mark', 'abbr', 'var', 'math', 'mi', 'mn', 'mo']);
/** HTML's limits on spans (the HTML Living Standard, "processing model" of tables). */
const MAX_COLSPAN = 1000;
const MAX_ROWSPAN = 65534;
/** Span bookkeeping per table: a fixed allowance plus some per cell. */
const BUDGET_BASE = 20_000;
const BUDGET_PER_CELL = 64;

/**
 * Tables written as HTML inside Markdown (PDF converters emit `<html><body><table>…` on one
 * line): every `<td>`/`<th>` becomes a cell at its row and column, columns counted after the
 * row and column spans of earlier cells as browsers do. Cell text has its character references
 * decoded, `<sup>` read as an exponent mark and `<br>` as a line break, other inline tags
 * dropped, whitespace runs read as one space; each character maps to its source. The HTML may
 * come in several pieces (blank lines end an HTML block in Markdown): a table left open is
 * continued by the next piece until `finish`.
 */
export class HtmlTableReader {
  private tables: OpenTable[] = [];
  private current: OpenText | undefined;

  constructor(
    private readonly src: string,
    private readonly nextTable: () => number,
    private readonly onPart: (part: HtmlTablePart) => void,
  ) {}

  get open(): boolean {
    return this.tables.length > 0;
  }

  /** Read the HTML at `src[start, end)`. */
  feed(start: number, end: number): void {
    let i = start;
    while (i < end) {
      const lt = this.src.indexOf('<', i);
      const stop = lt < 0 || lt >= end ? end : lt;
      if (stop > i) this.text(i, stop);
      if (stop >= end) return;
      i = this.markup(stop, end);
    }
  }

  /** Close the cell and every table still open. */
  finish(): void {
    this.closeText();
    this.tables = [];
  }

  /** The markup at `at` (`<`): a comment, a tag, or a lone `<` read as text. Returns where reading goes on. */
  private markup(at: number, end: number): number {
    if (this.src.startsWith('<!--', at)) {
      const close = this.src.indexOf('-->', at + 4);
      return close < 0 || close + 3 > end ? end : close + 3;
    }
    const tag = readTag(this.src, at, end);
    if (!tag) {
      this.text(at, at + 1);
      return at + 1;
    }
    const { after, closing, name, attributes } = tag;
    const table = this.tables.at(-1);
    switch (name) {
      case 'table':
        this.closeText();
        if (closing) this.tables.pop();
        else this.tables.push({ index: this.nextTable(), row: -1, column: 0, coveredUntil: [], budget: BUDGET_BASE });
        return after;
      case 'caption':
        this.closeText();
        if (!closing && table) this.current = { text: new MappedText(), last: '', table: table.index };
        return after;
      case 'tr':
        this.closeText();
        if (!closing && table) {
          table.row += 1;
          table.column = 0;
        }
        return after;
      case 'td':
      case 'th':
        this.closeText();
        if (!closing && table) this.current = { text: new MappedText(), last: '', place: this.place(table, attributes), table: table.index };
        return after;
      case 'thead':
      case 'tbody':
      case 'tfoot':
        this.closeText();
        return after;
      default:
        break;
    }
    const cell = this.current;
    if (!cell) return after;
    if (name === 'br') this.push(cell, '\n', at, after);
    else if (name === 'sup' && !closing) this.push(cell, '^', at, after);
    else if (!INLINE.has(name)) this.push(cell, ' ', at, after);
    return after;
  }

  /** Cell or caption text at `src[a, b)`: references decoded, whitespace runs as one space. */
  private text(a: number, b: number): void {
    const cell = this.current;
    if (!cell) return;
    for (let i = a; i < b; ) {
      const c = this.src[i] as string;
      if (c === ' ' || c === '\t' || c === '\n' || c === '\r' || c === '\f') {
        this.push(cell, ' ', i, i + 1);
        i += 1;
        continue;
      }
      if (c === '&') {
        CHARACTER_REFERENCE.lastIndex = i;
        const m = CHARACTER_REFERENCE.exec(this.src);
        const decoded = m && i + m[0].length <= b ? decodeNamedCharacterReference(m[1] as string) : false;
        if (m && decoded) {
          this.push(cell, decoded, i, i + m[0].length);
          i += m[0].length;
          continue;
        }
      }
      this.push(cell, c, i, i + 1);
      i += 1;
    }
  }

  /** Append `s`, collapsing whitespace into the space before it. */
  private push(cell: OpenText, s: string, a: number, b: number): void {
    if (s === ' ' && (cell.last === ' ' || cell.last === '\n' || cell.last === '')) return;
    cell.text.pushSynthetic(s, a, b);
    cell.last = s.slice(-1);
  }

  private closeText(): void {
    const cell = this.current;
    this.current = undefined;
    if (!cell) return;
    const t = cell.text;
    if (cell.last === ' ' || cell.last === '\n') {
      let k = t.starts.length;
      while (k > 0 && (t.text[k - 1] === ' ' || t.text[k - 1] === '\n')) k -= 1;
      t.text = t.text.slice(0, k);
      t.starts.length = k;
      t.ends.length = k;
    }
    if (cell.place) this.onPart({ kind: 'cell', text: cell.text, place: cell.place });
    else this.onPart({ kind: 'caption', text: cell.text, table: cell.table });
  }

  /** Row and column of the next cell, skipping columns that cells above still cover. */
  private place(table: OpenTable, attributes: string): TablePlace {
    if (table.row < 0) table.row = 0;
    let rowSpan = 1;
    let colSpan = 1;
    for (const m of attributes.matchAll(SPAN_ATTRIBUTE)) {
      const v = Number(m[2]);
      if ((m[1] as string).toLowerCase() === 'rowspan') rowSpan = Math.min(Math.max(v, 1), MAX_ROWSPAN);
      else colSpan = Math.min(Math.max(v, 1), MAX_COLSPAN);
    }
    table.budget += BUDGET_PER_CELL;
    let column = table.column;
    while (table.budget > 0 && (table.coveredUntil[column] ?? 0) > table.row) {
      column += 1;
      table.budget -= 1;
    }
    if (rowSpan > 1 && table.budget > colSpan) {
      for (let k = 0; k < colSpan; k += 1) table.coveredUntil[column + k] = table.row + rowSpan;
      table.budget -= colSpan;
    }
    table.column = column + colSpan;
    return {
      table: table.index,
      row: table.row,
      column,
      ...(rowSpan > 1 ? { rowSpan } : {}),
      ...(colSpan > 1 ? { colSpan } : {}),
    };
  }
}

const isLetter = (c: number) => (c >= 0x41 && c <= 0x5a) || (c >= 0x61 && c <= 0x7a);
const isAlnum = (c: number) => isLetter(c) || (c >= 0x30 && c <= 0x39);

/**
 * The start or end tag at `at` (a `<`) within `src[at, end)`: `<name attributes>` or `</name>`,
 * the name lower-cased; undefined when what follows is no tag (then the `<` is text). A `>`
 * inside a quoted attribute is not expected in converter output.
 */
function readTag(src: string, at: number, end: number): { after: number; closing: boolean; name: string; attributes: string } | undefined {
  let k = at + 1;
  const closing = src.charCodeAt(k) === 0x2f;
  if (closing) k += 1;
  const nameStart = k;
  if (!isLetter(src.charCodeAt(k))) return undefined;
  while (k < end && k - nameStart < 16 && isAlnum(src.charCodeAt(k))) k += 1;
  const name = src.slice(nameStart, k).toLowerCase();
  const limit = Math.min(end, k + MAX_ATTRIBUTES + 1);
  for (let j = k; j < limit; j += 1) {
    const c = src.charCodeAt(j);
    if (c === 0x3e) return { after: j + 1, closing, name, attributes: src.slice(k, j) };
    if (c === 0x3c) return undefined;
  }
  return undefined;
}
