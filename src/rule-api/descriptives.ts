import type { GroupSummary, SpreadKind } from '../extract/types.js';
import type { Design, LinkedResult } from '../link/index.js';
import { distanceBetween, oneSampleAbsT, studentAbsT, welchAbsT, welchDfRange, type Box, type Interval } from '../stats/index.js';
import { showInterval } from './format.js';
import { dfInterval, isWholeDf, numberInterval, tInterval } from './intervals.js';
import { oncePer } from './once.js';

export type Variant = 'one-sample' | 'student' | 'welch';
export type Reading = 'as labelled' | 'spread read as SE' | 'spread read as SD';

/** One way of recomputing t from the descriptives, and whether it reproduces the printed t. */
export interface Attempt {
  variant: Variant;
  reading: Reading;
  /** The group sizes used, and where they came from. */
  ns: number[];
  nSource: string;
  absT: Interval;
  fits: boolean;
}

export interface DescriptiveEvaluation {
  groups: GroupSummary[];
  design: Design;
  reportedAbsT: Interval;
  attempts: Attempt[];
  /** Some variant reproduces t when each spread is read as it is labelled (unstated: either way). */
  fitsAsLabelled: boolean;
  /** Only a reading against the label reproduces t. */
  fitsOnlyAgainstLabel: boolean;
  /** The kinds in force for each group after document statements. */
  kinds: SpreadKind[];
  /** Why some combinations could not be tried (missing n, and so on). */
  limits: string[];
}

const box = (n: { value: number; decimals: number; exponent: number; printed: string; span: { start: number; end: number } }): Box => numberInterval(n);
const MAX_SPLITS = 5000;

/**
 * Recompute t from the descriptives linked to a result, under every reading the printed
 * values allow: each variant the design permits (one-sample; Student and Welch for two
 * independent groups), each spread read as labelled and, for the label-mix-up check, against
 * it, and every split of a total N when the group sizes are not printed. Undefined when the
 * result has no linked descriptives with means and spreads, or the design is paired (a paired
 * t needs the SD of the differences, which is not in two groups' descriptives).
 */
export function evaluateDescriptives(result: LinkedResult): DescriptiveEvaluation | undefined {
  return evaluateDescriptivesOncePer(result);
}

/**
 * evaluateDescriptives made once per linked result (once.ts): spread-kind-matches-t and
 * t-follows-from-descriptives both ask for it, and each evaluation tries every reading, variant
 * and split of the sizes. The rules copy what they keep of it into their findings.
 */
const evaluateDescriptivesOncePer = oncePer(evaluateDescriptivesOnce);

