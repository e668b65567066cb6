import { fill, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  'p-above-one': 'Reported {reported}: a p value cannot exceed 1 (a decimal point may be missing).',
  'p-negative': 'Reported {reported}: a p value cannot be negative (the sign may belong to t, or be a typesetting slip).',
  'p-below-zero-bound': 'Reported {reported}: no p value lies below 0, so this bound cannot hold (a digit may be missing, e.g. p < .001).',
  'df-not-positive': 'Reported df = {df}: degrees of freedom must be positive.',
  'student-df-fractional':
    "Reported df = {df} with a test the text calls Student's: Student's (pooled) t has whole-number df (n1 + n2 − 2); a fractional df comes from Welch's test.",
  'r-outside-range': 'Reported {reported}: a correlation lies between −1 and 1.',
};

/** Reported p and df lie in the ranges they can take. */
export const valuesArePossible: Rule = {
  id: 'values-are-possible',
  summary: 'Reported p lies in (0, 1], df is positive (and whole for Student\'s test), and a correlation lies in [−1, 1].',
  kind: 'inconsistency',
  defaultLevel: 'error',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const result of document.results) {
      const r = result.report;
      const base = { reported: r.printed, resultId: r.id, block: r.block };
      const p = r.p?.kind === 'value' ? r.p : undefined;
      if (p?.number && p.number.value > 1) {
        out.push({ ...base, messageId: 'p-above-one', span: p.span, message: fill(messages['p-above-one'], { reported: p.printed }), check: 'Check how the p value was copied: "043" is probably ".043".' });
      }
      // `-0` is printed with a sign too; `1e-400` is 0 only as a double (beyondDouble keeps its size)
      const negative = p?.number !== undefined && (p.number.value < 0 || Object.is(p.number.value, -0));
      if (p?.number && negative && (p.op === '=' || p.op === '~')) {
        out.push({ ...base, messageId: 'p-negative', span: p.span, message: fill(messages['p-negative'], { reported: p.printed }), check: 'Check the p value against the analysis output: a p lies between 0 and 1.' });
      }
      if (p?.number && (negative || (p.number.value === 0 && !p.number.beyondDouble)) && (p.op === '<' || p.op === '<=')) {
        out.push({ ...base, messageId: 'p-below-zero-bound', span: p.span, message: fill(messages['p-below-zero-bound'], { reported: p.printed }), check: 'Report the bound the output supports, e.g. p < .001.' });
      }
      if (r.df && r.df.value <= 0) {
        out.push({ ...base, messageId: 'df-not-positive', span: r.df.span, message: fill(messages['df-not-positive'], { df: r.df.printed }), check: 'Check the df against the sample sizes.' });
      }
      if (r.df && r.namedVariant === 'student' && !Number.isInteger(r.df.value)) {
        out.push({ ...base, messageId: 'student-df-fractional', span: r.df.span, message: fill(messages['student-df-fractional'], { df: r.df.printed }), check: "Check whether Welch's or Student's test was run, and name that one." });
      }
    }
    for (const linked of document.statistics) {
      const s = linked.report;
      // r = 1.32 cannot be (a bound such as r < 1.2 says nothing); a rank correlation is bounded the same way.
      // Only an r reported as a test (with its df or a p) is a correlation: `r = 1.5` alone may be a rate or a radius.
      if (s.kind !== 'correlation' || !s.value || Math.abs(s.value.value) <= 1 || (s.op !== undefined && s.op !== '=')) continue;
      if (!s.dfs && !s.p) continue;
      out.push({
        messageId: 'r-outside-range', span: s.span, message: fill(messages['r-outside-range'], { reported: s.printed.trim() }),
        reported: s.printed, block: s.block, check: 'Check the correlation against the analysis output: the printed value may have lost its decimal point or belong to another statistic.',
      });
    }
    return out;
  },
};
