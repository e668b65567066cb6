import { openingWords } from '../blocks.js';
import { BoxList } from './boxes.js';
import type { PageRuns, PdfBlock, PdfLine, PdfPiece, TextRun } from './types.js';

/**
 * From the text runs of a PDF's pages to blocks in reading order. Everything here is geometry
 * on the runs pdf.js reports (baseline, left end, width, font size), in PDF points; a size-relative
 * threshold is given in ems of the text it is applied to. The steps, per page: runs to
 * characters with boxes (ligatures spelled out), line numbers in a margin dropped, rows by
 * baseline (raised and lowered small text joined to its row: an exponent after 10 as superscript
 * characters, a raised digit after a letter as a superscript — χ², R² —, a raised marker after
 * punctuation or a number as a footnote mark, dropped), rows cut into chunks at wide gaps, a
 * column gutter found, rows put in reading order (full-width rows between bands of left then right
 * column). Then over all pages: running heads, feet and page numbers dropped, lines numbered per
 * page, runs of rows with aligned wide gaps read as tables, the rest cut into paragraphs and
 * headings, and words hyphenated at a line end joined.
 */

/** Ligature characters and the letters they stand for. */
const LIGATURES: Record<string, string> = {
  '\uFB00': 'ff', '\uFB01': 'fi', '\uFB02': 'fl', '\uFB03': 'ffi', '\uFB04': 'ffl', '\uFB05': 'st', '\uFB06': 'st',
};

/** Superscript forms of what an exponent may hold. */
const SUPERSCRIPT: Record<string, string> = {
  '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹',
  '-': '⁻', '\u2212': '⁻', '\u2013': '⁻', '\u2010': '⁻', '\u2011': '⁻', '+': '⁺',
};

/** Text of a run with its character boxes. */
interface Frag {
  text: string;
  boxes: BoxList;
  x0: number;
  x1: number;
  y: number;
  size: number;
}

interface Row {
  frags: Frag[];
  y: number;
  size: number;
}

/** A stretch of a row with no wide gap inside. */
interface Chunk {
  text: string;
  boxes: BoxList;
  x0: number;
  x1: number;
  /** The largest font size in the chunk. */
  size: number;
}

/** A row (or the part of a row in one column) in reading order. */
interface OrderedLine {
  page: number;
  chunks: Chunk[];
  y: number;
  size: number;
  /** Left edge of the column the line sits in (the page's text left edge for a full-width line). */
  columnLeft: number;
  columnRight: number;
  column: 'left' | 'right' | 'full';
}

const RAISED_EXPONENT = /^[-\u2212\u2013\u2010\u2011+]?[0-9]{1,4}$/;
const TEN_BEFORE = /(?:^|[^0-9.,])10$/;
const LETTER_BEFORE = /\p{L}$/u;
const MARKER = /^(?:[0-9]{1,3}(?:[,–-][0-9]{1,3})*|[*†‡§¶]{1,3}|[a-z])$/;
const INTEGER = /^[0-9]{1,4}$/;
const PAGE_NUMBER = /^(?:[0-9]{1,4}|[ivxlcdm]{1,6}|(?:page|p\.) ?[0-9]{1,4}(?: of [0-9]{1,4})?)$/i;
const DIGITS = /[0-9]+/g;
const SPACES = /\s+/g;

/** Characters a run's text spells otherwise: ligatures, and the hyphens read as `-`. */
const RESPELLED = /[\uFB00-\uFB06\u2010\u2011]/;

/**
 * The characters of a run, ligatures spelled out, each with its box: the run's width shared
 * evenly between its code points, and a code point's share between the UTF-16 units it is
 * spelled with.
 */
function fragOf(run: TextRun): Frag {
  const str = run.str;
  const respelled = RESPELLED.test(str);
  const parts: string[] = [];
  const boxes = new BoxList();
  const chars = [...str];
  const step = chars.length > 0 ? run.width / chars.length : 0;
  const y0 = run.y - 0.22 * run.size;
  const y1 = run.y + 0.8 * run.size;
  chars.forEach((c, i) => {
    const x0 = run.x + i * step;
    const spelled = respelled ? (LIGATURES[c] ?? (c === '\u2010' || c === '\u2011' ? '-' : c)) : c;
    if (respelled) parts.push(spelled);
    const sub = step / spelled.length;
    for (let k = 0; k < spelled.length; k += 1) boxes.push(x0 + k * sub, x0 + (k + 1) * sub, y0, y1);
  });
  return { text: respelled ? parts.join('') : str, boxes, x0: run.x, x1: run.x + run.width, y: run.y, size: run.size };
}

