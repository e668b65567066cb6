import { fill, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  mismatch:
    'Reported {reported} for "{printedSize}" ({rows} rows, {cols} columns). Recomputed df = (rows − 1)(columns − 1) = {expected}. The printed df differs by {gap}.',
};

/** A χ² on a contingency table whose size the text states has df = (r − 1)(c − 1). */
export const chiSquareDfFollowsFromTable: Rule = {
  id: 'chi-square-df-follows-from-table',
  summary: 'A χ² test of a contingency table of stated size r × c has df = (r − 1)(c − 1).',
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const linked of document.statistics) {
      const s = linked.report;
      const size = linked.dimensions;
      const df = s.dfs?.[0];
      // a McNemar, goodness-of-fit, trend or stratified χ² has another df
      if (s.kind !== 'chi-square' || !size || !df || df.decimals !== 0 || s.namedAs) continue;
      const { rows, cols } = size.item;
      const expected = (rows - 1) * (cols - 1);
      if (df.value === expected) continue;
      out.push({
        messageId: 'mismatch',
        span: df.span,
        message: fill(messages.mismatch, {
          reported: `df = ${df.printed}`,
          printedSize: size.item.printed.trim(),
          rows: String(rows),
          cols: String(cols),
          expected: String(expected),
          gap: String(Math.abs(df.value - expected)),
        }),
        reported: s.reportPrinted ?? s.printed,
        recomputed: {
          quantity: 'df of χ²',
          low: expected,
          high: expected,
          inputs: [`${rows} rows and ${cols} columns (${size.item.printed.trim()}, in the χ²'s ${size.basis})`],
          assumptions: ["Pearson's χ² (or the likelihood-ratio G²) of independence on the whole table"],
        },
        gap: { absolute: Math.abs(df.value - expected) },
        check: 'Check the table the χ² was computed on (rows or columns merged or dropped?) and the df printed.',
        resultId: linked.id,
        block: s.block,
        related: [{ span: size.item.span, message: `the table's size: ${size.item.printed.trim()}` }],
        ...(linked.doubts.length > 0 ? { uncertain: linked.doubts } : {}),
      });
    }
    return out;
  },
};
