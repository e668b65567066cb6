import { checklistRule, evaluateP, type ChecklistEntry, type Fix, type FixEdit } from '../src/rule-api/index.js';

/** p is printed to two or three decimals: neither p = .04923 nor p = .0. */
export const pPrecisionIsSensible = checklistRule({
  id: 'p-precision-is-sensible',
  summary: 'Each exact p is printed to a sensible precision: two or three decimals (not p = .04923, not p = .0).',
  item: 'p is printed to a sensible precision',
  guidelines: { 'jars-quant': 'Table 1, Results, "Statistics and data analysis" (exact p values; the number of decimals follows the APA Publication Manual, 7th ed.)' },
  missingMessage: 'Reported {detail}.',
  check: 'Print p to two or three decimals (p < .001 for smaller values).',
  fixes: { 'three-decimals': 'p = .02136 → p = .021, where no common threshold or the alpha lies between the two' },
  assess(document) {
    return document.results.map((result): ChecklistEntry => {
      const r = result.report;
      const base = { scope: 'result' as const, resultId: r.id, block: r.block };
      const p = r.p;
      if (!p?.number || p.op !== '=' || r.inCode) return { ...base, status: 'not-applicable', detail: r.inCode ? 'software output' : 'no exact p' };
      const { value, decimals, exponent } = p.number;
      if (exponent !== 0 || value === 0 || value >= 1) return { ...base, status: 'not-applicable', detail: p.printed };
      if (value >= 0.001 && decimals > 3) {
        // a p that does not follow from its t and df is never tidied: the author has to look at the analysis
        const standing = evaluateP(result)?.standing;
        const fix = standing !== undefined && standing !== 'consistent' ? undefined : threeDecimalsFix(p.number.span, p.number.printed, value, result.alpha.value);
        return { ...base, status: 'missing', span: p.span, detail: `${p.printed}, more decimals than a p value carries`, ...(fix ? { fix } : {}) };
      }
      if (decimals < 2) return { ...base, status: 'missing', span: p.span, detail: `${p.printed}, too few decimals to tell what p was` };
      return { ...base, status: 'found', span: p.span, detail: p.printed };
    });
  },
});

/** Thresholds a reader may compare a p with: the result's alpha and the common ones (common practice, no source). */
const COMMON_ALPHAS = [0.1, 0.05, 0.01, 0.005, 0.001];

/**
 * Fix `three-decimals`: an exact p printed with more than three decimals (p = .04923) is
 * rounded half up to three (p = .049). Offered only when no threshold a reader may compare it
 * with (the result's alpha, .10, .05, .01, .005, .001) lies between the printed p and the
 * rounded one or equals the rounded one, so the significance call cannot change; the rounded
 * p's rounding interval holds the printed one, so every check of p against t stays as it was
 * or gets looser, never stricter.
 */
function threeDecimalsFix(span: FixEdit['span'], printed: string, value: number, alpha: number): Fix | undefined {
  const point = printed.indexOf('.');
  if (point < 0) return undefined; // a decimal comma or a form not read here: no fix
  const whole = printed.slice(0, point);
  if (whole !== '' && whole !== '0') return undefined;
  const fraction = printed.slice(point + 1);
  for (const c of fraction) if (c < '0' || c > '9') return undefined;
  const thousandths = Number(fraction.slice(0, 3)) + ((fraction[3] ?? '0') >= '5' ? 1 : 0);
  if (thousandths >= 1000 || thousandths < 1) return undefined;
  const rounded = thousandths / 1000;
  for (const a of [alpha, ...COMMON_ALPHAS]) {
    if (Math.abs(rounded - a) < 1e-12) return undefined;
    if (value < a !== rounded < a) return undefined;
  }
  const text = `${whole}.${String(thousandths).padStart(3, '0')}`;
  return { id: 'three-decimals', title: `Write p = ${text}`, edits: [{ span, find: printed, text }] };
}