function evaluateDescriptivesOnce(result: LinkedResult): DescriptiveEvaluation | undefined {
  const link = result.context.descriptives;
  const r = result.report;
  if (!link || r.tOp !== '=') return undefined;
  const groups = link.groups;
  if (!groups.every((g) => g.mean && g.spread)) return undefined;
  const design = inferDesign(result);
  const [tLow, tHigh] = tInterval(r);
  const reportedAbsT: Interval = { low: tLow <= 0 && tHigh >= 0 ? 0 : Math.min(Math.abs(tLow), Math.abs(tHigh)), high: Math.max(Math.abs(tLow), Math.abs(tHigh)) };
  const fitsT = (i: Interval) => i.low <= reportedAbsT.high && i.high >= reportedAbsT.low;
  const attempts: Attempt[] = [];
  const limits: string[] = [];
  const kinds = link.spreadKinds;

  const readings = (kind: SpreadKind): Array<{ reading: Reading; asSE: boolean; labelled: boolean }> => {
    if (kind === 'SD') return [{ reading: 'as labelled', asSE: false, labelled: true }, { reading: 'spread read as SE', asSE: true, labelled: false }];
    if (kind === 'SE') return [{ reading: 'as labelled', asSE: true, labelled: true }, { reading: 'spread read as SD', asSE: false, labelled: false }];
    return [{ reading: 'spread read as SD', asSE: false, labelled: true }, { reading: 'spread read as SE', asSE: true, labelled: true }];
  };
  const sdBox = (g: GroupSummary, n: number, asSE: boolean): Box => {
    const b = box((g.spread as NonNullable<GroupSummary['spread']>).number);
    return asSE ? [b[0] * Math.sqrt(n), b[1] * Math.sqrt(n)] : b;
  };
  let labelledFit = false;
  let againstFit = false;

  if (groups.length === 1) {
    const g = groups[0] as GroupSummary;
    if (design === 'independent') return undefined;
    // A one-sample test against an unstated value cannot be recomputed without guessing it.
    if (!result.context.reference && design !== 'paired') return undefined;
    const mu0 = result.context.reference?.value.value ?? 0;
    const n = g.n?.value ?? (r.df && isWholeDf(r.df) ? r.df.value + 1 : undefined);
    if (!n) return undefined;
    const nSource = g.n ? `n = ${g.n.printed}` : `n = df + 1 = ${n}`;
    for (const rd of readings(kinds[0] ?? 'unstated')) {
      const absT = oneSampleAbsT(box(g.mean as NonNullable<GroupSummary['mean']>), sdBox(g, n, rd.asSE), n, mu0);
      const fits = fitsT(absT);
      attempts.push({ variant: 'one-sample', reading: rd.reading, ns: [n], nSource, absT, fits });
      if (fits && rd.labelled) labelledFit = true;
      if (fits && !rd.labelled) againstFit = true;
    }
  } else if (groups.length === 2) {
    if (design === 'paired' || design === 'one-sample') return undefined;
    const [g1, g2] = groups as [GroupSummary, GroupSummary];
    const splits = candidateSplits(result, g1, g2);
    if (splits.pairs.length === 0) {
      // no sizes and no total, but a fractional df: only Welch's test gives one, and its df
      // bounds the sizes it could come from
      const bound = r.df && !isWholeDf(r.df) ? welchWithinDf(dfInterval(r.df)) : undefined;
      if (!bound) return undefined;
      const m1 = box(g1.mean as NonNullable<GroupSummary['mean']>);
      const m2 = box(g2.mean as NonNullable<GroupSummary['mean']>);
      for (const rd1 of readings(kinds[0] ?? 'unstated')) {
        for (const rd2 of readings(kinds[1] ?? 'unstated')) {
          if (rd1.asSE !== rd2.asSE) continue;
          const labelled = rd1.labelled && rd2.labelled;
          let absT: Interval;
          if (rd1.asSE) {
            // SDs rebuilt from SEs as SE·√n give SD²/n = SE² whatever n is: t does not depend on the sizes
            absT = welchAbsT(m1, sdBox(g1, 4, true), 4, m2, sdBox(g2, 4, true), 4);
          } else {
            const s1 = sdBox(g1, 2, false);
            const s2 = sdBox(g2, 2, false);
            let low = Infinity;
            let high = 0;
            // |t| rises with each size, so for each smaller size the range runs from the
            // fewest units the df allows in the other group to infinitely many
            for (let small = 2; small <= bound.maxSmaller; small += 1) {
              const other = Math.max(small, bound.minTotal - small);
              for (const [n1, n2, far1, far2] of [[small, other, small, Infinity], [other, small, Infinity, small]] as const) {
                low = Math.min(low, welchAbsT(m1, s1, n1, m2, s2, n2).low);
                high = Math.max(high, welchAbsT(m1, s1, far1, m2, s2, far2).high);
              }
            }
            absT = { low, high };
          }
          const fits = fitsT(absT);
          const nSource = rd1.asSE ? 'any group sizes' : `any group sizes the Welch df ${r.df?.printed} allows: the smaller group at most ${bound.maxSmaller}, both together at least ${bound.minTotal}`;
          attempts.push({ variant: 'welch', reading: rd1.reading, ns: [], nSource, absT, fits });
          if (fits && labelled) labelledFit = true;
          if (fits && !labelled) againstFit = true;
        }
      }
      return { groups, design, reportedAbsT, attempts, fitsAsLabelled: labelledFit, fitsOnlyAgainstLabel: !labelledFit && againstFit, kinds, limits };
    }
    for (const rd1 of readings(kinds[0] ?? 'unstated')) {
      for (const rd2 of readings(kinds[1] ?? 'unstated')) {
        if (rd1.asSE !== rd2.asSE) continue; // both groups are printed the same way
        const labelled = rd1.labelled && rd2.labelled;
        for (const variant of ['student', 'welch'] as const) {
          let best: Attempt | undefined;
          for (const [n1, n2] of splits.pairs) {
            const m1 = box(g1.mean as NonNullable<GroupSummary['mean']>);
            const m2 = box(g2.mean as NonNullable<GroupSummary['mean']>);
            const s1 = sdBox(g1, n1, rd1.asSE);
            const s2 = sdBox(g2, n2, rd2.asSE);
            const absT = variant === 'student' ? studentAbsT(m1, s1, n1, m2, s2, n2) : welchAbsT(m1, s1, n1, m2, s2, n2);
            let fits = fitsT(absT);
            if (fits && variant === 'welch' && r.df && !isWholeDf(r.df)) {
              const dfRange = welchDfRange(s1, n1, s2, n2);
              const [dl, dh] = dfInterval(r.df);
              fits = dfRange.low <= dh && dfRange.high >= dl;
            }
            const attempt: Attempt = { variant, reading: rd1.reading, ns: [n1, n2], nSource: splits.source, absT, fits };
            if (!best || (fits && !best.fits) || (!best.fits && !fits && distanceBetween(absT, reportedAbsT.low, reportedAbsT.high) < distanceBetween(best.absT, reportedAbsT.low, reportedAbsT.high))) best = attempt;
            if (fits) break;
          }
          if (best) {
            attempts.push(best);
            if (best.fits && labelled) labelledFit = true;
            if (best.fits && !labelled) againstFit = true;
          }
        }
      }
    }
    if (splits.truncated) limits.push(`only ${MAX_SPLITS} splits of the total tried`);
    // one group with its n, the other named as a reference (published norms, a population), and a
    // one-sample df: the sample's mean may be tested against the reference's ("our sample (M =
    // 16.8, SD = 3.1, n = 40) was lower than the published reference (M = 21.5, SD = 7.0), t(39)")
    // (only a group named as a reference, and not where the design is said to be two independent groups)
    const sized = g2.asReference && g1.n ? g1 : g1.asReference && g2.n ? g2 : undefined;
    if (sized?.n && design !== 'independent' && r.df && isWholeDf(r.df) && r.df.value === sized.n.value - 1) {
      const reference = (sized === g1 ? g2 : g1) as GroupSummary;
      const n = sized.n.value;
      const mu0 = box(reference.mean as NonNullable<GroupSummary['mean']>);
      for (const rd of readings(kinds[sized === g1 ? 0 : 1] ?? 'unstated')) {
        const mean = box(sized.mean as NonNullable<GroupSummary['mean']>);
        // the difference from the reference over both means' rounding
        const absT = oneSampleAbsT([mean[0] - mu0[1], mean[1] - mu0[0]], sdBox(sized, n, rd.asSE), n);
        const fits = fitsT(absT);
        attempts.push({ variant: 'one-sample', reading: rd.reading, ns: [n], nSource: `n = ${sized.n.printed}, against the reference's mean as a test value`, absT, fits });
        if (fits && rd.labelled) labelledFit = true;
        if (fits && !rd.labelled) againstFit = true;
      }
    }
  } else return undefined;

  return { groups, design, reportedAbsT, attempts, fitsAsLabelled: labelledFit, fitsOnlyAgainstLabel: !labelledFit && againstFit, kinds, limits };
}

