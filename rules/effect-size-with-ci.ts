import { checklistRule, groupBy, resultEntries, statisticBase, type ChecklistEntry, type LinkedDocument, type LinkedStatistic, type Span } from '../src/rule-api/index.js';

const key = (segment: number, sentence: number) => `${segment}:${sentence}`;

/** An effect size as read: its place and text. */
interface Effect {
  span: Span;
  printed: string;
}

/**
 * The effect sizes and intervals printed in each sentence, for F and χ² results: what an F or a
 * χ² owns is not linked beyond its η², but an absence from the whole sentence is certain.
 * F: η², ω², ε², R², d, g. χ²: Cramér's V, an odds, risk or hazard ratio, d, g.
 */
function sentenceReadings(document: LinkedDocument) {
  const x = document.extraction;
  const forF = groupBy(
    [
      ...x.otherStatistics.filter((o) => o.kind === 'eta-squared' || o.kind === 'r-squared'),
      ...x.effectSizes,
    ],
    (e) => key(e.segment, e.sentence),
  );
  const forChi = groupBy(
    [
      ...x.otherStatistics.filter((o) => o.kind === 'ratio' || o.kind === 'association' || (o.kind === 'rank-or-other' && /^V\b/u.test(o.printed))),
      ...x.effectSizes,
    ],
    (e) => key(e.segment, e.sentence),
  );
  const intervals = groupBy(x.intervals, (i) => key(i.segment, i.sentence));
  return { forF, forChi, intervals };
}

/** Each result gives an effect size and a confidence interval (CONSORT 17a). */
export const effectSizeWithCi = checklistRule({
  id: 'effect-size-with-ci',
  summary: 'Each result gives an effect size (a difference or a standardised d; η² and the like for an F, V or a ratio for a χ²) with its confidence interval.',
  item: 'An effect size with its confidence interval is given',
  guidelines: { sampl: 'section "Reporting hypothesis tests"', 'jars-quant': 'Table 1, Results, "Statistics and data analysis"', consort: 'item 17a' },
  missingMessage: 'Reported {detail}.',
  check: 'Give the estimated difference (or d; η² or ω² for an F, V or an odds ratio for a χ²) with its 95% CI beside the test.',
  assess(document) {
    let readings: ReturnType<typeof sentenceReadings> | undefined;
    const forStatistic = (linked: LinkedStatistic): ChecklistEntry | undefined => {
      const s = linked.report;
      // an r is itself the effect size and a z's depends on its test: the item speaks of F and χ²
      if (s.kind !== 'F' && s.kind !== 'chi-square') return undefined;
      readings ??= sentenceReadings(document);
      const k = key(s.segment, s.sentence);
      const own: Effect | undefined = s.etaSquared ?? s.association;
      const effect: Effect | undefined = own ?? (s.kind === 'F' ? readings.forF : readings.forChi).get(k)?.[0];
      const interval = readings.intervals.get(k)?.[0];
      const base = statisticBase(linked);
      const printed = s.reportPrinted ?? s.printed;
      if (effect && interval) return { ...base, status: 'found', span: interval.span, detail: `${effect.printed}, ${interval.printed}` };
      if (effect) return { ...base, status: 'missing', span: s.reportSpan ?? s.span, detail: `${printed} with ${effect.printed} but without a confidence interval` };
      // φ, V and odds ratios are read, but not every effect size a χ² may carry (w, a risk
      // difference in words): a χ² whose sentence shows none of them is left undecided
      if (s.kind === 'chi-square') return { ...base, status: 'not-applicable', detail: 'no effect size read beside the χ² (φ, V and odds ratios are read; others are not)' };
      return { ...base, status: 'missing', span: s.reportSpan ?? s.span, detail: `${printed} without an effect size${interval ? '' : ' or a confidence interval'}` };
    };
    return resultEntries(
      document,
      (result): ChecklistEntry => {
        const r = result.report;
        const c = result.context;
        const base = { scope: 'result' as const, resultId: r.id, block: r.block };
        const effect = (c.effectSizes[0] ?? c.estimate)?.item;
        const interval = (c.interval ?? c.intervals[0])?.item;
        if (interval && (effect || c.descriptives)) return { ...base, status: 'found', span: interval.span, detail: `${effect ? `${effect.printed}, ` : ''}${interval.printed}` };
        const missing = interval ? 'an effect size' : effect ? 'a confidence interval' : 'an effect size or a confidence interval';
        return { ...base, status: 'missing', span: r.span, detail: `${r.printed} without ${missing}` };
      },
      forStatistic,
    );
  },
});