function median(values: number[]): number {
  if (values.length === 0) return 0;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)] as number;
}

/**
 * Drop a column of line numbers: five or more integers that sit wholly in the left or right
 * margin of every other run on the page, mostly increasing from top to bottom.
 */
function dropLineNumbers(frags: Frag[]): Frag[] {
  const numeric = frags.filter((f) => INTEGER.test(f.text.trim()));
  const other = frags.filter((f) => !INTEGER.test(f.text.trim()));
  if (numeric.length < 5 || other.length === 0) return frags;
  let left = Infinity;
  let right = -Infinity;
  for (const f of other) {
    left = Math.min(left, f.x0);
    right = Math.max(right, f.x1);
  }
  const drop = new Set<Frag>();
  for (const side of ['left', 'right'] as const) {
    const margin = numeric
      .filter((f) => (side === 'left' ? f.x1 < left - 0.3 * f.size : f.x0 > right + 0.3 * f.size))
      .sort((a, b) => b.y - a.y);
    if (margin.length < 5) continue;
    let rising = 0;
    for (let i = 1; i < margin.length; i += 1) {
      if (Number((margin[i] as Frag).text) > Number((margin[i - 1] as Frag).text)) rising += 1;
    }
    if (rising >= 0.8 * (margin.length - 1)) for (const f of margin) drop.add(f);
  }
  return drop.size === 0 ? frags : frags.filter((f) => !drop.has(f));
}

/** Rows by baseline; small raised or lowered text joins the row it belongs to. */
function rowsOf(frags: Frag[]): Row[] {
  const sorted = [...frags].sort((a, b) => b.y - a.y || a.x0 - b.x0);
  const rows: Row[] = [];
  for (const f of sorted) {
    const last = rows.at(-1);
    if (last && Math.abs(last.y - f.y) <= 0.2 * Math.max(last.size, f.size)) {
      last.frags.push(f);
      last.size = Math.max(last.size, f.size);
    } else rows.push({ frags: [f], y: f.y, size: f.size });
  }
  // small rows set above or below a row of larger text, next to its runs, belong to it
  const out: Row[] = [];
  const small = new Set<Row>();
  for (let i = 0; i < rows.length; i += 1) {
    const row = rows[i] as Row;
    for (const host of [rows[i + 1], rows[i - 1]]) {
      if (!host || small.has(host) || row.size > 0.85 * host.size) continue;
      const rise = row.y - host.y;
      const raised = rise >= 0.15 * host.size && rise <= 0.75 * host.size;
      const lowered = -rise >= 0.08 * host.size && -rise <= 0.5 * host.size;
      if (!raised && !lowered) continue;
      if (!row.frags.every((f) => host.frags.some((h) => f.x0 >= h.x0 - 0.3 * host.size && f.x0 <= h.x1 + 0.4 * host.size))) continue;
      for (const f of row.frags) attach(host, f, raised);
      small.add(row);
      break;
    }
  }
  for (const row of rows) {
    if (small.has(row)) continue;
    row.frags.sort((a, b) => a.x0 - b.x0);
    out.push(row);
  }
  return out;
}

/** Join a raised or lowered run to its row: as an exponent, a superscript, a subscript, or (a footnote mark) not at all. */
function attach(host: Row, f: Frag, raised: boolean): void {
  const before = host.frags
    .filter((h) => h.x0 <= f.x0)
    .sort((a, b) => b.x1 - a.x1)[0];
  const glued = before !== undefined && f.x0 - before.x1 < 0.3 * host.size;
  const prior = glued ? before.text.trimEnd() : '';
  const body = f.text.trim();
  if (!raised) {
    // a subscript (t₂₈, η²ₚ) reads inline
    host.frags.push(f);
    return;
  }
  if (glued && RAISED_EXPONENT.test(body) && TEN_BEFORE.test(prior)) {
    host.frags.push(superscript(f));
    return;
  }
  if (glued && /^[0-9]{1,2}$/.test(body) && LETTER_BEFORE.test(prior)) {
    host.frags.push(superscript(f));
    return;
  }
  // a note's mark after a word's end, a number or punctuation
  if (MARKER.test(body)) return;
  host.frags.push(f);
}

