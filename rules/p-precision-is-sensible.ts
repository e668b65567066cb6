import { checklistRule, type ChecklistEntry } from '../src/rule-api/index.js';

/** p is printed to two or three decimals: neither p = .04923 nor p = .0. */
export const pPrecisionIsSensible = checklistRule({
  id: 'p-precision-is-sensible',
  summary: 'Each exact p is printed to a sensible precision: two or three decimals (not p = .04923, not p = .0).',
  item: 'p is printed to a sensible precision',
  guidelines: { 'jars-quant': 'Table 1, Results, "Statistics and data analysis" (exact p values; the number of decimals follows the APA Publication Manual, 7th ed.)' },
  missingMessage: 'Reported {detail}.',
  check: 'Print p to two or three decimals (p < .001 for smaller values).',
  assess(document) {
    return document.results.map((result): ChecklistEntry => {
      const r = result.report;
      const base = { scope: 'result' as const, resultId: r.id, block: r.block };
      const p = r.p;
      if (!p?.number || p.op !== '=' || r.inCode) return { ...base, status: 'not-applicable', detail: r.inCode ? 'software output' : 'no exact p' };
      const { value, decimals, exponent } = p.number;
      if (exponent !== 0 || value === 0 || value >= 1) return { ...base, status: 'not-applicable', detail: p.printed };
      if (value >= 0.001 && decimals > 3) return { ...base, status: 'missing', span: p.span, detail: `${p.printed}, more decimals than a p value carries` };
      if (decimals < 2) return { ...base, status: 'missing', span: p.span, detail: `${p.printed}, too few decimals to tell what p was` };
      return { ...base, status: 'found', span: p.span, detail: p.printed };
    });
  },
});
