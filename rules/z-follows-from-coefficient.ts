import { fill, linkDoubts, numberInterval, showBound, showInterval, showNumber, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';
import { quotientRange } from '../src/stats/index.js';

const messages = {
  mismatch:
    'Reported {reported} with {coefficient} and SE = {se}. Recomputed z = b / SE from {inputs}: {range}. Gap {gap}. No coefficient and SE within their rounding give the printed z (either sign accepted).',
};

/** A z printed right after a regression coefficient and its SE equals the coefficient over its SE, within rounding. */
export const zFollowsFromCoefficient: Rule = {
  id: 'z-follows-from-coefficient',
  summary: 'A z printed with a regression coefficient and its SE equals b / SE, within rounding.',
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const linked of document.statistics) {
      const s = linked.report;
      const link = linked.coefficient;
      if (s.kind !== 'z' || !link || !s.value || (s.op !== undefined && s.op !== '=') || !Number.isFinite(s.value.value)) continue;
      const { value: b, se } = link.item;
      if (!Number.isFinite(b.value) || !Number.isFinite(se.value)) continue;
      const [b0, b1] = numberInterval(b);
      const [s0, s1] = numberInterval(se);
      // an SE printed as 0.00 allows any z: nothing to check
      if (!(s0 > 0)) continue;
      const range = quotientRange(b0, b1, s0, s1);
      if (Number.isNaN(range.low) || Number.isNaN(range.high)) continue;
      const [z0, z1] = numberInterval(s.value);
      // some print |z| whatever the coefficient's sign: either sign is accepted
      const gap = Math.min(distance(range.low, range.high, z0, z1), distance(range.low, range.high, -z1, -z0));
      if (gap <= 0) continue;
      const inputs = [
        `${link.item.printed.trim()} (read as ${showBound(b0, b.decimals, b.exponent)} to ${showBound(b1, b.decimals, b.exponent)})`,
        `SE = ${se.printed.trim()} (read as ${showBound(s0, se.decimals, se.exponent)} to ${showBound(s1, se.decimals, se.exponent)})`,
      ];
      const doubts = linkDoubts({ linked: [link] });
      out.push({
        messageId: 'mismatch',
        span: s.span,
        message: fill(messages.mismatch, {
          reported: s.printed.trim(),
          coefficient: link.item.printed.trim(),
          se: se.printed.trim(),
          inputs: inputs.join(', '),
          range: showInterval(range.low, range.high),
          gap: showNumber(gap),
        }),
        reported: s.printed,
        recomputed: { quantity: 'z = b / SE', low: range.low, high: range.high, inputs, assumptions: ['z is the coefficient over its standard error (the Wald statistic)', 'either sign of z accepted'] },
        gap: { absolute: gap },
        check: 'Check the coefficient, its SE and z against the model output: one of them may be mistyped, standardised (β with the SE of b), on another scale (an odds ratio for a log-odds coefficient) or copied from another row.',
        resultId: linked.id,
        block: s.block,
        related: [{ span: link.item.span, message: `the coefficient and its SE: ${link.item.printed.trim()}, SE = ${se.printed.trim()}` }],
        ...(doubts.length > 0 ? { uncertain: doubts } : {}),
      });
    }
    return out;
  },
};

/** How far apart [a0, a1] and [b0, b1] are (0 when they meet). */
function distance(a0: number, a1: number, b0: number, b1: number): number {
  if (a1 < b0) return b0 - a1;
  if (b1 < a0) return a0 - b1;
  return 0;
}
