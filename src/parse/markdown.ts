import type { Nodes, Parent, PhrasingContent, Root, RootContent, Table } from 'mdast';
import type { Point } from 'unist';
import remarkFrontmatter from 'remark-frontmatter';
import remarkGfm from 'remark-gfm';
import remarkMath from 'remark-math';
import remarkParse from 'remark-parse';
import { unified } from 'unified';
import { MappedText, OffsetArena, alignedEnd } from './builder.js';
import { readDirective } from './directives.js';
import { readFrontMatter } from './frontMatter.js';
import { normalize } from './normalize.js';
import { readMath } from './math.js';
import { literalNumberOfInlineR } from './rInline.js';
import { HtmlTableReader, type HtmlTablePart } from './htmlTable.js';
import { markLegends } from './legends.js';
import { defuseDenseMarkup, exceedsNesting } from './depth.js';
import { LAZY_LIMIT, QUOTE_LIMIT, SETEXT_LIMIT, defuseSlowShapes, joinLongParagraphs, type SlowShape } from './shapes.js';
import { BULK_CHUNK_ROWS, BULK_MIN_ROWS, blankRuns, blankedRange, findBulkRuns, plainCells, type BulkRun } from './bulkTable.js';
import { PLAIN_MIN_GROUPS, findPlainRuns, inlineTagText, lineShift, plainRange, readPlainGroup, standInRuns, type PlainGroup, type PlainRun } from './plainRuns.js';
import { remarkLabelLists } from './definedLabels.js';
import { PIECE_CHARS, parseInPieces } from './pieces.js';
import type { Directive, FrontMatter, ParsedDocument, ReadNote, Segment, SegmentKind, TablePlace } from './types.js';

// remarkLabelLists comes last: its constructs must be tried before remark-gfm's at `[` (see definedLabels.ts)
const processor = unified().use(remarkParse).use(remarkGfm).use(remarkFrontmatter, ['yaml']).use(remarkMath).use(remarkLabelLists);
/**
 * The same without front matter, for a text whose first line of `---` opens none: when no
 * closing `---` line follows, micromark's front-matter construct fails and leaves the rest of
 * the document misread (lists and block quotes become paragraphs; seen with
 * micromark-extension-frontmatter 2.0); when a blank line follows it (Pandoc's rule: front
 * matter starts right below the fence), or the block between the fences is not a YAML mapping,
 * it is the thematic break CommonMark makes of it and the text below is the manuscript.
 */
const withoutFrontMatter = unified().use(remarkParse).use(remarkGfm).use(remarkMath).use(remarkLabelLists);

/** The two parsers above, for tests that look inside them (test/parse/defined-labels.test.ts). */
export const markdownProcessors = { processor, withoutFrontMatter } as const;

/** HTML that holds table markup (read by HtmlTableReader). */
const HTML_TABLE = /<t(?:able|r|d|h)\b/i;

/** A line of `---` (trailing spaces allowed): a front-matter fence, anywhere in the text. */
const FENCE_LINE = /^---[ \t]*\r?$/m;

/** How a text opening with `---` is read: `undefined` when it does not. */
function frontMatterOpening(text: string): { closed: boolean; blankAfter: boolean; yamlLike: boolean } | undefined {
  if (!text.startsWith('---')) return undefined;
  const lines = text.split('\n', 3);
  if (!FENCE_LINE.test(lines[0] ?? '')) return undefined;
  const second = lines[1] ?? '';
  return {
    closed: FENCE_LINE.test(text.slice(text.indexOf('\n') + 1)),
    blankAfter: /^[ \t]*\r?$/.test(second),
    // the line below reads as a YAML key: the author meant front matter
    yamlLike: /^[A-Za-z_][\w -]{0,60}:/.test(second),
  };
}

export interface MarkdownOptions {
  /** R Markdown / Quarto: fenced chunks with a `{lang …}` info string are source code, skipped whole. */
  chunks?: boolean;
  /**
   * Tables with at least this many rows past their head are read row by row here rather than
   * by the Markdown parser (same segments, a fraction of the cost; see bulkTable.ts).
   * `Infinity` turns that off (the tests compare both readings).
   */
  bulkRows?: number;
  /**
   * Paragraphs of more than this many lines have their line breaks read as spaces (see
   * joinLongParagraphs). `Infinity` turns that off (the tests compare both readings).
   */
  paragraphLines?: number;
  /**
   * Runs of at least this many plain paragraphs are read here rather than by the Markdown
   * parser (same segments; see plainRuns.ts). `Infinity` turns that off (the tests compare both).
   */
  plainGroups?: number;
  /**
   * Texts of at least twice this many characters are parsed in pieces of about this size (same
   * tree; see pieces.ts). `Infinity` turns that off (the tests compare both readings).
   */
  pieceChars?: number;
}

