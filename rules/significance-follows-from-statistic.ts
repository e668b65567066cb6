import { statisticPFindings, type Rule, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  mismatch:
    'Reported {reported} ({reportedSide} at alpha {alpha}). Recomputed {quantity} from {inputs}: {range}, which is {recomputedSide} (every reading considered: {readings}). Gap {gap}.',
};

/** The significance call the reported p implies agrees with the one its F, χ², r or z implies. */
export const significanceFollowsFromStatistic: Rule = {
  id: 'significance-follows-from-statistic',
  summary: 'The reported p and the p recomputed from its F, χ², r or z fall on the same side of alpha.',
  kind: 'inconsistency',
  defaultLevel: 'error',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    return statisticPFindings(
      document.statistics,
      ['F', 'chi-square', 'correlation', 'z'],
      messages.mismatch,
      'Check the statistic, its df and p against the analysis output before drawing conclusions: the conclusion about significance depends on which number is right.',
      true,
    );
  },
};