function superscript(f: Frag): Frag {
  const text: string[] = [];
  const boxes = new BoxList();
  [...f.text].forEach((c, i) => {
    if (c.trim() === '') return;
    text.push(SUPERSCRIPT[c] ?? c);
    boxes.pushFrom(f.boxes, i);
  });
  return { ...f, text: text.join(''), boxes };
}

/** A row's runs joined into chunks: a gap of `wide` ems or more starts a new chunk. */
function chunksOf(row: Row, wide: number): Chunk[] {
  const chunks: Chunk[] = [];
  let cur: Chunk | undefined;
  for (const f of row.frags) {
    if (f.text.trim() === '' && f.text.length > 0 && cur) continue;
    const gap = cur ? f.x0 - cur.x1 : 0;
    if (!cur || gap >= wide * row.size) {
      cur = { text: '', boxes: new BoxList(), x0: f.x0, x1: f.x1, size: f.size };
      chunks.push(cur);
    } else if (gap > 0.15 * row.size && !/\s$/.test(cur.text) && !/^\s/.test(f.text)) {
      cur.text += ' ';
      const some = f.boxes.length > 0;
      cur.boxes.push(cur.x1, f.x0, some ? f.boxes.y0(0) : row.y, some ? f.boxes.y1(0) : row.y);
    }
    cur.text += f.text;
    cur.boxes.append(f.boxes);
    cur.x1 = Math.max(cur.x1, f.x1);
    cur.size = Math.max(cur.size, f.size);
  }
  for (const c of chunks) trimChunk(c);
  return chunks.filter((c) => c.text.length > 0);
}

/** Whitespace that trimChunk changes inside a chunk: a run of it, or any but the plain space. */
const UNEVEN_SPACE = /\s\s|[^\S ]/;

function trimChunk(c: Chunk): void {
  // most chunks are already trimmed, with single plain spaces: kept as they are, boxes uncopied
  if (!UNEVEN_SPACE.test(c.text) && !c.text.startsWith(' ') && !c.text.endsWith(' ')) return;
  let a = 0;
  let b = c.text.length;
  while (a < b && /\s/.test(c.text[a] as string)) a += 1;
  while (b > a && /\s/.test(c.text[b - 1] as string)) b -= 1;
  // runs of spaces inside a chunk read as one
  const text: string[] = [];
  const boxes = new BoxList();
  for (let i = a; i < b; i += 1) {
    const ch = c.text[i] as string;
    const space = /\s/.test(ch);
    if (space && text.at(-1) === ' ') continue;
    text.push(space ? ' ' : ch);
    boxes.pushFrom(c.boxes, i);
  }
  c.text = text.join('');
  c.boxes = boxes;
}

/**
 * The x of a column gutter: in the middle 30–70 % of the text's width, the widest stretch that
 * at most 30 % of the rows cross, at least a third of an em wide, with text on both sides in at
 * least three rows each, more rows than cross it, and lines of prose on both sides (their chunks
 * fill, at the median, half the column's width: the narrow cells of a table do not). None when the
 * page reads as one column.
 */
