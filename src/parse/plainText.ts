import { MappedText, offsetArray } from './builder.js';
import { markLegends } from './legends.js';
import { normalize } from './normalize.js';
import { alignedTable, hasColumnGap, isPipeRow, pipeTable, type TextCell, type TextLine } from './textTables.js';
import type { ParsedDocument, Segment, SegmentKind, TablePlace } from './types.js';

/**
 * Plain text, typically pulled out of a PDF or converted from LaTeX or XML. Paragraphs are runs
 * of non-blank lines; a hard line wrap reads as a space, and a word hyphenated across a line end
 * (`signifi-` / `cant`) is joined. Converted text often puts each paragraph on one line: a line
 * longer than LONG_LINE characters is a paragraph of its own. Short title-like lines are
 * headings (the section of what follows), ` | ` rows and aligned columns are tables. Text
 * pulled from PDFs loses its line numbers, running heads and page numbers, and a paragraph a
 * page break cut is joined again. Every character stays mapped to its original line and column.
 */
export function parsePlainText(path: string, source: string): ParsedDocument {
  const hadBom = source.charCodeAt(0) === 0xfeff;
  const lines = readLines(source, splitLines(source, hadBom ? 1 : 0));
  stripLineNumbers(source, lines);
  dropPageFurniture(lines);
  const kept = keptLines(lines);
  const tables = findTables(kept);
  const headings = findHeadings(kept, tables);
  const out = new Output();

  // the paragraph's lines, and the line break before each (kept apart until the paragraph ends,
  // so that undoing a hyphen never copies the text gathered so far)
  let para: Array<{ text: string; from: number; space?: [number, number] }> = [];
  let prev: Line | undefined;
  const flush = () => {
    if (para.length > 0) {
      const text = new MappedText();
      for (const piece of para) {
        if (piece.space) text.pushSynthetic(' ', piece.space[0], piece.space[1]);
        text.pushVerbatim(piece.text, piece.from);
      }
      out.emit('text', text);
    }
    para = [];
  };
  for (let i = 0; i < kept.length; ) {
    const line = kept[i] as Line;
    const table = tables.get(i);
    if (table) {
      flush();
      out.table(source, table.cells);
      i = table.end;
      prev = undefined;
      continue;
    }
    if (headings.has(i)) {
      flush();
      const text = new MappedText();
      text.pushVerbatim(line.text, line.from);
      out.heading(text);
      i += 1;
      prev = undefined;
      continue;
    }
    const last = para.at(-1);
    if (last && prev && joins(prev, line)) {
      if (hyphenated(prev.text, line.text)) {
        // undo end-of-line hyphenation: drop the hyphen, join without a space
        last.text = last.text.slice(0, -1);
        para.push({ text: line.text, from: line.from });
      } else {
        para.push({ text: line.text, from: line.from, space: [prev.end, prev.nextStart] });
      }
    } else {
      flush();
      para.push({ text: line.text, from: line.from });
    }
    prev = line;
    i += 1;
  }
  flush();
  markLegends(out.segments, source);
  return { path, source, format: 'text', segments: out.segments, directives: [], hadBom };
}

/** Longer lines are whole paragraphs in converted text (a wrapped page line rarely exceeds ~100). */
export const LONG_LINE = 160;

interface Line extends TextLine {
  /** End of the source line (before its line break). */
  end: number;
  /** Start of the next source line (after the break), or the source length. */
  nextStart: number;
  dropped: boolean;
  /** Set on kept lines: a blank line, or a dropped one, lies between this and the kept line before. */
  blankBefore: boolean;
  droppedBefore: boolean;
}

class Output {
  segments: Segment[] = [];
  private block = 0;
  private tables = 0;
  private section: string | undefined;

  emit(kind: SegmentKind, raw: MappedText, table?: TablePlace): Segment | undefined {
    const text = normalize(raw);
    if (text.text.trim() === '') return undefined;
    if (!table) this.block += 1;
    const seg: Segment = {
      id: this.segments.length,
      block: this.block,
      kind,
      text: text.text,
      starts: offsetArray(text.starts),
      ends: offsetArray(text.ends),
      ...(table ? { table } : {}),
      ...(this.section !== undefined && kind !== 'heading' ? { section: this.section } : {}),
    };
    this.segments.push(seg);
    return seg;
  }