/**
 * Markdown (CommonMark + GFM tables + YAML front matter + `$…$` math) into prose segments.
 * Paragraphs, headings and table cells become segments (list items and block quotes are
 * walked through to their paragraphs); fenced and indented code and inline code become
 * `code` segments, which the extractor reads only for complete reported results; HTML
 * blocks and comments are not prose (comments addressed to plumbline become directives).
 */
export function parseMarkdown(path: string, source: string, options: MarkdownOptions = {}): ParsedDocument {
  const hadBom = source.charCodeAt(0) === 0xfeff;
  // Parse the text after the BOM and shift every offset back by one, so spans index the
  // file as read (columns on line 1 then count from the first visible character + 1).
  const body = hadBom ? source.slice(1) : source;
  const shift = hadBom ? 1 : 0;
  const defused = defuseDenseMarkup(body);
  const slow = defuseSlowShapes(defused?.text ?? body);
  const shaped = slow?.text ?? defused?.text ?? body;
  // exact: a line break inside a paragraph reads as a space (see joinLongParagraphs)
  const text = (options.paragraphLines === Infinity ? undefined : joinLongParagraphs(shaped, options.paragraphLines)) ?? shaped;
  const opening = frontMatterOpening(text);
  const minRows = options.bulkRows ?? BULK_MIN_ROWS;
  let walker = walk(text, shift, options, minRows, opening && (!opening.closed || opening.blankAfter) ? withoutFrontMatter : processor);
  const fm = walker.frontMatter;
  if (fm && !fm.error && fm.data !== null && fm.data !== undefined && (typeof fm.data !== 'object' || Array.isArray(fm.data))) {
    // a string or a list between two rules: prose, not settings
    walker = walk(text, shift, options, minRows, withoutFrontMatter);
  }
  if (opening && !opening.closed && opening.yamlLike) {
    walker.frontMatter = {
      data: undefined,
      span: { start: shift, end: shift + 3 },
      error: 'the opening --- on line 1 is never closed by a --- line, so the text below it was read as the manuscript',
    };
  }
  const readNotes: ReadNote[] = defused
    ? [{
        kind: 'dense-markup',
        message: `${defused.blocks} block${defused.blocks === 1 ? '' : 's'} made mostly of emphasis, link, math, code or strike-through markup (the first at line ${defused.firstLine}) ${defused.blocks === 1 ? 'was' : 'were'} read without that markup, to keep the parse fast`,
        span: { start: 0, end: 0 },
      }]
    : [];
  for (const shape of slow?.shapes ?? []) readNotes.push({ kind: 'slow-shape', message: slowShapeMessage(shape), span: { start: 0, end: 0 } });
  const doc: ParsedDocument = {
    path,
    source,
    format: 'markdown',
    segments: walker.segments,
    directives: walker.finishDirectives(),
    ...(walker.frontMatter ? { frontMatter: walker.frontMatter } : {}),
    hadBom,
    ...(readNotes.length > 0 ? { readNotes } : {}),
  };
  // read as written, every block by the parser: an edit inside one paragraph can be re-read alone
  if (!hadBom && text === body && opening === undefined && walker.bulkFree && walker.definitions === false)
    REUSE.set(doc, { blocks: walker.topBlocks, chunks: options.chunks === true, options });
  return doc;
}

/** A top-level block of a parsed Markdown document: its source range and the segments and blocks it made. */
interface TopBlock {
  type: string;
  start: number;
  end: number;
  /** Index of its first segment, and one past its last. */
  firstSegment: number;
  endSegment: number;
  /** The block number before its first (its blocks are `blockBefore + 1` …). */
  blockBefore: number;
  blockEnd: number;
  /** Directives read inside it. */
  directives: number;
}

/** What an incremental re-read needs of a document parsed whole (see reparseEdit). */
interface Reuse {
  blocks: TopBlock[];
  chunks: boolean;
  options: MarkdownOptions;
}

/** Documents parsed whole by parseMarkdown that an edit may be re-read against (kept beside, so the document's own shape is unchanged). */
const REUSE = new WeakMap<ParsedDocument, Reuse>();

