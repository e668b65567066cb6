import { checklistRule, resultEntries, statisticBase, statisticName, type ChecklistEntry, type ReportedP } from '../src/rule-api/index.js';

/** Found for `p = x` and for bounds at or below .001; missing for larger bounds and n.s. */
function exactness(p: ReportedP): Pick<ChecklistEntry, 'status' | 'span' | 'detail'> {
  if (p.kind === 'ns') return { status: 'missing', span: p.span, detail: `"${p.printed}"` };
  const v = p.number?.value ?? NaN;
  if (p.op === '=' || p.op === '~') return { status: 'found', span: p.span, detail: p.printed };
  if ((p.op === '<' || p.op === '<=') && v <= 0.001) return { status: 'found', span: p.span, detail: p.printed };
  return { status: 'missing', span: p.span, detail: p.printed };
}

/** Each p, of a t-test or of an F, χ², r or z, is given exactly (p < .001 allowed), not as p < .05 or n.s. */
export const pIsExact = checklistRule({
  id: 'p-is-exact',
  summary: 'Each p is given as an exact value (p < .001 is fine), not as a bound such as p < .05 or as n.s.',
  item: 'An exact p is given (p < .001 allowed)',
  guidelines: { sampl: 'section "Reporting hypothesis tests"', 'jars-quant': 'Table 1, Results, "Statistics and data analysis"' },
  missingMessage: 'Reported {detail}; give the exact p (or p < .001).',
  check: 'Replace the bound or "n.s." with the exact p value from the output.',
  assess(document) {
    return resultEntries(
      document,
      (result): ChecklistEntry => {
        const r = result.report;
        const base = { scope: 'result' as const, resultId: r.id, block: r.block };
        const p = r.p;
        if (!p) return { ...base, status: 'not-applicable', detail: 'no p reported (see result-is-complete)' };
        if (r.plural) return { ...base, status: 'not-applicable', detail: 'several tests summarised by one bound' };
        return { ...base, ...exactness(p) };
      },
      (linked): ChecklistEntry => {
        const p = linked.report.p;
        if (!p) return { ...statisticBase(linked), status: 'not-applicable', detail: `no p read with ${statisticName(linked.report.kind)}` };
        return { ...statisticBase(linked), ...exactness(p) };
      },
    );
  },
});
