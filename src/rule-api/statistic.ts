import type { ReportedNumber } from '../extract/types.js';
import type { LinkedStatistic } from '../link/types.js';
import type { Span } from '../parse/types.js';
import {
  distanceBetween, meets, sideOfAlpha, twoSidedPRangeR, twoSidedPRangeZ, upperPRangeChiSquare, upperPRangeF, upperPRangeFSphericity, type Interval, type PInterval,
} from '../stats/index.js';
import { adjustmentDoubt, mayBeAdjusted, resampledDoubt } from './evaluate.js';
import { fill, showBound, showInterval, showLastDigitUnits, showNumber } from './format.js';
import { dfInterval, numberInterval, pInterval, pLastDigit } from './intervals.js';
import { oncePer } from './once.js';
import type { Gap, Recomputed, RuleFinding } from './types.js';

/** One reading of a p from its statistic: its name, and the p range over the printed values' rounding box. */
export interface StatisticReading {
  name: string;
  range: Interval;
  fits: boolean;
}

/** How a reported p stands against the F, χ², r or z printed with it. */
export interface StatisticPEvaluation {
  readings: StatisticReading[];
  /** Some reading reproduces the reported p. */
  fits: boolean;
  /** The reading nearest to the reported p (for the message). */
  nearest: StatisticReading;
  reported: PInterval;
  reportedSide: 'below' | 'above' | 'straddles';
  /** The side of alpha every reading's range lies on, or straddles when they differ. */
  recomputedSide: 'below' | 'above' | 'straddles';
  decisionFlips: boolean;
  recomputed: Recomputed;
  gap: Gap;
  inputs: string[];
  /**
   * For an F whose p no reading reproduces, in a text that names a repeated-measures analysis
   * (LinkedStatistic.repeatedMeasures), with whole dfs, df1 >= 2 and df2 a multiple of df1 (as a
   * within-subject effect's error df is): the p range under a sphericity correction of any size,
   * ε from 1/df1 to 1 on both dfs, and whether it holds the reported p.
   */
  sphericity?: { range: Interval; fits: boolean; epsilonLow: number };
  /** As PEvaluation.maybeAdjusted: the p lies above every reading, and the text names a correction for it or for every p, labelling none as adjusted. */
  maybeAdjusted?: true;
}

/** The symbol a reader knows the statistic by. */
export function statisticName(kind: LinkedStatistic['report']['kind']): string {
  return kind === 'chi-square' ? 'χ²' : kind === 'correlation' ? 'r' : kind;
}

/** A printed value's interval under its comparison: rounding for `=`, a half-line for bounds. */
function valueInterval(s: LinkedStatistic['report'], value: ReportedNumber, floor: number, ceiling: number): [number, number] {
  const v = value.value;
  switch (s.op) {
    case '<':
    case '<=':
      return floor === 0 ? [0, Math.abs(v)] : [-Math.abs(v), Math.abs(v)];
    case '>':
    case '>=':
      return v >= 0 ? [v, ceiling] : [floor, v];
    default: {
      const [lo, hi] = numberInterval(value);
      return [Math.max(floor, lo), Math.min(ceiling, hi)];
    }
  }
}

function describeValue(symbol: string, s: LinkedStatistic['report'], value: ReportedNumber, lo: number, hi: number): string {
  if (s.op && s.op !== '=') return `${symbol} ${s.op} ${value.printed.trim()}`;
  return `${symbol} = ${value.printed.trim()} (read as ${showBound(lo, value.decimals, value.exponent)} to ${showBound(hi, value.decimals, value.exponent)})`;
}

function describeDfs(label: string, df: ReportedNumber): string {
  const [lo, hi] = dfInterval(df);
  return lo === hi ? `${label} = ${df.printed}` : `${label} = ${df.printed} (read as ${showBound(lo, df.decimals)} to ${showBound(hi, df.decimals)})`;
}