  heading(text: MappedText): void {
    const seg = this.emit('heading', text);
    if (seg) this.section = seg.text.trim();
  }

  table(source: string, cells: TextCell[]): void {
    const table = this.tables;
    this.tables += 1;
    for (const cell of cells) {
      const text = new MappedText();
      text.pushVerbatim(source.slice(cell.from, cell.to), cell.from);
      this.block += 1;
      this.emit('tableCell', text, { table, row: cell.row, column: cell.column, ...(cell.colSpan ? { colSpan: cell.colSpan } : {}) });
    }
  }
}

function readLines(source: string, ranges: LineRange[]): Line[] {
  return ranges.map((r, k) => {
    let from = r.start;
    let to = r.end;
    while (from < to && isBlank(source.charCodeAt(from))) from += 1;
    while (to > from && isBlank(source.charCodeAt(to - 1))) to -= 1;
    const next = ranges[k + 1];
    return {
      start: r.start,
      end: r.end,
      nextStart: next ? next.start : source.length,
      from,
      to,
      text: source.slice(from, to),
      dropped: false,
      blankBefore: false,
      droppedBefore: false,
    };
  });
}

/** Space, tab, form feed (page breaks in PDF text), vertical tab, no-break space. */
function isBlank(c: number): boolean {
  return c === 0x20 || c === 0x09 || c === 0x0c || c === 0x0b || c === 0xa0;
}

/** `12  text`: a line number at the start of a line. */
const LINE_NUMBER = /^[0-9]{1,5}(?:[ \t]{1,8}|$)/;

/**
 * Line numbers (manuscripts submitted with numbered lines): when most lines start with a
 * number and the numbers mostly go up, they are margin, not text.
 */
function stripLineNumbers(source: string, lines: Line[]): void {
  let content = 0;
  let numbered = 0;
  let rising = 0;
  let last = -1;
  for (const l of lines) {
    if (l.from >= l.to) continue;
    content += 1;
    const m = LINE_NUMBER.exec(l.text);
    if (!m) continue;
    numbered += 1;
    const n = Number(m[0]);
    if (n > last) rising += 1;
    last = n;
  }
  if (numbered < 10 || numbered < 0.7 * content || rising < 0.9 * numbered) return;
  for (const l of lines) {
    const m = l.from < l.to ? LINE_NUMBER.exec(l.text) : null;
    if (!m) continue;
    l.from += m[0].length;
    while (l.from < l.to && isBlank(source.charCodeAt(l.from))) l.from += 1;
    l.text = l.text.slice(l.from - (l.to - l.text.length));
  }
}

