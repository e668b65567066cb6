/**
 * Block shapes that cost the Markdown parser time quadratic in their number (measured with
 * remark-parse 11 / micromark 4, time at 2N over time at N about 4):
 * - setext headings (`Title` over `===` or `---`): each one's resolver splices the document's
 *   whole event list, so the cost is their number times the document's length;
 * - block quotes: closing each one edits the document's whole event list the same way;
 * - lazy continuation lines (a line without `>` or indentation continuing a paragraph in a
 *   quote or list item): each one scans back over its paragraph.
 * Past a limit, those blocks are set aside here, in one linear pass, by replacing their marks
 * (the underline, the `>` markers, the list marker) with U+200B: same length, so offsets are
 * unchanged, and dropped by the normaliser, so their text (and any result in it) is read as
 * paragraph text. Ordinary manuscripts stay far below the limits and are never touched.
 */

import { htmlBlockNames, htmlRawNames } from 'micromark-util-html-tag-name';

/** Setext headings kept as headings; the underlines of later ones are read as text. */
export const SETEXT_LIMIT = 64;
/** Block quotes kept as quotes; later ones are read as paragraphs. */
export const QUOTE_LIMIT = 64;
/** Lazy lines one quote or list item may have before it is read as a paragraph. */
export const LAZY_LIMIT = 64;

export type SlowShapeKind = 'setext' | 'quote' | 'lazy';

export interface SlowShape {
  kind: SlowShapeKind;
  /** How many blocks of this shape were read as text. */
  blocks: number;
  /** 1-based line of the first of them. */
  firstLine: number;
}

const ZWSP = '\u200b';

/** A line's text: from its start to its end before the line break. */
interface LineRange {
  start: number;
  end: number;
}

interface Line extends LineRange {
  number: number;
}

/** A quote or list item whose lazy lines are counted: its marks, replaced when it is set aside. */
interface Container {
  kind: 'quote' | 'list';
  marks: number[];
  lazy: number;
  line: number;
}

export function defuseSlowShapes(source: string): { text: string; shapes: SlowShape[] } | undefined {
  const lines: Line[] = [];
  for (let start = 0, number = 1; start <= source.length; number += 1) {
    const nl = source.indexOf('\n', start);
    const stop = nl < 0 ? source.length : nl;
    lines.push({ start, end: stop > start && source.charCodeAt(stop - 1) === 0x0d ? stop - 1 : stop, number });
    if (nl < 0) break;
    start = nl + 1;
  }
  const underlines: { from: number; to: number; line: number }[] = [];
  const quotes: Container[] = [];
  const lazyItems: Container[] = [];
  let first = 0;
  // closed front matter: its closing `---` is no underline
  if (lines.length > 1 && isFence(source, lines[0] as Line)) {
    for (let i = 1; i < lines.length; i++) if (isFence(source, lines[i] as Line)) { first = i + 1; break; }
  }
  let fence: { char: number; size: number } | undefined;
  let prevText = false;
  let open: Container | undefined;
  for (let i = first; i < lines.length; i++) {
    const line = lines[i] as Line;
    let p = line.start;
    let indent = 0;
    while (p < line.end && indent < 4 && source.charCodeAt(p) === 0x20) { p++; indent++; }
    const c = source.charCodeAt(p);
    if (fence) {
      if (c === fence.char && runLength(source, p, line.end, c) >= fence.size && onlySpaces(source, p + runLength(source, p, line.end, c), line.end)) fence = undefined;
      continue;
    }
    if (p >= line.end || onlySpaces(source, p, line.end)) {
      prevText = false;
      open = undefined;
      continue;
    }
    if (indent < 4 && (c === 0x60 || c === 0x7e) && runLength(source, p, line.end, c) >= 3) {
      fence = { char: c, size: runLength(source, p, line.end, c) };
      prevText = false;
      open = undefined;
      continue;
    }
    if (indent < 4 && c === 0x3e /* > */) {
      // the `>` markers (and spaces) that open the line
      const marks: number[] = [];
      let q = p;
      while (q < line.end) {
        const d = source.charCodeAt(q);
        if (d === 0x3e) marks.push(q);
        else if (d !== 0x20 && d !== 0x09) break;
        q++;
      }
      if (open?.kind !== 'quote') {
        open = { kind: 'quote', marks: [], lazy: 0, line: line.number };
        quotes.push(open);
      }
      open.marks.push(...marks);
      const under = underlineAt(source, q, line.end);
      if (under && prevText) underlines.push({ ...under, line: line.number });
      prevText = !under && q < line.end;
      continue;
    }
    const item = indent < 4 ? listMarker(source, p, line.end) : 0;
    if (item > 0 && !(prevText && underlineAt(source, p, line.end))) {
      open = { kind: 'list', marks: range(p, p + item), lazy: 0, line: line.number };
      lazyItems.push(open);
      prevText = true;
      continue;
    }
    const under = indent < 4 ? underlineAt(source, p, line.end) : undefined;
    if (under && prevText) {
      underlines.push({ ...under, line: line.number });
      prevText = false;
      continue;
    }
    // a line that continues a quote without `>`, or a list item without its indentation
    if (open && (open.kind === 'quote' || indent < 2)) open.lazy += 1;
    prevText = true;
  }

  const shapes: SlowShape[] = [];
  // the offsets whose marks are read as text; the text is copied only when there are any (most
  // documents have none, and a copy of every character was a cost of every check)
  const blanked: number[] = [];
  const blank = (at: number) => { blanked.push(at); };
  if (underlines.length > SETEXT_LIMIT) {
    const later = underlines.slice(SETEXT_LIMIT);
    for (const u of later) for (let k = u.from; k < u.to; k++) blank(k);
    shapes.push({ kind: 'setext', blocks: later.length, firstLine: (later[0] as { line: number }).line });
  }
  const laterQuotes = quotes.slice(QUOTE_LIMIT);
  if (laterQuotes.length > 0) {
    for (const q of laterQuotes) for (const m of q.marks) blank(m);
    shapes.push({ kind: 'quote', blocks: laterQuotes.length, firstLine: (laterQuotes[0] as Container).line });
  }
  const lazy = [...quotes.slice(0, QUOTE_LIMIT), ...lazyItems].filter((b) => b.lazy > LAZY_LIMIT).sort((a, b) => a.line - b.line);
  if (lazy.length > 0) {
    for (const b of lazy) for (const m of b.marks) blank(m);
    shapes.push({ kind: 'lazy', blocks: lazy.length, firstLine: (lazy[0] as Container).line });
  }
  if (shapes.length === 0) return undefined;
  const out = source.split('');
  for (const at of blanked) out[at] = ZWSP;
  return { text: out.join(''), shapes };
}

