/**
 * A long Markdown text parsed in pieces, with the tree one parse of the whole text gives.
 *
 * micromark keeps every event of a text until its tree is built: the parse alone of a 5.6 MB
 * manuscript of 60,000 results (bench figure 13's document) peaked near 600 MB of memory.
 * Parsed a piece at a time, only one piece's events are alive at once (about 400 MB there).
 *
 * A piece ends with a line that a blank line follows, and the next piece starts at the first
 * line after the blank lines. Where the piece's own tree has a block at the root that ends on
 * that line and that nothing holds open past a blank line (a paragraph, table, heading or
 * thematic break: CLOSED), the parse of the whole text has nothing open after the blank line: a
 * block at the root means no block quote, list item or other container holds it. The next line
 * is then read as the first line of a text is, save for what micromark does at the very start
 * of a document: a byte-order mark is dropped, and front matter (`---`) opens only on line 1.
 * So no piece starts with U+FEFF or `---`. Front matter runs across blank lines, and where it
 * is not closed micromark (micromark-extension-frontmatter 2.0) misreads the rest of the text
 * (lists become paragraphs): so where the text opens with `---`, the first piece ends after the
 * next line that opens with `---`, and must open with the front matter read; otherwise (or when
 * no such line follows) the text is parsed whole. A piece is first cut at a line with no space or tab
 * before its line ending, so no trailing white space is read at the end of a piece that the
 * whole text has before a line ending.
 *
 * One thing crosses blank lines at the root: the labels a document defines (link references and
 * footnotes, `[a]: …`, `[^a]: …`). A reference is a link only where its label is defined
 * anywhere in the text, before or after it; each definition holds `]:`, so a text holding `]:`
 * anywhere is parsed whole. So is a text that opens with a byte-order mark, which micromark
 * leaves out of its offsets.
 *
 * A piece's tree is kept up to its last block at the root that closes so, where a piece may end
 * (cutAt); the text after that block is read again as the start of the next piece, which
 * reaches at least twice as far past the piece's end as that text is long. A piece that has no
 * such block (one list, fence or block of raw HTML or math throughout) is parsed again at least
 * twice as long, and so on: each character is read a bounded number of times. Each piece's places are moved by the offset and the
 * lines before it.
 * test/parse/pieces.test.ts compares the two trees on generated documents.
 */
import type { Root, RootContent } from 'mdast';
import type { Point } from 'unist';
import { LineIndex } from './lines.js';

/**
 * The blocks that, last in a piece and ending where it ends, leave nothing open once a blank
 * line follows: a paragraph or a table (a blank line closes either), a heading or a thematic
 * break (each closed by its own line), and a block quote: a line goes on a quote only when it
 * opens with `>` or lazily continues a paragraph, and a blank line does neither, so the quote
 * and all it holds close there (CommonMark 0.31, block quotes). A quote whose last line is only
 * `>` is the exception (endsOnEmptyQuoteLine). A list item, fenced code block,
 * math block or raw HTML ending there may instead run on past the piece, so they are not among
 * them.
 */
const CLOSED = new Set(['paragraph', 'table', 'heading', 'thematicBreak', 'blockquote']);

/** A line after the first that opens with `---` (after spaces or tabs): where front matter may close. */
const LATER_FENCE = /[\r\n][ \t]*---/;

/** Texts of at least twice this many characters are parsed in pieces of about this size. */
export const PIECE_CHARS = 32_768;

type Parser = { parse(text: string): unknown };

const isBlankChar = (c: number) => c === 32 || c === 9;

/** The offset just past the line ending at `i` (`\n`, `\r\n` or a lone `\r`), or -1 when there is none at `i`. */
function pastLineEnding(text: string, i: number): number {
  const c = text.charCodeAt(i);
  if (c === 10) return i + 1;
  if (c === 13) return text.charCodeAt(i + 1) === 10 ? i + 2 : i + 1;
  return -1;
}

/**
 * Where a piece may end at `end`: a line ending follows it (after spaces and tabs only where
 * `trailing` allows them), then one or more blank lines, then a line that opens neither with
 * U+FEFF nor with `---`. `next` is where that line starts; undefined when a piece may not end
 * at `end`.
 */
export function cutAt(text: string, end: number, trailing: boolean): { end: number; next: number } | undefined {
  let k = end;
  while (k < text.length && isBlankChar(text.charCodeAt(k))) k += 1;
  if (k > end && !trailing) return undefined;
  let at = pastLineEnding(text, k);
  if (at < 0) return undefined;
  let blanks = 0;
  for (;;) {
    let j = at;
    while (j < text.length && isBlankChar(text.charCodeAt(j))) j += 1;
    const past = pastLineEnding(text, j);
    if (past < 0) break;
    blanks += 1;
    at = past;
  }
  if (blanks === 0 || at >= text.length || text.charCodeAt(at) === 0xfeff || text.startsWith('---', at)) return undefined;
  return { end, next: at };
}

/**
 * The first end of a line at or after `from` where a piece may end, with no space or tab before
 * its line ending (cutAt), or undefined when there is none.
 */
