import type { Segment } from '../parse/types.js';
import { sourceSpan } from './numbers.js';
import type { TTestReport } from './types.js';
import { matchesOf } from './matches.js';

/** One symbol of a star legend: `***p < .001`, `† p < .10`, `* P ≤ 0.05`. */
const LEGEND = /(?<![*†‡\p{L}\p{N}])(\*{1,4}|†|‡) ?(?:p|P)(?:[- ]?values?)? ?(<|≤|<=) ?(0?\.\d{1,4})(?!\d)/gu;

export interface StarLegend {
  thresholds: Map<string, number>;
  span: { start: number; end: number };
}

/** The star legends printed in one segment (a table note, a figure legend, a sentence). */
export function findStarLegends(seg: Segment): StarLegend | undefined {
  if (!seg.text.includes('*') && !seg.text.includes('†') && !seg.text.includes('‡')) return undefined;
  const thresholds = new Map<string, number>();
  let first = -1;
  let last = -1;
  for (const m of matchesOf(LEGEND, seg.text)) {
    thresholds.set(m[1] as string, Number(m[3]));
    if (first < 0) first = m.index;
    last = m.index + m[0].length;
  }
  return thresholds.size === 0 ? undefined : { thresholds, span: sourceSpan(seg, first, last) };
}

/**
 * Stars read with the document's legend: where every legend that names a symbol gives it the
 * same bound, that bound replaces the lenient reading. Legends that disagree (one table uses
 * * < .10, another * < .05) leave the lenient reading in place.
 */
export function applyStarLegends(tests: TTestReport[], legends: StarLegend[]): void {
  if (legends.length === 0) return;
  for (const t of tests) {
    const stars = t.p?.stars;
    if (!stars || !t.p?.number) continue;
    const bounds = new Set<number>();
    let where: StarLegend | undefined;
    for (const l of legends) {
      const b = l.thresholds.get(stars.symbol);
      if (b !== undefined) {
        bounds.add(b);
        where ??= l;
      }
    }
    if (bounds.size !== 1 || !where) continue;
    const bound = [...bounds][0] as number;
    t.p.number = { ...t.p.number, value: bound, decimals: decimalsOf(bound) };
    t.p.stars = { ...stars, basis: 'legend', legend: where.span };
  }
}

/**
 * The bound a run of stars stands for when no legend says: the most lenient of the common
 * conventions (* < .10, ** < .05, *** < .01, **** < .001; † < .10), so that no convention
 * in use claims less than what is read (common practice, no source).
 */
export function starBound(symbol: string): number | undefined {
  return ({ '†': 0.1, '*': 0.1, '**': 0.05, '***': 0.01, '****': 0.001 } as Record<string, number>)[symbol];
}

export function decimalsOf(x: number): number {
  const s = String(x);
  const dot = s.indexOf('.');
  return dot < 0 ? 0 : s.length - dot - 1;
}
