import { dfInterval, fill, numberInterval, showInterval, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';
import { partialEtaSquaredRange } from '../src/stats/index.js';

const messages = {
  mismatch:
    'Reported {reported} with F({df1}, {df2}) = {f}. Recomputed partial η² = F·df1 / (F·df1 + df2) from F and its dfs within their rounding: {range}. No value in that range rounds to the reported η².',
};

/** A partial η² printed with an F follows from the F and its dfs. */
export const etaSquaredFollowsFromF: Rule = {
  id: 'eta-squared-follows-from-f',
  summary: 'A partial η² printed with an F equals F·df1 / (F·df1 + df2), within rounding.',
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const linked of document.statistics) {
      const s = linked.report;
      const eta = s.etaSquared;
      const [df1, df2] = s.dfs ?? [];
      // only an η² said to be partial: a plain η² of a design with several effects is smaller
      if (s.kind !== 'F' || !eta?.partial || !s.value || !df1 || !df2 || (s.op !== undefined && s.op !== '=')) continue;
      if (eta.value.value < 0 || eta.value.value > 1) continue;
      const [f0, f1] = numberInterval(s.value);
      const [a0, a1] = dfInterval(df1);
      const [b0, b1] = dfInterval(df2);
      if (!(a0 > 0 && b0 > 0) || f1 < 0) continue;
      const range = partialEtaSquaredRange(f0, f1, a0, a1, b0, b1);
      // `ηp2 < .01` is any value below .01; `ηp2 = .10` its rounding interval
      const [r0, r1] = numberInterval(eta.value);
      const [e0, e1] = eta.op === '<' || eta.op === '<=' ? [0, eta.value.value] : eta.op === '>' || eta.op === '>=' ? [eta.value.value, 1] : [r0, r1];
      if (range.high >= e0 && range.low <= e1) continue;
      const gap = range.high < e0 ? e0 - range.high : range.low - e1;
      out.push({
        messageId: 'mismatch',
        span: eta.span,
        message: fill(messages.mismatch, { reported: eta.printed.trim(), df1: df1.printed, df2: df2.printed, f: s.value.printed.trim(), range: showInterval(range.low, range.high) }),
        reported: eta.printed,
        recomputed: { quantity: 'partial η²', low: range.low, high: range.high, inputs: [`F = ${s.value.printed.trim()}`, `df1 = ${df1.printed}`, `df2 = ${df2.printed}`], assumptions: ['partial η² of the effect the F tests'] },
        gap: { absolute: gap },
        check: 'Check whether the η² is partial or plain (or generalised), and that it belongs to this F.',
        resultId: linked.id,
        block: s.block,
        ...(linked.doubts.length > 0 ? { uncertain: linked.doubts } : {}),
      });
    }
    return out;
  },
};
