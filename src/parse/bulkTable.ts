/**
 * Long GFM tables, read without the Markdown parser's per-cell machinery.
 *
 * micromark tokenises every table cell as its own inline document: linear, but about ten
 * times the cost per byte of prose, so a data dump of 100,000 rows took longer than a
 * whole ordinary manuscript of the same size many times over. Here a long run of table
 * rows is found before parsing; all but its first few lines are blanked (replaced by spaces,
 * the line endings between them too, so every other offset stays where it was and the parser
 * sees one blank line); the parser reads the table head; and the blanked rows are then read
 * here, in order, as rows of that same table.
 *
 * Exactness: every blanked line starts (after at most three spaces) with `|`, or holds a `|`
 * and starts with a letter or a digit that is not a list marker, which no other block
 * construct can start with, so in the original each was a row of the table whose last
 * kept row the parser returns (checked against the tree after parsing; a run that is not a
 * table there, say inside a fenced block or raw HTML, is put back and parsed as written).
 * A row whose text has no inline markup character is split here the way GFM splits rows;
 * a chunk holding any row with markup is handed to the parser as a small table of its own,
 * so markup inside cells reads exactly as it would have. A property test compares both
 * readings over generated tables.
 */

/** How many leading lines of a run the parser sees: header, delimiter row and one row. */
const KEPT_LINES = 3;

/** Rows read per chunk; a chunk with any markup row goes to the parser whole. */
export const BULK_CHUNK_ROWS = 256;

/** Default: only runs with at least this many rows past the kept lines are read here. */
export const BULK_MIN_ROWS = 64;

export interface BulkLine {
  /** Offset of the line's first character, of its row text (after the container prefix) and of its end (before `\r\n` / `\n`). */
  lineStart: number;
  start: number;
  end: number;
}

export interface BulkRun {
  /** 1-based line number of the last line the parser sees (a table row, if verified). */
  lastKeptLine: number;
  /** The blanked lines, read here. */
  rows: BulkLine[];
  /**
   * The container prefix (block-quote markers and indentation) all lines of the run share, or
   * undefined when the lines differ in indentation (then the run is taken only for a table at
   * the top level, where up to three spaces of indentation never matter).
   */
  prefix: string | undefined;
  /** Whether every line's prefix is at most three spaces (what a top-level table needs). */
  shallow: boolean;
}

/** Characters that may start inline markup (or an escape, reference, math or raw HTML) in a cell. */
const MARKUP = new Uint8Array(128);
for (const c of '\\`*_~$[]!<&') MARKUP[c.charCodeAt(0)] = 1;

/** End of a line's container prefix: the leading run of spaces and `>` markers. */
function prefixEnd(text: string, start: number, end: number): number {
  let i = start;
  while (i < end && (text.charCodeAt(i) === 32 || text.charCodeAt(i) === 62)) i += 1;
  return i;
}

/**
 * Whether a prefix reads the same when it opens a document of its own: block-quote markers, and
 * between them (or before the first) at most three spaces beyond the one a marker may take, so
 * that no stretch of it reads as indented code. Inside a list item whose content is indented four
 * or more, the table is left to the parser.
 */
function portablePrefix(prefix: string): boolean {
  let spaces = 0;
  for (let i = 0; i < prefix.length; i += 1) {
    if (prefix.charCodeAt(i) === 62) {
      spaces = 0;
      if (prefix.charCodeAt(i + 1) === 32) i += 1; // the one optional space after `>`
    } else if (++spaces > 3) return false;
  }
  return true;
}

/**
 * Whether the text from `at` (after the container prefix) can only be a row when it follows a
 * table row: it starts with `|`, or it holds a `|` and starts with a letter, a digit (not an
 * ordered list marker such as `1.` or `2)`) or a non-ASCII character — nothing a block
 * construct starts with.
 */
function isRowText(text: string, at: number, end: number): boolean {
  const c = text.charCodeAt(at);
  if (c === 124 /* | */) return true;
  const letter = (c >= 65 && c <= 90) || (c >= 97 && c <= 122) || c >= 0x80;
  const digit = c >= 48 && c <= 57;
  if (!letter && !digit) return false;
  if (digit) {
    let i = at;
    while (i < end && i - at < 10 && text.charCodeAt(i) >= 48 && text.charCodeAt(i) <= 57) i += 1;
    const after = text.charCodeAt(i);
    if ((after === 46 || after === 41) && i - at <= 9) {
      const next = text.charCodeAt(i + 1);
      if (i + 1 >= end || next === 32 || next === 9) return false; // `1.` / `1)` starts a list item
    }
  }
  for (let i = at + 1; i < end; i += 1) if (text.charCodeAt(i) === 124) return true;
  return false;
}

function isSpaceOrTab(c: number): boolean {
  return c === 32 || c === 9;
}

function isBlank(text: string, start: number, end: number): boolean {
  for (let i = start; i < end; i += 1) if (!isSpaceOrTab(text.charCodeAt(i))) return false;
  return true;
}

/**
 * Runs of at least `minRows` + 3 consecutive row lines (see isRowText), each followed by a
 * blank line or the end of the text, so that the run's end is the table's end in the original
 * too.
 */
