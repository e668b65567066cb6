import { checklistRule, type ChecklistEntry } from '../src/rule-api/index.js';

/** The t statistic is given with its degrees of freedom. */
export const statisticHasDf = checklistRule({
  id: 'statistic-has-df',
  summary: 'The t statistic is given with its degrees of freedom.',
  item: 'The test statistic is given with its df',
  guidelines: { 'jars-quant': 'Table 1, Results, "Statistics and data analysis"' },
  missingMessage: 'Reported {detail} without its degrees of freedom, so p cannot be checked against t.',
  check: 'Add the df, e.g. t(28) = 2.10.',
  assess(document) {
    return document.results.map((result): ChecklistEntry => {
      const r = result.report;
      const base = { scope: 'result' as const, resultId: r.id, block: r.block };
      return r.df ? { ...base, status: 'found', span: r.df.span, detail: `df = ${r.df.printed}` } : { ...base, status: 'missing', span: r.span, detail: r.printed };
    });
  },
});
