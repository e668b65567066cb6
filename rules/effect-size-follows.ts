import { fill, inferDesign, numberInterval, showInterval, tInterval, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';
import { dAverage, dFromMeansPooled, dFromTIndependent, dzFromT, hedgesCorrection, type Box, type Interval } from '../src/stats/index.js';

const messages = {
  mismatch: 'Reported {effect}. Recomputed: {tried}. None of these definitions gives the reported value within rounding.',
};

interface Candidate {
  name: string;
  range: Interval;
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
      const es = result.context.effectSizes[0];
      if (!es || !r.df || r.tOp !== '=') continue;
      const [tl, th] = tInterval(r);
      const absT: Box = [tl <= 0 && th >= 0 ? 0 : Math.min(Math.abs(tl), Math.abs(th)), Math.max(Math.abs(tl), Math.abs(th))];
      const df = r.df.value;
      const design = inferDesign(result);
      const groups = result.context.descriptives?.groups ?? [];
      const perGroup = result.context.sampleSizes.find((s) => s.scope === 'per-group')?.n.value;
      const ns = groups.map((g) => g.n?.value ?? perGroup);
      const candidates: Candidate[] = [];
      // From t.
      if (design !== 'independent') candidates.push({ name: 'd_z = t/√n (paired or one-sample, n = df + 1)', range: dzFromT(absT, df + 1) });
      if (design !== 'paired' && design !== 'one-sample') {
        if (ns.length === 2 && ns.every((n) => n !== undefined)) candidates.push({ name: `d = t√(1/n1 + 1/n2) (n = ${ns.join(' and ')})`, range: dFromTIndependent(absT, ns[0] as number, ns[1] as number) });
        else {
          // sizes unknown: every split of df + 2 (balanced gives the smallest d), and 2t/√df
          const total = Math.round(df) + 2;
          const smallest = dFromTIndependent(absT, total / 2, total / 2);
          const largest = total >= 4 ? dFromTIndependent(absT, 2, total - 2) : smallest;
          candidates.push({ name: `d = t√(1/n1 + 1/n2) (any split of ${total})`, range: { low: smallest.low, high: largest.high } });
          candidates.push({ name: 'd = 2t/√df', range: { low: (2 * absT[0]) / Math.sqrt(df), high: (2 * absT[1]) / Math.sqrt(df) } });
        }
      }
      // From the means and SDs.
      if (groups.length === 2 && groups.every((g) => g.mean && g.spread) && result.context.descriptives?.spreadKinds.every((k) => k !== 'SE')) {
        const [g1, g2] = groups as [NonNullable<(typeof groups)[0]>, NonNullable<(typeof groups)[0]>];
        const m1 = numberInterval(g1.mean!);
        const m2 = numberInterval(g2.mean!);
        const s1 = numberInterval(g1.spread!.number);
        const s2 = numberInterval(g2.spread!.number);
        const n1 = ns[0] ?? (df + 2) / 2;
        const n2 = ns[1] ?? (df + 2) / 2;
        candidates.push({ name: 'd = (M1 − M2)/pooled SD', range: dFromMeansPooled(m1, s1, n1, m2, s2, n2) });
        candidates.push({ name: 'd_av = (M1 − M2)/mean of the SDs', range: dAverage(m1, s1, m2, s2) });
        candidates.push({ name: "Glass's Δ (either group's SD)", range: glass(m1, m2, s1, s2) });
      }
      if (groups.length === 1 && groups[0]?.mean && groups[0].spread && result.context.descriptives?.spreadKinds[0] !== 'SE') {
        const m = numberInterval(groups[0].mean);
        const s = numberInterval(groups[0].spread.number);
        const mu = result.context.reference?.value.value ?? 0;
        const diff: Box = [Math.abs(m[0] - mu), Math.abs(m[1] - mu)].sort((a, b) => a - b) as Box;
        candidates.push({ name: 'd = (M − μ0)/SD', range: { low: diff[0] / s[1], high: diff[1] / s[0] } });
      }
      // Hedges' g for each (J from the df; also the common approximation 1 − 3/(4df − 1)).
      const j = hedgesCorrection(df);
      const jApprox = 1 - 3 / (4 * df - 1);
      const all = [...candidates];
      for (const c of candidates) {
        if (Number.isFinite(j)) all.push({ name: `Hedges' g from ${c.name}`, range: { low: c.range.low * Math.min(j, jApprox), high: c.range.high * Math.max(j, jApprox) } });
      }
      const [vl, vh] = numberInterval(es.value);
      const reported: Box = [Math.min(Math.abs(vl), Math.abs(vh)), Math.max(Math.abs(vl), Math.abs(vh))];
      if (vl <= 0 && vh >= 0) reported[0] = 0;
      const fits = all.some((c) => c.range.low <= reported[1] && c.range.high >= reported[0]);
      if (fits || all.length === 0) continue;
      out.push({
        messageId: 'mismatch',
        span: es.span,
        message: fill(messages.mismatch, { effect: es.printed, tried: candidates.map((c) => `${c.name}: ${showInterval(c.range.low, c.range.high)}`).join('; ') }),
        reported: es.printed,
        recomputed: { quantity: '|d| under the common definitions', low: Math.min(...all.map((c) => c.range.low)), high: Math.max(...all.map((c) => c.range.high)), inputs: [r.printed, ...groups.map((g) => g.printed)], assumptions: all.map((c) => c.name) },
        check: 'Check which definition of d was used and recompute it from the output; say which one in the text.',
        related: [{ span: r.span, message: 'the test it belongs to' }],
        resultId: r.id,
        block: r.block,
      });
    }
    return out;
  },
};

function glass(m1: Box, m2: Box, s1: Box, s2: Box): Interval {
  const lo = m1[0] - m2[1];
  const hi = m1[1] - m2[0];
  const dLow = lo <= 0 && hi >= 0 ? 0 : Math.min(Math.abs(lo), Math.abs(hi));
  const dHigh = Math.max(Math.abs(lo), Math.abs(hi));
  return { low: dLow / Math.max(s1[1], s2[1]), high: dHigh / Math.max(Math.min(s1[0], s2[0]), Number.MIN_VALUE) };
}
