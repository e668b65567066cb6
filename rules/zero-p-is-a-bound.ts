import { fill, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';

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
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const result of document.results) {
      const p = result.report.p;
      if (p?.kind !== 'value' || !p.number || p.number.value !== 0 || p.op !== '=') continue;
      // `1e-400` is not zero (a double cannot hold it); `-0` is a negative p for values-are-possible
      if (p.number.beyondDouble || Object.is(p.number.value, -0)) continue;
      const bound = p.number.decimals > 0 ? `p < .${'0'.repeat(p.number.decimals - 1)}1` : 'p < .001';
      out.push({
        messageId: 'p-printed-as-zero',
        span: p.span,
        message: fill(messages['p-printed-as-zero'], { reported: p.printed }),
        reported: result.report.printed,
        figure: { kind: 'p' },
        check: `Write ${bound} (or the exact p).`,
        resultId: result.report.id,
        block: result.report.block,
      });
    }
    return out;
  },
};