/**
 * The p a statistic implies, rounding-aware, against the reported p; undefined when there is
 * nothing to check (no p, no df where one is needed, an adjusted or plural p, a p or statistic
 * outside its range, which other rules speak of, or a p below 1e-300).
 *
 * Readings: F and χ² have one tail by definition (their upper tail). z and r are read both
 * two-tailed and one-tailed (half the two-tailed p): a rule speaks only when neither fits, so
 * a one-tailed p is never taken for an error here. An r whose bracket holds a number is read
 * both as df and as n (df = n − 2), as both are printed in that place.
 *
 * Made once per statistic (oncePer), as the report's record and the rules all ask for it.
 * Shared by every caller: copy what is to be changed.
 */
export function evaluateStatisticP(linked: LinkedStatistic): StatisticPEvaluation | undefined {
  return evaluateStatisticPOncePer(linked);
}

function evaluateStatisticPOnce(linked: LinkedStatistic): StatisticPEvaluation | undefined {
  const s = linked.report;
  const p = s.p;
  const value = s.value;
  if (!p || !value || p.adjusted || p.stars || !Number.isFinite(value.value)) return undefined;
  const n = p.kind === 'value' ? p.number : undefined;
  if (n && (n.value > 1 || n.value < 0 || Object.is(n.value, -0) || n.beyondDouble || (n.value !== 0 && n.value < 1e-300) || (n.value === 0 && (p.op === '<' || p.op === '<=')))) return undefined;
  const alpha = linked.alpha.value;
  const reported = pInterval(p, alpha);
  const symbol = statisticName(s.kind);
  const readings: Array<{ name: string; range: Interval }> = [];
  let inputs: string[];
  // an F's box with whole dfs, for the sphericity-corrected reading below
  let wholeF: { lo: number; hi: number; df1: number; df2: number } | undefined;
  if (s.kind === 'F') {
    const [df1, df2] = s.dfs ?? [];
    if (!df1 || !df2 || value.value < 0) return undefined;
    const [a0, a1] = dfInterval(df1);
    const [b0, b1] = dfInterval(df2);
    if (!(a0 > 0 && b0 > 0)) return undefined;
    const [lo, hi] = valueInterval(s, value, 0, Infinity);
    readings.push({ name: 'p (upper tail of F)', range: upperPRangeF(lo, hi, a0, a1, b0, b1) });
    if (a0 === a1 && b0 === b1 && Number.isInteger(a0) && Number.isInteger(b0)) wholeF = { lo, hi, df1: a0, df2: b0 };
    inputs = [describeValue(symbol, s, value, lo, hi), describeDfs('df1', df1), describeDfs('df2', df2)];
  } else if (s.kind === 'chi-square') {
    const df = s.dfs?.[0];
    if (!df || value.value < 0) return undefined;
    const [d0, d1] = dfInterval(df);
    if (!(d0 > 0)) return undefined;
    const [lo, hi] = valueInterval(s, value, 0, Infinity);
    readings.push({ name: 'p (upper tail of χ²)', range: upperPRangeChiSquare(lo, hi, d0, d1) });
    inputs = [describeValue(symbol, s, value, lo, hi), describeDfs('df', df)];
  } else if (s.kind === 'z') {
    const [lo, hi] = valueInterval(s, value, -Infinity, Infinity);
    const two = twoSidedPRangeZ(lo, hi);
    readings.push({ name: 'two-tailed p', range: two }, { name: 'one-tailed p', range: { low: two.low / 2, high: two.high / 2 } });
    inputs = [describeValue(symbol, s, value, lo, hi)];
  } else {
    if (Math.abs(value.value) > 1) return undefined; // values outside [−1, 1] are another finding
    const [lo, hi] = valueInterval(s, value, -1, 1);
    const options: Array<{ df: [number, number]; label: string }> = [];
    const bracket = s.dfs?.[0];
    if (bracket) {
      const [d0, d1] = dfInterval(bracket);
      options.push({ df: [d0, d1], label: describeDfs('df', bracket) });
      if (d0 - 2 > 0) options.push({ df: [d0 - 2, d1 - 2], label: `df = ${showNumber(d0 - 2)} if the bracket holds n` });
    } else if (s.n && s.n.decimals === 0 && s.n.value > 2) {
      options.push({ df: [s.n.value - 2, s.n.value - 2], label: `df = n − 2 = ${s.n.value - 2} (n = ${s.n.printed})` });
    }
    if (options.length === 0) return undefined;
    for (const o of options) {
      const two = twoSidedPRangeR(lo, hi, o.df[0], o.df[1]);
      const which = options.length > 1 ? (o === options[0] ? ' (bracket as df)' : ' (bracket as n)') : '';
      readings.push({ name: `two-tailed p${which}`, range: two }, { name: `one-tailed p${which}`, range: { low: two.low / 2, high: two.high / 2 } });
    }
    inputs = [describeValue(symbol, s, value, lo, hi), ...options.map((o) => o.label)];
  }
  if (readings.some((r) => Number.isNaN(r.range.low) || Number.isNaN(r.range.high))) return undefined;
  const judged = readings.map((r) => ({ ...r, fits: meets(r.range, reported) }));
  const fits = judged.some((r) => r.fits);
  const nearest = judged.reduce((a, b) => (distanceBetween(b.range, reported.low, reported.high) < distanceBetween(a.range, reported.low, reported.high) ? b : a));
  const reportedSide = sideOfAlpha(reported.low, reported.high, alpha, reported.highOpen);
  const sides = new Set(judged.map((r) => sideOfAlpha(r.range.low, r.range.high, alpha)));
  const recomputedSide = sides.size === 1 ? (sides.values().next().value as 'below' | 'above' | 'straddles') : 'straddles';
  const decisionFlips = !fits && reportedSide !== 'straddles' && recomputedSide !== 'straddles' && reportedSide !== recomputedSide;
  const recomputed: Recomputed = {
    quantity: nearest.name,
    low: nearest.range.low,
    high: nearest.range.high,
    inputs,
    assumptions: [
      s.kind === 'F' || s.kind === 'chi-square' ? `${symbol} has one tail by definition` : 'either tail reading (two-tailed or one-tailed) accepted',
      `alpha ${alpha} (${linked.alpha.basis === 'default' ? 'default' : linked.alpha.basis.replace('-', ' ')})`,
    ],
  };
  const absolute = distanceBetween(nearest.range, reported.low, reported.high);
  const unit = p.op === '=' ? pLastDigit(p) : undefined;
  const point = p.number ? distanceBetween(nearest.range, p.number.value, p.number.value) : absolute;
  const gap: Gap = unit ? { absolute: point, lastDigitUnits: point / unit, roundingAllowance: unit / 2 } : { absolute };
  const sphericity = !fits && linked.repeatedMeasures && wholeF ? sphericityReading(wholeF, reported) : undefined;
  const said = linked.adjustmentSaid;
  const maybeAdjusted = !fits && said !== undefined && judged.every((r) => reported.low > r.range.high) && judged.some((r) => mayBeAdjusted(said, r.range, reported));
  return { readings: judged, fits, nearest, reported, reportedSide, recomputedSide, decisionFlips, recomputed, gap, inputs, ...(sphericity ? { sphericity } : {}), ...(maybeAdjusted ? { maybeAdjusted: true as const } : {}) };
}

