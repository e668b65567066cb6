import { fill, inferDesign, linkDoubts, standardiserDoubt, withDoubt, spreadReadings, numberInterval, showInterval, tInterval, type EffectSizeReport, type GroupSummary, type LinkedResult, type Rule, type RuleFinding, NO_OPTIONS, isWholeDf } from '../src/rule-api/index.js';
import { dAverage, dFromMeansPooled, dFromTIndependent, dRepeatedMeasures, dzFromT, hedgesCorrection, studentAbsT, type Box, type Interval } from '../src/stats/index.js';

const messages = {
  mismatch: 'Reported {effect}. Recomputed: {tried}. None of these definitions gives the reported value within rounding.',
  'fits-only-paired': 'Reported {effect}. As two independent groups it would be {independent}; only a paired design gives it ({paired}), and the text does not say the design is paired.',
};

interface Candidate {
  name: string;
  range: Interval;
  /** The design the definition assumes, where it assumes one. */
  family?: 'paired' | 'independent';
}

/** A reported Cohen's d (or Hedges' g) follows from t and the group sizes, or from the means and SDs. */
export const effectSizeFollows: Rule = {
  id: 'effect-size-follows',
  summary: "A reported Cohen's d or Hedges' g follows from t and the group sizes, or from the means and SDs, under one of the common definitions.",
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const result of document.results) {
      const r = result.report;
      if (!r.df || r.tOp !== '=') continue;
      for (const es of result.context.effectSizes) {
        const finding = checkOne(result, es.item);
        if (!finding) continue;
        const doubts = [...linkDoubts({ descriptives: result.context.descriptives, linked: [es] }), ...(finding.uncertain ?? [])];
        // a d standardised by an SD the text names but does not print here cannot be recomputed
        out.push(withDoubt({ ...finding, ...(doubts.length > 0 ? { uncertain: doubts } : {}) }, standardiserDoubt(result)));
      }
    }
    return out;
  },
};

/**
 * Every common definition the printed numbers allow for this effect size; a finding when none
 * gives it (with `uncertain` when a definition the text allows could not be computed).
 */