/** A line holding nothing but spaces or tabs between two offsets: a blank line separates them. */
function blankLineBetween(text: string, from: number, to: number): boolean {
  let lineStart = text.indexOf('\n', from);
  while (lineStart >= 0 && lineStart < to) {
    const next = text.indexOf('\n', lineStart + 1);
    const end = next < 0 || next > to ? to : next;
    if (next >= 0 && next <= to && text.slice(lineStart + 1, end).trim() === '') return true;
    if (next < 0 || next >= to) return false;
    lineStart = next;
  }
  return false;
}

/**
 * The document `source` as parseMarkdown reads it, from `prev` (a parse of an earlier text)
 * when the two differ inside one top-level paragraph only, set off from its neighbours by blank
 * lines: top-level blocks separated so are read independently of each other once the link
 * reference definitions (none here) and the front matter (none here) are unchanged. That
 * paragraph alone is parsed again; every other segment is kept, its offsets shifted by the
 * edit's length. `undefined` whenever any of that is not certain (the edited text reads as
 * anything but one paragraph, a guard of the parser would act on the new text, the paragraph
 * stands next to a table or its legends, it holds a directive, or it makes a different number
 * of segments): the caller then parses the whole text. `test/parse/incremental.test.ts` and
 * `test/engine/incremental.test.ts` compare both readings on random edits.
 */
export function reparseEdit(prev: ParsedDocument, source: string): ParsedDocument | undefined {
  const reuse = REUSE.get(prev);
  if (!reuse || prev.readNotes || prev.source === source || source.charCodeAt(0) === 0xfeff || source.startsWith('---')) return undefined;
  const old = prev.source;
  const limit = Math.min(old.length, source.length);
  let prefix = 0;
  while (prefix < limit && old.charCodeAt(prefix) === source.charCodeAt(prefix)) prefix += 1;
  let suffix = 0;
  while (suffix < limit - prefix && old.charCodeAt(old.length - 1 - suffix) === source.charCodeAt(source.length - 1 - suffix)) suffix += 1;
  const oldEnd = old.length - suffix;
  const delta = source.length - old.length;
  // the top-level block holding the edit: after its first character (its indentation and first
  // mark unchanged, so a list above cannot take it in), up to its end
  const blocks = reuse.blocks;
  let lo = 0;
  let hi = blocks.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if ((blocks[mid] as TopBlock).start < prefix) lo = mid;
    else hi = mid - 1;
  }
  const index = lo;
  const b = blocks[index];
  if (!b || (b.type !== 'paragraph' && b.type !== 'table') || b.directives > 0 || !(b.start < prefix && oldEnd <= b.end)) return undefined;
  const before = blocks[index - 1];
  const after = blocks[index + 1];
  if (before && !blankLineBetween(old, before.end, b.start)) return undefined;
  if (after && !blankLineBetween(old, b.end, after.start)) return undefined;
  const segs = prev.segments;
  const neighbour = (from: number, step: number): Segment | undefined => {
    let i = from;
    while (segs[i]?.kind === 'code') i += step;
    return segs[i];
  };
  if (b.type === 'paragraph') {
    // a paragraph's legend role is read from its neighbours: it must have none, and stand next
    // to no table or legend (a table's own legends depend only on its place among the segments
    // and on the text of its cells, which are read again below)
    for (let i = b.firstSegment; i < b.endSegment; i += 1) if ((segs[i] as Segment).legendOf) return undefined;
    const prevSeg = neighbour(b.firstSegment - 1, -1);
    const nextSeg = neighbour(b.endSegment, 1);
    if (prevSeg && (prevSeg.table || prevSeg.legendOf)) return undefined;
    if (nextSeg?.table) return undefined;
  }
  // the guards that read the whole text must leave the new text as it is
  if (exceedsNesting(source) || defuseDenseMarkup(source) || defuseSlowShapes(source)) return undefined;
  if (reuse.options.paragraphLines !== Infinity && joinLongParagraphs(source, reuse.options.paragraphLines) !== undefined) return undefined;
  if (findBulkRuns(source, reuse.options.bulkRows ?? BULK_MIN_ROWS).length > 0) return undefined;
  const end = b.end + delta;
  const piece = source.slice(b.start, end);
  const tree = processor.parse(piece) as Root;
  const node = tree.children[0];
  if (tree.children.length !== 1 || node?.type !== b.type || node.position?.start.offset !== 0 || node.position.end.offset !== piece.length) return undefined;
  const walker = new Walker(piece, b.start, reuse.options);
  const firstOld = b.endSegment > b.firstSegment ? segs[b.firstSegment] : undefined;
  // a table keeps its number: the tables before it are unchanged
  const table = firstOld?.table?.table ?? segs.slice(0, b.firstSegment).reduce((n, x) => Math.max(n, (x.table?.table ?? -1) + 1), 0);
  walker.resume(b.firstSegment, b.blockBefore, firstOld?.section, table);
  walker.walkBlocks(tree.children);
  const fresh = walker.segments;
  if (walker.directiveCount > 0 || (b.type === 'table' && firstOld === undefined)) return undefined;
  markLegends(fresh, piece, b.start);
  // the segments and blocks after it move by what it gained or lost
  const segmentDelta = fresh.length - (b.endSegment - b.firstSegment);
  const blockDelta = walker.blockNumber - b.blockEnd;
  const moved = (s: Segment): Segment =>
    delta === 0 && segmentDelta === 0 && blockDelta === 0
      ? s
      : { ...s, id: s.id + segmentDelta, block: s.block + blockDelta, starts: delta === 0 ? s.starts : s.starts.map((o) => o + delta), ends: delta === 0 ? s.ends : s.ends.map((o) => o + delta) };
  const segments = segs.slice(0, b.firstSegment).concat(fresh, segs.slice(b.endSegment).map(moved));
  const doc: ParsedDocument = {
    ...prev,
    source,
    segments,
    directives: prev.directives.map((d) =>
      d.span.start >= oldEnd
        ? { ...d, span: { start: d.span.start + delta, end: d.span.end + delta }, appliesToBlock: d.appliesToBlock > b.blockEnd ? d.appliesToBlock + blockDelta : d.appliesToBlock }
        : d,
    ),
  };
  REUSE.set(doc, {
    ...reuse,
    blocks: blocks.map((x, i) =>
      i < index
        ? x
        : i === index
          ? { ...x, end, endSegment: x.endSegment + segmentDelta, blockEnd: x.blockEnd + blockDelta }
          : { ...x, start: x.start + delta, end: x.end + delta, firstSegment: x.firstSegment + segmentDelta, endSegment: x.endSegment + segmentDelta, blockBefore: x.blockBefore + blockDelta, blockEnd: x.blockEnd + blockDelta },
    ),
  });
  return doc;
}