/**
 * The p of an F under a sphericity correction that was not printed: only for an effect that can
 * have one (df1 >= 2; with two levels ε is 1) and whose error df is a multiple of df1, as that of
 * an effect within subjects is ((k − 1)(n − 1) in a one-way design; common practice, no source).
 */
function sphericityReading(f: { lo: number; hi: number; df1: number; df2: number }, reported: PInterval): StatisticPEvaluation['sphericity'] {
  if (f.df1 < 2 || f.df2 % f.df1 !== 0) return undefined;
  const range = upperPRangeFSphericity(f.lo, f.hi, f.df1, f.df2);
  return { range, fits: meets(range, reported), epsilonLow: 1 / f.df1 };
}

/** Why a p that fits only a sphericity-corrected reading is not called wrong: the words that name such an analysis, and the corrected range. */
function sphericityDoubt(linked: LinkedStatistic, sphericity: NonNullable<StatisticPEvaluation['sphericity']>): string {
  const rm = linked.repeatedMeasures;
  const where = rm?.basis === 'sentence' ? 'in its sentence' : rm?.basis === 'paragraph' ? 'in its paragraph' : 'elsewhere in the text';
  return `the text speaks of repeated measures ${where}, “${rm?.mention.printed ?? ''}”, and with a sphericity correction of both dfs (ε from ${showNumber(sphericity.epsilonLow)} to 1) the p would be ${showInterval(sphericity.range.low, sphericity.range.high)}, which holds the reported p: the p may be corrected while its dfs are printed uncorrected`;
}

