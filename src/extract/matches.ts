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
