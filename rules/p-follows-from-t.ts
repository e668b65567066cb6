import { evaluateP, fill, pMessageId, pPlaceholders, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  mismatch:
    'Reported {reported}. Recomputed {quantity} from {inputs}: {range}, assuming {tails}. Gap {gap}. No value of t and df within their rounding reproduces the reported p (one-tailed would be {oneTailed}).',
  'one-tailed-although-two-stated':
    'Reported {reported}. Recomputed {quantity} from {inputs}: {range}, assuming {tails}. Gap {gap}. The reported p matches the one-tailed value ({oneTailed}) although the text says two-tailed.',
  'two-tailed-although-one-stated':
    'Reported {reported}. Recomputed {quantity} from {inputs}: {range}, assuming {tails}. Gap {gap}. The reported p matches the two-tailed value ({twoTailed}) although the text says one-tailed.',
};

const checks: Record<keyof typeof messages, string> = {
  mismatch: 'Check t, df and p against the analysis output: one of them may be mistyped or copied from another result.',
  'one-tailed-although-two-stated': 'Check which test was run: either the p is one-tailed or the text about tails is wrong.',
  'two-tailed-although-one-stated': 'Check which test was run: a one-tailed p is half the two-tailed one.',
};

/** The reported p follows from the reported t and df (when the significance call agrees). */
export const pFollowsFromT: Rule = {
  id: 'p-follows-from-t',
  summary: 'The reported p follows from the reported t and df, within rounding.',
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const result of document.results) {
      const e = evaluateP(result);
      if (!e || e.decisionFlips) continue; // a changed significance call is its own rule
      const id = pMessageId(e);
      if (!id || !result.report.p) continue;
      out.push({
        messageId: id,
        span: result.report.span,
        message: fill(messages[id], pPlaceholders(result, e)),
        reported: result.report.printed,
        recomputed: e.recomputed,
        gap: e.gap,
        figure: { kind: 'p' },
        check: checks[id],
        resultId: result.report.id,
        block: result.report.block,
      });
    }
    return out;
  },
};
