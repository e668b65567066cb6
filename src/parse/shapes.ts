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

interface Line {
  start: number;
  /** End before `\r?\n`. */
  end: number;
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
  const out = source.split('');
  const blank = (at: number) => { out[at] = ZWSP; };
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
  return { text: out.join(''), shapes };
}

function isFence(source: string, line: Line): boolean {
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

function range(from: number, to: number): number[] {
  const r: number[] = [];
  for (let k = from; k < to; k++) r.push(k);
  return r;
}
