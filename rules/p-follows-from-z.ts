import { statisticPFindings, type Rule, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  mismatch: 'Reported {reported}. Recomputed {quantity} from {inputs}: {range}. Gap {gap}. No value of z within its rounding reproduces the reported p (neither the two-tailed nor the one-tailed reading: {readings}).',
};

/** The reported p follows from the reported z (when the significance call agrees). */
export const pFollowsFromZ: Rule = {
  id: 'p-follows-from-z',
  summary: 'The reported p follows from the reported z, within rounding.',
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    return statisticPFindings(document.statistics, ['z'], messages.mismatch, 'Check z and p against the analysis output: one of them may be mistyped or copied from another result.', false);
  },
};
