import { fill, numberInterval, showBound, showInterval, showNumber, tInterval, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  mismatch: 'Reported {reported}, said to be the same comparison as {t}. Recomputed F = t² from {inputs}: {range}. Gap {gap}. No t within its rounding squares to the printed F.',
  df: 'Reported {reported}, said to be the same comparison as {t}: an F of one comparison has df1 = 1 and df2 = the t\'s df ({df}).',
};

/** An F said to be the same comparison as a t equals t², with df1 = 1 and df2 = the t's df. */
export const fEqualsTSquared: Rule = {
  id: 'f-equals-t-squared',
  summary: "An F said to be the same comparison as a t equals t², with dfs (1, the t's df), within rounding.",
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    const byId = new Map(document.results.map((r) => [r.report.id, r.report]));
    for (const linked of document.statistics) {
      const s = linked.report;
      const t = s.sameAsT ? byId.get(s.sameAsT) : undefined;
      if (s.kind !== 'F' || !t || !s.value || (s.op !== undefined && s.op !== '=') || t.tOp !== '=' || t.plural) continue;
      if (!Number.isFinite(s.value.value) || !Number.isFinite(t.t.value)) continue;
      const base = { reported: s.printed.trim(), t: t.printed.trim() };
      const [df1, df2] = s.dfs ?? [];
      if (df1 && df2 && t.df && (df1.value !== 1 || (t.df.decimals === 0 && df2.decimals === 0 && df2.value !== t.df.value))) {
        out.push({
          messageId: 'df',
          span: s.span,
          message: fill(messages.df, { ...base, df: t.df.printed }),
          reported: s.printed,
          recomputed: { quantity: 'dfs of F', low: 1, high: 1, inputs: [`t's df = ${t.df.printed}`], assumptions: ['F of the one comparison the t tests'] },
          check: 'Check that the F and the t are the same comparison, and the dfs printed with each.',
          resultId: linked.id,
          block: s.block,
          related: [{ span: t.span, message: `the t: ${t.printed.trim()}` }],
        });
        continue;
      }
      const [t0, t1] = tInterval(t);
      const a = Math.min(Math.abs(t0), Math.abs(t1));
      const lowSq = t0 <= 0 && t1 >= 0 ? 0 : a * a;
      const highSq = Math.max(t0 * t0, t1 * t1);
      const [f0, f1] = numberInterval(s.value);
      const gap = highSq < f0 ? f0 - highSq : lowSq > f1 ? lowSq - f1 : 0;
      if (gap <= 0) continue;
      const inputs = [`t = ${t.t.printed.trim()} (read as ${showBound(t0, t.t.decimals, t.t.exponent)} to ${showBound(t1, t.t.decimals, t.t.exponent)})`];
      out.push({
        messageId: 'mismatch',
        span: s.span,
        message: fill(messages.mismatch, { ...base, inputs: inputs.join(', '), range: showInterval(lowSq, highSq), gap: showNumber(gap) }),
        reported: s.printed,
        recomputed: { quantity: 'F = t²', low: lowSq, high: highSq, inputs, assumptions: ['the F and the t test the same single comparison'] },
        gap: { absolute: gap },
        check: 'Check that the F and the t are the same comparison, and the values printed for each.',
        resultId: linked.id,
        block: s.block,
        related: [{ span: t.span, message: `the t: ${t.printed.trim()}` }],
      });
    }
    return out;
  },
};