function isFence(source: string, line: LineRange): boolean {
  return source.startsWith('---', line.start) && onlySpaces(source, line.start + 3, line.end);
}

function runLength(source: string, from: number, to: number, c: number): number {
  let k = from;
  while (k < to && source.charCodeAt(k) === c) k++;
  return k - from;
}

function onlySpaces(source: string, from: number, to: number): boolean {
  for (let k = from; k < to; k++) {
    const c = source.charCodeAt(k);
    if (c !== 0x20 && c !== 0x09) return false;
  }
  return true;
}

/** A setext underline (`===` or `---`, trailing spaces allowed) starting at `p`: the range of its marks. */
function underlineAt(source: string, p: number, end: number): { from: number; to: number } | undefined {
  const c = source.charCodeAt(p);
  if (c !== 0x3d && c !== 0x2d) return undefined;
  const n = runLength(source, p, end, c);
  return onlySpaces(source, p + n, end) ? { from: p, to: p + n } : undefined;
}

/** Length of a list marker (`-`, `*`, `+`, `1.`, `1)`) followed by a space or the line's end at `p`, else 0. */
function listMarker(source: string, p: number, end: number): number {
  const c = source.charCodeAt(p);
  let k = p;
  if (c === 0x2d || c === 0x2a || c === 0x2b) k = p + 1;
  else {
    while (k < end && k - p < 9 && source.charCodeAt(k) >= 0x30 && source.charCodeAt(k) <= 0x39) k++;
    if (k === p || (source.charCodeAt(k) !== 0x2e && source.charCodeAt(k) !== 0x29)) return 0;
    k++;
  }
  const d = source.charCodeAt(k);
  return k >= end || d === 0x20 || d === 0x09 ? k - p : 0;
}

/** A list item's marker at `at` (`- - -` and `* * *` are thematic breaks, not items): its length, else 0. */
function itemMarker(source: string, at: number, end: number): number {
  return thematicBreak(source, at, end) ? 0 : listMarker(source, at, end);
}

/** Where a line's content starts after the list markers (and their spaces) at `c`. */
function afterItems(source: string, c: number, end: number): number {
  let d = c;
  for (let item = itemMarker(source, d, end); item > 0; item = itemMarker(source, d, end)) d = skipSpaces(source, d + item, end, 4);
  return d;
}

function range(from: number, to: number): number[] {
  const r: number[] = [];
  for (let k = from; k < to; k++) r.push(k);
  return r;
}

