/**
 * Runs of plain paragraphs, read without the Markdown parser.
 *
 * micromark's cost per block is far above its cost per byte of prose: a megabyte of tiny
 * separate paragraphs (one-character blocks, the block quotes that shapes.ts sets aside past its
 * limit, which become paragraphs) took some six times the time of ordinary text. A paragraph
 * whose lines hold no character that can start Markdown markup reads as its own text, one for
 * one, so such paragraphs are found here before parsing, in one linear pass, and read here.
 *
 * A run is at least `minGroups` such paragraphs separated only by blank lines, with a blank line
 * (or the start of the text) before it and after each paragraph (or the end of the text). The
 * parser sees only the run's first character (a one-character paragraph standing in for the
 * run, so containers before it close exactly as the run's first paragraph closes them) and
 * spaces (line endings kept, offsets unchanged). After the run the parser's state is the same
 * in both readings: at the top level, nothing open, a paragraph closed by a blank line. The
 * tree confirms each stand-in as a top-level paragraph (else the run is put back: it sat in a
 * fence, raw HTML or math this scan did not see).
 *
 * A plain line starts at its first column with a letter, a digit that opens no ordered list
 * item, a backslash escape, or any non-ASCII character; holds no tab, CR or trailing space (but
 * a paragraph's last line may end in spaces, which the parser drops and so are left out); and none of
 * `` ` * _ ~ $ [ ] | @ `` (but any of them escaped by a backslash), no `\` ending it, no `<` or
 * `&` or `!` that could open a tag, a character reference or an image, and no `www.` or `://`
 * (autolink literals). Its paragraph's text is then its lines joined by line breaks with
 * backslash escapes resolved, exactly as the parser gives it. A run is also taken when it has
 * fewer paragraphs but spans PLAIN_MIN_CHARS (one long paragraph of escapes is slow too). test/parse/plain-runs.test.ts compares
 * both readings on generated documents.
 */

/**
 * Default: runs of at least this many plain paragraphs are read here, so every plain paragraph
 * is. In an ordinary manuscript most paragraphs are plain prose between paragraphs that hold
 * statistics (`$`, `*`, `[`): read here, they cost a linear scan and a copy instead of
 * micromark's tokenizer, events and tree (bench figure 1: the parse was some two thirds of an
 * in-process check of a stat-dense manuscript). A stand-in that the tree does not confirm costs
 * a second parse, which only code or raw HTML this scan does not follow can cause.
 */
export const PLAIN_MIN_GROUPS = 1;

/** Runs of fewer paragraphs are read here too when they span at least this many characters. */
export const PLAIN_MIN_CHARS = 65_536;

/** One plain paragraph: its lines' ranges (no line ending). */
export interface PlainGroup {
  lines: Array<{ start: number; end: number }>;
}

export interface PlainRun {
  /** Offset of the run's first character: the stand-in the parser sees. */
  start: number;
  /** Length of the stand-in (one code point). */
  standIn: number;
  groups: PlainGroup[];
}

/** ASCII characters that never appear in a plain line. */
const BANNED = new Uint8Array(128);
for (const c of '`*_~$[]|@\t\r') BANNED[c.charCodeAt(0)] = 1;

/** ASCII punctuation: what a backslash escapes (CommonMark 2.4). */
function isAsciiPunctuation(c: number): boolean {
  return (c >= 33 && c <= 47) || (c >= 58 && c <= 64) || (c >= 91 && c <= 96) || (c >= 123 && c <= 126);
}

function isAsciiLetter(c: number): boolean {
  return (c >= 65 && c <= 90) || (c >= 97 && c <= 122);
}

function isDigit(c: number): boolean {
  return c >= 48 && c <= 57;
}

