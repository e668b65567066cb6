/**
 * The matches of a global regular expression in a text, the ones `text.matchAll(re)` gives, in
 * the same order, without the copy of `re` that matchAll makes on every call (ECMAScript's
 * RegExp.prototype[@@matchAll] constructs a new RegExp from it).
 *
 * That copy cost more than its construction. V8 keeps a regular expression's compiled code with
 * the object, and finds it again for a copy through a cache whose entries go when no live object
 * holds that code: for an expression only ever matched through copies, each full garbage
 * collection could drop it, and the next copy compiled it afresh (measured with Node 20: 1.6-3 ms
 * for one of the extractors' patterns with `\p{L}` classes under the `i` flag, against 0.01 ms
 * warm). Matched here on the expression itself, compiled once per process.
 *
 * Starts at the text's beginning (matchAll starts at the expression's `lastIndex`, which every
 * caller here leaves at 0), sets `lastIndex` before each match, so nested or interleaved loops
 * over the same expression do not disturb each other, and leaves it at 0.
 */
export function* matchesOf(re: RegExp, text: string): Generator<RegExpExecArray, void, undefined> {
  if (!re.global) throw new TypeError(`matchesOf needs a global regular expression: /${re.source}/${re.flags}`);
  let at = 0;
  try {
    while (at <= text.length) {
      re.lastIndex = at;
      const m = re.exec(text);
      if (m === null) return;
      at = re.lastIndex;
      // an empty match moves on by one character (a whole surrogate pair in Unicode mode), as matchAll does
      if (m[0] === '') at = nextIndex(text, at, re.unicode || re.flags.includes('v'));
      yield m;
    }
  } finally {
    re.lastIndex = 0;
  }
}

/** ECMAScript's AdvanceStringIndex. */
function nextIndex(text: string, at: number, unicode: boolean): number {
  if (!unicode || at + 1 >= text.length) return at + 1;
  const c = text.charCodeAt(at);
  return c >= 0xd800 && c <= 0xdbff && (text.charCodeAt(at + 1) & 0xfc00) === 0xdc00 ? at + 2 : at + 1;
}

/**
 * The first match of a pattern inside slices `text[from, to)` of one text, as
 * `pattern.exec(text.slice(from, to))` finds it (its `index` counted in `text`), for many slices
 * that share their start: every F of a sentence reads the sentence from its start to the F's
 * own clause, and reading each such slice again made a sentence of n Fs cost n².
 *
 * The first match in `text[from, limit)` is found once per `from`, `limit` being an end no slice
 * from there passes (the sentence's end: a search to the text's end would read the rest of the
 * paragraph for every sentence). The pattern may have no anchors, word boundaries or look-arounds
 * (refused), so a match inside a slice is one inside the region, found by the same alternatives
 * on the same characters: when the region's first match ends by `to` it is also the slice's,
 * and when it starts at or past `to` the slice has none. Only a match that runs across `to`, a
 * slice past the region's end, or a pattern that matches the empty string needs the slice itself.
 */
/**
 * Patterns FirstMatches has taken, each with whether it matches the empty string: a pattern is
 * checked once, not once per text (a FirstMatches is made for every paragraph, and checking the
 * pattern's source cost some 1.3 µs each time: 262 ms of a megabyte of 200,000 one-line block
 * quotes, bench figure 7). Flags and source cannot change after a RegExp is made.
 */
const CHECKED_PATTERNS = new WeakMap<RegExp, boolean>();

export class FirstMatches {
  /** The pattern: without `g` or `y`, so each search starts at its string's start. */
  private readonly once: RegExp;
  /**
   * Whether the pattern matches the empty string: then a slice may hold an empty match where the
   * region's first match does not fit (`a*` in `a`, sliced to nothing), and every slice is read.
   * Without anchors or look-arounds, a pattern that matches empty somewhere matches `''`.
   */
  private readonly matchesEmpty: boolean;
  private readonly firstFrom = new Map<number, { limit: number; m: RegExpExecArray | null }>();

  constructor(
    pattern: RegExp,
    private readonly text: string,
  ) {
    let empty = CHECKED_PATTERNS.get(pattern);
    if (empty === undefined) {
      if (pattern.global || pattern.sticky || pattern.hasIndices || /\(\?<?[=!]|\\[bB]|[$^]/.test(pattern.source)) {
        throw new TypeError(`FirstMatches needs a pattern without the g, y or d flag, anchors, word boundaries or look-arounds: /${pattern.source}/${pattern.flags}`);
      }
      empty = pattern.exec('') !== null;
      CHECKED_PATTERNS.set(pattern, empty);
    }
    this.once = pattern;
    this.matchesEmpty = empty;
  }

  within(from: number, to: number, limit = this.text.length): RegExpExecArray | null {
    if (this.matchesEmpty) return this.at(from, to);
    let first = this.firstFrom.get(from);
    if (first === undefined) {
      first = { limit, m: this.at(from, limit) };
      this.firstFrom.set(from, first);
    }
    const m = first.m;
    if (to <= first.limit) {
      if (m === null || m.index >= to) return null;
      if (m.index + m[0].length <= to) return m;
    }
    return this.at(from, to);
  }

  /** The first match in text[from, to), its index counted in the text. */
  private at(from: number, to: number): RegExpExecArray | null {
    const m = this.once.exec(this.text.slice(from, to));
    if (m !== null) m.index += from;
    return m;
  }
}
