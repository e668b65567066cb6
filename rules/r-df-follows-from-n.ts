import { fill, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  'df-not-n-minus-2': 'Reported r({df}) with n = {n}: a Pearson correlation of n pairs has df = n − 2 = {expected}.',
};

/** A correlation's df is n − 2 when both are printed. */
export const rDfFollowsFromN: Rule = {
  id: 'r-df-follows-from-n',
  summary: 'A Pearson correlation printed with its df and n has df = n − 2.',
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const linked of document.statistics) {
      const s = linked.report;
      if (s.kind !== 'correlation') continue;
      const uncertain = linked.doubts.length > 0 ? { uncertain: linked.doubts } : {};
      const df = s.dfs?.[0];
      if (!df || !s.n || df.decimals !== 0 || s.n.decimals !== 0 || s.symbol !== 'r') continue;
      const expected = s.n.value - 2;
      if (df.value === expected) continue;
      out.push({
        messageId: 'df-not-n-minus-2', span: df.span,
        message: fill(messages['df-not-n-minus-2'], { df: df.printed, n: s.n.printed, expected: String(expected) }),
        reported: s.reportPrinted ?? s.printed,
        recomputed: { quantity: 'df', low: expected, high: expected, inputs: [`n = ${s.n.printed}`], assumptions: ['a Pearson correlation of n complete pairs'] },
        gap: { absolute: Math.abs(df.value - expected) },
        check: 'Check whether the bracket holds n or df, and whether some pairs were missing.', block: s.block, ...uncertain,
      });
    }
    return out;
  },
};
