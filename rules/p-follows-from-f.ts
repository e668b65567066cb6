import { statisticPFindings, type Rule, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  mismatch: 'Reported {reported}. Recomputed {quantity} from {inputs}: {range}. Gap {gap}. No value of F and its dfs within their rounding reproduces the reported p (F has one tail by definition; no one-tailed reading applies).',
};

/** The reported p follows from the reported F (when the significance call agrees). */
export const pFollowsFromF: Rule = {
  id: 'p-follows-from-f',
  summary: 'The reported p follows from the reported F and its dfs, within rounding.',
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    return statisticPFindings(document.statistics, ['F'], messages.mismatch, 'Check F, df1, df2 and p against the analysis output: one of them may be mistyped or copied from another result.', false);
  },
};
