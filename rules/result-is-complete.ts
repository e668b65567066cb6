import { fill, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  'p-missing': 'Reported {reported} with no p value beside it, so the reader cannot see the result of the test.',
  't-missing': 'Reported {reported} for a t-test ("{mention}") without the t statistic and its df, so the p value cannot be checked.',
  'p-untied': 'Reported {reported}, then {count} p values listed "respectively" ({list}) for the {tests} t value{s} read here: which p is this test\'s cannot be told, so its p was not checked.',
};

/** A reported t-test gives t, its df and p together. */
export const resultIsComplete: Rule = {
  id: 'result-is-complete',
  summary: 'A reported t-test gives its p with t, and a p for a t-test comes with its t.',
  kind: 'advice',
  defaultLevel: 'note',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const result of document.results) {
      const r = result.report;
      if (r.listedPs) {
        const l = r.listedPs;
        out.push({ messageId: 'p-untied', span: r.span, message: fill(messages['p-untied'], { reported: r.printed, count: l.count, list: l.printed, tests: l.tests, s: l.tests === 1 ? '' : 's' }), reported: r.printed, check: 'Give each t its own p, or list as many p values as t values, in the same order ("respectively").', related: [{ span: l.span, message: 'the p values listed' }], resultId: r.id, block: r.block });
        continue;
      }
      // "t(30) < 1" is itself a statement that the test was not significant.
      if (!r.p && r.df && r.tOp === '=') {
        out.push({ messageId: 'p-missing', span: r.span, message: fill(messages['p-missing'], { reported: r.printed }), reported: r.printed, check: 'Add the exact p value (or p < .001).', resultId: r.id, block: r.block });
      }
    }
    for (const item of document.pWithoutT) {
      out.push({
        messageId: 't-missing',
        span: item.p.span,
        message: fill(messages['t-missing'], { reported: item.p.printed, mention: item.mentionPrinted }),
        reported: item.p.printed,
        check: 'Add the t statistic with its df, e.g. t(28) = 2.10.',
        related: [{ span: item.mention, message: 'the t-test named here' }],
        block: item.block,
      });
    }
    return out;
  },
};
