import { statisticPFindings, type Rule, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  mismatch: 'Reported {reported}. Recomputed {quantity} from {inputs}: {range}. Gap {gap}. No value of r and its df within their rounding reproduces the reported p (neither the two-tailed nor the one-tailed reading: {readings}).',
};

/** The reported p follows from the reported r (when the significance call agrees). */
export const pFollowsFromR: Rule = {
  id: 'p-follows-from-r',
  summary: 'The reported p follows from the reported r and its df, within rounding.',
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    return statisticPFindings(document.statistics, ['correlation'], messages.mismatch, 'Check r, df (or n) and p against the analysis output: one of them may be mistyped or copied from another result.', false);
  },
};
