/**
 * Accumulates segment text together with, for each character, the source range it came
 * from. Every producer of segment text goes through here so the map cannot drift.
 */
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

const ENTITY = /^&(?:#[0-9]{1,7}|#[xX][0-9a-fA-F]{1,6}|[A-Za-z][A-Za-z0-9]{1,31});/;

function findProducer(source: string, from: number, end: number, c: string): { start: number; end: number } | undefined {
  for (let pos = from; pos < end; pos += 1) {
    const s = source[pos];
    if (s === '&') {
      const m = ENTITY.exec(source.slice(pos, Math.min(end, pos + 40)));
      if (m) return { start: pos, end: pos + m[0].length };
    }
    if (s === c) return { start: pos, end: pos + 1 };
    if (s === '\\' && source[pos + 1] === c) return { start: pos, end: pos + 2 };
    // Only markup may be skipped: whitespace, quote markers, backslashes, list bullets.
    if (!/[\s>\\]/.test(s as string)) {
      if (c === '\n' || c === ' ') return { start: pos, end: pos };
      return undefined;
    }
  }
  return undefined;
}
