import { expect } from 'vitest';
import { parseDocument, type Segment, type SegmentKind, type TableLegend, type TablePlace } from '../../src/parse/index.js';

/** One expected segment: what the extractor reads, and where it sits in the source. */
export interface ExpectedSegment {
  kind: SegmentKind;
  text: string;
  table?: TablePlace;
  legendOf?: TableLegend;
  section?: string;
  /** The exact source text from the segment's first to its last character (first occurrence in the source). */
  at?: string;
  /** For pieces of the segment text, the exact source text each maps back to. */
  spans?: Record<string, string>;
}

export interface SegmentCase {
  name: string;
  /** The path decides the reader: `.txt` plain text, `.Rmd` R Markdown, else Markdown. */
  path?: string;
  source: string;
  expect: ExpectedSegment[];
}

/**
 * Parses `source` and checks every segment against `expect`, in order: kind, text, table place,
 * legend and section exactly; `at` and `spans` against the source map. Every character of every
 * segment must map into the source in reading order, and a letter or digit must come from a
 * source range holding that character.
 */
export function expectSegments({ path = 'x.md', source, expect: expected }: SegmentCase): Segment[] {
  const doc = parseDocument(path, source);
  for (const seg of doc.segments) expectExactMap(source, seg);
  const shape = (s: Segment | ExpectedSegment) => ({
    kind: s.kind,
    text: s.text,
    ...(s.table ? { table: s.table } : {}),
    ...(s.legendOf ? { legendOf: s.legendOf } : {}),
    ...(s.section !== undefined ? { section: s.section } : {}),
  });
  expect(doc.segments.map(shape)).toEqual(expected.map(shape));
  expected.forEach((e, k) => {
    const seg = doc.segments[k] as Segment;
    if (e.at !== undefined) {
      const start = source.indexOf(e.at);
      expect(start, `"${e.at}" is not in the source`).toBeGreaterThanOrEqual(0);
      expect({ start: seg.starts[0], end: seg.ends.at(-1) }).toEqual({ start, end: start + e.at.length });
    }
    for (const [piece, from] of Object.entries(e.spans ?? {})) {
      const i = seg.text.indexOf(piece);
      expect(i, `"${piece}" is not in "${seg.text}"`).toBeGreaterThanOrEqual(0);
      expect(source.slice(seg.starts[i], seg.ends[i + piece.length - 1])).toBe(from);
    }
  });
  return doc.segments;
}

function expectExactMap(source: string, seg: Segment): void {
  expect(seg.starts).toHaveLength(seg.text.length);
  expect(seg.ends).toHaveLength(seg.text.length);
  for (let i = 0; i < seg.text.length; i += 1) {
    const a = seg.starts[i] as number;
    const b = seg.ends[i] as number;
    expect(a).toBeGreaterThanOrEqual(i > 0 ? (seg.starts[i - 1] as number) : 0);
    expect(b).toBeGreaterThanOrEqual(a);
    expect(b).toBeLessThanOrEqual(source.length);
    const c = seg.text[i] as string;
    if (/[A-Za-z0-9]/.test(c)) expect(source.slice(a, b), `segment character ${i} of "${seg.text}"`).toContain(c);
  }
}
