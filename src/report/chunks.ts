/**
 * Text reports given out piece by piece. A report of some 110,000 results in HTML is longer than
 * the longest string V8 can make (about 2^29 characters), so the formatters yield their text in
 * order and the command line writes it in chunks; the library's string functions join the same
 * pieces. Serialisation only: nothing is computed here.
 */
import { CHUNK } from './jsonChunks.js';

/** A piece of a report: a string, or pieces in order. */
export type Pieces = string | Iterable<string>;

/**
 * The pieces, each followed by nothing but `separator` before the next: the same text as
 * `items.join(separator)` when every item is a string, without building it.
 */
export function* joined(items: Iterable<Pieces>, separator: string): Generator<string> {
  let first = true;
  for (const item of items) {
    if (!first && separator !== '') yield separator;
    first = false;
    if (typeof item === 'string') yield item;
    else yield* item;
  }
}

/** Each line followed by a line break: the same text as `${lines.join('\n')}\n`, or nothing for no lines. */
export function* linesOf(lines: Iterable<string>): Generator<string> {
  for (const line of lines) yield `${line}\n`;
}

/**
 * The pieces regrouped into chunks of at most `chunk` characters (all but the last that long, or
 * one less where a cut would part a surrogate pair: written as UTF-8 one by one, the two halves
 * would each become U+FFFD). A piece longer than a chunk is cut; short pieces are gathered, so
 * the writes stay few. Each character is copied a bounded number of times: linear.
 */
export function* inChunks(pieces: Iterable<string>, chunk = CHUNK): Generator<string> {
  if (chunk < 2) throw new RangeError('a chunk holds at least two characters (a surrogate pair)');
  let pending: string[] = [];
  let size = 0;
  for (const piece of pieces) {
    if (piece.length === 0) continue;
    pending.push(piece);
    size += piece.length;
    if (size < chunk) continue;
    const text = pending.join('');
    let at = 0;
    while (text.length - at >= chunk) {
      let end = at + chunk;
      const last = text.charCodeAt(end - 1);
      // a high surrogate at the cut waits for its low half, in the next chunk
      if (last >= 0xd800 && last <= 0xdbff) end -= 1;
      yield text.slice(at, end);
      at = end;
    }
    const rest = text.slice(at);
    pending = rest === '' ? [] : [rest];
    size = rest.length;
  }
  if (size > 0) yield pending.join('');
}

/** All the pieces as one string: what the string-returning formatters give. */
export function wholeText(pieces: Iterable<string>): string {
  const all: string[] = [];
  for (const p of pieces) all.push(p);
  return all.join('');
}