/**
 * Lines one paragraph may span before its line breaks are read as spaces. Ordinary paragraphs,
 * hard-wrapped at 60–100 columns, span a few dozen lines at most.
 */
export const PARAGRAPH_LINE_LIMIT = 100;

/**
 * micromark merges the adjacent `data` events of each line of a paragraph with one splice of
 * the paragraph's whole event list (micromark 4, `resolveAllText`), so a paragraph of L lines
 * that each hold more than one piece of text (any word after the first, once GFM autolink
 * literals split text at word starts, or an `&`, `\` or `]`) costs time quadratic in L:
 * 8,000 such lines took 1.7 s and 16,000 took 4.6 s, against 0.2 s for the same text on one line.
 *
 * Past PARAGRAPH_LINE_LIMIT lines, the line breaks inside a paragraph are replaced by spaces,
 * one for one (a CRLF by two), and so are the `>` markers that open a continued line inside a
 * block quote: offsets are unchanged, line numbers are counted from the file, and the
 * paragraph's text reads as before, since a line break inside a paragraph is read as a space
 * anyway (a space, not U+200B, so that emphasis at a line's start flanks as before). A break
 * is kept wherever the next line could start a block of its own (heading, list item, fence,
 * HTML, table, math, quote, underline) or ends a hard break with `\`, so the document's
 * structure is the parser's, unchanged.
 */
