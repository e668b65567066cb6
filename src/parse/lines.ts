import type { Position } from './types.js';

/**
 * Offsets of line starts, for turning source offsets into line/column. A line ends at
 * "\r\n", "\n" or a lone "\r" (CommonMark's line endings), so CRLF files map exactly. A
 * byte-order mark is not a column: line 1 starts after it, as in editors.
 */
export class LineIndex {
  /** Each line's start offset, line 1 first. */
  readonly starts: readonly number[];

  /** The lines of `text`; or, given the starts themselves (a report's line table read back), those lines. */
  constructor(text: string | readonly number[]) {
    if (typeof text !== 'string') {
      this.starts = text;
      return;
    }
    const starts = [text.charCodeAt(0) === 0xfeff ? 1 : 0];
    for (let i = 0; i < text.length; i += 1) {
      const c = text.charCodeAt(i);
      if (c === 10) starts.push(i + 1);
      else if (c === 13) {
        if (text.charCodeAt(i + 1) === 10) i += 1;
        starts.push(i + 1);
      }
    }
    this.starts = starts;
  }

  /** 1-based line and column of a source offset. */
  position(offset: number): Position {
    let lo = 0;
    let hi = this.starts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if ((this.starts[mid] as number) <= offset) lo = mid;
      else hi = mid - 1;
    }
    return { line: lo + 1, column: Math.max(1, offset - (this.starts[lo] as number) + 1) };
  }

  /** Source offset where 1-based `line` starts. */
  lineStart(line: number): number {
    return this.starts[Math.max(0, Math.min(line - 1, this.starts.length - 1))] as number;
  }

  get lineCount(): number {
    return this.starts.length;
  }
}