function slowShapeMessage(s: SlowShape): string {
  const n = s.blocks.toLocaleString('en-US');
  const where = `(the first at line ${s.firstLine})`;
  const why = 'each costs the Markdown parser time that grows with the length of the document';
  switch (s.kind) {
    case 'setext':
      return `the underlines of ${n} setext heading${s.blocks === 1 ? '' : 's'} after the first ${SETEXT_LIMIT} ${where} were read as paragraph text, since ${why}`;
    case 'quote':
      return `${n} block quote${s.blocks === 1 ? '' : 's'} after the first ${QUOTE_LIMIT} ${where} ${s.blocks === 1 ? 'was' : 'were'} read as paragraph text, since ${why}`;
    case 'lazy':
      return `${n} block quote${s.blocks === 1 ? '' : 's'} or list item${s.blocks === 1 ? '' : 's'} with more than ${LAZY_LIMIT} lazy continuation lines ${where} ${s.blocks === 1 ? 'was' : 'were'} read as paragraph text, since each such line costs the Markdown parser time that grows with its paragraph`;
  }
}

function walk(text: string, shift: number, options: MarkdownOptions, minRows: number, parser: { parse(text: string): unknown }): Walker {
  const { tree, runs, plain, lineOf } = parseWithBulkRuns(text, minRows, parser, options.plainGroups ?? PLAIN_MIN_GROUPS, options.pieceChars ?? PIECE_CHARS);
  const walker = new Walker(text, shift, options, runs, plain, lineOf);
  walker.walkTop(tree.children);
  walker.finishHtml();
  markLegends(walker.segments, text, shift);
  return walker;
}

/**
 * Parse `text` with long table runs blanked, keeping only the runs the tree confirms as the
 * tail of a table (a run inside a fenced block or raw HTML is put back and the text parsed
 * again; after two rounds of that, every run is put back).
 */
