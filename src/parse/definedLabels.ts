import type { Construct, Extension, Tokenizer } from 'micromark-util-types';
import type { Processor } from 'unified';

/**
 * micromark keeps the labels a document defines in arrays on its parser and asks them with
 * `includes`, a scan of every label defined so far:
 * - `parser.defined`, the link reference definitions: micromark-core-commonmark's
 *   label-end.js asks `defined.includes(normalizeIdentifier(…))` at every `]` that closes a
 *   label (each link, image and reference; twice for a full reference `[a][b]`), and
 *   definition.js pushes each definition's label;
 * - `parser.gfmFootnotes`, the footnote definitions (micromark-extension-gfm-footnote's
 *   syntax.js): each definition asks `includes` before its `push`, and each footnote call
 *   (`[^a]`, `![^a]`) asks `includes`.
 * So n definitions with n uses cost time in n² (seen with micromark 4.0, micromark-core-commonmark
 * 2.0 and micromark-extension-gfm-footnote 2.1). `LabelList` answers `includes` from a Set kept in
 * step with `push`; the extension below puts one in place of each array before the first label
 * can be pushed, so every answer, and with it the tree, is the one the array gives.
 */
export class LabelList extends Array<string> {
  /** Copies made by `slice`, `map`, `filter` … are plain arrays. */
  static override get [Symbol.species](): ArrayConstructor {
    return Array;
  }

  private readonly labels = new Set<string>();
  /** How many labels were pushed: a list changed by anything but `push` answers as an array does. */
  private pushed = 0;

  /** A list holding `labels`, in order. */
  static holding(labels: readonly string[]): LabelList {
    const list = new LabelList();
    for (const label of labels) list.push(label);
    return list;
  }

  override push(...items: string[]): number {
    for (const item of items) this.labels.add(item);
    this.pushed += items.length;
    return super.push(...items);
  }

  /** Labels defined from the start of the parse (withDefinedLabels), held by reference: answered as if they opened the list. */
  private seeded: ReadonlySet<string> | undefined;

  /** Makes the list answer as if `labels` opened it (a set shared by every piece of a text, not copied into each). */
  seed(labels: ReadonlySet<string>): void {
    this.seeded = labels;
  }

  override includes(label: string, fromIndex?: number): boolean {
    if (fromIndex === undefined && this.seeded?.has(label) === true) return true;
    // the Set holds exactly the pushed labels while only `push` changed the list (the only
    // change micromark makes); SameValueZero, as `includes` compares, is what a Set compares by
    if (fromIndex === undefined && this.pushed === this.length) return this.labels.has(label);
    return super.includes(label, fromIndex);
  }
}

/** The parser fields the lists live in (micromark-util-types' ParseContext, and the footnote extension's addition to it). */
interface LabelLists {
  defined: string[];
  gfmFootnotes?: string[];
}

/**
 * Puts a LabelList in place of `defined`, with the labels it already holds: safe at any time,
 * since micromark reads `parser.defined` afresh at each use.
 */
function installDefined(parser: LabelLists): void {
  if (!(parser.defined instanceof LabelList)) parser.defined = LabelList.holding(parser.defined);
}

/**
 * Puts LabelLists in place of `defined` and `gfmFootnotes`. The footnote constructs keep the
 * array they found for the length of one attempt, so `gfmFootnotes` is replaced only where no
 * footnote construct is under way: at the start of a container construct (tried by the document
 * tokenizer at a line's start, before the footnote definition construct).
 */
function installAll(parser: LabelLists): void {
  installDefined(parser);
  if (!(parser.gfmFootnotes instanceof LabelList)) parser.gfmFootnotes = LabelList.holding(parser.gfmFootnotes ?? []);
}

/**
 * A construct tried before the others keyed on `[` (a construct keyed on a code goes before
 * those already there: micromark-util-combine-extensions), so it runs before any definition can
 * push a label; it consumes nothing and fails at once, so micromark goes on to the next
 * construct as if it were not there. `partial` keeps it out of `currentConstruct`, which later
 * constructs read.
 */
function installer(install: (parser: LabelLists) => void): Construct {
  const tokenize: Tokenizer = function (this, _effects, _ok, nok) {
    install(this.parser as unknown as LabelLists);
    return nok;
  };
  return { tokenize, partial: true };
}

/** Labels a parse is to hold as defined from its start, as micromark normalises them (normalizeIdentifier). */
export interface LabelSeed {
  /** Link reference definitions' labels. */
  links: ReadonlySet<string>;
  /** Footnote definitions' labels, without the `^`. */
  footnotes: ReadonlySet<string>;
}

/** The seed of the parse under way (withDefinedLabels), and the parsers that have it. */
let seed: LabelSeed | undefined;
const seeded = new WeakSet<object>();

/**
 * Runs `parse` (one synchronous parse) with `labels` defined in it from the start, as if the
 * text held their definitions somewhere: a reference or footnote call to one of them is a link
 * or a call wherever it stands. A piece of a longer text (pieces.ts) is so parsed with the
 * labels the whole text defines.
 *
 * micromark asks whether a label is defined only while it reads inline text, and it reads a
 * text's inline content only after all its blocks (their definitions pushed, so every one of
 * them is known there): at a `]` closing a label that `[` or `![` opened (label-end.js, and
 * the footnote extension's potential call) and in a footnote call `[^a]`, which opens at `[`.
 * So the labels are added at the first `[` or `!` of the inline text (`text` below, tried
 * before every other construct there), before any such question; the lists then answer for
 * them and for those the parse's own definitions push (micromark asks membership only). The
 * sets are shared, not copied: each of a text's pieces costs the same whatever its labels.
 */
export function withDefinedLabels<T>(labels: LabelSeed, parse: () => T): T {
  const before = seed;
  seed = labels;
  try {
    return parse();
  } finally {
    seed = before;
  }
}

/** Adds the seed of the parse under way to the lists, once per parse. */
function installSeed(parser: LabelLists): void {
  if (seed === undefined || seeded.has(parser)) return;
  seeded.add(parser);
  // in inline text no footnote definition is being read: both lists can be replaced
  installAll(parser);
  (parser.defined as LabelList).seed(seed.links);
  (parser.gfmFootnotes as LabelList).seed(seed.footnotes);
}

/**
 * The micromark extension: at `[` in `document` (where GFM footnote definitions start) and in
 * `contentInitial` (where link reference definitions start); and at `[` and `!` in `text`,
 * where labels open, for a seed (withDefinedLabels).
 */
export const labelListsSyntax: Extension = {
  document: { 91: installer(installAll) },
  contentInitial: { 91: installer(installDefined) },
  text: { 33: installer(installSeed), 91: installer(installSeed) },
};

/** The unified plugin that adds labelListsSyntax to remark-parse's micromark (as remark-gfm adds its syntax). */
export function remarkLabelLists(this: Processor): undefined {
  const data = this.data();
  (data.micromarkExtensions ??= []).push(labelListsSyntax);
  return undefined;
}
