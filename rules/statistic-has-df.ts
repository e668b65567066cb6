import { checklistRule, resultEntries, statisticBase, type ChecklistEntry } from '../src/rule-api/index.js';

/**
 * The t, F, χ² or r statistic is given with its degrees of freedom (an r's n gives them too);
 * a z has none.
 */
export const statisticHasDf = checklistRule({
  id: 'statistic-has-df',
  summary: 'The t, F, χ² or r statistic is given with its degrees of freedom.',
  item: 'The test statistic is given with its df',
  guidelines: { 'jars-quant': 'Table 1, Results, "Statistics and data analysis"' },
  missingMessage: 'Reported {detail}, so p cannot be checked against the statistic.',
  check: 'Add the df, e.g. t(28) = 2.10, F(2, 57) = 4.31, χ²(1, N = 90) = 5.20 or r(48) = .32.',
  assess(document) {
    return resultEntries(
      document,
      (result): ChecklistEntry => {
        const r = result.report;
        const base = { scope: 'result' as const, resultId: r.id, block: r.block };
        return r.df
          ? { ...base, status: 'found', span: r.df.span, detail: `df = ${r.df.printed}` }
          : { ...base, status: 'missing', span: r.span, detail: `${r.printed} without its degrees of freedom` };
      },
      (linked): ChecklistEntry => {
        const s = linked.report;
        const base = statisticBase(linked);
        const printed = s.reportPrinted ?? s.printed;
        const span = s.reportSpan ?? s.span;
        const [first, second] = s.dfs ?? [];
        switch (s.kind) {
          case 'F':
            if (first && second) return { ...base, status: 'found', span: { start: first.span.start, end: second.span.end }, detail: `df = ${first.printed}, ${second.printed}` };
            return { ...base, status: 'missing', span, detail: `${printed} without its two degrees of freedom` };
          case 'chi-square':
            if (first) return { ...base, status: 'found', span: first.span, detail: `df = ${first.printed}` };
            return { ...base, status: 'missing', span, detail: `${printed} without its degrees of freedom` };
          case 'correlation':
            if (first) return { ...base, status: 'found', span: first.span, detail: `df = ${first.printed}` };
            // df = n − 2: the sample size printed in the r's clause gives them
            if (s.n) return { ...base, status: 'found', span: s.n.span, detail: `n = ${s.n.printed} (df = n − 2)` };
            return { ...base, status: 'missing', span, detail: `${printed} without its degrees of freedom or n` };
          case 'z':
            return { ...base, status: 'not-applicable', detail: 'z has no degrees of freedom' };
        }
      },
    );
  },
});
