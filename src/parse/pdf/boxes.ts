import type { CharBox } from './types.js';

/**
 * The boxes of a stretch of characters, one for each UTF-16 unit of its text, kept as four
 * numbers each (x0, x1, y0, y1) in one array of numbers. The layout carries a box for every
 * character it reads, beside the text, through every step (rows, chunks, lines, pieces), and
 * only an annotated copy of the PDF ever looks at them. As one object per character (an object
 * and four boxed numbers) they took over a quarter of the layout's time, and much of the
 * collector's, when reading the 40-page bench PDF. An array that holds only numbers keeps them
 * unboxed, in one block of the heap; a typed array would too, but costs far more to create, and
 * a list is created for every run and chunk.
 *
 * A list is only added to while it is being built: every step that changes boxes (slice,
 * concat, the characters kept) makes a new list, so lists may be shared, as the arrays were.
 */
export class BoxList {
  private readonly data: number[];

  /** A list of the boxes in `data` (four numbers each), which becomes the list's own. */
  constructor(data: number[] = []) {
    if (data.length % 4 !== 0) throw new RangeError(`boxes are four numbers each; got ${data.length}`);
    this.data = data;
  }

  /** The number of boxes. */
  get length(): number {
    return this.data.length >> 2;
  }

  /** Adds one box. */
  push(x0: number, x1: number, y0: number, y1: number): void {
    this.data.push(x0, x1, y0, y1);
  }

  /** Adds box `i` of `from`. */
  pushFrom(from: BoxList, i: number): void {
    if (i < 0 || i >= from.length) throw new RangeError(`box ${i} of ${from.length}`);
    const s = from.data;
    const k = i * 4;
    this.data.push(s[k] as number, s[k + 1] as number, s[k + 2] as number, s[k + 3] as number);
  }

  /** Adds every box of `from`, in order. */
  append(from: BoxList): void {
    const s = from.data;
    // the length read once: a list appended to itself is doubled, as push(...array) did
    const n = s.length;
    for (let k = 0; k < n; k += 1) this.data.push(s[k] as number);
  }

  /** Boxes `start` up to `end` (not included) as a new list; the bounds are clamped to the list, as Array's slice does for bounds of 0 or more. */
  slice(start = 0, end = this.length): BoxList {
    const a = Math.min(Math.max(0, start), this.length);
    const z = Math.min(Math.max(a, end), this.length);
    return new BoxList(this.data.slice(a * 4, z * 4));
  }

  /** This list's boxes, then `other`'s, as a new list. */
  concat(other: BoxList): BoxList {
    return new BoxList(this.data.concat(other.data));
  }

  x0(i: number): number {
    return this.at(i, 0);
  }

  x1(i: number): number {
    return this.at(i, 1);
  }

  y0(i: number): number {
    return this.at(i, 2);
  }

  y1(i: number): number {
    return this.at(i, 3);
  }

  private at(i: number, k: number): number {
    if (i < 0 || i >= this.length) throw new RangeError(`box ${i} of ${this.length}`);
    return this.data[i * 4 + k] as number;
  }

  /** Box `i` as an object. */
  box(i: number): CharBox {
    return { x0: this.x0(i), x1: this.x1(i), y0: this.y0(i), y1: this.y1(i) };
  }

  /** Boxes `start` up to `end` as objects. */
  boxes(start = 0, end = this.length): CharBox[] {
    const out: CharBox[] = [];
    for (let i = Math.max(0, start); i < Math.min(end, this.length); i += 1) out.push(this.box(i));
    return out;
  }
}