function gutterOf(rows: Array<{ chunks: Chunk[]; size: number }>): number | undefined {
  if (rows.length < 4) return undefined;
  let left = Infinity;
  let right = -Infinity;
  for (const r of rows) for (const c of r.chunks) {
    left = Math.min(left, c.x0);
    right = Math.max(right, c.x1);
  }
  const from = Math.floor(left + 0.3 * (right - left));
  const to = Math.ceil(left + 0.7 * (right - left));
  if (to <= from) return undefined;
  const cover = new Array<number>(to - from + 1).fill(0);
  for (const r of rows) for (const c of r.chunks) {
    const a = Math.max(from, Math.ceil(c.x0));
    const b = Math.min(to, Math.floor(c.x1));
    for (let x = a; x <= b; x += 1) cover[x - from] = (cover[x - from] as number) + 1;
  }
  const allowed = Math.floor(0.3 * rows.length);
  let best: [number, number] | undefined;
  for (let x = 0; x < cover.length; ) {
    if ((cover[x] as number) > allowed) {
      x += 1;
      continue;
    }
    let y = x;
    while (y + 1 < cover.length && (cover[y + 1] as number) <= allowed) y += 1;
    if (!best || y - x > best[1] - best[0]) best = [x, y];
    x = y + 1;
  }
  if (!best) return undefined;
  const size = median(rows.map((r) => r.size));
  if (best[1] - best[0] + 1 < size / 3) return undefined;
  const gutter = from + (best[0] + best[1]) / 2;
  const leftWidths: number[] = [];
  const rightWidths: number[] = [];
  let crossing = 0;
  for (const r of rows) {
    if (r.chunks.some((c) => c.x0 < gutter && c.x1 > gutter)) crossing += 1;
    const l = r.chunks.filter((c) => c.x1 <= gutter);
    const rt = r.chunks.filter((c) => c.x0 >= gutter);
    if (l.length > 0) leftWidths.push(l.reduce((w, c) => w + c.x1 - c.x0, 0));
    if (rt.length > 0) rightWidths.push(rt.reduce((w, c) => w + c.x1 - c.x0, 0));
  }
  if (leftWidths.length < 3 || rightWidths.length < 3 || Math.min(leftWidths.length, rightWidths.length) <= crossing) return undefined;
  const prose = median(leftWidths) >= 0.5 * (gutter - left) && median(rightWidths) >= 0.5 * (right - gutter);
  return prose ? gutter : undefined;
}

/** One page's lines in reading order. */
function orderPage(page: PageRuns): OrderedLine[] {
  // pdf.js adds runs of spaces where it sees a word gap; the gaps themselves say as much
  const frags = dropLineNumbers(page.runs.filter((r) => r.upright && r.str.trim().length > 0 && r.size > 0).map(fragOf));
  const rows = rowsOf(frags).map((r) => ({ row: r, chunks: chunksOf(r, 1) }));
  const kept = rows.filter((r) => r.chunks.length > 0);
  const gutter = gutterOf(kept.map((r) => ({ chunks: r.chunks, size: r.row.size })));
  let textLeft = Infinity;
  let textRight = -Infinity;
  for (const r of kept) for (const c of r.chunks) {
    textLeft = Math.min(textLeft, c.x0);
    textRight = Math.max(textRight, c.x1);
  }
  const line = (r: Row, chunks: Chunk[], column: OrderedLine['column']): OrderedLine => ({
    page: page.page,
    chunks,
    y: r.y,
    size: Math.max(...chunks.map((c) => c.size)),
    column,
    columnLeft: column === 'right' && gutter !== undefined ? gutter : textLeft,
    columnRight: column === 'left' && gutter !== undefined ? gutter : textRight,
  });
  if (gutter === undefined) return kept.map((r) => line(r.row, r.chunks, 'full'));
  const out: OrderedLine[] = [];
  let band: { left: OrderedLine[]; right: OrderedLine[] } = { left: [], right: [] };
  const flush = () => {
    out.push(...band.left, ...band.right);
    band = { left: [], right: [] };
  };
  const wide = wideTableRows(kept, gutter, textLeft, textRight);
  for (const r of kept) {
    if (wide.has(r) || r.chunks.some((c) => c.x0 < gutter && c.x1 > gutter)) {
      flush();
      out.push(line(r.row, r.chunks, 'full'));
      continue;
    }
    const l = r.chunks.filter((c) => c.x1 <= gutter);
    const rt = r.chunks.filter((c) => c.x0 >= gutter);
    if (l.length > 0) band.left.push(line(r.row, l, 'left'));
    if (rt.length > 0) band.right.push(line(r.row, rt, 'right'));
  }
  flush();
  return out;
}

/**
 * Rows of a table set across both columns of a two-column page, whose cells happen to leave the
 * gutter empty: three or more chunks with some on each side, where neither side is one chunk
 * filling most of its column (a line of prose); then a row of two such chunks right above or
 * below one of them (a header line of the same table).
 */
