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
 * item, a backslash escape, `&`, an inline tag (below) or any non-ASCII character; holds no tab
 * or CR, and no trailing space unless it ends its paragraph; and none of `` ` * _ ~ $ [ ] | ``
 * (but any of them escaped by a backslash) outside a tag, no `\` ending it, and no `<` that
 * opens anything but a whole tag on the line. What such a paragraph holds besides its words is
 * read here as micromark reads it (remark-parse 11, micromark 4):
 * - backslash escapes and character references (`&amp;`, `&#38;`, `&#x26;`: named ones only when
 *   the name is HTML's, numeric ones with micromark's replacements), decoded;
 * - inline HTML tags, open or closing, attributes and all (micromark's grammar, html-text), read
 *   as the walker reads a tag (`<sup>` as `^`, `<br>` as a line break, any other as nothing); a
 *   line may open with one when its name opens no HTML block (CommonMark's kinds 1 and 6) and
 *   text follows it on the line (else kind 7); comments, declarations and the like are not taken;
 * - autolink literals (`www.`, `://`, `@`), whose link text is the text as printed, in a
 *   paragraph with no escape or reference (inside a literal micromark decodes neither).
 * A paragraph's text is then its pieces between tags, decoded, each aligned with its source as
 * the parser's text nodes are. A run is also taken when it has fewer paragraphs but spans
 * PLAIN_MIN_CHARS (one long paragraph of escapes, tags or references is slow too).
 * test/parse/plain-runs.test.ts compares both readings on generated documents.
 */

import { decodeNamedCharacterReference } from 'decode-named-character-reference';
import { htmlBlockNames, htmlRawNames } from 'micromark-util-html-tag-name';
import type { MappedText } from './builder.js';

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

/** One plain paragraph: its lines' ranges (no line ending, no trailing space). */
export interface PlainGroup {
  lines: Array<{ start: number; end: number }>;
  /** A line holds a backslash escape or something that may be a character reference. */
  decodes?: boolean;
  /** A line holds what may start an autolink literal (`www.`, `://`, `@`). */
  literal?: boolean;
}

export interface PlainRun {
  /** Offset of the run's first character: the stand-in the parser sees. */
  start: number;
  /** Length of the stand-in (one code point). */
  standIn: number;
  groups: PlainGroup[];
}

/** ASCII characters that never appear in a plain line outside a tag. */
const BANNED = new Uint8Array(128);
for (const c of '`*_~$[]|\t\r') BANNED[c.charCodeAt(0)] = 1;

/** What a plain line holds beyond words: `PLAIN_DECODES` and `PLAIN_LITERAL` (0 alone: nothing). */
export const PLAIN_DECODES = 1;
export const PLAIN_LITERAL = 2;

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

function isAlphanumeric(c: number): boolean {
  return isAsciiLetter(c) || isDigit(c);
}

function isSpaceOrTab(c: number): boolean {
  return c === 32 || c === 9;
}

/**
 * An inline HTML tag, open or closing, starting with the `<` at `k` and ending before `end`, as
 * micromark's html-text reads one (micromark-core-commonmark 2): the offset just past its `>`,
 * else -1. Line endings, which the parser allows inside a tag, are not: the tag must close on
 * its line.
 */
export function inlineTagEnd(text: string, k: number, end: number): number {
  let p = k + 1;
  if (text.charCodeAt(p) === 47) {
    p += 1;
    if (p >= end || !isAsciiLetter(text.charCodeAt(p))) return -1;
    p += 1;
    while (p < end && (isAlphanumeric(text.charCodeAt(p)) || text.charCodeAt(p) === 45)) p += 1;
    while (p < end && isSpaceOrTab(text.charCodeAt(p))) p += 1;
    return p < end && text.charCodeAt(p) === 62 ? p + 1 : -1;
  }
  if (p >= end || !isAsciiLetter(text.charCodeAt(p))) return -1;
  p += 1;
  while (p < end && (isAlphanumeric(text.charCodeAt(p)) || text.charCodeAt(p) === 45)) p += 1;
  // the name ends at `/`, `>` or a space
  const after = p < end ? text.charCodeAt(p) : -1;
  if (!(after === 47 || after === 62 || isSpaceOrTab(after))) return -1;
  for (;;) {
    if (p >= end) return -1;
    const c = text.charCodeAt(p);
    if (c === 62) return p + 1;
    if (c === 47) return p + 1 < end && text.charCodeAt(p + 1) === 62 ? p + 2 : -1;
    if (isSpaceOrTab(c)) {
      p += 1;
      continue;
    }
    if (!(c === 58 || c === 95 || isAsciiLetter(c))) return -1;
    // an attribute: its name, then `=` and a value, or not
    p += 1;
    for (let d = text.charCodeAt(p); p < end && (isAlphanumeric(d) || d === 45 || d === 46 || d === 58 || d === 95); d = text.charCodeAt(p)) p += 1;
    while (p < end && isSpaceOrTab(text.charCodeAt(p))) p += 1;
    if (p >= end || text.charCodeAt(p) !== 61) continue;
    p += 1;
    while (p < end && isSpaceOrTab(text.charCodeAt(p))) p += 1;
    if (p >= end) return -1;
    const q = text.charCodeAt(p);
    if (q === 60 || q === 61 || q === 62 || q === 96) return -1;
    if (q === 34 || q === 39) {
      p += 1;
      while (p < end && text.charCodeAt(p) !== q) p += 1;
      if (p >= end) return -1;
      p += 1;
      // after a quoted value: `>`, `/` or a space
      const a = p < end ? text.charCodeAt(p) : -1;
      if (!(a === 62 || a === 47 || isSpaceOrTab(a))) return -1;
      continue;
    }
    for (;;) {
      if (p >= end) return -1;
      const u = text.charCodeAt(p);
      if (u === 34 || u === 39 || u === 60 || u === 61 || u === 96) return -1;
      if (u === 47 || u === 62 || isSpaceOrTab(u)) break;
      p += 1;
    }
  }
}

/** A tag's name, lower-cased (`<Div x>`, `</p>`). */
function tagName(text: string, k: number, tagEnd: number): string {
  let p = k + 1;
  if (text.charCodeAt(p) === 47) p += 1;
  const from = p;
  while (p < tagEnd && (isAlphanumeric(text.charCodeAt(p)) || text.charCodeAt(p) === 45)) p += 1;
  return text.slice(from, p).toLowerCase();
}

/**
 * A character reference at the `&` at `k` (micromark's character-reference construct): its end
 * and the text it stands for, else undefined (the `&` is then text).
 */
export function referenceAt(text: string, k: number, end: number): { end: number; value: string } | undefined {
  let p = k + 1;
  if (text.charCodeAt(p) === 35) {
    p += 1;
    const hex = text.charCodeAt(p) === 120 || text.charCodeAt(p) === 88;
    if (hex) p += 1;
    const from = p;
    const max = hex ? 6 : 7;
    while (p < end && p - from < max && (hex ? isHexDigit(text.charCodeAt(p)) : isDigit(text.charCodeAt(p)))) p += 1;
    if (p === from || p >= end || text.charCodeAt(p) !== 59) return undefined;
    return { end: p + 1, value: numericReference(Number.parseInt(text.slice(from, p), hex ? 16 : 10)) };
  }
  const from = p;
  while (p < end && p - from < 31 && isAlphanumeric(text.charCodeAt(p))) p += 1;
  if (p === from || p >= end || text.charCodeAt(p) !== 59) return undefined;
  const value = decodeNamedCharacterReference(text.slice(from, p));
  return value === false ? undefined : { end: p + 1, value };
}

function isHexDigit(c: number): boolean {
  return isDigit(c) || (c >= 65 && c <= 70) || (c >= 97 && c <= 102);
}

/**
 * What a numeric reference stands for, as micromark decodes one
 * (micromark-util-decode-numeric-character-reference 2): U+FFFD for controls but tab and line
 * endings, surrogates, noncharacters and values past Unicode.
 */
function numericReference(code: number): string {
  if (
    code < 9 ||
    code === 11 ||
    (code > 13 && code < 32) ||
    (code > 126 && code < 160) ||
    (code > 55_295 && code < 57_344) ||
    (code > 64_975 && code < 65_008) ||
    (code & 65_535) === 65_535 ||
    (code & 65_535) === 65_534 ||
    code > 1_114_111
  ) {
    return '\ufffd';
  }
  return String.fromCodePoint(code);
}

/**
 * Whether text[start, end) is a plain line (see the module comment): -1 when it is not, else
 * `PLAIN_DECODES` and `PLAIN_LITERAL` for what it holds. `end` excludes any trailing space (the
 * caller allows them only on a paragraph's last line).
 */
export function plainLineKind(text: string, start: number, end: number): number {
  if (start >= end) return -1;
  const first = text.charCodeAt(start);
  // a backslash escape opens no block (`\# x`, `\| a` are paragraph text)
  const escaped = first === 92 && start + 1 < end && isAsciiPunctuation(text.charCodeAt(start + 1));
  if (first === 60) {
    // a tag opening the line: not one that opens an HTML block, and text after it on the line
    const tagEnd = inlineTagEnd(text, start, end);
    if (tagEnd < 0) return -1;
    const name = tagName(text, start, tagEnd);
    if (htmlBlockNames.includes(name) || htmlRawNames.includes(name)) return -1;
    let k = tagEnd;
    while (k < end && isSpaceOrTab(text.charCodeAt(k))) k += 1;
    if (k >= end) return -1;
  } else if (first < 128 && !isAsciiLetter(first) && !isDigit(first) && !escaped && first !== 38) return -1;
  if (first >= 0xd800 && first <= 0xdfff && !(first <= 0xdbff && start + 1 < end)) return -1;
  if (isDigit(first)) {
    // `1.` or `1)` followed by a space or the line's end opens an ordered list item
    let k = start;
    while (k < end && isDigit(text.charCodeAt(k))) k += 1;
    const after = text.charCodeAt(k);
    if ((after === 46 || after === 41) && k - start <= 9 && (k + 1 >= end || text.charCodeAt(k + 1) === 32)) return -1;
  }
  if (text.charCodeAt(end - 1) === 32) return -1;
  let kind = 0;
  for (let k = start; k < end; k += 1) {
    const c = text.charCodeAt(k);
    if (c >= 128) continue;
    if (c === 92) {
      // `\|` reads `|` (whatever it escapes is text); a backslash before anything else is
      // itself; one ending the line is a hard break
      if (k + 1 >= end) return -1;
      if (isAsciiPunctuation(text.charCodeAt(k + 1))) {
        kind |= PLAIN_DECODES;
        k += 1;
      }
      continue;
    }
    if (BANNED[c] === 1) return -1;
    const next = k + 1 < end ? text.charCodeAt(k + 1) : 32;
    if (c === 60) {
      // a whole tag is read; anything else a `<` may open (a comment, a declaration, an
      // autolink, a tag closing on a later line) is not
      if (isAsciiLetter(next) || next === 47) {
        const tagEnd = inlineTagEnd(text, k, end);
        if (tagEnd < 0) return -1;
        k = tagEnd - 1;
      } else if (next === 33 || next === 63) return -1;
      continue;
    }
    // a character reference, or what may be one
    if (c === 38 && (isAlphanumeric(next) || next === 35)) kind |= PLAIN_DECODES;
    // `www.`, `://` and `@` start autolink literals
    else if (c === 64) kind |= PLAIN_LITERAL;
    else if (c === 46 && k >= start + 3 && (text.charCodeAt(k - 1) | 32) === 119 && (text.charCodeAt(k - 2) | 32) === 119 && (text.charCodeAt(k - 3) | 32) === 119) kind |= PLAIN_LITERAL;
    else if (c === 58 && next === 47 && text.charCodeAt(k + 2) === 47) kind |= PLAIN_LITERAL;
  }
  return kind;
}

/** Whether text[start, end) is a plain line that ends no paragraph (see plainLineKind). */
export function isPlainLine(text: string, start: number, end: number): boolean {
  return plainLineKind(text, start, end) >= 0;
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
  /** The line before ended with a space: only a blank line may follow it in a plain paragraph. */
  let trailing = false;
  let fence: { char: number; size: number } | undefined;
  let html: string | undefined;
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
      if (group && !spoilt && takes(group)) groups.push(group);
      else if (group || spoilt) closeRun();
      group = undefined;
      spoilt = false;
      trailing = false;
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
    // trailing spaces end a paragraph's last line only (elsewhere they may make a hard break)
    let stop = end;
    while (stop > pos && text.charCodeAt(stop - 1) === 32) stop -= 1;
    const kind = f || html !== undefined || trailing ? -1 : plainLineKind(text, pos, stop);
    if (kind < 0) {
      spoilt = true;
      group = undefined;
      closeRun();
    } else if (!spoilt) {
      if (prevBlank) group = { lines: [] };
      if (group) {
        group.lines.push({ start: pos, end: stop });
        if (kind & PLAIN_DECODES) group.decodes = true;
        if (kind & PLAIN_LITERAL) group.literal = true;
      }
    }
    trailing = stop < end;
    prevBlank = false;
    pos = next;
  }
  if (group && !spoilt && takes(group)) groups.push(group);
  closeRun();
  return runs;
}

/** Inside an autolink literal micromark decodes no escape or reference: a paragraph holding both is left to it. */
function takes(group: PlainGroup): boolean {
  return !(group.decodes === true && group.literal === true);
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

/** The range standInRuns makes spaces of, line endings and all, with the stand-in before it. */
export function plainRange(run: PlainRun): { start: number; end: number } {
  return { start: run.start, end: runEnd(run) };
}

/**
 * How to turn a line number the parser gives for a place at or after `offset` into the line of
 * the original text: add the line endings that the ranges before `offset` had (the ranges made
 * spaces for the parser: plain runs' by standInRuns, long tables' by blankRuns in bulkTable.ts;
 * in order, not overlapping).
 */
export function lineShift(text: string, ranges: ReadonlyArray<{ start: number; end: number }>): (offset: number) => number {
  if (ranges.length === 0) return () => 0;
  const ends: number[] = [];
  const removed: number[] = [];
  let total = 0;
  for (const range of ranges) {
    for (let k = range.start; k < range.end; k += 1) if (text.charCodeAt(k) === 10) total += 1;
    ends.push(range.end);
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

/** `<sup>` reads as an exponent mark, `<br>` as a line break; any other tag as nothing (the walker's reading of an inline tag). */
export function inlineTagText(tag: string): string {
  return SUP.test(tag) ? '^' : BR.test(tag) ? '\n' : '';
}

const SUP = /^<sup\b/i;
const BR = /^<br\b/i;

/**
 * A plain paragraph as the parser's tree gives it to the walker: the text between tags (text
 * nodes, escapes and references decoded, each aligned with its source) and each tag read as the
 * walker reads inline HTML.
 */
export function readPlainGroup(text: string, group: PlainGroup, out: MappedText): void {
  const from = (group.lines[0] as { start: number }).start;
  const to = (group.lines[group.lines.length - 1] as { end: number }).end;
  let piece = from;
  const pushText = (a: number, b: number) => {
    if (b > a) out.pushAligned(decodeText(text, a, b), text, a, b);
  };
  for (const line of group.lines) {
    for (let k = line.start; k < line.end; k += 1) {
      const c = text.charCodeAt(k);
      if (c === 92 && k + 1 < line.end && isAsciiPunctuation(text.charCodeAt(k + 1))) k += 1;
      else if (c === 60) {
        const tagEnd = inlineTagEnd(text, k, line.end);
        if (tagEnd < 0) continue;
        pushText(piece, k);
        const read = inlineTagText(text.slice(k, tagEnd));
        if (read !== '') out.pushSynthetic(read, k, tagEnd);
        piece = tagEnd;
        k = tagEnd - 1;
      }
    }
  }
  pushText(piece, to);
}

/** Source text of a plain paragraph between tags, escapes and character references decoded. */
function decodeText(text: string, a: number, b: number): string {
  const raw = text.slice(a, b);
  if (!raw.includes('\\') && !raw.includes('&')) return raw;
  const parts: string[] = [];
  let at = a;
  for (let k = a; k < b; k += 1) {
    const c = text.charCodeAt(k);
    if (c === 92 && k + 1 < b && isAsciiPunctuation(text.charCodeAt(k + 1))) {
      parts.push(text.slice(at, k));
      at = k + 1;
      k += 1;
    } else if (c === 38) {
      const ref = referenceAt(text, k, b);
      if (!ref) continue;
      parts.push(text.slice(at, k), ref.value);
      at = ref.end;
      k = ref.end - 1;
    }
  }
  parts.push(text.slice(at, b));
  return parts.join('');
}
