import { decodeNamedCharacterReference } from 'decode-named-character-reference';
/**
 * Accumulates segment text together with, for each character, the source range it came
 * from. Every producer of segment text goes through here so the map cannot drift.
 */
/**
 * A segment's map as a typed array: a plain array of small integers takes 8 bytes an element and
 * more while it grows, and the map has an element per character of the document's prose (a
 * 5.6 MB document's parse was 118 MB of heap, nearly all of it these maps; 44 MB as Int32Array).
 * Offsets fit: no string is longer than 2^30 characters. `shift` is added to every offset.
 */
export function offsetArray(offsets: readonly number[], shift = 0): Int32Array {
  const out = new Int32Array(offsets.length);
  for (let i = 0; i < offsets.length; i += 1) out[i] = (offsets[i] as number) + shift;
  return out;
}

/**
 * Segment maps cut from shared blocks: each short map is a view (`subarray`) of a larger
 * Int32Array rather than an array of its own. An Int32Array of its own costs some 200 bytes of
 * heap besides its elements (the view, its ArrayBuffer and the backing store), and a table of
 * 170,000 rows makes two for each of its 333,000 cells; measured here, the views took half the
 * time and half the heap, and the garbage collector, which copies every surviving object of a
 * parse, had that much less to copy. A map longer than `OWN_FROM` gets an array of its own, and
 * blocks grow from 1,024 elements to 16,384, so that a small parse (an edited paragraph) does not
 * hold a large block. A view reads and writes as an array of its own; nothing here sends a
 * segment to another thread, where a view would carry its whole block.
 */
export class OffsetArena {
  private block = new Int32Array(0);
  private used = 0;
  private next = 1024;

  /** `offsets`, each plus `shift`, as an Int32Array (a view of a shared block when short). */
  take(offsets: readonly number[], shift = 0): Int32Array {
    const n = offsets.length;
    if (n > OWN_FROM) return offsetArray(offsets, shift);
    if (this.used + n > this.block.length) {
      this.block = new Int32Array(this.next);
      this.used = 0;
      this.next = Math.min(this.next * 2, 16_384);
    }
    const out = this.block.subarray(this.used, this.used + n);
    this.used += n;
    for (let i = 0; i < n; i += 1) out[i] = (offsets[i] as number) + shift;
    return out;
  }
}

/** Maps longer than this get an Int32Array of their own (see OffsetArena). */
const OWN_FROM = 256;

const WHITESPACE = /\s/;

export class MappedText {
  text = '';
  starts: number[] = [];
  ends: number[] = [];

  /** Append `s`, whose characters sit one-for-one at source offsets from `sourceStart`. */
  pushVerbatim(s: string, sourceStart: number): void {
    for (let i = 0; i < s.length; i += 1) {
      this.text += s[i];
      this.starts.push(sourceStart + i);
      this.ends.push(sourceStart + i + 1);
    }
  }

  /** Append characters that all stand for the source range [start, end). */
  pushSynthetic(s: string, start: number, end: number): void {
    for (let i = 0; i < s.length; i += 1) {
      this.text += s[i];
      this.starts.push(start);
      this.ends.push(end);
    }
  }

  /** This text without the whitespace at its ends, map kept (itself when there is none). */
  trimmed(): MappedText {
    const t = this.text;
    let a = 0;
    let b = t.length;
    while (a < b && WHITESPACE.test(t[a] as string)) a += 1;
    while (b > a && WHITESPACE.test(t[b - 1] as string)) b -= 1;
    if (a === 0 && b === t.length) return this;
    const out = new MappedText();
    out.text = t.slice(a, b);
    out.starts = this.starts.slice(a, b);
    out.ends = this.ends.slice(a, b);
    return out;
  }

  /** Append another mapped text as it stands. */
  append(other: MappedText): void {
    this.text += other.text;
    for (let i = 0; i < other.starts.length; i += 1) {
      this.starts.push(other.starts[i] as number);
      this.ends.push(other.ends[i] as number);
    }
  }

  /**
   * Append a node's decoded `value` whose source is `source.slice(start, end)`. Where they
   * differ (backslash escapes, character references, stripped indentation or blockquote
   * markers after a soft break), each value character is matched to the next source
   * character that produces it.
   */
  pushAligned(value: string, source: string, start: number, end: number): void {
    if (source.slice(start, end) === value) {
      this.pushVerbatim(value, start);
      return;
    }
    let pos = start;
    for (let i = 0; i < value.length; i += 1) {
      const c = value[i] as string;
      const found = findProducer(source, pos, end, c);
      if (found) {
        this.pushSynthetic(c, found.start, found.end);
        pos = found.end;
      } else {
        const at = Math.min(pos, Math.max(start, end - 1));
        this.pushSynthetic(c, at, Math.min(at + 1, end));
      }
    }
  }
}

/**
 * Where `value` ends when read from `start` the way pushAligned reads it (markup skipped), or
 * `undefined` when some character of it is not found before `end`.
 */
export function alignedEnd(value: string, source: string, start: number, end: number): number | undefined {
  let pos = start;
  for (let i = 0; i < value.length; i += 1) {
    const found = findProducer(source, pos, end, value[i] as string);
    if (!found) return undefined;
    pos = found.end;
  }
  return pos;
}

const ENTITY = /^&(?:#[0-9]{1,7}|#[xX][0-9a-fA-F]{1,6}|[A-Za-z][A-Za-z0-9]{1,31});/;

/** What `&…;` stands for, or '' when it stands for nothing (the parser then keeps it as text). */
function decodeReference(ref: string): string {
  const body = ref.slice(1, -1);
  if (body.startsWith('#')) {
    const code = body[1] === 'x' || body[1] === 'X' ? Number.parseInt(body.slice(2), 16) : Number.parseInt(body.slice(1), 10);
    // CommonMark: 0 and values past Unicode or in the surrogate range become U+FFFD
    return code === 0 || code > 0x10ffff || (code >= 0xd800 && code <= 0xdfff) ? '\ufffd' : String.fromCodePoint(code);
  }
  const named = decodeNamedCharacterReference(body);
  return named === false ? '' : named;
}

/** Whether the `>` at `pos` opens a quoted line (only spaces and other markers before it on its line), so it is markup, not text. */
function quoteMarker(source: string, pos: number): boolean {
  let spaces = 0;
  // (looked at over 64 characters at most, so that a line of many `>` stays linear)
  for (let k = pos - 1; k >= 0 && k >= pos - 64; k -= 1) {
    const d = source[k];
    if (d === '\n' || d === '\r') return true;
    if (d === ' ') {
      spaces += 1;
      if (spaces > 3) return false;
    } else if (d === '>') spaces = 0;
    else return false;
  }
  return pos <= 64;
}

function findProducer(source: string, from: number, end: number, c: string): { start: number; end: number } | undefined {
  for (let pos = from; pos < end; pos += 1) {
    const s = source[pos];
    if (s === '&') {
      // a character reference produces its character; `&A0;` and the like are not references
      const m = ENTITY.exec(source.slice(pos, Math.min(end, pos + 40)));
      if (m && decodeReference(m[0]).startsWith(c)) return { start: pos, end: pos + m[0].length };
    }
    if (s === c && !(c === '>' && quoteMarker(source, pos))) return { start: pos, end: pos + 1 };
    if (s === '\\' && source[pos + 1] === c) return { start: pos, end: pos + 2 };
    // Only markup may be skipped: whitespace, quote markers, backslashes, list bullets.
    if (!/[\s>\\]/.test(s as string)) {
      if (c === '\n' || c === ' ') return { start: pos, end: pos };
      return undefined;
    }
  }
  return undefined;
}