function wideTableRows<R extends { row: Row; chunks: Chunk[] }>(rows: R[], gutter: number, left: number, right: number): Set<R> {
  const prose = (side: Chunk[], width: number) => side.length === 1 && (side[0] as Chunk).x1 - (side[0] as Chunk).x0 >= 0.6 * width;
  const tableLike = (r: R, least: number) => {
    const l = r.chunks.filter((c) => c.x1 <= gutter);
    const rt = r.chunks.filter((c) => c.x0 >= gutter);
    return r.chunks.length >= least && l.length > 0 && rt.length > 0 && !prose(l, gutter - left) && !prose(rt, right - gutter);
  };
  const wide = new Set(rows.filter((r) => tableLike(r, 3)));
  if (wide.size === 0) return wide;
  const near = (a: R, b: R) => Math.abs(a.row.y - b.row.y) <= 1.6 * Math.max(a.row.size, b.row.size);
  for (const order of [rows, [...rows].reverse()]) {
    for (let i = 1; i < order.length; i += 1) {
      const r = order[i] as R;
      const prev = order[i - 1] as R;
      if (!wide.has(r) && wide.has(prev) && near(r, prev) && tableLike(r, 2)) wide.add(r);
    }
  }
  return wide;
}

function lineText(l: OrderedLine): string {
  return l.chunks.map((c) => c.text).join(' ');
}

/**
 * Running heads and feet: among the first and last two lines of each page, a line whose text
 * (digits aside) recurs at the same height (within 3 pt) on at least 40 % of the pages, and
 * at least two. A lone page number there goes too.
 */
function dropFurniture(pages: OrderedLine[][], heights: number[]): OrderedLine[][] {
  const keyOf = (l: OrderedLine) => lineText(l).toLowerCase().replace(DIGITS, '#').replace(SPACES, ' ').trim();
  const edge = (lines: OrderedLine[]) => {
    const byHeight = [...lines].sort((a, b) => b.y - a.y);
    return new Set([...byHeight.slice(0, 2), ...byHeight.slice(-2)]);
  };
  const edges = pages.map(edge);
  const seen = new Map<string, Array<{ page: number; y: number }>>();
  edges.forEach((set, p) => {
    for (const l of set) {
      const k = keyOf(l);
      const list = seen.get(k) ?? [];
      list.push({ page: p, y: l.y });
      seen.set(k, list);
    }
  });
  const need = Math.max(2, Math.ceil(0.4 * pages.length));
  return pages.map((lines, p) => {
    const set = edges[p] as Set<OrderedLine>;
    const height = heights[p] as number;
    return lines.filter((l) => {
      if (!set.has(l)) return true;
      const text = lineText(l).trim();
      const inMargin = l.y > 0.88 * height || l.y < 0.12 * height;
      if (PAGE_NUMBER.test(text) && (inMargin || l.chunks.length === 1)) return false;
      const same = (seen.get(keyOf(l)) ?? []).filter((o) => Math.abs(o.y - l.y) <= 3);
      return new Set(same.map((o) => o.page)).size < need;
    });
  });
}

/** Whether consecutive lines `a..b` look like table rows: two or more chunks apart by 1.5 em or more. */
function isTableRow(l: OrderedLine): boolean {
  if (l.chunks.length < 2) return false;
  for (let i = 1; i < l.chunks.length; i += 1) {
    if ((l.chunks[i] as Chunk).x0 - (l.chunks[i - 1] as Chunk).x1 < 1.5 * l.size) return false;
  }
  return true;
}