/** A page number alone on its line: `12`, `- 12 -`, `Page 3 of 20`. */
const PAGE_NUMBER = /^(?:(?:[Pp]age|p\.)[ \t]{0,3})?[-–—]?[ \t]{0,3}[0-9]{1,4}[ \t]{0,3}[-–—]?(?:[ \t]{1,3}(?:of|\/)[ \t]{1,3}[0-9]{1,4})?$/;
/** A running head or foot is short and repeats with only its digits changed. */
const HEADER_MAX = 100;
const HEADER_REPEATS = 3;
const LETTER = /\p{L}/u;
/** A word of three letters or more: what every running head carries ("Page", a title, a name). */
const WORD = /\p{L}{3}/u;
/** A value reported with a relation: `= 0.78`, `< .001`, `t(52) =` at a line end. */
const REPORTS_VALUE = /[=<>≤≥](?:[ \t]{0,3}[-−–]?[0-9.]|[ \t]{0,3}$)/u;
/** The end of a sentence, quotes and brackets allowed after the mark. */
const SENTENCE_END = /[.!?:]["'”’)\]]{0,3}$/;
/** How a sentence cut at a line end goes on: a lowercase word or a number, not a new capitalised start. */
const GOES_ON = /^["'“‘(]{0,2}[\p{Ll}\p{N}]/u;

/**
 * Page furniture of PDF text: lone page numbers between two lines of text, and running heads
 * and feet (short lines repeated at least three times, identical apart from digits, at least
 * one of them cutting a sentence that goes on below it). Headings repeated once per study
 * ("Results") never cut a sentence and stay.
 */
function dropPageFurniture(lines: Line[]): void {
  const content = lines.map((l, k) => (l.from < l.to ? k : -1)).filter((k) => k >= 0);
  const at = (j: number) => (j >= 0 && j < content.length ? (lines[content[j] as number] as Line) : undefined);
  const prose = (l: Line | undefined) => l !== undefined && LETTER.test(l.text) && !isPipeRow(l.text);
  const groups = new Map<string, number[]>();
  content.forEach((k, j) => {
    const l = lines[k] as Line;
    if (PAGE_NUMBER.test(l.text)) {
      if (prose(at(j - 1)) && prose(at(j + 1))) l.dropped = true;
      return;
    }
    // A running head has a word in it and reports no value: a wrapped line of a result
    // ("0.78, P = 0.436.", "(M = 2.56, SD = 0.71), t(52) =") repeats with only its digits changed
    // where a paper words its results alike, and is text.
    if (l.text.length > HEADER_MAX || !WORD.test(l.text) || REPORTS_VALUE.test(l.text) || isPipeRow(l.text)) return;
    const key = l.text.replace(/[0-9]{1,12}/g, '#').replace(/\s{1,50}/g, ' ');
    const list = groups.get(key);
    if (list) list.push(j);
    else groups.set(key, [j]);
  });
  for (const members of groups.values()) {
    if (members.length < HEADER_REPEATS) continue;
    // table rows repeat too, but on neighbouring lines
    if (members.some((j, k) => k > 0 && j - (members[k - 1] as number) < 2)) continue;
    const cuts = members.some((j) => {
      // a page number between the cut sentence and the head is furniture too
      const before = at(j - 1)?.dropped ? at(j - 2) : at(j - 1);
      const after = at(j + 1);
      return prose(before) && !SENTENCE_END.test((before as Line).text) && after !== undefined && GOES_ON.test(after.text);
    });
    if (cuts) for (const j of members) (lines[content[j] as number] as Line).dropped = true;
  }
}

/** The non-blank, non-dropped lines, each knowing what was left out before it. */
function keptLines(lines: Line[]): Line[] {
  const kept: Line[] = [];
  let blank = false;
  let dropped = false;
  for (const l of lines) {
    if (l.from >= l.to) blank = true;
    else if (l.dropped) dropped = true;
    else {
      l.blankBefore = blank || dropped;
      l.droppedBefore = dropped;
      kept.push(l);
      blank = false;
      dropped = false;
    }
  }
  return kept;
}

const CAPTION_LINE = /^(?:Table|TABLE|Tab\.|Figure|Fig\.)[ \u00A0]{0,2}(?:[A-Z]?[0-9]{1,3}|[IVXLC]{1,7}(?![A-Za-z]))/;

/** A line drawn with dashes, rules or equals signs only (three or more): a table's rule. */
function isRuleLine(text: string): boolean {
  let marks = 0;
  for (const c of text) {
    if (c === '-' || c === '=' || c === '─' || c === '━' || c === '—' || c === '_') marks += 1;
    else if (c !== ' ' && c !== '\t') return false;
  }
  return marks >= 3;
}

/** Tables by their first kept line: ` | ` rows first, then aligned columns. */
function findTables(kept: Line[]): Map<number, { end: number; cells: TextCell[] }> {
  const found = new Map<number, { end: number; cells: TextCell[] }>();
  for (let i = 0; i < kept.length; ) {
    // a table is a run of lines without blank lines between them
    let runEnd = i + 1;
    while (runEnd < kept.length && !(kept[runEnd] as Line).blankBefore) runEnd += 1;
    const run = kept.slice(i, runEnd);
    for (let k = 0; k < run.length; ) {
      const pipes = isPipeRow((run[k] as Line).text) ? pipeTable(run, k) : undefined;
      if (pipes) {
        found.set(i + k, { end: i + pipes.end, cells: pipes.cells });
        k = pipes.end;
        continue;
      }
      let e = k;
      // rules drawn with dashes above, under and below the header are part of the table
      while (e < run.length && (isRuleLine((run[e] as Line).text) || (hasColumnGap((run[e] as Line).text) && !isPipeRow((run[e] as Line).text) && !CAPTION_LINE.test((run[e] as Line).text)))) e += 1;
      const rows = run.slice(k, e).filter((l) => !isRuleLine(l.text));
      const cells = rows.length >= 3 ? alignedTable(rows) : undefined;
      if (cells) {
        found.set(i + k, { end: i + e, cells });
        k = e;
      } else k = Math.max(k + 1, e);
    }
    i = runEnd;
  }
  return found;
}

/** `2. Method`, `2.1 Participants`, `IV. Results`: a section number before a title. */
const SECTION_NUMBER = /^(?:[0-9]{1,2}(?:\.[0-9]{1,2}){0,3}\.?|[IVX]{1,5}\.)[ \t]{1,4}(?=\p{Lu})/u;
const TITLE_START = /^\p{Lu}/u;
const NOT_TITLE = /^(?:Table|TABLE|Tab\.|Figure|Fig\.|Notes?\b)|[.,;:]$/;
const HEADING_WORDS = 8;
const HEADING_MAX = 80;
/** How a paragraph starts: a capital, a digit, a quote or a bracket (not a wrapped line's lowercase). */
const PARAGRAPH_START = /^["'“‘(\[]{0,2}[\p{Lu}\p{N}]/u;

/**
 * Short title-like lines: no final period, at most HEADING_WORDS words, starting with a
 * capital (after an optional section number), standing after a blank line or a finished
 * sentence, and followed by a paragraph (or by another heading that is, or by a table after a
 * blank line).
 */
function findHeadings(kept: Line[], tables: Map<number, { end: number }>): Set<number> {
  const inTable = new Uint8Array(kept.length);
  for (const [start, { end }] of tables) for (let k = start; k < end; k += 1) inTable[k] = 1;
  const candidate = (k: number) => {
    const l = kept[k];
    if (!l || inTable[k] || l.text.length > HEADING_MAX || NOT_TITLE.test(l.text) || isPipeRow(l.text)) return false;
    const title = l.text.slice(SECTION_NUMBER.exec(l.text)?.[0].length ?? 0);
    if (!TITLE_START.test(title)) return false;
    return title.split(' ').filter((w) => w !== '').length <= HEADING_WORDS;
  };
  const headings = new Set<number>();
  for (let k = kept.length - 2; k >= 0; k -= 1) {
    if (!candidate(k)) continue;
    const l = kept[k] as Line;
    const before = kept[k - 1];
    // after a blank line, a finished sentence, a table, or a heading above it (`2. Method` / `2.1 Participants`)
    const standsAlone = !before || l.blankBefore || inTable[k - 1] === 1 || candidate(k - 1) || SENTENCE_END.test(before.text) || before.text.length > LONG_LINE;
    if (!standsAlone) continue;
    const next = kept[k + 1] as Line;
    const after = kept[k + 2];
    // the next line opens a paragraph: not title-like itself, or a short first line the paragraph goes on from
    const opensParagraph = PARAGRAPH_START.test(next.text) && (!candidate(k + 1) || (after !== undefined && !after.blankBefore && !inTable[k + 2] && !headings.has(k + 2)));
    // a heading stands over a paragraph, another heading, or a table set off by a blank line
    if (inTable[k + 1] ? next.blankBefore : headings.has(k + 1) || opensParagraph) headings.add(k);
  }
  return headings;
}

/** Whether `line` goes on the paragraph that `prev` ended. */
function joins(prev: Line, line: Line): boolean {
  if (line.droppedBefore) return continues(prev, line);
  if (line.blankBefore) return false;
  if (prev.text.length > LONG_LINE || line.text.length > LONG_LINE) return continues(prev, line);
  return true;
}

/** A sentence cut at the line end goes on below (a lowercase or numeric start, or a hyphenated word). */
function continues(prev: Line, line: Line): boolean {
  return hyphenated(prev.text, line.text) || (!SENTENCE_END.test(prev.text) && GOES_ON.test(line.text));
}

function hyphenated(prev: string, next: string): boolean {
  return /[A-Za-z]-$/.test(prev) && /^[a-z]/.test(next);
}

interface LineRange {
  start: number;
  end: number;
}

function splitLines(text: string, from: number): LineRange[] {
  const out: LineRange[] = [];
  let start = from;
  for (let i = from; i <= text.length; i += 1) {
    const c = text.charCodeAt(i);
    if (i === text.length || c === 10 || c === 13) {
      out.push({ start, end: i });
      if (c === 13 && text.charCodeAt(i + 1) === 10) i += 1;
      start = i + 1;
    }
  }
  return out;
}