export function parseWithBulkRuns(text: string, minRows: number, parser: { parse(text: string): unknown } = processor, minGroups = PLAIN_MIN_GROUPS, pieceChars = PIECE_CHARS): { tree: Root; runs: Map<number, BulkRun>; plain: Map<number, PlainRun>; lineOf: (point: Point) => number } {
  let runs = findBulkRuns(text, minRows);
  // plain lines hold no `|`, so no plain run shares a line with a table run
  let plain = findPlainRuns(text, minGroups);
  for (let round = 0; ; round += 1) {
    const tree = parseInPieces(parser, standInRuns(blankRuns(text, runs), plain), pieceChars, parser !== withoutFrontMatter);
    // the parser's line numbers, in lines of `text` (the line endings of a plain run and of a
    // long table's rows are not parsed; plain lines hold no `|`, so the two never share a line)
    const shifted = lineShift(text, [...plain.map(plainRange), ...runs.map(blankedRange)].sort((a, b) => a.start - b.start));
    const lineOf = (point: Point): number => point.line + shifted(point.offset as number);
    if (runs.length === 0 && plain.length === 0) return { tree, runs: new Map(), plain: new Map(), lineOf };
    const tables = tablesByEndLine(tree, lineOf);
    const confirmed = runs.filter((run) => {
      const t = tables.get(run.lastKeptLine);
      const last = t?.table.children.at(-1);
      return t !== undefined && last?.position !== undefined && lineOf(last.position.start) === run.lastKeptLine && (t.atRoot ? run.shallow : run.prefix !== undefined);
    });
    // a plain run's stand-in must be a paragraph at the top level, starting where the run starts
    const rootParagraphs = new Set<number>();
    for (const node of tree.children) if (node.type === 'paragraph' && node.position) rootParagraphs.add(node.position.start.offset as number);
    const plainConfirmed = plain.filter((run) => rootParagraphs.has(run.start));
    if (confirmed.length === runs.length && plainConfirmed.length === plain.length) {
      return { tree, runs: new Map(runs.map((r) => [r.lastKeptLine, r])), plain: new Map(plain.map((r) => [r.start, r])), lineOf };
    }
    runs = round >= 1 ? [] : confirmed;
    plain = round >= 1 ? [] : plainConfirmed;
  }
}

function tablesByEndLine(tree: Root, lineOf: (point: Point) => number): Map<number, { table: Table; atRoot: boolean }> {
  const found = new Map<number, { table: Table; atRoot: boolean }>();
  const visit = (nodes: readonly RootContent[], atRoot: boolean): void => {
    for (const node of nodes) {
      if (node.type === 'table' && node.position) found.set(lineOf(node.position.end), { table: node, atRoot });
      else if (node.type === 'blockquote' || node.type === 'list' || node.type === 'listItem' || node.type === 'footnoteDefinition') {
        visit(node.children as RootContent[], false);
      }
    }
  };
  visit(tree.children, true);
  return found;
}

function firstTable(tree: Root): Table | undefined {
  let node: RootContent | undefined = tree.children[0];
  while (node?.type === 'blockquote') node = node.children[0];
  return node?.type === 'table' ? node : undefined;
}

class Walker {
  segments: Segment[] = [];
  frontMatter: FrontMatter | undefined;
  private directives: Directive[] = [];
  private pendingDirectives: Directive[] = [];
  private block = 0;
  private tables = 0;
  private section: string | undefined;
  private readonly html: HtmlTableReader;
  /** Where the segments' maps are cut from (see OffsetArena). */
  private readonly arena = new OffsetArena();
  /** The top-level blocks walked by walkTop, for an incremental re-read (reparseEdit). */
  topBlocks: TopBlock[] = [];
  /** Whether a link reference or footnote definition was met: a reference elsewhere may name it. */
  definitions = false;
  /** The id the next segment gets, past those of the segments array (set by resume). */
  private firstId = 0;

  constructor(
    private src: string,
    private shift: number,
    private readonly options: MarkdownOptions,
    private readonly bulk: ReadonlyMap<number, BulkRun> = new Map(),
    private readonly plain: ReadonlyMap<number, PlainRun> = new Map(),
    private readonly lineOf: (point: Point) => number = (point) => point.line,
  ) {
    this.html = new HtmlTableReader(src, () => this.tables++, (part) => this.htmlPart(part));
  }

  walkBlocks(nodes: RootContent[]): void {
    for (const node of nodes) this.walkBlock(node);
  }

