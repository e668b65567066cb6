import type { LinkedResult } from '../link/types.js';
import type { PEvaluation } from './evaluate.js';
import { showRange } from './evaluate.js';
import { distanceBetween } from '../stats/index.js';
import { showLastDigitUnits, showLog10Interval, showNumber } from './format.js';

/** Placeholder values shared by the rules that compare p with t and df. */
export function pPlaceholders(result: LinkedResult, e: PEvaluation): Record<string, string> {
  const r = result.report;
  const gap = e.gap.lastDigitUnits !== undefined
    ? // both counts in the same unit, the last printed digit (half a unit is what rounding explains)
      `${showNumber(e.gap.absolute)} (${showLastDigitUnits(e.gap.lastDigitUnits)} units of the last printed digit; rounding allows 0.5 units)`
    : e.log10
      ? // compared as log10 p: a distance between such p values is a ratio, not a difference
        `a factor of 10^${logDistance(e.log10.applicable, e.log10.reported).toFixed(1)}`
      : showNumber(e.gap.absolute);
  return {
    reported: reportedP(r),
    inputs: e.recomputed.inputs.join(', '),
    quantity: e.applicableName,
    // a p below 1e-300 was compared as log10 p: shown from there, not from doubles that round to 0
    range: e.log10 ? showLog10Interval(e.log10.applicable.low, e.log10.applicable.high) : showRange(e.applicable),
    twoTailed: e.log10 ? showLog10Interval(e.log10.check.twoSided.low, e.log10.check.twoSided.high) : showRange(e.check.twoSided),
    oneTailed: e.log10 ? showLog10Interval(e.log10.check.oneSidedSame.low, e.log10.check.oneSidedSame.high) : showRange(e.check.oneSidedSame),
    oneTailedOpposite: e.log10 ? showLog10Interval(e.log10.check.oneSidedOpposite.low, e.log10.check.oneSidedOpposite.high) : showRange(e.check.oneSidedOpposite),
    tails: e.recomputed.assumptions[0] ?? '',
    alpha: String(result.alpha.value),
    gap,
    reportedSide: e.reportedSide === 'below' ? 'significant' : 'not significant',
    recomputedSide: e.recomputedSide === 'below' ? 'significant' : 'not significant',
  };
}

/** The message id for each standing a p-versus-t rule reports. */
export function pMessageId(e: PEvaluation): 'mismatch' | 'one-tailed-although-two-stated' | 'two-tailed-although-one-stated' | undefined {
  switch (e.standing) {
    case 'mismatch':
    case 'one-tailed-although-two-stated':
    case 'two-tailed-although-one-stated':
      return e.standing;
    default:
      return undefined;
  }
}

/** The reported p as a reader should see it: stars with the bound they were read as. */
function reportedP(r: LinkedResult['report']): string {
  const p = r.p;
  if (!p) return '';
  if (p.stars && p.number) {
    const why = p.stars.basis === 'legend' ? 'as the legend defines it' : 'the most lenient common reading; no legend says otherwise';
    return `${r.printed} (${p.stars.symbol} read as p < ${p.number.value}, ${why})`;
  }
  return r.style === 'table-columns' && p.number ? `p ${p.op} ${p.number.printed}` : p.printed.trim();
}

/** How many powers of ten lie between a recomputed and a reported p, both as log10 ranges. */
function logDistance(range: { low: number; high: number }, reported: { low: number; high: number }): number {
  return distanceBetween(range, reported.low, reported.high);
}
