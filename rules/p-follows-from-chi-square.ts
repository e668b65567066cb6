import { statisticPFindings, type Rule, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  mismatch: 'Reported {reported}. Recomputed {quantity} from {inputs}: {range}. Gap {gap}. No value of χ² and its df within their rounding reproduces the reported p (χ² has one tail by definition; no one-tailed reading applies).',
};

/** The reported p follows from the reported χ² (when the significance call agrees). */
export const pFollowsFromChiSquare: Rule = {
  id: 'p-follows-from-chi-square',
  summary: 'The reported p follows from the reported χ² and its df, within rounding.',
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    return statisticPFindings(document.statistics, ['chi-square'], messages.mismatch, 'Check χ², df and p against the analysis output: one of them may be mistyped or copied from another result.', false);
  },
};
