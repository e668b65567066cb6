import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { BoxList, layoutPages, type CharBox, type PageRuns, type TextRun } from '../../src/parse/pdf/index.js';

/**
 * Character boxes in the PDF layout (src/parse/pdf/boxes.ts). The layout keeps them as four
 * numbers per character in one list; these tests hold the list to the arrays of box objects it
 * replaced, and the layout's boxes to the geometry it promises (a run's width shared evenly
 * between its code points, a code point's share between the units it is spelled with).
 */

const asList = (boxes: CharBox[]) => {
  const l = new BoxList();
  for (const b of boxes) l.push(b.x0, b.x1, b.y0, b.y1);
  return l;
};

describe('BoxList', () => {
  const box = fc.record({ x0: fc.double({ noNaN: true }), x1: fc.double({ noNaN: true }), y0: fc.double({ noNaN: true }), y1: fc.double({ noNaN: true }) });
  const boxes = fc.array(box, { maxLength: 30 });

  it('slices, joins and copies boxes as arrays of box objects do', () => {
    fc.assert(
      fc.property(boxes, boxes, fc.nat(40), fc.nat(40), fc.array(fc.nat(29)), (a, b, s, e, picks) => {
        const la = asList(a);
        const lb = asList(b);
        expect(la.length).toBe(a.length);
        expect(la.boxes()).toEqual(a);
        expect(la.slice(s, e).boxes()).toEqual(a.slice(s, e));
        expect(la.slice(s).boxes()).toEqual(a.slice(s));
        expect(la.concat(lb).boxes()).toEqual(a.concat(b));
        expect(la.boxes(s, e)).toEqual(a.slice(s, e));
        const joined = new BoxList();
        joined.append(la);
        joined.append(lb);
        expect(joined.boxes()).toEqual([...a, ...b]);
        const kept = new BoxList();
        const valid = picks.filter((i) => i < a.length);
        for (const i of valid) kept.pushFrom(la, i);
        expect(kept.boxes()).toEqual(valid.map((i) => a[i]));
        // a list made from another is its own: changing the new one leaves the old as it was
        const copy = la.slice();
        copy.push(1, 2, 3, 4);
        expect(la.boxes()).toEqual(a);
      }),
      { numRuns: 300 },
    );
  });

  it('doubles a list appended to itself, and takes only whole boxes', () => {
    const l = asList([{ x0: 0, x1: 1, y0: 2, y1: 3 }]);
    l.append(l);
    expect(l.boxes()).toEqual([{ x0: 0, x1: 1, y0: 2, y1: 3 }, { x0: 0, x1: 1, y0: 2, y1: 3 }]);
    expect(() => new BoxList([1, 2, 3])).toThrow(RangeError);
  });

  it('refuses a box it does not hold', () => {
    const l = asList([{ x0: 0, x1: 1, y0: 2, y1: 3 }]);
    expect(l.box(0)).toEqual({ x0: 0, x1: 1, y0: 2, y1: 3 });
    expect(() => l.x0(1)).toThrow(RangeError);
    expect(() => l.y1(-1)).toThrow(RangeError);
    expect(() => new BoxList().pushFrom(l, 1)).toThrow(RangeError);
  });
});

