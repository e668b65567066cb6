import { fill, linkDoubts, numberInterval, showBound, showInterval, showNumber, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';
import { quotientRange } from '../src/stats/index.js';

const messages = {
  mismatch:
    'Reported {reported} with {coefficient} and SE = {se}. Recomputed t = b / SE from {inputs}: {range}. Gap {gap}. No coefficient and SE within their rounding give the printed t (either sign accepted).',
};

/** A regression coefficient's t equals the coefficient over its SE, within rounding. */
export const tFollowsFromCoefficient: Rule = {
  id: 't-follows-from-coefficient',
  summary: 'A t printed with a regression coefficient and its SE equals b / SE, within rounding.',
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const result of document.results) {
      const link = result.context.coefficient;
      const r = result.report;
      if (!link || r.tOp !== '=' || !Number.isFinite(r.t.value)) continue;
      const { value: b, se } = link.item;
      if (!Number.isFinite(b.value) || !Number.isFinite(se.value)) continue;
      const [b0, b1] = numberInterval(b);
      const [s0, s1] = numberInterval(se);
      // an SE printed as 0.00 allows any t: nothing to check
      if (!(s0 > 0)) continue;
      const range = quotientRange(b0, b1, s0, s1);
      if (Number.isNaN(range.low) || Number.isNaN(range.high)) continue;
      const [t0, t1] = numberInterval(r.t);
      // some print |t| whatever the coefficient's sign: either sign is accepted
      const gap = Math.min(distance(range.low, range.high, t0, t1), distance(range.low, range.high, -t1, -t0));
      if (gap <= 0) continue;
      const inputs = [
        `${link.item.printed.trim()} (read as ${showBound(b0, b.decimals, b.exponent)} to ${showBound(b1, b.decimals, b.exponent)})`,
        `SE = ${se.printed.trim()} (read as ${showBound(s0, se.decimals, se.exponent)} to ${showBound(s1, se.decimals, se.exponent)})`,
      ];
      const doubts = linkDoubts({ linked: [link] });
      out.push({
        messageId: 'mismatch',
        span: r.span,
        message: fill(messages.mismatch, {
          reported: `t = ${r.t.printed.trim()}`,
          coefficient: link.item.printed.trim(),
          se: se.printed.trim(),
          inputs: inputs.join(', '),
          range: showInterval(range.low, range.high),
          gap: showNumber(gap),
        }),
        reported: r.printed,
        recomputed: { quantity: 't = b / SE', low: range.low, high: range.high, inputs, assumptions: ['t is the coefficient over its standard error (the Wald statistic)', 'either sign of t accepted'] },
        gap: { absolute: gap },
        check: 'Check the coefficient, its SE and t against the model output: one of them may be mistyped, standardised (β with the SE of b) or copied from another row.',
        resultId: r.id,
        block: r.block,
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