/** Whether text[start, end) is a plain line (see the module comment). */
export function isPlainLine(text: string, start: number, end: number): boolean {
  if (start >= end) return false;
  const first = text.charCodeAt(start);
  // a backslash escape opens no block (`\# x`, `\| a` are paragraph text)
  const escaped = first === 92 && start + 1 < end && isAsciiPunctuation(text.charCodeAt(start + 1));
  if (first < 128 && !isAsciiLetter(first) && !isDigit(first) && !escaped) return false;
  if (first >= 0xd800 && first <= 0xdfff && !(first <= 0xdbff && start + 1 < end)) return false;
  if (isDigit(first)) {
    // `1.` or `1)` followed by a space or the line's end opens an ordered list item
    let k = start;
    while (k < end && isDigit(text.charCodeAt(k))) k += 1;
    const after = text.charCodeAt(k);
    if ((after === 46 || after === 41) && k - start <= 9 && (k + 1 >= end || text.charCodeAt(k + 1) === 32)) return false;
  }
  if (text.charCodeAt(end - 1) === 32) return false;
  for (let k = start; k < end; k += 1) {
    const c = text.charCodeAt(k);
    if (c >= 128) continue;
    if (c === 92) {
      // `\|` reads `|` (whatever it escapes is text); a backslash before anything else is
      // itself; one ending the line is a hard break
      if (k + 1 >= end) return false;
      if (isAsciiPunctuation(text.charCodeAt(k + 1))) k += 1;
      continue;
    }
    if (BANNED[c] === 1) return false;
    const next = k + 1 < end ? text.charCodeAt(k + 1) : 32;
    // a tag, a comment, a declaration or an autolink needs a letter, `/`, `!` or `?` after `<`
    if (c === 60 && (isAsciiLetter(next) || next === 47 || next === 33 || next === 63)) return false;
    // a character reference: `&amp;`, `&#38;`
    if (c === 38 && (isAsciiLetter(next) || next === 35)) return false;
    // `www.` and `://` start autolink literals
    if (c === 46 && k >= start + 3 && (text.charCodeAt(k - 1) | 32) === 119 && (text.charCodeAt(k - 2) | 32) === 119 && (text.charCodeAt(k - 3) | 32) === 119) return false;
    if (c === 58 && next === 47 && text.charCodeAt(k + 2) === 47) return false;
  }
  return true;
}

function isBlankLine(text: string, start: number, end: number): boolean {
  for (let k = start; k < end; k += 1) {
    const c = text.charCodeAt(k);
    if (c !== 32 && c !== 9) return false;
  }
  return true;
}

/** A fence (``` or ~~~ of three or more, or $$ of two or more) after up to three spaces: its character and length. */
function fenceAt(text: string, start: number, end: number): { char: number; size: number; info: boolean } | undefined {
  let p = start;
  while (p < end && p - start < 3 && text.charCodeAt(p) === 32) p += 1;
  const c = text.charCodeAt(p);
  if (c !== 96 && c !== 126 && c !== 36) return undefined;
  let k = p;
  while (k < end && text.charCodeAt(k) === c) k += 1;
  if (k - p < (c === 36 ? 2 : 3)) return undefined;
  return { char: c, size: k - p, info: !isBlankLine(text, k, end) };
}

/** Raw HTML of CommonMark's kinds 1 to 5 opening after up to three spaces: the text that closes it. */
function longHtmlAt(text: string, start: number, end: number): string | undefined {
  let p = start;
  while (p < end && p - start < 3 && text.charCodeAt(p) === 32) p += 1;
  if (text.charCodeAt(p) !== 60) return undefined;
  const s = text.slice(p, Math.min(end, p + 12)).toLowerCase();
  if (s.startsWith('<!--')) return '-->';
  if (s.startsWith('<?')) return '?>';
  if (s.startsWith('<![cdata[')) return ']]>';
  if (/^<![a-z]/.test(s)) return '>';
  const m = /^<(script|pre|style|textarea)(?:[\s>]|$)/.exec(s);
  return m ? `</${m[1] as string}>` : undefined;
}

/**
 * Runs of at least `minGroups` plain paragraphs. Code and raw HTML that may run across blank
 * lines (fences, `$$` math, HTML of kinds 1 to 5) are followed wherever they may open, so that
 * no line inside one is taken; where this scan cannot tell (a backtick fence whose info holds a
 * backtick, `$$` with text after it), nothing further is taken.
 */