describe('character boxes of the layout', () => {
  const run = (str: string, x: number, y: number, width: number, size = 10): TextRun => ({ str, x, y, width, size, upright: true });
  const page = (runs: TextRun[]): PageRuns => ({ page: 1, width: 612, height: 792, runs });
  const y0 = (r: TextRun) => r.y - 0.22 * r.size;
  const y1 = (r: TextRun) => r.y + 0.8 * r.size;

  it('gives each character of a run an even share of its width', () => {
    const r = run('t = 2.1', 100, 700, 35);
    const { lines } = layoutPages([page([r])]);
    expect(lines).toHaveLength(1);
    const line = lines[0];
    expect(line?.text).toBe('t = 2.1');
    expect(line?.boxes.boxes()).toEqual([...'t = 2.1'].map((_, i) => ({ x0: 100 + i * 5, x1: 100 + (i + 1) * 5, y0: y0(r), y1: y1(r) })));
  });

  it('spells a ligature out, its share split between its letters, and reads a hyphen U+2010 as -', () => {
    // 'e', 'ﬃ', '‐', 'x': four code points, 10 points each; 'ﬃ' becomes 'ffi', three boxes of 10/3
    const r = run('e\uFB03\u2010x', 50, 600, 40);
    const line = layoutPages([page([r])]).lines[0];
    expect(line?.text).toBe('effi-x');
    const xs = line?.boxes.boxes().map((b) => [b.x0, b.x1]);
    expect(xs).toEqual([
      [50, 60],
      [60, 60 + 10 / 3],
      [60 + 10 / 3, 60 + 2 * (10 / 3)],
      [60 + 2 * (10 / 3), 60 + 3 * (10 / 3)],
      [70, 80],
      [80, 90],
    ]);
  });

  it('gives a character outside the Basic Multilingual Plane one share, halved between its two units', () => {
    // '𝑡' (U+1D461, two UTF-16 units) then '=': two code points, 8 points each
    const r = run('\u{1D461}=', 20, 500, 16);
    const line = layoutPages([page([r])]).lines[0];
    expect(line?.text).toBe('\u{1D461}=');
    expect(line?.boxes.boxes().map((b) => [b.x0, b.x1])).toEqual([
      [20, 24],
      [24, 28],
      [28, 36],
    ]);
  });

  it('gives the space put between runs the gap, and keeps one box per character of every piece', () => {
    const a = run('mean', 72, 700, 20);
    const b = run('score', 72 + 20 + 4, 700, 25);
    const { lines, blocks } = layoutPages([page([a, b])]);
    const line = lines[0];
    expect(line?.text).toBe('mean score');
    expect(line?.boxes.box(4)).toEqual({ x0: 92, x1: 96, y0: y0(b), y1: y1(b) });
    for (const block of blocks) for (const p of block.pieces) expect(p.boxes.length).toBe(p.text.length);
  });

  it('drops the boxes of spaces it trims or collapses with their characters', () => {
    const r = run('  a \t b  ', 0, 400, 90);
    const line = layoutPages([page([r])]).lines[0];
    expect(line?.text).toBe('a b');
    // kept: 'a' (unit 2), the first of the inner spaces (unit 3), 'b' (unit 6), ten points each
    expect(line?.boxes.boxes().map((b) => b.x0)).toEqual([20, 30, 60]);
  });

  it('reads a tab or no-break space inside a run as a space, and drops a leading or trailing space, with their boxes', () => {
    for (const inner of ['\t', '\u00A0', '\u2028']) {
      const line = layoutPages([page([run(`a${inner}b`, 0, 400, 30)])]).lines[0];
      expect(line?.text).toBe('a b');
      expect(line?.boxes.boxes().map((b) => b.x0)).toEqual([0, 10, 20]);
    }
    const trailing = layoutPages([page([run('mean ', 0, 400, 50)])]).lines[0];
    expect(trailing?.text).toBe('mean');
    expect(trailing?.boxes.boxes().map((b) => b.x1)).toEqual([10, 20, 30, 40]);
    const leading = layoutPages([page([run(' mean', 0, 400, 50)])]).lines[0];
    expect(leading?.text).toBe('mean');
    expect(leading?.boxes.boxes().map((b) => b.x0)).toEqual([10, 20, 30, 40]);
  });

  it('spells out every ligature U+FB00 to U+FB06 and reads U+2011 as -', () => {
    const spelled: Array<[string, string]> = [['\uFB00', 'ff'], ['\uFB01', 'fi'], ['\uFB02', 'fl'], ['\uFB03', 'ffi'], ['\uFB04', 'ffl'], ['\uFB05', 'st'], ['\uFB06', 'st'], ['\u2011', '-']];
    for (const [c, letters] of spelled) {
      // 'x', the character, 'y': three code points of 12 points each
      const line = layoutPages([page([run(`x${c}y`, 0, 300, 36)])]).lines[0];
      expect(line?.text).toBe(`x${letters}y`);
      const share = 12 / letters.length;
      expect(line?.boxes.boxes().map((b) => [b.x0, b.x1])).toEqual([[0, 12], ...[...letters].map((_, k) => [12 + k * share, 12 + (k + 1) * share]), [24, 36]]);
    }
  });

  it('counts a lone surrogate as one character, as the string iterator does', () => {
    const line = layoutPages([page([run('\uD835x', 0, 300, 20)])]).lines[0];
    expect(line?.boxes.boxes().map((b) => [b.x0, b.x1])).toEqual([
      [0, 10],
      [10, 20],
    ]);
  });

  it('keeps a raised exponent’s own boxes when it is read as superscript characters', () => {
    // 'p < 10' then '-3' set smaller and raised right after it: read as 'p < 10⁻³'
    const host = run('p < 10', 100, 700, 30);
    const raised = run('-3', 130.5, 704, 7, 7);
    const line = layoutPages([page([host, raised])]).lines[0];
    expect(line?.text).toBe('p < 10⁻³');
    expect(line?.boxes.boxes(6)).toEqual([
      { x0: 130.5, x1: 134, y0: y0(raised), y1: y1(raised) },
      { x0: 134, x1: 137.5, y0: y0(raised), y1: y1(raised) },
    ]);
  });

  it('gives the space between the chunks of a line (cut at a wide gap) the gap, at the next chunk’s height', () => {
    const a = run('Mean', 72, 700, 20);
    const b = run('4.1', 150, 700, 15, 12);
    const line = layoutPages([page([a, b])]).lines[0];
    expect(line?.text).toBe('Mean 4.1');
    expect(line?.boxes.box(4)).toEqual({ x0: 92, x1: 150, y0: y0(b), y1: y1(b) });
    expect(line?.boxes.length).toBe(8);
  });

  it('moves a hyphenated word’s boxes with its letters onto the first line', () => {
    const runs = [run('The groups were com-', 72, 700, 100), run('pared with care and more words here.', 72, 688, 180)];
    const { blocks } = layoutPages([page(runs)]);
    const pieces = blocks[0]?.pieces ?? [];
    expect(pieces.map((p) => p.text)).toEqual(['The groups were compared', 'with care and more words here.']);
    for (const p of pieces) expect(p.boxes.length).toBe(p.text.length);
    // 'pared' keeps the boxes it had on the second line
    expect(pieces[0]?.boxes.boxes(19, 24).map((b) => b.x0)).toEqual([72, 77, 82, 87, 92]);
    expect(pieces[1]?.boxes.x0(0)).toBe(72 + 6 * 5);
  });
});
