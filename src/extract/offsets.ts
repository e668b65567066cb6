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

/** `lowerBound` over a list sorted by a key of its items. */
export function lowerBoundBy<T>(items: readonly T[], key: (item: T) => number, x: number): number {
  let lo = 0;
  let hi = items.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (key(items[mid] as T) < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Whether each segment's source map runs in source order (checked once per segment). */
const ascending = new WeakMap<Segment, boolean>();

/**
 * The first text index whose source start is at or after `offset` (the text's length when none
 * is). A binary search when the segment's map is in source order (as the parse layer builds it),
 * so a paragraph of thousands of groups is not scanned once per group; a scan otherwise, with the
 * same answer.
 */
export function indexOfSource(seg: Segment, offset: number): number {
  const starts = seg.starts;
  let sorted = ascending.get(seg);
  if (sorted === undefined) {
    sorted = true;
    for (let i = 1; i < starts.length && sorted; i += 1) sorted = (starts[i - 1] as number) <= (starts[i] as number);
    ascending.set(seg, sorted);
  }
  if (!sorted) {
    const i = starts.findIndex((s) => s >= offset);
    return i < 0 ? seg.text.length : i;
  }
  const lo = lowerBound(starts, offset);
  return lo === starts.length ? seg.text.length : lo;
}

/**
 * The index in a segment's text of the first character printed at or after a source offset
 * (the last character when none is), for a segment whose `starts` run in source order: the other
 * statistics' reader (statistics.ts) reads prose whose map is so.
 */
export function textIndexOf(seg: Segment, source: number): number {
  return Math.min(lowerBound(seg.starts, source), Math.max(0, seg.starts.length - 1));
}