export function joinLongParagraphs(source: string, limit = PARAGRAPH_LINE_LIMIT): string | undefined {
  const lines: (LineRange & { next: number })[] = [];
  for (let start = 0; start <= source.length; ) {
    let end = start;
    while (end < source.length && source.charCodeAt(end) !== 0x0a && source.charCodeAt(end) !== 0x0d) end++;
    const next = end >= source.length ? end : source.charCodeAt(end) === 0x0d && source.charCodeAt(end + 1) === 0x0a ? end + 2 : end + 1;
    lines.push({ start, end, next });
    if (end >= source.length) break;
    start = next;
  }
  if (lines.length <= limit) return undefined;

  // joins[k]: the break after line k may become a space, with these `>` markers of line k + 1
  const joins: (number[] | undefined)[] = new Array(lines.length);
  /** A fence opened outside every quote and list item: tracked exactly. */
  let fence: { char: number; size: number } | undefined;
  /**
   * A fence, raw HTML, table or paragraph opened inside a quote or list item, whose end (with
   * its container) only the parser knows: nothing is joined until a line with fewer `>` or
   * less indentation than its container closes it.
   */
  let nested: { markers: number; column: number } | undefined;
  /** A list item may be open: until a line indented less than its text, not continuing a paragraph. */
  let listOpen = false;
  /** The text column of the outermost open list item, and the `>` markers before it. */
  let listColumn = 0;
  let listMarkers = 0;
  /** A line below the item, read here as something else, may have been a lazy line keeping it open. */
  let listUnsure = false;
  let prevBlank = false;
  /** Raw HTML of CommonMark's kinds 1 to 6: ends at a blank line, or at the line holding this text. */
  let html: string | undefined;
  /**
   * A block that ends at a blank line but whose kind only the parser knows (a table, raw HTML of
   * kind 7, or a paragraph opening with `<`): a fence or raw HTML opened inside it would leave
   * the parser's reading of everything below unknown, so then nothing more is joined.
   */
  let unsure = false;
  let para = false;
  /** The `>` markers (with the spaces around them) that opened the paragraph's first line. */
  let paraPrefix = '';
  let paraMarkers = 0;
  const text = (line: LineRange | undefined) => (line ? source.slice(line.start, line.end) : undefined);
  let k = 0;
  // closed front matter is YAML, not paragraphs
  if (lines.length > 1 && isFence(source, lines[0] as LineRange)) {
    for (let i = 1; i < lines.length; i++) if (isFence(source, lines[i] as LineRange)) { k = i + 1; break; }
  }
  for (; k < lines.length; k++) {
    const line = lines[k] as LineRange;
    if (fence) {
      const p = skipSpaces(source, line.start, line.end, 3);
      const n = runLength(source, p, line.end, fence.char);
      if (n >= fence.size && onlySpaces(source, p + n, line.end)) fence = undefined;
      continue;
    }
    if (html !== undefined && html !== 'blank') {
      if (source.slice(line.start, line.end).toLowerCase().includes(html)) html = undefined;
      continue;
    }
    const blank = onlySpaces(source, line.start, line.end);
    const { markers, p } = quoteMarkers(source, line.start, line.end);
    const lead = indentOf(source, line.start, line.end);
    if (nested) {
      if (blank || (markers.length >= nested.markers && lead >= nested.column)) continue;
      nested = undefined;
    }
    if (blank) {
      para = false;
      html = undefined;
      unsure = false;
      prevBlank = true;
      continue;
    }
    const wasBlank = prevBlank;
    prevBlank = false;
    if (html !== undefined) continue;
    const indent = indentOf(source, p, line.end);
    let c = p;
    while (c < line.end && (source.charCodeAt(c) === 0x20 || source.charCodeAt(c) === 0x09)) c++;
    const next = text(lines[k + 1]);
    if (unsure) {
      const d = afterItems(source, c, line.end);
      if (d > c) {
        listOpen = true;
        listColumn = 0;
      }
      const kind = startKind(source, d, line.end, undefined);
      if (kind === 'fence' || (kind === 'html' && htmlBlock(source, d, line.end) !== undefined)) break;
      continue;
    }
    // A paragraph goes on unless the line may open a block of its own, at whatever indentation
    // (inside a list item, indentation counts from the item's text). The line repeats the first
    // line's `>` markers exactly, or lazily some of them in the same order, or none. A line
    // opening with `<` is never joined: raw HTML of kind 7 cannot interrupt a paragraph, but
    // micromark reads a lazy line that opens it as a new block, and which lines are lazy depends
    // on containers only the parser knows.
    const prefix = source.slice(line.start, p);
    const same = markers.length === 0 || prefix === paraPrefix || (markers.length < paraMarkers && paraPrefix.startsWith(prefix));
    if (para && same && startKind(source, c, line.end, next) === 'text') {
      if (!hardBreakBackslash(source, (lines[k - 1] as LineRange).end)) joins[k - 1] = markers;
      continue;
    }
    para = false;
    if (listOpen && (lead < listColumn || markers.length < listMarkers)) {
      // it closes the list item, unless it is a lazy line of a paragraph kept open there,
      // which only the parser knows when a line above was not read as text here
      if (wasBlank || startKind(source, c, line.end, next) !== 'text') {
        listOpen = false;
        listUnsure = false;
      } else listUnsure = true;
    }
    // outside every quote and list item
    let margin = markers.length === 0 && !listOpen;
    if (listUnsure) {
      // whether a list item is open is unknown, and so is where a fence or raw HTML would end
      const kind = startKind(source, afterItems(source, c, line.end), line.end, next);
      if (kind === 'fence' || kind === 'html' || kind === 'table') break;
    }
    if (indent >= 4) {
      // indented code, or (inside a list item) anything
      if (!margin) nested = { markers: markers.length, column: listOpen ? listColumn : 0 };
      continue;
    }
    // list markers open items whose first line may be text
    for (let item = itemMarker(source, c, line.end); item > 0; item = itemMarker(source, c, line.end)) {
      c = skipSpaces(source, c + item, line.end, 4);
      margin = false;
      if (!listOpen || c - line.start < listColumn) {
        listColumn = c - line.start;
        listMarkers = markers.length;
      }
      listOpen = true;
    }
    const kind = startKind(source, c, line.end, next);
    if (kind === 'fence' || kind === 'html' || kind === 'table') {
      if (!margin) nested = { markers: markers.length, column: listOpen ? listColumn : 0 };
      else if (kind === 'fence') {
        const ch = source.charCodeAt(c);
        fence = { char: ch, size: runLength(source, c, line.end, ch) };
      } else if (kind === 'table') unsure = true;
      else {
        const end = htmlBlock(source, c, line.end);
        if (end === undefined) unsure = true;
        // kinds 1 to 5 may close on their first line
        else html = end !== 'blank' && source.slice(c, line.end).toLowerCase().includes(end) ? undefined : end;
      }
    } else if (kind === 'text') {
      para = true;
      paraPrefix = prefix;
      paraMarkers = markers.length;
    }
  }

  // join only inside paragraphs longer than the limit
  let out: string[] | undefined;
  for (let k = 0; k < lines.length; ) {
    let j = k;
    while (joins[j]) j++;
    if (j - k + 1 > limit) {
      out ??= source.split('');
      for (let i = k; i < j; i++) {
        const line = lines[i] as { end: number; next: number };
        for (let at = line.end; at < line.next; at++) out[at] = ' ';
        for (const m of joins[i] as number[]) out[m] = ' ';
      }
    }
    k = j + 1;
  }
  return out?.join('');
}

