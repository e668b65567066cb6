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
 * anywhere in the text, before or after it. So every piece of a text holding `]:` (each
 * definition holds it) is parsed with the labels the whole text defines (definedLabels.ts,
 * withDefinedLabels): first those its lines show (guessLabels); then the tree's definitions,
 * read at their places (definedLabels), must define exactly those, else the pieces are parsed
 * again with the ones they define (a definition is one whatever labels are defined, and the
 * blocks are the whole text's). A definition whose label runs across lines has the text parsed
 * whole, as has a text that opens with a byte-order mark, which micromark leaves out of its
 * offsets.
 *
 * Inside a run of definitions, one a line with no blank line between them (a reference list, a
 * document's footnotes), a piece may also end after a definition when the next line opens with
 * `[` (definitionCut).
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
import { normalizeIdentifier } from 'micromark-util-normalize-identifier';
import { type LabelSeed, withDefinedLabels } from './definedLabels.js';
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
 * Where a piece may end at `end` inside a run of definitions: a line ending follows it at once
 * and the next line opens with `[` (definitionCut settles it by the block that ends there).
 * `next` is where that line starts; undefined otherwise.
 */
function bracketLineAt(text: string, end: number): { end: number; next: number } | undefined {
  const at = pastLineEnding(text, end);
  return at >= 0 && text.charCodeAt(at) === 91 ? { end, next: at } : undefined;
}

/**
 * A footnote definition's opening, `[^label]:`, as micromark-extension-gfm-footnote 2.1 reads
 * one at a line's start: a label of one or more characters, none of them white space or an
 * unescaped bracket, at most 999 characters (an escape counts two; at most 499 pieces of at
 * most two characters here). Stricter than the extension (no other space, no backslash but
 * before a bracket or a backslash), so each line it takes opens one.
 */
const FOOTNOTE_OPENING = /\[\^(?:[^\s[\]\\]|\\[[\]\\]){1,499}\]:/y;

/**
 * Whether a piece may end after `node`, a block at the root ending at `end` (in `text`), where a
 * line that opens with `[` follows it at once (bracketLineAt): the whole text then reads that
 * line as a text of its own read from its start does, and the block as the piece does.
 * - After a link reference definition: the line goes on the definition's content, which is
 *   exact only when it holds nothing but definitions to its end: a setext underline below a
 *   paragraph in it makes a heading that micromark starts where the content starts, definitions
 *   and all (the property test found that). So the line and each below it up to a blank line,
 *   the text's end or a footnote definition must be a whole definition on its line
 *   (definitionsToTheEnd); each is then one in both readings, as after a definition micromark
 *   tries a definition as at the start of content, and none can take a title from the next. Not
 *   before a footnote definition: opened on a line that interrupts the open content, its first
 *   line may not open an ordered list from other than 1 or an empty item (micromark's interrupt
 *   flag reaches the new container's content), which a piece opening there would (found in
 *   review: `[^b]: 2019. Data …` read as a list).
 * - After a footnote definition: only when the line opens another (FOOTNOTE_OPENING), which
 *   closes the first and all it holds; any other line would go on it (indented or lazily). And
 *   only when its last block, and the last inside that, is none that runs to the end of its
 *   lines (OPEN_TO_LINE_END): closed by the next definition, such a block (a fence left open)
 *   takes in the line ending before it, which the piece's end leaves out.
 */
function definitionCut(node: RootContent, text: string, end: number, runs: DefinitionRuns): { end: number; next: number } | undefined {
  if (node.type !== 'definition' && node.type !== 'footnoteDefinition') return undefined;
  const cut = bracketLineAt(text, end);
  if (cut === undefined) return undefined;
  FOOTNOTE_OPENING.lastIndex = cut.next;
  const opensFootnote = FOOTNOTE_OPENING.test(text);
  if (node.type === 'definition') return !opensFootnote && definitionsToTheEnd(text, cut.next, runs) ? cut : undefined;
  if (!opensFootnote) return undefined;
  for (let last: unknown = node; last !== undefined; ) {
    const n = last as { type: string; children?: unknown[] };
    if (OPEN_TO_LINE_END.has(n.type)) return undefined;
    last = n.children?.at(-1);
  }
  return cut;
}

/**
 * A link reference definition whole on one line, as CommonMark reads one at a line's start: a
 * label with no unescaped bracket, of at most 999 characters (499 pieces of at most two here), a destination (in `<>`, or with no space, parenthesis,
 * backslash or control character), and optionally a title in double quotes, then only spaces
 * or tabs. Stricter than CommonMark, so each line it takes is a definition wherever content may
 * start a definition.
 */
const DEFINITION_ON_ITS_LINE = /\[(?:[^\\[\]\r\n]|\\[[\]\\]){1,499}\]:[ \t]*(?:<[^<>\\\r\n]*>|[^\s<()\\\x00-\x1f\x7f][^\s()\\\x00-\x1f\x7f]*)(?:[ \t]+"[^"\\\r\n]*")?[ \t]*(?=[\r\n]|$)/y;

/** definitionsToTheEnd's last answer: the lines from `from` to `to` (a line's start) all hold definitions on their own, ending as it says. */
interface DefinitionRuns {
  from: number;
  to: number;
  ok: boolean;
}

/**
 * Whether the line at `at` (a line's start) and each below it to the next blank line, the text's
 * end or a line opening a footnote definition are each a link reference definition on its own
 * (DEFINITION_ON_ITS_LINE, with a label that is not all white space). Remembered in `runs`, so
 * the lines of a run are read once, not once per piece that ends inside it, also when the
 * questions walk up the run (a piece's blocks are tried from its last).
 */
function definitionsToTheEnd(text: string, at: number, runs: DefinitionRuns): boolean {
  if (at >= runs.from && at < runs.to) return runs.ok;
  let line = at;
  let ok = false;
  for (;;) {
    // the lines below were read before: their answer holds from here
    if (line > at && line === runs.from && runs.to > runs.from) {
      ok = runs.ok;
      line = runs.to;
      break;
    }
    if (line > at) {
      let k = line;
      while (k < text.length && isBlankChar(text.charCodeAt(k))) k += 1;
      // a blank line or the text's end closes the content
      if (k >= text.length || pastLineEnding(text, k) >= 0) {
        ok = true;
        break;
      }
      FOOTNOTE_OPENING.lastIndex = line;
      if (FOOTNOTE_OPENING.test(text)) {
        ok = true;
        break;
      }
    }
    DEFINITION_ON_ITS_LINE.lastIndex = line;
    const m = DEFINITION_ON_ITS_LINE.exec(text);
    if (m === null || text.slice(line + 1, text.indexOf(']:', line)).trim() === '') break;
    const end = line + m[0].length;
    const next = pastLineEnding(text, end);
    if (next < 0) {
      // the definition ends the text
      ok = true;
      break;
    }
    line = next;
  }
  runs.from = at;
  runs.to = line;
  runs.ok = ok;
  return ok;
}

/**
 * Blocks that a container's end may close with the line ending after their last line (fenced
 * or indented code, raw HTML, math): in a footnote definition at a piece's end, not a place to
 * end the piece.
 */
const OPEN_TO_LINE_END = new Set(['code', 'html', 'math']);

/**
 * The first end of a line at or after `from` where a piece may end, with no space or tab before
 * its line ending (cutAt; and, in a text that may define labels, bracketLineAt, inside a run of
 * definitions), or undefined when there is none. Without definitions no piece can end at a
 * bracket line, so such a text is not cut there only to be read again from an earlier block.
 */
export function nextCut(text: string, from: number, definitions = false): { end: number; next: number } | undefined {
  for (let k = from; k < text.length; k += 1) {
    const c = text.charCodeAt(k);
    if (c !== 10 && c !== 13) continue;
    const before = k > 0 ? text.charCodeAt(k - 1) : 10;
    const cut = isBlankChar(before) || before === 10 || before === 13 ? undefined : (cutAt(text, k, false) ?? (definitions ? bracketLineAt(text, k) : undefined));
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
  const whole = () => parser.parse(text) as Root;
  // micromark drops a byte-order mark that opens the text and counts offsets without it
  if (text.length < 2 * pieceChars || text.charCodeAt(0) === 0xfeff) return whole();
  /** The text in pieces, each parsed with `labels` defined in it when given (a text that may define labels). */
  const pieces = (labels?: LabelSeed) =>
    inPieces((piece) => (labels ? withDefinedLabels(labels, () => parser.parse(piece)) : parser.parse(piece)) as Root, text, pieceChars, frontMatter, labels !== undefined);
  // no definition without `]:`: no label to share between pieces
  if (!text.includes(']:')) return pieces() ?? whole();
  // each piece holds the labels the whole text defines (seeded): first those a look at its lines
  // finds, then, where the definitions in the tree are others, those
  const guess = guessLabels(text);
  const first = pieces(guess);
  const defined = first && definedLabels(first.children, text);
  if (first === undefined || defined === undefined) return whole();
  if (sameLabels(defined, guess)) return first;
  return pieces(defined) ?? whole();
}

/**
 * parseInPieces's pieces, each parsed by `parse`; undefined when the text must be parsed whole
 * (front matter that no piece may end inside). `definitions`: the text may define labels, so
 * pieces may also end inside runs of definitions (definitionCut).
 */
function inPieces(parse: (piece: string) => Root, text: string, pieceChars: number, frontMatter: boolean, definitions: boolean): Root | undefined {
  const children: RootContent[] = [];
  const runs: DefinitionRuns = { from: 0, to: 0, ok: false };
  let start = 0;
  // the lines before an offset (a text opening with a byte-order mark is parsed whole, above)
  let index: LineIndex | undefined;
  const linesBefore = (offset: number) => (index ??= new LineIndex(text)).position(offset).line - 1;
  let last: Root | undefined;
  let opening: Point | undefined;
  // front matter opening the text runs on across blank lines to a later `---` line: no piece ends before it
  const opensWithFence = frontMatter && text.startsWith('---');
  const fence = opensWithFence ? LATER_FENCE.exec(text) : null;
  if (opensWithFence && fence === null) return undefined;
  const firstFrom = fence ? fence.index + fence[0].length : 0;
  // the length tried for the next piece: doubled after a piece whose blocks give no place to end
  let span = pieceChars;
  for (;;) {
    const cut = text.length - start >= span + pieceChars ? nextCut(text, Math.max(start + span, start === 0 ? firstFrom : 0), definitions) : undefined;
    const piece = cut ? text.slice(start, cut.end) : text.slice(start);
    const tree = parse(piece);
    // front matter not read in the first piece: the whole text is parsed as one
    if (start === 0 && opensWithFence && cut !== undefined && tree.children[0]?.type !== 'yaml') return undefined;
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
        if (end !== undefined && (next = definitionCut(node, text, start + end, runs)) !== undefined) break;
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

/**
 * A line that may hold a definition: after marks that may open containers (`>`, list markers,
 * indentation), `[label]:` or `[^label]:` on one line. A guess: a fence or raw HTML may hold
 * such a line, and a label may run across lines; the tree settles it (definedLabels).
 */
const DEFINITION_LINE = /^[ \t>*+\-.)0-9]*\[(\^?)((?:[^\\[\]\r\n]|\\[^\r\n])+)\]:/gm;

/** The labels of the lines of `text` that look like definitions (DEFINITION_LINE), normalised as micromark does. */
export function guessLabels(text: string): LabelSeed {
  const links = new Set<string>();
  const footnotes = new Set<string>();
  for (const m of text.matchAll(DEFINITION_LINE)) {
    const label = m[2] as string;
    // a footnote's label holds no space or tab (micromark-extension-gfm-footnote)
    if (m[1] !== '^') links.add(normalizeIdentifier(label));
    else if (!label.includes(' ') && !label.includes('\t')) footnotes.add(normalizeIdentifier(label));
  }
  return { links, footnotes };
}

/**
 * The label of the definition that opens at `offset` (`[label]:`, or `[^label]:` when
 * `footnote`) as micromark reads it: up to the first `]` that no backslash escapes. Undefined
 * when `[` does not stand there, or the label runs across lines: inside a container, the
 * container's marks on the next line are not part of the label micromark reads.
 */
function labelAt(text: string, offset: number | undefined, footnote: boolean): string | undefined {
  if (offset === undefined || text.charCodeAt(offset) !== 91) return undefined;
  let i = offset + 1;
  if (footnote) {
    if (text.charCodeAt(i) !== 94) return undefined;
    i += 1;
  }
  const from = i;
  for (; i < text.length; i += 1) {
    const c = text.charCodeAt(i);
    if (c === 10 || c === 13 || c === 91) return undefined;
    if (c === 93) return text.slice(from, i);
    // an escaped bracket or backslash belongs to the label (micromark-factory-label)
    if (c === 92) {
      const d = text.charCodeAt(i + 1);
      if (d === 91 || d === 92 || d === 93) i += 1;
    }
  }
  return undefined;
}

/**
 * The labels that the definitions among `nodes` (and inside them) define, as micromark
 * normalises them, read from `text` at each one's place; undefined when one of them cannot be
 * read so, or reads as other than its node's identifier.
 */
export function definedLabels(nodes: readonly RootContent[], text: string): LabelSeed | undefined {
  const links = new Set<string>();
  const footnotes = new Set<string>();
  const stack: unknown[] = [...nodes];
  while (stack.length > 0) {
    const node = stack.pop() as { type: string; identifier?: string; position?: { start: Point }; children?: unknown[] };
    if (node.type === 'definition' || node.type === 'footnoteDefinition') {
      const label = labelAt(text, node.position?.start.offset, node.type === 'footnoteDefinition');
      if (label === undefined) return undefined;
      const key = normalizeIdentifier(label);
      if (key.toLowerCase() !== node.identifier) return undefined;
      (node.type === 'definition' ? links : footnotes).add(key);
    }
    if (node.children) for (const child of node.children) stack.push(child);
  }
  return { links, footnotes };
}

/** Whether two seeds hold the same labels. */
function sameLabels(a: LabelSeed, b: LabelSeed): boolean {
  const same = (x: ReadonlySet<string>, y: ReadonlySet<string>) => x.size === y.size && [...x].every((l) => y.has(l));
  return same(a.links, b.links) && same(a.footnotes, b.footnotes);
}