const SENTENCE_END = /[.!?:]["”’)]?$/;
const LETTER = /\p{L}/u;
const LOWER_START = /^(\p{Ll}+)/u;

interface Numbered {
  line: OrderedLine;
  number: number;
  text: string;
  boxes: BoxList;
}

/** Blocks in reading order from all pages' runs. */
export function layoutPages(pages: PageRuns[]): { blocks: PdfBlock[]; lines: PdfLine[] } {
  const ordered = dropFurniture(pages.map(orderPage), pages.map((p) => p.height));
  const all: Numbered[] = [];
  for (const lines of ordered) {
    lines.forEach((l, i) => {
      const text: string[] = [];
      const boxes = new BoxList();
      l.chunks.forEach((c, k) => {
        if (k > 0) {
          text.push(' ');
          const some = c.boxes.length > 0;
          boxes.push((l.chunks[k - 1] as Chunk).x1, c.x0, some ? c.boxes.y0(0) : l.y, some ? c.boxes.y1(0) : l.y);
        }
        text.push(c.text);
        boxes.append(c.boxes);
      });
      all.push({ line: l, number: i + 1, text: text.join(''), boxes });
    });
  }
  const bodySize = median(all.flatMap((n) => (n.text.length > 20 ? [n.line.size] : [])));
  const leading = median(
    all.flatMap((n, i) => {
      const prev = all[i - 1];
      if (!prev || prev.line.page !== n.line.page || prev.line.column !== n.line.column) return [];
      const d = prev.line.y - n.line.y;
      return d > 0 ? [d] : [];
    }),
  );
  const words = wordsOf(all);
  const blocks: PdfBlock[] = [];
  let tableCount = 0;
  let para: PdfBlock | undefined;
  let prev: Numbered | undefined;
  for (let i = 0; i < all.length; ) {
    const n = all[i] as Numbered;
    // a table: two or more consecutive rows with wide gaps, in one column of one page
    let end = i;
    while (end < all.length && isTableRow((all[end] as Numbered).line) && (all[end] as Numbered).line.page === n.line.page && (all[end] as Numbered).line.column === n.line.column) end += 1;
    if (end - i >= 2) {
      blocks.push(...tableBlocks(all.slice(i, end), tableCount));
      tableCount += 1;
      para = undefined;
      prev = undefined;
      i = end;
      continue;
    }
    const heading = bodySize > 0 && n.line.size > 1.15 * bodySize && n.text.length < 120;
    if (heading) {
      if (para?.kind === 'heading' && prev && prev.line.page === n.line.page && prev.line.y - n.line.y < 2 * n.line.size) para.pieces.push(pieceOf(n));
      else {
        para = { kind: 'heading', pieces: [pieceOf(n)] };
        blocks.push(para);
      }
      prev = n;
      i += 1;
      continue;
    }
    if (!para || para.kind !== 'paragraph' || !prev || startsParagraph(prev, n, leading)) {
      para = { kind: 'paragraph', pieces: [] };
      blocks.push(para);
    }
    const piece = pieceOf(n);
    const last = para.pieces.at(-1);
    if (last) joinHyphen(last, piece, words);
    if (piece.text.length > 0) para.pieces.push(piece);
    prev = n;
    i += 1;
  }
  const lines: PdfLine[] = all.map((n) => ({
    page: n.line.page,
    line: n.number,
    text: n.text,
    boxes: n.boxes,
    x0: Math.min(...n.line.chunks.map((c) => c.x0)),
    x1: Math.max(...n.line.chunks.map((c) => c.x1)),
    y: n.line.y,
    size: n.line.size,
  }));
  return { blocks: blocks.filter((b) => b.pieces.length > 0), lines };
}

/** Whether line `n` starts a new paragraph after line `prev`. */
function startsParagraph(prev: Numbered, n: Numbered, leading: number): boolean {
  const ended = SENTENCE_END.test(prev.text);
  const samePlace = prev.line.page === n.line.page && prev.line.column === n.line.column;
  if (!samePlace) return ended;
  const gap = prev.line.y - n.line.y;
  if (gap <= 0 || (leading > 0 && gap > 1.6 * leading)) return true;
  // a sentence end, then a gap a third of a line wider than the document's leading: paragraph
  // spacing, as a browser or word processor sets it (space after a paragraph, no indent)
  if (ended && leading > 0 && gap > 1.3 * leading) return true;
  const em = n.line.size;
  const indented = (n.line.chunks[0] as Chunk).x0 > n.line.columnLeft + 0.8 * em && (prev.line.chunks[0] as Chunk).x0 <= n.line.columnLeft + 0.8 * em;
  if (indented && ended) return true;
  const short = (prev.line.chunks.at(-1) as Chunk).x1 < prev.line.columnRight - 3 * em;
  return short && ended;
}

function pieceOf(n: Numbered): PdfPiece {
  return { text: n.text, boxes: n.boxes, page: n.line.page, line: n.number, charOffset: 0, opening: openingWords(n.text) };
}


/** Lower-case words of the document as printed, hyphenated compounds kept whole. */
function wordsOf(all: Numbered[]): Set<string> {
  const set = new Set<string>();
  for (const n of all) for (const w of n.text.toLowerCase().split(/[^\p{L}-]+/u)) if (w.length > 0) set.add(w);
  return set;
}

/**
 * A word hyphenated at the end of `last` and carried on in `next` in lower case: moved whole
 * onto `last`'s line, without the hyphen unless the hyphen is part of the word (a single
 * letter before it, as in `t-`/`test`, or the document spells the word with a hyphen elsewhere
 * and never without).
 */
function joinHyphen(last: PdfPiece, next: PdfPiece, words: Set<string>): void {
  const l = LOWER_START.exec(next.text);
  if (!l || !last.text.endsWith('-')) return;
  // the letters before the hyphen, read backwards (a pattern anchored at the end would be tried from every letter)
  let from = last.text.length - 1;
  while (from > 0 && LETTER.test(last.text[from - 1] as string)) from -= 1;
  if (from === last.text.length - 1) return;
  const before = last.text.slice(from, -1).toLowerCase();
  const after = l[1] as string;
  // the word continues to the next space
  let end = next.text.indexOf(' ');
  if (end < 0) end = next.text.length;
  const keep = before.length === 1 || (words.has(`${before}-${after}`) && !words.has(`${before}${after}`));
  const cut = last.text.length - 1;
  if (!keep) {
    last.text = last.text.slice(0, cut);
    last.boxes = last.boxes.slice(0, cut);
  }
  last.text += next.text.slice(0, end);
  last.boxes = last.boxes.concat(next.boxes.slice(0, end));
  const rest = end < next.text.length ? end + 1 : end;
  next.text = next.text.slice(rest);
  next.boxes = next.boxes.slice(rest);
  next.charOffset += rest;
}

const NUMBER_CELL = /^[<>=≤≥−\-–\s]{0,4}(?:[0-9]{1,9}(?:[.,][0-9]{1,9})?|[.,][0-9]{1,9})[%*†‡a-z]{0,3}$/;

/**
 * A table's rows as cells: columns from the row with the most cells, others by overlap. Header
 * lines at the top (rows with no cell that is a number: `Mean` / `accuracy` /
 * `(N = 82)` set on three lines) are read as one header row, each cell's lines joined.
 */
function tableBlocks(rows: Numbered[], table: number): PdfBlock[] {
  const widest = rows.reduce((a, b) => (b.line.chunks.length > a.line.chunks.length ? b : a));
  const anchors = widest.line.chunks.map((c) => ({ x0: c.x0, x1: c.x1 }));
  const cellsOf = (r: Numbered) => {
    let offset = 0;
    const used = new Set<number>();
    return r.line.chunks.map((c) => {
      let column = 0;
      let best = -Infinity;
      anchors.forEach((a, k) => {
        const overlap = Math.min(a.x1, c.x1) - Math.max(a.x0, c.x0);
        const score = overlap > 0 ? overlap : -Math.abs((a.x0 + a.x1) / 2 - (c.x0 + c.x1) / 2);
        if (score > best && !used.has(k)) {
          best = score;
          column = k;
        }
      });
      used.add(column);
      const start = r.text.indexOf(c.text, offset);
      const at = start < 0 ? offset : start;
      offset = at + c.text.length;
      const piece: PdfPiece = { text: c.text, boxes: c.boxes, page: r.line.page, line: r.number, charOffset: at, opening: openingWords(r.text) };
      return { column, piece };
    });
  };
  let header = 0;
  while (header < rows.length - 1 && !(rows[header] as Numbered).line.chunks.some((c) => NUMBER_CELL.test(c.text))) header += 1;
  const blocks: PdfBlock[] = [];
  let first = 0;
  if (header >= 2) {
    const merged = new Map<number, PdfPiece[]>();
    for (const r of rows.slice(0, header)) for (const { column, piece } of cellsOf(r)) merged.set(column, [...(merged.get(column) ?? []), piece]);
    for (const column of [...merged.keys()].sort((a, b) => a - b)) blocks.push({ kind: 'tableCell', table: { table, row: 0, column }, pieces: merged.get(column) ?? [] });
    first = header;
  }
  rows.slice(first).forEach((r, i) => {
    const row = i + (first > 0 ? 1 : 0);
    for (const { column, piece } of cellsOf(r)) blocks.push({ kind: 'tableCell', table: { table, row, column }, pieces: [piece] });
  });
  return blocks;
}
