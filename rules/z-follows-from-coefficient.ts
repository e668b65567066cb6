import { coefficientRatio, fill, linkDoubts, showInterval, showNumber, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';

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
      const ratio = coefficientRatio(link.item, s.value);
      if (!ratio || ratio.gap <= 0) continue;
      const { inputs, gap } = ratio;
      const se = link.item.se;
      const doubts = linkDoubts({ linked: [link] });
      out.push({
        messageId: 'mismatch',
        span: s.span,
        message: fill(messages.mismatch, {
          reported: s.printed.trim(),
          coefficient: link.item.printed.trim(),
          se: se.printed.trim(),
          inputs: inputs.join(', '),
          range: showInterval(ratio.low, ratio.high),
          gap: showNumber(gap),
        }),
        reported: s.printed,
        recomputed: { quantity: 'z = b / SE', low: ratio.low, high: ratio.high, inputs, assumptions: ['z is the coefficient over its standard error (the Wald statistic)', 'either sign of z accepted'] },
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
