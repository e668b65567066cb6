import type { Segment } from '../parse/types.js';

/**
 * The first index of a sorted list whose value is at least `x` (the list's length when none
 * is): the one binary search the readers share.
 */
export function lowerBound(values: ArrayLike<number>, x: number, from = 0, to = values.length): number {
  let lo = from;
  let hi = to;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if ((values[mid] as number) < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * The index in a segment's text of the first character printed at or after a source offset
 * (the last character when none is): the segment's `starts` run in source order.
 */
export function textIndexOf(seg: Segment, source: number): number {
  return Math.min(lowerBound(seg.starts, source), Math.max(0, seg.starts.length - 1));
}
