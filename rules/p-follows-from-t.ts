import { evaluateP, fill, notRecomputed, pMessageId, pPlaceholders, type Rule, type RuleFinding, pDoubts, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  mismatch:
    'Reported {reported}. Recomputed {quantity} from {inputs}: {range}, assuming {tails}. Gap {gap}. No value of t and df within their rounding reproduces the reported p (one-tailed would be {oneTailed}).',
  'one-tailed-although-two-stated':
    'Reported {reported}. Recomputed {quantity} from {inputs}: {range}, assuming {tails}. Gap {gap}. The reported p matches the one-tailed value ({oneTailed}) although the text says two-tailed.',
  'two-tailed-although-one-stated':
    'Reported {reported}. Recomputed {quantity} from {inputs}: {range}, assuming {tails}. Gap {gap}. The reported p matches the two-tailed value ({twoTailed}) although the text says one-tailed.',
  'not-recomputed': 'Reported {reported}. The p was not recomputed from t and df, so whether it follows from them is not known.',
};

const checks: Record<keyof typeof messages, string> = {
  mismatch: 'Check t, df and p against the analysis output: one of them may be mistyped or copied from another result.',
  'one-tailed-although-two-stated': 'Check which test was run: either the p is one-tailed or the text about tails is wrong.',
  'two-tailed-although-one-stated': 'Check which test was run: a one-tailed p is half the two-tailed one.',
  'not-recomputed': 'Check the df and the p against the analysis output: numbers of this size are rarely what a test printed.',
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
      // a df or an exponent beyond what is computed here: a note of what could not be checked
      const why = notRecomputed(result);
      if (why !== undefined) {
        const reported = result.report.printed;
        out.push({ messageId: 'not-recomputed', span: result.report.span, message: fill(messages['not-recomputed'], { reported }), reported, check: checks['not-recomputed'], resultId: result.report.id, block: result.report.block, uncertain: [why] });
        continue;
      }
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
        ...pDoubts(result, e),
      });
    }
    return out;
  },
};