/**
 * The group sizes a Welch df in [dl, dh] allows: min(n1, n2) − 1 ≤ df ≤ n1 + n2 − 2 (Welch
 * 1947; Satterthwaite 1946), so the smaller group has at most ⌊dh⌋ + 1 units and both together
 * at least ⌈dl⌉ + 2. Undefined for a df too large to search (the smaller group is enumerated).
 */
export function welchWithinDf([dl, dh]: [number, number]): { maxSmaller: number; minTotal: number } | undefined {
  if (!(dh >= 1) || dh > 100_000) return undefined;
  return { maxSmaller: Math.floor(dh) + 1, minTotal: Math.max(4, Math.ceil(dl - 1e-9) + 2) };
}

/**
 * How two groups' spreads may be read, as SDs (false) or SEs (true): as labelled when both are
 * labelled alike, either way otherwise.
 */
export function spreadReadings(kinds: readonly string[]): boolean[] {
  return kinds.every((k) => k === 'SD') ? [false] : kinds.every((k) => k === 'SE') ? [true] : [false, true];
}


/**
 * The most df a result's own groups give, from the sizes printed with its descriptives (or a
 * per-group n): n − 1 for one group or pairs (the size printed with either of the two), n1 + n2
 * − 2 for two independent groups (the most Welch's df can be too). Undefined when a size it needs
 * is not printed.
 */