  /** The document's top-level blocks, each recorded with the segments and blocks it made. */
  walkTop(nodes: RootContent[]): void {
    for (const node of nodes) {
      // a stand-in for a run of plain paragraphs: each paragraph a top-level block of its own, as
      // the parser would have read it, so an edit inside one is re-read as inside any paragraph
      const run = node.type === 'paragraph' && node.position ? this.plain.get(node.position.start.offset as number) : undefined;
      if (run) {
        if (this.html.open) this.html.finish();
        for (const group of run.groups) {
          const firstSegment = this.segments.length;
          const blockBefore = this.block;
          this.plainParagraph(group);
          this.topBlocks.push({
            type: 'paragraph',
            start: (group.lines[0] as { start: number }).start + this.shift,
            end: (group.lines[group.lines.length - 1] as { end: number }).end + this.shift,
            firstSegment,
            endSegment: this.segments.length,
            blockBefore,
            blockEnd: this.block,
            directives: 0,
          });
        }
        continue;
      }
      const firstSegment = this.segments.length;
      const blockBefore = this.block;
      const directives = this.directives.length;
      this.walkBlock(node);
      this.topBlocks.push({
        type: node.type,
        start: (node.position?.start.offset ?? -1) + this.shift,
        end: (node.position?.end.offset ?? -1) + this.shift,
        firstSegment,
        endSegment: this.segments.length,
        blockBefore,
        blockEnd: this.block,
        directives: this.directives.length - directives,
      });
    }
  }

  /**
   * No long table was read row by row (its rows depend on the table around them). Runs of plain
   * paragraphs may have been read outside the parser: walkTop records each of their paragraphs
   * as a top-level block, read exactly as the parser reads it.
   */
  get bulkFree(): boolean {
    return this.bulk.size === 0;
  }

  get blockNumber(): number {
    return this.block;
  }

  get directiveCount(): number {
    return this.directives.length + this.pendingDirectives.length;
  }

  /**
   * Carry on from a walk of the whole document just before a top-level paragraph: segment ids
   * from `firstId`, blocks after `block`, under the section its segments had.
   */
  resume(firstId: number, block: number, section: string | undefined, table: number): void {
    this.firstId = firstId;
    this.block = block;
    this.tables = table;
    // the section comes from the headings above, which the edit left alone
    this.section = section;
  }

  finishDirectives(): Directive[] {
    for (const d of this.pendingDirectives) d.appliesToBlock = -1;
    return this.directives;
  }

  private startBlock(): number {
    this.block += 1;
    for (const d of this.pendingDirectives) d.appliesToBlock = this.block;
    this.pendingDirectives = [];
    return this.block;
  }

  /** Close HTML tables left open (the document ended inside one). */
  finishHtml(): void {
    this.html.finish();
  }

  private htmlPart(part: HtmlTablePart): void {
    if (part.kind === 'cell') {
      this.emit('tableCell', part.text, this.startBlock(), part.place);
      return;
    }
    const seg = this.emit('paragraph', part.text, this.startBlock());
    if (seg) seg.legendOf = { table: part.table, role: 'caption' };
  }

  /** One paragraph of a run of plain paragraphs (plainRuns.ts), read here as the parser reads it. */
  private plainParagraph(group: PlainGroup): void {
    const text = new MappedText();
    readPlainGroup(this.src, group, text);
    this.emit('paragraph', text, this.startBlock());
  }