export function nextCut(text: string, from: number): { end: number; next: number } | undefined {
  for (let k = from; k < text.length; k += 1) {
    const c = text.charCodeAt(k);
    if (c !== 10 && c !== 13) continue;
    const before = k > 0 ? text.charCodeAt(k - 1) : 10;
    const cut = isBlankChar(before) || before === 10 || before === 13 ? undefined : cutAt(text, k, false);
    if (cut) return cut;
    if (c === 13 && text.charCodeAt(k + 1) === 10) k += 1;
  }
  return undefined;
}

/**
 * Whether the line that ends at `end` holds only quote markers, spaces and tabs (`>`, `> >`).
 * A block quote ending on such a line is not a place to end a piece: where the text ends there,
 * micromark ends a fence, math block, raw HTML or quote open inside it before that line, and
 * where a blank line follows, after it.
 */
function endsOnEmptyQuoteLine(text: string, end: number): boolean {
  for (let k = end - 1; k >= 0; k -= 1) {
    const c = text.charCodeAt(k);
    if (c === 10 || c === 13) return true;
    if (c !== 62 && !isBlankChar(c)) return false;
  }
  return true;
}

/** Moves every place in `nodes` (and inside them) by `offset` characters and `lines` lines. */
function movePlaces(nodes: readonly RootContent[], offset: number, lines: number): void {
  const move = (p: Point) => {
    p.line += lines;
    if (p.offset !== undefined) p.offset += offset;
  };
  const stack: unknown[] = [...nodes];
  while (stack.length > 0) {
    const node = stack.pop() as { position?: { start: Point; end: Point }; children?: unknown[] };
    if (node.position) {
      move(node.position.start);
      move(node.position.end);
    }
    if (node.children) for (const child of node.children) stack.push(child);
  }
}

/**
 * The tree of `text` as `parser` gives it for the whole text, parsed in pieces of about
 * `pieceChars` where that is exact (above). `frontMatter` says whether the parser reads front
 * matter: one that does not reads an opening `---` as any other line, and needs none of the
 * front-matter rules.
 */
export function parseInPieces(parser: Parser, text: string, pieceChars = PIECE_CHARS, frontMatter = true): Root {
  // micromark drops a byte-order mark that opens the text and counts offsets without it
  if (text.length < 2 * pieceChars || text.includes(']:') || text.charCodeAt(0) === 0xfeff) return parser.parse(text) as Root;
  const children: RootContent[] = [];
  let start = 0;
  // the lines before an offset (a text opening with a byte-order mark is parsed whole, above)
  let index: LineIndex | undefined;
  const linesBefore = (offset: number) => (index ??= new LineIndex(text)).position(offset).line - 1;
  let last: Root | undefined;
  let opening: Point | undefined;
  // front matter opening the text runs on across blank lines to a later `---` line: no piece ends before it
  const opensWithFence = frontMatter && text.startsWith('---');
  const fence = opensWithFence ? LATER_FENCE.exec(text) : null;
  if (opensWithFence && fence === null) return parser.parse(text) as Root;
  const firstFrom = fence ? fence.index + fence[0].length : 0;
  // the length tried for the next piece: doubled after a piece whose blocks give no place to end
  let span = pieceChars;
  for (;;) {
    const cut = text.length - start >= span + pieceChars ? nextCut(text, Math.max(start + span, start === 0 ? firstFrom : 0)) : undefined;
    const piece = cut ? text.slice(start, cut.end) : text.slice(start);
    const tree = parser.parse(piece) as Root;
    // front matter not read in the first piece: the whole text is parsed as one
    if (start === 0 && opensWithFence && cut !== undefined && tree.children[0]?.type !== 'yaml') return parser.parse(text) as Root;
    let taken = tree.children.length;
    let next: { end: number; next: number } | undefined;
    if (cut !== undefined) {
      // the last block at the root that closes where a piece may end: the piece's tree up to it
      // is the whole text's; what follows is read again in the next piece
      for (taken = tree.children.length; taken > 0; taken -= 1) {
        const node = tree.children[taken - 1] as RootContent;
        const end = node.position?.end.offset;
        // trailing white space on the piece's last line may read otherwise before a line ending
        if (CLOSED.has(node.type) && end !== undefined && (node.type !== 'blockquote' || !endsOnEmptyQuoteLine(piece, end)) && (next = cutAt(text, start + end, end < piece.length)) !== undefined) break;
      }
      if (taken === 0) {
        // the next try must reach past this cut (the first cut after `start + span` may lie far
        // beyond it): otherwise the same piece would be parsed again
        span = Math.max(span, cut.end - start) * 2;
        continue;
      }
    }
    const kept = taken === tree.children.length ? tree.children : tree.children.slice(0, taken);
    if (start === 0) opening = tree.position?.start;
    if (start > 0) movePlaces(kept, start, linesBefore(start));
    for (const child of kept) children.push(child);
    last = tree;
    if (next === undefined) break;
    // what this piece read past its last kept block had no place to end: the next piece reaches
    // beyond it, so that it is not read to the same cut again
    span = Math.max(pieceChars, 2 * (cut === undefined ? 0 : cut.end - next.next));
    start = next.next;
  }
  const root: Root = { type: 'root', children };
  const end = last.position?.end;
  if (opening && end) {
    // the first tree's start, and the last tree's end in the lines and offsets of the whole text
    root.position = { start: opening, end: { line: end.line + (start > 0 ? linesBefore(start) : 0), column: end.column, offset: (end.offset ?? 0) + start } };
  }
  return root;
}