export function ownGroupsDf(result: LinkedResult): number | undefined {
  const perGroup = result.context.sampleSizes.find((s) => s.scope === 'per-group')?.n.value;
  const groups = result.context.descriptives?.groups ?? [];
  const ns = groups.map((g) => g.n?.value ?? perGroup).filter((n): n is number => n !== undefined);
  if (groups.length === 1) return ns.length === 1 ? (ns[0] as number) - 1 : undefined;
  if (groups.length !== 2 || ns.length === 0) return undefined;
  // pairs have one size: printed with either group, it is the number of pairs
  if (inferDesign(result) === 'paired') return Math.max(...ns) - 1;
  return ns.length === 2 ? (ns[0] as number) + (ns[1] as number) - 2 : undefined;
}

/**
 * The design used for recomputation: the linked one; where unknown, the df decides when the
 * group sizes are printed (n1 + n2 − 2 is independent, n − 1 paired).
 */
export function inferDesign(result: LinkedResult): Design {
  const d = result.context.design.value;
  if (d !== 'unknown') return d;
  const groups = result.context.descriptives?.groups ?? [];
  const df = result.report.df;
  if (groups.length === 2 && df && groups.every((g) => g.n)) {
    const [n1, n2] = groups.map((g) => g.n?.value as number) as [number, number];
    if (df.value === n1 + n2 - 2) return 'independent';
    if (n1 === n2 && df.value === n1 - 1) return 'paired';
  }
  return 'unknown';
}

/** Group sizes to try: printed ones; a per-group n; else every split of a total N (or of df + 2). */
function candidateSplits(result: LinkedResult, g1: GroupSummary, g2: GroupSummary): { pairs: Array<[number, number]>; source: string; truncated: boolean } {
  if (g1.n && g2.n) return { pairs: [[g1.n.value, g2.n.value]], source: `n = ${g1.n.printed} and ${g2.n.printed}`, truncated: false };
  const perGroup = result.context.sampleSizes.find((s) => s.scope === 'per-group');
  if (perGroup) return { pairs: [[perGroup.n.value, perGroup.n.value]], source: `${perGroup.n.printed} per group`, truncated: false };
  const df = result.report.df;
  // a total printed in the result's own sentence, else df + 2 (a total elsewhere in the
  // paragraph may be of another sample)
  const r = result.report;
  const total = result.context.sampleSizes.find((s) => s.scope === 'total' && s.segment === r.segment && s.sentence === r.sentence)?.n.value ?? (df && isWholeDf(df) ? df.value + 2 : undefined);
  if (!total || total < 4) return { pairs: [], source: '', truncated: false };
  const pairs: Array<[number, number]> = [];
  const half = Math.floor(total / 2);
  // balanced first, then outward, so the first fitting split found is the most balanced
  for (let k = 0; k <= half - 2 && pairs.length < MAX_SPLITS; k += 1) {
    pairs.push([half - k, total - half + k]);
    if (k > 0 || total % 2 === 1) pairs.push([total - half + k, half - k]);
  }
  const source = total !== (df && isWholeDf(df) ? df.value + 2 : undefined) ? `any split of N = ${total}` : `any split of df + 2 = ${total}`;
  return { pairs, source, truncated: pairs.length >= MAX_SPLITS };
}

/** "Student (n = 24 and 24): |t| 2.01 to 2.05" */
export function describeAttempt(a: Attempt): string {
  const name = a.variant === 'student' ? "Student's pooled t" : a.variant === 'welch' ? "Welch's t" : 'one-sample t';
  const reading = a.reading === 'as labelled' ? '' : `, ${a.reading}`;
  return `${name} (${a.nSource}${reading}): |t| ${showInterval(a.absT.low, a.absT.high)}`;
}