export function findPlainRuns(text: string, minGroups = PLAIN_MIN_GROUPS): PlainRun[] {
  if (!Number.isFinite(minGroups)) return [];
  const runs: PlainRun[] = [];
  let groups: PlainGroup[] = [];
  let group: PlainGroup | undefined;
  /** The current paragraph (non-blank lines) holds a line that is not plain. */
  let spoilt = false;
  let prevBlank = true;
  let fence: { char: number; size: number } | undefined;
  let html: string | undefined;
  /** The current paragraph's last line had trailing spaces: it must be its last. */
  let openEnd = false;
  const closeRun = () => {
    const first = groups[0]?.lines[0];
    if (first && (groups.length >= Math.max(1, minGroups) || runEnd({ start: first.start, standIn: 1, groups }) - first.start >= PLAIN_MIN_CHARS)) {
      const c = text.charCodeAt(first.start);
      runs.push({ start: first.start, standIn: c >= 0xd800 && c <= 0xdbff ? 2 : 1, groups });
    }
    groups = [];
  };
  let pos = 0;
  // closed front matter is YAML, not paragraphs
  if (/^---[ \t]*\r?\n/.test(text)) {
    const close = /\n---[ \t]*\r?(?:\n|$)/.exec(text);
    if (close) pos = close.index + close[0].length;
    else return [];
  }
  for (; pos <= text.length; ) {
    const nl = text.indexOf('\n', pos);
    const end = nl < 0 ? text.length : nl;
    const next = nl < 0 ? text.length + 1 : nl + 1;
    if (fence) {
      const f = fenceAt(text, pos, end);
      if (f && f.char === fence.char && f.size >= fence.size && !f.info) fence = undefined;
      pos = next;
      prevBlank = false;
      continue;
    }
    if (html !== undefined) {
      if (text.slice(pos, end).toLowerCase().includes(html)) html = undefined;
      pos = next;
      prevBlank = false;
      continue;
    }
    if (isBlankLine(text, pos, end)) {
      openEnd = false;
      if (group && !spoilt) groups.push(group);
      else if (group || spoilt) closeRun();
      group = undefined;
      spoilt = false;
      prevBlank = true;
      pos = next;
      continue;
    }
    const f = fenceAt(text, pos, end);
    if (f) {
      // an info string with a backtick makes it no fence, and `$$` followed by text is math the
      // scan does not follow: stop taking runs
      if ((f.char === 96 && text.slice(pos, end).lastIndexOf('`') > text.slice(pos, end).indexOf('`') + f.size - 1) || (f.char === 36 && f.info)) {
        group = undefined;
        closeRun();
        return runs;
      }
      fence = f;
    } else {
      const h = longHtmlAt(text, pos, end);
      if (h !== undefined) html = text.slice(pos, end).toLowerCase().includes(h, 2) ? undefined : h;
    }
    // trailing spaces end a paragraph's last line only (the parser drops them there; inside a
    // paragraph they make a break): such a line is taken without them, and a line after it spoils
    let bare = end;
    while (bare > pos && text.charCodeAt(bare - 1) === 32) bare -= 1;
    if (f || html !== undefined || openEnd || !isPlainLine(text, pos, bare)) {
      spoilt = true;
      group = undefined;
      openEnd = false;
      closeRun();
    } else if (!spoilt) {
      if (prevBlank) group = { lines: [] };
      group?.lines.push({ start: pos, end: bare });
      openEnd = bare < end;
    }
    prevBlank = false;
    pos = next;
  }
  if (group && !spoilt) groups.push(group);
  closeRun();
  return runs;
}

/**
 * The text as the parser sees it: each run's stand-in kept and the rest of the run, line endings
 * too, made spaces (offsets unchanged): micromark's cost per line is high even for blank lines
 * (some 40 µs each measured here), so a run of 200,000 tiny paragraphs must not leave 400,000 of
 * them. The stand-in paragraph then ends at the run's end, where a blank line (or the end of the
 * text) follows, as after the run's last paragraph. Line numbers after a run are the parser's
 * minus the line endings removed before them: see `lineShift`.
 */
export function standInRuns(text: string, runs: readonly PlainRun[]): string {
  if (runs.length === 0) return text;
  const parts: string[] = [];
  let at = 0;
  for (const run of runs) {
    const from = run.start + run.standIn;
    const to = runEnd(run);
    parts.push(text.slice(at, from), ' '.repeat(to - from));
    at = to;
  }
  parts.push(text.slice(at));
  return parts.join('');
}

/** Offset just past a run's last line (before its line ending). */
export function runEnd(run: PlainRun): number {
  const last = run.groups[run.groups.length - 1] as PlainGroup;
  return (last.lines[last.lines.length - 1] as { end: number }).end;
}

/**
 * How to turn a line number the parser gives for a place at or after `offset` into the line of
 * the original text: add the line endings the runs before `offset` had (standInRuns removed them).
 */
export function lineShift(text: string, runs: readonly PlainRun[]): (offset: number) => number {
  if (runs.length === 0) return () => 0;
  const ends: number[] = [];
  const removed: number[] = [];
  let total = 0;
  for (const run of runs) {
    const to = runEnd(run);
    for (let k = run.start; k < to; k += 1) if (text.charCodeAt(k) === 10) total += 1;
    ends.push(to);
    removed.push(total);
  }
  return (offset) => {
    let lo = 0;
    let hi = ends.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if ((ends[mid] as number) <= offset) lo = mid + 1;
      else hi = mid;
    }
    return lo === 0 ? 0 : (removed[lo - 1] as number);
  };
}

/** A plain paragraph's text as the parser gives it: its lines joined by line breaks, escapes resolved. */
export function plainGroupText(text: string, group: PlainGroup): string {
  const joined = group.lines.map((l) => text.slice(l.start, l.end)).join('\n');
  return joined.includes('\\') ? joined.replace(ESCAPE, '$1') : joined;
}

const ESCAPE = /\\([!-/:-@[-`{-~])/g;
