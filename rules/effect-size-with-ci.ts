import { checklistRule, type ChecklistEntry } from '../src/rule-api/index.js';

/** Each result gives an effect size and a confidence interval (CONSORT 17a). */
export const effectSizeWithCi = checklistRule({
  id: 'effect-size-with-ci',
  summary: 'Each result gives an effect size (a difference or a standardised d) with its confidence interval.',
  item: 'An effect size with its confidence interval is given',
  guidelines: { sampl: 'section "Reporting hypothesis tests"', 'jars-quant': 'Table 1, Results, "Statistics and data analysis"', consort: 'item 17a' },
  missingMessage: 'Reported {detail}.',
  check: 'Give the estimated difference (or d) with its 95% CI beside the test.',
  assess(document) {
    return document.results.map((result): ChecklistEntry => {
      const r = result.report;
      const c = result.context;
      const base = { scope: 'result' as const, resultId: r.id, block: r.block };
      const effect = (c.effectSizes[0] ?? c.estimate)?.item;
      const interval = (c.interval ?? c.intervals[0])?.item;
      if (interval && (effect || c.descriptives)) return { ...base, status: 'found', span: interval.span, detail: `${effect ? `${effect.printed}, ` : ''}${interval.printed}` };
      const missing = interval ? 'an effect size' : effect ? 'a confidence interval' : 'an effect size or a confidence interval';
      return { ...base, status: 'missing', span: r.span, detail: `${r.printed} without ${missing}` };
    });
  },
});