  private walkBlock(node: RootContent): void {
    // an HTML table goes on across HTML blocks only (a blank line ends each)
    if (node.type !== 'html' && this.html.open) this.html.finish();
    switch (node.type) {
      case 'paragraph': {
        // a top-level stand-in for a run of plain paragraphs (plainRuns.ts): read them here
        const run = node.position ? this.plain.get(node.position.start.offset as number) : undefined;
        if (run) {
          for (const group of run.groups) this.plainParagraph(group);
          return;
        }
        this.phrasingSegment('paragraph', node.children, this.startBlock(), undefined, node);
        return;
      }
      case 'heading': {
        const seg = this.phrasingSegment('heading', node.children, this.startBlock(), undefined, node);
        this.section = seg?.text.trim() || this.section;
        return;
      }
      case 'footnoteDefinition':
        this.definitions = true;
        this.walkBlocks((node as Parent).children as RootContent[]);
        return;
      case 'blockquote':
      case 'list':
      case 'listItem':
        this.walkBlocks((node as Parent).children as RootContent[]);
        return;
      case 'table': {
        const table = this.tables;
        this.tables += 1;
        node.children.forEach((row, r) => {
          row.children.forEach((cell, c) => {
            this.phrasingSegment('tableCell', cell.children, this.startBlock(), { table, row: r, column: c }, cell);
          });
        });
        const run = node.position ? this.bulk.get(this.lineOf(node.position.end)) : undefined;
        if (run) this.bulkRows(run, table, node.children.length);
        return;
      }
      case 'code': {
        const block = this.startBlock();
        if (this.options.chunks && /^\{/.test(node.lang ?? '')) return;
        if (!node.position) return;
        const text = new MappedText();
        const start = node.position.start.offset as number;
        const end = node.position.end.offset as number;
        const raw = this.src.slice(start, end);
        const inner = innerCode(raw, node.value);
        text.pushAligned(node.value, this.src, start + inner, end);
        this.emit('code', text, block);
        return;
      }
      case 'math': {
        if (!node.position) return;
        const text = new MappedText();
        const start = node.position.start.offset as number;
        const end = node.position.end.offset as number;
        // align from inside the opening fence: the aligner cannot step over its `$$`
        text.pushAligned(node.value, this.src, start + innerMath(this.src.slice(start, end), node.value), end);
        this.emit('math', readMath(text), this.startBlock());
        return;
      }
      case 'html': {
        const d = node.position ? readDirective(node.value, this.offsetSpan(node)) : undefined;
        if (d) {
          this.directives.push(d);
          this.pendingDirectives.push(d);
        } else if (node.position && (this.html.open || HTML_TABLE.test(node.value))) {
          this.html.feed(node.position.start.offset as number, node.position.end.offset as number);
        }
        return;
      }
      case 'yaml':
        if (node.position) this.frontMatter = readFrontMatter(node.value, this.offsetSpan(node));
        return;
      case 'definition':
        this.definitions = true;
        return;
      default:
        return;
    }
  }

  /** The blanked rows of a long table, in order, as rows `firstRow`, `firstRow + 1`, … of it. */
  private bulkRows(run: BulkRun, table: number, firstRow: number): void {
    for (let from = 0; from < run.rows.length; from += BULK_CHUNK_ROWS) {
      const chunk = run.rows.slice(from, from + BULK_CHUNK_ROWS);
      const split = chunk.map((row) => plainCells(this.src, row.start, row.end));
      if (split.every((cells) => cells !== undefined)) {
        split.forEach((cells, i) => {
          cells?.forEach((cell, c) => {
            const text = new MappedText();
            text.pushAligned(cell.value, this.src, cell.start, cell.end);
            this.emit('tableCell', text, this.startBlock(), { table, row: firstRow + from + i, column: c });
          });
        });
        continue;
      }
      // Markup in some row: the parser reads the chunk as the body of a one-column table of its
      // own, in the same containers (a body row's cells do not depend on the head), at offsets
      // shifted back onto the source.
      const prefix = run.prefix ?? '';
      const head = `${prefix}|h|\n${prefix}|-|\n`;
      const first = chunk[0] as (typeof chunk)[number];
      const last = chunk[chunk.length - 1] as (typeof chunk)[number];
      const piece = head + this.src.slice(first.lineStart, last.end);
      const rows = firstTable(processor.parse(piece) as Root)?.children.slice(1) ?? [];
      if (rows.length !== chunk.length) throw new Error(`bulk table rows: read ${rows.length} of ${chunk.length} rows after line ${run.lastKeptLine}`);
      const [src, shift] = [this.src, this.shift];
      this.src = piece;
      this.shift = shift + first.lineStart - head.length;
      try {
        rows.forEach((row, i) => {
          row.children.forEach((cell, c) => {
            this.phrasingSegment('tableCell', cell.children, this.startBlock(), { table, row: firstRow + from + i, column: c }, cell);
          });
        });
      } finally {
        this.src = src;
        this.shift = shift;
      }
    }
  }

  private offsetSpan(node: Nodes): { start: number; end: number } {
    return {
      start: (node.position?.start.offset ?? 0) + this.shift,
      end: (node.position?.end.offset ?? 0) + this.shift,
    };
  }

  private phrasingSegment(kind: SegmentKind, children: PhrasingContent[], block: number, table?: TablePlace, within?: Nodes): Segment | undefined {
    const text = new MappedText();
    const codes: MappedText[] = [];
    const pos = within?.position;
    this.phrasing(children, text, codes, { cursor: pos?.start.offset ?? 0, end: pos?.end.offset ?? this.src.length });
    const seg = this.emit(kind, text, block, table);
    for (const code of codes) this.emit('code', code, block, table);
    return seg;
  }

  /**
   * `range.cursor` follows the source through the children, so that nodes a tree transform
   * made without a position (the GFM autolink transform splits text around `www.` links that
   * follow a non-space, leaving the pieces unplaced) are found in the source after it.
   */
  private phrasing(children: PhrasingContent[], out: MappedText, codes: MappedText[], range: { cursor: number; end: number }): void {
    for (const node of children) {
      const pos = node.position;
      if (!pos) {
        if (node.type === 'text') {
          // read it the way positioned text is aligned (markup skipped: the indentation and
          // `>` markers the parser left out after a line break, escapes): from where the text
          // before it ended; else where it is found whole, or by its first line
          let from = range.cursor;
          let stop = alignedEnd(node.value, this.src, from, range.end);
          if (stop === undefined) {
            const at = this.src.indexOf(node.value, range.cursor);
            const nl = node.value.search(/[\r\n]/);
            const first = nl < 0 ? node.value : node.value.slice(0, nl);
            from = at >= 0 && at + node.value.length <= range.end ? at : first === '' ? -1 : this.src.indexOf(first, range.cursor);
            stop = from >= 0 ? alignedEnd(node.value, this.src, from, range.end) : undefined;
          }
          if (stop !== undefined) {
            out.pushAligned(node.value, this.src, from, stop);
            range.cursor = stop;
          }
        } else if ('children' in node) {
          this.phrasing(node.children, out, codes, range);
        }
        continue;
      }
      const start = pos.start.offset as number;
      const end = pos.end.offset as number;
      switch (node.type) {
        case 'text':
          out.pushAligned(node.value, this.src, start, end);
          break;
        case 'inlineMath': {
          const [a, b] = insideDelimiters(this.src, start, end, '$');
          const math = new MappedText();
          math.pushAligned(node.value, this.src, a, b);
          out.append(readMath(math));
          break;
        }
        case 'inlineCode': {
          const [a, b] = insideDelimiters(this.src, start, end, '`');
          const literal = this.options.chunks ? literalNumberOfInlineR(this.src.slice(a, b)) : undefined;
          if (literal) {
            // knitting prints the number where the code stands
            out.pushVerbatim(this.src.slice(a + literal.start, a + literal.end), a + literal.start);
            break;
          }
          const code = new MappedText();
          code.pushAligned(node.value, this.src, a, b);
          codes.push(code);
          // Keep word boundaries in the prose around it.
          out.pushSynthetic(' ', start, end);
          break;
        }
        case 'break':
          out.pushSynthetic('\n', start, end);
          break;
        case 'html':
          this.inlineHtml(node.value, start, end, out);
          break;
        case 'emphasis':
        case 'strong':
        case 'delete':
        case 'link':
        case 'linkReference':
          this.phrasing(node.children, out, codes, { cursor: start, end });
          break;
        default:
          // images, footnote references: not prose
          break;
      }
      range.cursor = Math.max(range.cursor, end);
    }
  }

  /** A comment may be a directive; a tag reads as `inlineTagText` says (plainRuns.ts reads tags the same way). */
  private inlineHtml(value: string, start: number, end: number, out: MappedText): void {
    const read = inlineTagText(value);
    if (read !== '') out.pushSynthetic(read, start, end);
    else if (value.startsWith('<!--')) {
      const d = readDirective(value, { start: start + this.shift, end: end + this.shift });
      if (d) {
        this.directives.push(d);
        this.pendingDirectives.push(d);
      }
    }
  }

  private emit(kind: SegmentKind, raw: MappedText, block: number, table?: TablePlace): Segment | undefined {
    const text = normalize(raw);
    if (text.text.trim() === '') return undefined;
    const seg: Segment = {
      id: this.firstId + this.segments.length,
      block,
      kind,
      text: text.text,
      starts: this.arena.take(text.starts, this.shift),
      ends: this.arena.take(text.ends, this.shift),
      ...(table ? { table } : {}),
      ...(this.section !== undefined && kind !== 'heading' ? { section: this.section } : {}),
    };
    this.segments.push(seg);
    return seg;
  }
}

/** The source range inside a run of `mark` characters at both ends (inline code or math). */
function insideDelimiters(src: string, start: number, end: number, mark: string): [number, number] {
  let a = start;
  let b = end;
  while (a < b && src[a] === mark) a += 1;
  while (b > a && src[b - 1] === mark) b -= 1;
  return [a, b];
}

/** Offset of a display-math block's content (below its `$$` line) within its raw source. */
function innerMath(raw: string, value: string): number {
  if (value === '') return 0;
  const firstLine = value.split(/\r?\n/, 1)[0] as string;
  const at = raw.indexOf(firstLine, /^ {0,3}\${2,}/.test(raw) ? raw.search(/\r?\n/) + 1 : 0);
  return at < 0 ? 0 : at;
}

/** Offset of a fenced or indented code block's content within its raw source. */
function innerCode(raw: string, value: string): number {
  if (value === '') return 0;
  const firstLine = value.split(/\r?\n/, 1)[0] as string;
  const at = raw.indexOf(firstLine, /^ {0,3}(?:`{3,}|~{3,})/.test(raw) ? raw.search(/\r?\n/) + 1 : 0);
  return at < 0 ? 0 : at;
}