function checkOne(result: LinkedResult, es: EffectSizeReport): RuleFinding | undefined {
  const r = result.report;
  const df = r.df?.value as number;
  const [tl, th] = tInterval(r);
  const absT: Box = [tl <= 0 && th >= 0 ? 0 : Math.min(Math.abs(tl), Math.abs(th)), Math.max(Math.abs(tl), Math.abs(th))];
  const design = inferDesign(result);
  const groups = result.context.descriptives?.groups ?? [];
  const kinds = result.context.descriptives?.spreadKinds ?? [];
  const perGroup = result.context.sampleSizes.find((s) => s.scope === 'per-group')?.n.value;
  const printedPair = result.context.groupSizes?.map((n) => n.value);
  const ns = groups.length === 2 ? groups.map((g, i) => g.n?.value ?? perGroup ?? printedPair?.[i]) : (printedPair ?? []);
  const welch = !isWholeDf(r.df as NonNullable<typeof r.df>);
  const candidates: Candidate[] = [];
  /** Definitions the text allows that the printed numbers cannot compute (the finding is then a note). */
  const open: string[] = [];
  const mayBePaired = design === 'paired' || design === 'unknown';
  const mayBeIndependent = design === 'independent' || design === 'unknown';

  // From t.
  if (design === 'one-sample' || (mayBePaired && !welch)) candidates.push({ name: 'd_z = t/√n (paired or one-sample, n = df + 1)', range: dzFromT(absT, df + 1), ...(design === 'unknown' ? { family: 'paired' as const } : {}) });
  if (mayBeIndependent) {
    if (ns.length === 2 && ns.every((n) => n !== undefined)) {
      const [n1, n2] = ns as [number, number];
      if (welch && !(groups.length === 2 && groups.every((g) => g.spread))) {
        // Welch's t divides by √(s1²/n1 + s2²/n2), the pooled-SD d by s_p: their ratio depends
        // on the variance ratio, and runs between its two limits (one variance dominating).
        // With the SDs printed, d comes from the means and SDs below instead.
        const limit = (v: number) => Math.sqrt(((v / n1 + (1 - v) / n2) * (n1 + n2 - 2)) / ((n1 - 1) * v + (n2 - 1) * (1 - v)));
        const [lo, hi] = [limit(0), limit(1)].sort((a, b) => a - b) as [number, number];
        candidates.push({ name: `pooled-SD d from Welch's t (n = ${n1} and ${n2}, any variance ratio)`, range: { low: absT[0] * lo, high: absT[1] * hi }, family: 'independent' });
      } else if (!welch) candidates.push({ name: `d = t√(1/n1 + 1/n2) (n = ${n1} and ${n2})`, range: dFromTIndependent(absT, n1, n2), family: 'independent' });
    } else if (welch) {
      // Welch's t with the group sizes unknown bounds no pooled-SD d: only the common shortcut
      // below can be tried, so a d it does not give is only a note.
      open.push("with Welch's t and the group sizes not printed, the pooled-SD d cannot be recomputed from t");
    } else {
      const total = Math.round(df) + 2;
      const fitting = splitsGivingT(groups, kinds, absT, total);
      if (fitting) {
        // the means and SDs printed with the test say which splits of the total it can have
        const range = fitting.reduce<Interval>((acc, [a, b]) => {
          const d = dFromTIndependent(absT, a, b);
          return { low: Math.min(acc.low, d.low), high: Math.max(acc.high, d.high) };
        }, { low: Infinity, high: 0 });
        const sizes = fitting.map(([a]) => a);
        candidates.push({ name: `d = t√(1/n1 + 1/n2) (the splits of ${total} with which the printed means and SDs give t: n1 ${Math.min(...sizes)} to ${Math.max(...sizes)})`, range, family: 'independent' });
      } else {
        const smallest = dFromTIndependent(absT, total / 2, total / 2);
        const largest = total >= 4 ? dFromTIndependent(absT, 2, total - 2) : smallest;
        candidates.push({ name: `d = t√(1/n1 + 1/n2) (any split of ${total})`, range: { low: smallest.low, high: largest.high }, family: 'independent' });
      }
    }
    candidates.push({ name: 'd = 2t/√df', range: { low: (2 * absT[0]) / Math.sqrt(df), high: (2 * absT[1]) / Math.sqrt(df) }, family: 'independent' });
  }
  // From the means and SDs. Spreads read as labelled: SDs as they are, SEs as SD = SE·√n, unstated ones both ways.
  if (groups.length === 2 && groups.every((g) => g.mean && g.spread)) {
    const [g1, g2] = groups as [GroupSummary, GroupSummary];
    const m1 = numberInterval(g1.mean!);
    const m2 = numberInterval(g2.mean!);
    const paired = design === 'paired' && !welch;
    const n1 = ns[0] ?? (paired ? df + 1 : undefined);
    const n2 = ns[1] ?? (paired ? df + 1 : undefined);
    for (const asSE of spreadReadings(kinds)) {
      const s1 = sdBox(g1, n1, asSE);
      const s2 = sdBox(g2, n2, asSE);
      if (!s1 || !s2) {
        open.push('the spreads may be SEs, and without the group sizes their SDs cannot be recovered');
        continue;
      }
      const how = asSE ? ' (spreads read as SEs, SD = SE·√n)' : '';
      candidates.push({ name: `d = (M1 − M2)/pooled SD${how}`, range: dFromMeansPooled(m1, s1, n1 ?? (df + 2) / 2, m2, s2, n2 ?? (df + 2) / 2) });
      candidates.push({ name: `d_av = (M1 − M2)/mean of the SDs${how}`, range: dAverage(m1, s1, m2, s2) });
      candidates.push({ name: `Glass's Δ (either group's SD)${how}`, range: glass(m1, m2, s1, s2) });
      if (mayBePaired && !welch) {
        const rm = dRepeatedMeasures(m1, s1, m2, s2, df + 1, absT);
        if (Number.isFinite(rm.low)) candidates.push({ name: `d_rm = d_z·√(2(1 − r)), r implied by the means, SDs and t${how}`, range: rm, family: 'paired' });
      }
    }
  } else if (mayBePaired && !welch) {
    // Without the means and SDs, d_av, d_rm and the pooled-SD d of a paired design cannot be
    // computed, but each is at most 2·d_z: SD_diff ≤ SD1 + SD2 (common practice, no source).
    const dz = dzFromT(absT, df + 1);
    candidates.push({ name: 'd_av, d_rm or pooled-SD d of a paired design (at most 2·d_z, as SD_diff ≤ SD1 + SD2)', range: { low: 0, high: 2 * dz.high }, family: 'paired' });
  }
  const single = groups.length === 1 ? groups[0] : undefined;
  if (single?.mean && single.spread) {
    const m = numberInterval(single.mean);
    const mu = result.context.reference?.value.value ?? 0;
    const diff = [Math.abs(m[0] - mu), Math.abs(m[1] - mu)].sort((a, b) => a - b) as Box;
    for (const asSE of spreadReadings(kinds)) {
      const s = sdBox(single, single.n?.value ?? df + 1, asSE) as Box;
      candidates.push({ name: `d = (M − μ0)/SD${asSE ? ' (spread read as an SE, SD = SE·√n)' : ''}`, range: { low: diff[0] / s[1], high: diff[1] / s[0] } });
    }
  }
  const named = es.kind === 'dz' ? candidates.filter((c) => c.name.startsWith('d_z')) : es.kind === 'dav' ? candidates.filter((c) => c.name.startsWith('d_av')) : candidates;
  // Hedges' g for each (J from the df; also the common approximation 1 − 3/(4df − 1)).
  const j = hedgesCorrection(df);
  const jApprox = 1 - 3 / (4 * df - 1);
  const all = [...named];
  for (const c of named) {
    if (Number.isFinite(j)) all.push({ name: `Hedges' g from ${c.name}`, range: { low: c.range.low * Math.min(j, jApprox), high: c.range.high * Math.max(j, jApprox) }, ...(c.family ? { family: c.family } : {}) });
  }
  if (all.length === 0) return undefined;
  const [vl, vh] = numberInterval(es.value);
  const reported: Box = [Math.min(Math.abs(vl), Math.abs(vh)), Math.max(Math.abs(vl), Math.abs(vh))];
  if (vl <= 0 && vh >= 0) reported[0] = 0;
  const fits = (c: Candidate) => c.range.low <= reported[1] && c.range.high >= reported[0];
  if (all.some(fits)) {
    // Design not stated, and every definition that gives d assumes paired data while those
    // for two independent groups do not: a note asks which design it was.
    const independent = named.filter((c) => c.family === 'independent');
    if (design !== 'unknown' || independent.length === 0 || !all.filter(fits).every((c) => c.family === 'paired')) return undefined;
    // one name per definition: its Hedges' g twin says nothing more
    const paired = [...new Set(all.filter(fits).map((c) => c.name.replace(/^Hedges' g from /, '')))];
    return {
      messageId: 'fits-only-paired',
      span: es.span,
      message: fill(messages['fits-only-paired'], { effect: es.printed, independent: independent.map((c) => `${c.name}: ${showInterval(c.range.low, c.range.high)}`).join('; '), paired: paired.join('; ') }),
      reported: es.printed,
      recomputed: { quantity: '|d| for two independent groups', low: Math.min(...independent.map((c) => c.range.low)), high: Math.max(...independent.map((c) => c.range.high)), inputs: [r.printed, ...groups.map((g) => g.printed)], assumptions: independent.map((c) => c.name) },
      check: 'Say whether the groups were independent or the same units measured twice, and which d was computed; if the groups were independent, recompute d.',
      related: [{ span: r.span, message: 'the test it belongs to' }],
      resultId: r.id,
      block: r.block,
      uncertain: ['the text does not state the design, and only a paired design gives this d'],
    };
  }
  return {
    messageId: 'mismatch',
    span: es.span,
    message: fill(messages.mismatch, { effect: es.printed, tried: named.map((c) => `${c.name}: ${showInterval(c.range.low, c.range.high)}`).join('; ') }),
    reported: es.printed,
    recomputed: { quantity: '|d| under the common definitions', low: Math.min(...all.map((c) => c.range.low)), high: Math.max(...all.map((c) => c.range.high)), inputs: [r.printed, ...groups.map((g) => g.printed)], assumptions: all.map((c) => c.name) },
    check: 'Check which definition of d was used and recompute it from the output; say which one in the text.',
    related: [{ span: r.span, message: 'the test it belongs to' }],
    resultId: r.id,
    block: r.block,
    ...(open.length > 0 ? { uncertain: open } : {}),
  };
}

/** A group's SD box: the printed spread, or SE·√n when it is read as an SE (undefined without n). */
function sdBox(g: GroupSummary, n: number | undefined, asSE: boolean): Box | undefined {
  const b = numberInterval(g.spread!.number);
  if (!asSE) return b;
  return n === undefined ? undefined : [b[0] * Math.sqrt(n), b[1] * Math.sqrt(n)];
}

/**
 * The splits (n1, n2) of a total with which two groups' printed means and SDs give the reported
 * Student's |t| within rounding, spreads read as labelled (unstated ones both ways). Undefined
 * when the groups lack means or SDs, the total is too large to search, or no split gives t
 * (then t and the descriptives disagree, which t-follows-from-descriptives reports, and every
 * split stays possible for d).
 */
function splitsGivingT(groups: readonly GroupSummary[], kinds: readonly string[], absT: Box, total: number): Array<[number, number]> | undefined {
  if (groups.length !== 2 || !groups.every((g) => g.mean && g.spread) || total < 4 || total > 20_000) return undefined;
  const [g1, g2] = groups as [GroupSummary, GroupSummary];
  const m1 = numberInterval(g1.mean!);
  const m2 = numberInterval(g2.mean!);
  const ses = spreadReadings(kinds);
  const out: Array<[number, number]> = [];
  for (let a = 2; a <= total - 2; a += 1) {
    const b = total - a;
    const gives = ses.some((asSE) => {
      const t = studentAbsT(m1, sdBox(g1, a, asSE) as Box, a, m2, sdBox(g2, b, asSE) as Box, b);
      return t.low <= absT[1] && t.high >= absT[0];
    });
    if (gives) out.push([a, b]);
  }
  return out.length > 0 ? out : undefined;
}

function glass(m1: Box, m2: Box, s1: Box, s2: Box): Interval {
  const lo = m1[0] - m2[1];
  const hi = m1[1] - m2[0];
  const dLow = lo <= 0 && hi >= 0 ? 0 : Math.min(Math.abs(lo), Math.abs(hi));
  const dHigh = Math.max(Math.abs(lo), Math.abs(hi));
  return { low: dLow / Math.max(s1[1], s2[1]), high: dHigh / Math.max(Math.min(s1[0], s2[0]), Number.MIN_VALUE) };
}