/** Message placeholders shared by the rules that compare a p with its F, χ², r or z. */
export function statisticPlaceholders(linked: LinkedStatistic, e: StatisticPEvaluation): Record<string, string> {
  const gap = e.gap.lastDigitUnits !== undefined
    ? `${showNumber(e.gap.absolute)} (${showLastDigitUnits(e.gap.lastDigitUnits)} units of the last printed digit; rounding allows 0.5 units)`
    : showNumber(e.gap.absolute);
  return {
    reported: linked.report.p?.printed.trim() ?? '',
    statistic: statisticName(linked.report.kind),
    inputs: e.inputs.join(', '),
    quantity: e.nearest.name,
    range: showInterval(e.nearest.range.low, e.nearest.range.high),
    readings: e.readings.map((r) => `${r.name} ${showInterval(r.range.low, r.range.high)}`).join('; '),
    alpha: String(linked.alpha.value),
    gap,
    reportedSide: e.reportedSide === 'below' ? 'significant' : 'not significant',
    recomputedSide: e.recomputedSide === 'below' ? 'significant' : 'not significant',
  };
}

/**
 * The findings of a p-follows rule for one kind of statistic: a p that no reading of the printed
 * statistic and dfs reproduces, and whose significance call does not flip (a flip is
 * significance-follows-from-statistic's). Doubts about the p's tie make the finding a note.
 */
export function statisticPFindings(
  statistics: readonly LinkedStatistic[],
  kinds: ReadonlyArray<LinkedStatistic['report']['kind']>,
  message: string,
  check: string,
  flips: boolean,
): RuleFinding[] {
  const out: RuleFinding[] = [];
  for (const linked of statistics) {
    if (!kinds.includes(linked.report.kind)) continue;
    const e = evaluateStatisticP(linked);
    if (!e || e.fits || e.decisionFlips !== flips) continue;
    const s = linked.report;
    const doubts = [...linked.doubts];
    const related: Array<{ span: Span; message: string }> = [];
    if (e.sphericity?.fits) {
      doubts.push(sphericityDoubt(linked, e.sphericity));
      if (linked.repeatedMeasures && linked.repeatedMeasures.basis !== 'sentence') related.push({ span: linked.repeatedMeasures.mention.span, message: 'repeated measures named here' });
    }
    if (e.maybeAdjusted && linked.adjustmentSaid) {
      const said = linked.adjustmentSaid;
      // the range of the reading the correction could have made the p from (maybeAdjusted found one)
      const from = e.readings.find((r) => mayBeAdjusted(said, r.range, e.reported))?.range ?? e.nearest.range;
      doubts.push(adjustmentDoubt(said, `${statisticName(s.kind)} gives`, from));
      related.push({ span: linked.adjustmentSaid.span, message: 'the correction named here' });
    }
    if (linked.resampledP) {
      doubts.push(resampledDoubt(linked.resampledP, statisticName(s.kind)));
      related.push({ span: linked.resampledP.span, message: 'resampling named here' });
    }
    out.push({
      messageId: 'mismatch',
      span: s.reportSpan ?? s.span,
      message: fill(message, statisticPlaceholders(linked, e)),
      reported: s.reportPrinted ?? s.printed,
      recomputed: e.recomputed,
      gap: e.gap,
      figure: { kind: 'p' },
      check,
      resultId: linked.id,
      block: s.block,
      ...(related.length > 0 ? { related } : {}),
      ...(doubts.length > 0 ? { uncertain: doubts } : {}),
    });
  }
  return out;
}

const evaluateStatisticPOncePer = oncePer(evaluateStatisticPOnce);
