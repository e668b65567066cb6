import { evaluateP, fill, type Fix, type FixEdit, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  'p-printed-as-zero': 'Reported {reported}: a p value is never exactly 0; software prints .000 when p < .0005.',
};

/** A p printed as zero is written as the bound it stands for. */
export const zeroPIsABound: Rule = {
  id: 'zero-p-is-a-bound',
  summary: 'A p printed as zero (p = .000) is reported as a bound instead (p < .001).',
  kind: 'advice',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  fixes: { 'bound-for-zero': 'p = .000 → p < .001, with as many decimals as printed' },
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const result of document.results) {
      const p = result.report.p;
      if (p?.kind !== 'value' || !p.number || p.number.value !== 0 || p.op !== '=') continue;
      // `1e-400` is not zero (a double cannot hold it); `-0` is a negative p for values-are-possible
      if (p.number.beyondDouble || Object.is(p.number.value, -0)) continue;
      const bound = p.number.decimals > 0 ? `p < .${'0'.repeat(p.number.decimals - 1)}1` : 'p < .001';
      // a p that does not follow from its t and df is never tidied: the author has to look at the analysis
      const standing = evaluateP(result)?.standing;
      const fix = standing !== undefined && standing !== 'consistent' ? undefined : zeroPFix(p.span.start, p.number.span, p.number.printed, p.number.decimals, p.number.exponent);
      out.push({
        messageId: 'p-printed-as-zero',
        span: p.span,
        message: fill(messages['p-printed-as-zero'], { reported: p.printed }),
        reported: result.report.printed,
        figure: { kind: 'p' },
        check: `Write ${bound} (or the exact p).`,
        resultId: result.report.id,
        block: result.report.block,
        ...(fix ? { fix } : {}),
      });
    }
    return out;
  },
};

/**
 * Fix `bound-for-zero`: `p = .000` becomes `p < .001`, with as many decimals as were printed.
 * Software prints .000 for every p below .0005, so the bound says exactly what the printed zero
 * did: the p was below half a unit of the last digit, and so below one unit of it. Only a
 * plain decimal with at least one decimal is rewritten (`p = 0` says only p < .5, and a bound
 * of .001 would claim more than was printed).
 */
function zeroPFix(pStart: number, number: FixEdit['span'], printed: string, decimals: number, exponent: number): Fix | undefined {
  if (decimals < 1 || exponent !== 0 || !printed.endsWith('0')) return undefined;
  for (const c of printed) if (c !== '0' && c !== '.' && c !== ',') return undefined;
  return {
    id: 'bound-for-zero',
    title: `Write p < ${printed.slice(0, -1)}1`,
    edits: [
      // the sign between the p and its number: exactly one "=" there, else no fix
      { span: { start: pStart, end: number.start }, find: '=', text: '<' },
      { span: number, find: printed, text: `${printed.slice(0, -1)}1` },
    ],
  };
}
