import { coefficientRatio, fill, linkDoubts, showInterval, showNumber, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';

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
      const ratio = coefficientRatio(link.item, r.t);
      if (!ratio || ratio.gap <= 0) continue;
      const { inputs, gap } = ratio;
      const se = link.item.se;
      const doubts = linkDoubts({ linked: [link] });
      out.push({
        messageId: 'mismatch',
        span: r.span,
        message: fill(messages.mismatch, {
          reported: `t = ${r.t.printed.trim()}`,
          coefficient: link.item.printed.trim(),
          se: se.printed.trim(),
          inputs: inputs.join(', '),
          range: showInterval(ratio.low, ratio.high),
          gap: showNumber(gap),
        }),
        reported: r.printed,
        recomputed: { quantity: 't = b / SE', low: ratio.low, high: ratio.high, inputs, assumptions: ['t is the coefficient over its standard error (the Wald statistic)', 'either sign of t accepted'] },
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
