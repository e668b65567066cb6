import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { NUMBERS_ONLY, recogniseSegment } from '../../src/extract/index.js';
import type { Segment, SegmentKind } from '../../src/parse/types.js';

/**
 * extract() skips the recognisers for a segment whose text is only digits, spaces, points, commas
 * and plus or minus signs (NUMBERS_ONLY in src/extract/index.ts), on the ground that none of them
 * reads anything there. Here every recogniser runs on such texts, as a paragraph, a heading, a
 * table cell (header and body) and code, and must find nothing at all. (The reference is the
 * recognisers themselves, run without the skip.)
 */
const RUNS = Number(process.env.PLUMBLINE_PROPERTY_RUNS ?? 2_000);

function segment(text: string, kind: SegmentKind, row: number): Segment {
  const starts = Int32Array.from(text, (_, i) => i);
  return {
    id: 0,
    block: 1,
    kind,
    text,
    starts,
    ends: starts.map((i) => i + 1),
    ...(kind === 'tableCell' ? { table: { table: 0, row, column: 0 } } : {}),
    section: 'Results',
  };
}

function foundIn(text: string): string[] {
  const found: string[] = [];
  for (const [kind, row] of [['paragraph', 0], ['heading', 0], ['tableCell', 0], ['tableCell', 3], ['code', 0]] as const) {
    const finds = recogniseSegment(segment(text, kind, row), text);
    for (const [name, value] of Object.entries(finds)) {
      if (Array.isArray(value) ? value.length > 0 : value !== undefined) found.push(`${kind}: ${name}`);
    }
  }
  return found;
}

const piece = fc.constantFrom('0', '1', '2', '5', '9', '12', '28', '2.47', '.021', '.05', '0.001', '1,234', '1,5', '-', '+', '.', ',', ' ', '  ', '-0.3', '+1', '95', '100', '2024', '1-2', '3 - 4', '1.2.3', ',,', '--', '++');

describe('a numbers-only text holds nothing the recognisers read', () => {
  it('fixed cases, table cells of data dumps among them', () => {
    for (const text of ['1', '2', '2.5', '-0.3', '+1', '1,234.5', '12 34', '1-2', '1 - 2', '18-25', '1.2.3', '.', '-', '+', '', ' ', '1, 2,  3', '001', '3.14159265358979']) {
      expect(NUMBERS_ONLY.test(text), text).toBe(true);
      expect(foundIn(text), text).toEqual([]);
    }
  });

  it('generated texts of digits, spaces, points, commas and signs', () => {
    fc.assert(
      fc.property(fc.array(piece, { maxLength: 12 }), (pieces) => {
        const text = pieces.join('');
        expect(NUMBERS_ONLY.test(text)).toBe(true);
        expect(foundIn(text), text).toEqual([]);
      }),
      { numRuns: RUNS, seed: 20261204 },
    );
  });

  it('a letter or a mark beside the numbers is read as before (the skip is no wider than its class)', () => {
    // the same recognisers do find something once a mark other than those is there
    expect(foundIn('1 ± 2').length).toBeGreaterThan(0);
    expect(foundIn('t(23) = 2.47').length).toBeGreaterThan(0);
    expect(foundIn('12 (40%)').length).toBeGreaterThan(0);
  });
});
