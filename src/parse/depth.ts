/**
 * A cheap upper estimate of how deeply the Markdown containers (block quotes, list items,
 * indentation) of any line nest. The Markdown parser and the tree utilities it feeds recurse
 * per level and slow down with depth, so a document nested past DEPTH_LIMIT is read as plain
 * text instead (positions stay exact; the note says so).
 */
export const DEPTH_LIMIT = 100;

export function exceedsNesting(source: string, limit = DEPTH_LIMIT): { line: number; offset: number } | undefined {
  let line = 1;
  // a byte-order mark is not part of the first line's markers (the Markdown parser skips it too)
  let i = source.charCodeAt(0) === 0xfeff ? 1 : 0;
  const n = source.length;
  while (i < n) {
    const lineStart = i;
    let depth = 0;
    let columns = 0;
    // leading container markers and whitespace
    for (; i < n; i++) {
      const c = source.charCodeAt(i);
      if (c === 0x20) columns += 1;
      else if (c === 0x09) columns += 4;
      else if (c === 0x3e /* > */) depth += 1;
      else if ((c === 0x2d || c === 0x2a || c === 0x2b) /* - * + */ && isSpace(source.charCodeAt(i + 1))) depth += 1;
      else if (c >= 0x30 && c <= 0x39) {
        let j = i;
        while (j < n && j - i < 9 && source.charCodeAt(j) >= 0x30 && source.charCodeAt(j) <= 0x39) j++;
        const d = source.charCodeAt(j);
        if ((d === 0x2e || d === 0x29) && isSpace(source.charCodeAt(j + 1))) {
          depth += 1;
          i = j;
        } else break;
      } else break;
      if (depth + (columns >> 1) > limit) return { line, offset: lineStart };
    }
    const next = source.indexOf('\n', i);
    if (next < 0) break;
    i = next + 1;
    line += 1;
  }
  return undefined;
}

function isSpace(c: number): boolean {
  return c === 0x20 || c === 0x09;
}

/** Below this many markup characters in a document, nothing is defused. */
export const DENSE_MARKUP_FLOOR = 10_000;
/** Share of a block's characters that are emphasis or link markup from which the block is defused. */
export const DENSE_MARKUP_SHARE = 0.05;

const EMPHASIS = /[*_]/g;
const BRACKETS = /[[\]!]/g;
const DOLLARS = /\$/g;
const TILDES = /~/g;
const BACKTICKS = /`/g;
/**
 * Each class of markup character, counted and defused on its own. Strike-through pairs cost
 * the parser time quadratic in their number per block, so a block with more than
 * STRIKE_BLOCK_LIMIT tildes is defused whatever their share.
 */
const CLASSES = [EMPHASIS, BRACKETS, DOLLARS, TILDES, BACKTICKS];
export const STRIKE_BLOCK_LIMIT = 4_000;

/**
 * Emphasis, link, inline-math and code-span markup costs the Markdown parser some 15× the time of prose per
 * character (measured with remark-parse 11, remark-math 6 for `$`), nested images grow faster than linearly,
 * and GFM strike-through (`~~`) is quadratic in the number of pairs in a block (remark-gfm 4: 1 MB of them
 * took over 130× ordinary text). A document that
 * is mostly such markup (conversion debris, or input made to stall a CI job) has those characters
 * in its densest blocks replaced by U+200B, which has the same length (offsets are unchanged) and
 * which the normaliser drops, so statistics inside read as before. Ordinary manuscripts, with
 * fewer than DENSE_MARKUP_FLOOR such characters, are never touched.
 */
export function defuseDenseMarkup(source: string): { text: string; firstLine: number; blocks: number } | undefined {
  const dense = CLASSES.filter((re) => count(source, re) >= DENSE_MARKUP_FLOOR);
  if (dense.length === 0) return undefined;
  const blank = /\n[ \t]*(?:\r?\n)+/g;
  let out = '';
  let from = 0;
  let blocks = 0;
  let firstOffset = -1;
  const take = (to: number) => {
    const block = source.slice(from, to);
    let piece = block;
    for (const re of dense) {
      const n = count(block, re);
      if (n > block.length * DENSE_MARKUP_SHARE || (re === TILDES && n > STRIKE_BLOCK_LIMIT)) piece = piece.replace(re, '\u200b');
    }
    if (piece !== block) {
      blocks += 1;
      if (firstOffset < 0) firstOffset = from;
    }
    out += piece;
  };
  for (let m = blank.exec(source); m; m = blank.exec(source)) {
    take(m.index);
    out += m[0];
    from = m.index + m[0].length;
  }
  take(source.length);
  if (blocks === 0) return undefined;
  let firstLine = 1;
  for (let i = source.indexOf('\n'); i >= 0 && i < firstOffset; i = source.indexOf('\n', i + 1)) firstLine += 1;
  return { text: out, firstLine, blocks };
}

function count(s: string, re: RegExp): number {
  re.lastIndex = 0;
  let n = 0;
  while (re.exec(s)) n += 1;
  return n;
}