export function findBulkRuns(text: string, minRows = BULK_MIN_ROWS): BulkRun[] {
  if (!Number.isFinite(minRows)) return [];
  const runs: BulkRun[] = [];
  let lineNo = 0;
  let pos = 0;
  let run: BulkLine[] = [];
  let runFirstLine = 0;
  let prefix: string | undefined;
  let shallow = true;
  const close = (nextBlank: boolean): void => {
    if (nextBlank && run.length >= KEPT_LINES + Math.max(1, minRows) && (shallow || (prefix !== undefined && portablePrefix(prefix)))) {
      runs.push({ lastKeptLine: runFirstLine + KEPT_LINES - 1, rows: run.slice(KEPT_LINES), prefix, shallow });
    }
    run = [];
  };
  while (pos <= text.length) {
    lineNo += 1;
    const nl = text.indexOf('\n', pos);
    const next = nl < 0 ? text.length : nl;
    const end = next > pos && text.charCodeAt(next - 1) === 13 ? next - 1 : next;
    const at = prefixEnd(text, pos, end);
    if (at < end && isRowText(text, at, end)) {
      const own = text.slice(pos, at);
      if (run.length === 0) {
        runFirstLine = lineNo;
        prefix = own;
        shallow = true;
      } else if (own !== prefix) {
        prefix = undefined;
      }
      if (own.length > 3 || own.includes('>')) shallow = false;
      run.push({ lineStart: pos, start: at, end });
    } else if (run.length > 0) {
      close(isBlank(text, pos, end));
    }
    if (nl < 0) break;
    pos = nl + 1;
  }
  if (run.length > 0) close(true);
  return runs;
}

/**
 * The text with each run's rows replaced by spaces, the line endings between them too (offsets
 * unchanged): one blank line where the rows stood. micromark's cost per line is high even for a
 * blank line (see standInRuns in plainRuns.ts), so a run of 170,000 rows left as 170,000 blank
 * lines cost more than all the rest of reading the table. The line after the run is blank (or
 * the text ends), as findBulkRuns requires, so the table and its containers end where they did.
 * Line numbers after a run are the parser's plus the line endings removed before them
 * (`blankedRange` gives the range, `lineShift` in plainRuns.ts the shift).
 */
export function blankRuns(text: string, runs: readonly BulkRun[]): string {
  if (runs.length === 0) return text;
  const parts: string[] = [];
  let at = 0;
  for (const run of runs) {
    const { start, end } = blankedRange(run);
    parts.push(text.slice(at, start), ' '.repeat(end - start));
    at = end;
  }
  parts.push(text.slice(at));
  return parts.join('');
}

/** The range blankRuns makes spaces of: from the run's first row's line start to its last row's end. */
export function blankedRange(run: BulkRun): { start: number; end: number } {
  return { start: (run.rows[0] as BulkLine).lineStart, end: (run.rows[run.rows.length - 1] as BulkLine).end };
}

/** ASCII punctuation: the characters a backslash escapes (CommonMark 2.4). */
function isAsciiPunctuation(c: number): boolean {
  return (c >= 33 && c <= 47) || (c >= 58 && c <= 64) || (c >= 91 && c <= 96) || (c >= 123 && c <= 126);
}

/** One cell of a plain row: its content range in the source (trimmed) and its text. */
export interface PlainCell {
  start: number;
  end: number;
  /** The content with backslash escapes resolved (`\|` reads `|`). */
  value: string;
}

/**
 * A row's cells, split as GFM splits a row (`start` is past the container prefix): an opening
 * `|` and a closing `|` optional, cells between unescaped pipes, each trimmed of spaces and
 * tabs, backslash escapes of ASCII punctuation resolved. Undefined when the row holds any other
 * character that may start inline markup (or a backslash before anything else); such rows go
 * to the parser.
 */
export function plainCells(text: string, start: number, end: number): PlainCell[] | undefined {
  let i = start;
  if (text.charCodeAt(i) === 124) i += 1; // past the opening pipe
  const pipes: number[] = [];
  let escapes = false;
  for (let k = i; k < end; k += 1) {
    const c = text.charCodeAt(k);
    if (c === 92 /* \ */) {
      if (k + 1 >= end || !isAsciiPunctuation(text.charCodeAt(k + 1))) return undefined;
      escapes = true;
      k += 1;
    } else if (c === 124) {
      pipes.push(k);
    } else if (c < 128 && MARKUP[c] === 1) {
      return undefined;
    }
  }
  if (escapes) {
    // Around a GFM autolink literal the parser's tree leaves text unplaced, and its reading of
    // an escape there differs in mapping (not in text): such rows go to the parser.
    const line = text.slice(i, end).toLowerCase();
    if (line.includes('www.') || line.includes('://') || line.includes('@')) return undefined;
  }
  let e = end;
  while (e > i && isSpaceOrTab(text.charCodeAt(e - 1))) e -= 1;
  let last = end;
  if (pipes.length > 0 && pipes[pipes.length - 1] === e - 1) last = pipes.pop() as number; // the closing pipe
  const cells: PlainCell[] = [];
  const bounds = [...pipes, last];
  let from = i;
  for (const to of bounds) {
    let a = from;
    let b = to;
    while (a < b && isSpaceOrTab(text.charCodeAt(a))) a += 1;
    while (b > a && isSpaceOrTab(text.charCodeAt(b - 1))) b -= 1;
    const raw = text.slice(a, b);
    cells.push({ start: a, end: b, value: escapes ? raw.replace(ESCAPE, '$1') : raw });
    from = to + 1;
  }
  return cells;
}

const ESCAPE = /\\([!-/:-@[-`{-~])/g;
