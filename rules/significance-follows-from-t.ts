import { evaluateP, fill, pMessageId, pPlaceholders, type Rule, type RuleFinding, pDoubts, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  mismatch:
    'Reported {reported} ({reportedSide} at alpha {alpha}). Recomputed {quantity} from {inputs}: {range}, assuming {tails}, which is {recomputedSide}. Gap {gap}.',
  'one-tailed-although-two-stated':
    'Reported {reported} ({reportedSide} at alpha {alpha}). Recomputed {quantity} from {inputs}: {range}, assuming {tails}, which is {recomputedSide}. Gap {gap}. The reported p matches the one-tailed value ({oneTailed}) although the text says two-tailed.',
  'two-tailed-although-one-stated':
    'Reported {reported} ({reportedSide} at alpha {alpha}). Recomputed {quantity} from {inputs}: {range}, assuming {tails}, which is {recomputedSide}. Gap {gap}. The reported p matches the two-tailed value ({twoTailed}) although the text says one-tailed.',
};

/** The significance call the reported p implies agrees with the one t and df imply. */
export const significanceFollowsFromT: Rule = {
  id: 'significance-follows-from-t',
  summary: 'The reported p and the p recomputed from t and df fall on the same side of alpha.',
  kind: 'inconsistency',
  defaultLevel: 'error',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const result of document.results) {
      const e = evaluateP(result);
      if (!e || !e.decisionFlips) continue;
      const id = pMessageId(e);
      if (!id) continue;
      out.push({
        messageId: id,
        span: result.report.span,
        message: fill(messages[id], pPlaceholders(result, e)),
        reported: result.report.printed,
        recomputed: e.recomputed,
        gap: e.gap,
        figure: { kind: 'p' },
        check: 'Check t, df and p against the analysis output before drawing conclusions: the conclusion about significance depends on which number is right.',
        resultId: result.report.id,
        block: result.report.block,
        ...pDoubts(result, e),
      });
    }
    return out;
  },
};