/** The `>` markers that open a line, and where its content starts after them. */
function quoteMarkers(source: string, start: number, end: number): { markers: number[]; p: number } {
  const markers: number[] = [];
  let p = start;
  for (;;) {
    const q = skipSpaces(source, p, end, 3);
    if (source.charCodeAt(q) !== 0x3e) break;
    markers.push(q);
    p = q + 1;
    if (source.charCodeAt(p) === 0x20) p++;
  }
  return { markers, p };
}

type StartKind = 'text' | 'fence' | 'html' | 'table' | 'other';

/** What a line whose content starts at `p` opens, as far as a paragraph before it is concerned. */
function startKind(source: string, p: number, end: number, nextLine: string | undefined): StartKind {
  if (p >= end) return 'other';
  const c = source.charCodeAt(p);
  if ((c === 0x60 || c === 0x7e) && runLength(source, p, end, c) >= 3) return 'fence';
  if (c === 0x24 && source.charCodeAt(p + 1) === 0x24) return 'fence'; // $$ math
  if (c === 0x3c) return 'html';
  if (c === 0x3e) return 'other';
  if (c === 0x23) return 'other'; // ATX heading, or text: either way kept apart
  if (underlineAt(source, p, end) || thematicBreak(source, p, end)) return 'other';
  if (listMarker(source, p, end) > 0) return 'other';
  if (c === 0x5b) return 'other'; // a link or footnote definition, or text: either way kept apart
  if (nextLine !== undefined && isDelimiterRow(nextLine)) return 'table';
  return 'text';
}

/**
 * A GFM table's delimiter row: `>` markers, then pipes, dashes, colons and spaces, with a dash
 * and a pipe or colon (micromark reads `:-` under a line as a one-column table).
 */
function isDelimiterRow(line: string): boolean {
  let pipe = false;
  let dash = false;
  let body = false;
  for (let k = 0; k < line.length; k++) {
    const c = line.charCodeAt(k);
    if (c === 0x7c || c === 0x3a) pipe = true;
    else if (c === 0x2d) dash = true;
    else if (c === 0x3e && !body) continue;
    else if (c !== 0x3a && c !== 0x20 && c !== 0x09) return false;
    if (c !== 0x20 && c !== 0x09) body = true;
  }
  return pipe && dash;
}

/**
 * Where raw HTML opening at `c` ends, for CommonMark's kinds 1 to 6 (the kinds that may
 * interrupt a paragraph): the text that closes kinds 1 to 5, or `blank` for kind 6. `undefined`
 * for anything else: raw HTML of kind 7, or text. The tag names are the parser's own lists.
 */
function htmlBlock(source: string, c: number, end: number): string | undefined {
  const s = source.slice(c, Math.min(end, c + 48)).toLowerCase();
  if (s.startsWith('<!--')) return '-->';
  if (s.startsWith('<?')) return '?>';
  if (s.startsWith('<![cdata[')) return ']]>';
  if (/^<![a-z]/.test(s)) return '>';
  const m = /^<(\/?)([a-z][a-z0-9]*)/.exec(s);
  if (!m) return undefined;
  const name = m[2] as string;
  const at = c + m[0].length;
  const after = at < end ? source.charAt(at) : '';
  if (!m[1] && htmlRawNames.includes(name) && (after === '' || after === '>' || after === ' ' || after === '\t')) return `</${name}>`;
  if (htmlBlockNames.includes(name) && (after === '' || after === '>' || after === ' ' || after === '\t' || (after === '/' && source.charAt(at + 1) === '>'))) return 'blank';
  return undefined;
}

function thematicBreak(source: string, p: number, end: number): boolean {
  const c = source.charCodeAt(p);
  if (c !== 0x2a && c !== 0x2d && c !== 0x5f) return false;
  let n = 0;
  for (let k = p; k < end; k++) {
    const d = source.charCodeAt(k);
    if (d === c) n++;
    else if (d !== 0x20 && d !== 0x09) return false;
  }
  return n >= 3;
}

function hardBreakBackslash(source: string, end: number): boolean {
  return end > 0 && source.charCodeAt(end - 1) === 0x5c;
}

function skipSpaces(source: string, from: number, to: number, most: number): number {
  let k = from;
  while (k < to && k - from < most && source.charCodeAt(k) === 0x20) k++;
  return k;
}

/** Columns of leading spaces and tabs (a tab to the next multiple of 4). */
function indentOf(source: string, from: number, to: number): number {
  let col = 0;
  for (let k = from; k < to; k++) {
    const c = source.charCodeAt(k);
    if (c === 0x20) col += 1;
    else if (c === 0x09) col += 4 - (col % 4);
    else break;
  }
  return col;
}
