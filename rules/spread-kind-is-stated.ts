import { fill, type Rule, type RuleFinding } from '../src/rule-api/index.js';

const messages = {
  'unstated-spread': 'Reported {reported}: the document never says whether the value after ± is a standard deviation or a standard error.',
};

/** The value after ± is said to be an SD or an SE, there or somewhere in the document. */
export const spreadKindIsStated: Rule = {
  id: 'spread-kind-is-stated',
  summary: 'The value after ± is stated to be an SD or an SE (beside it, or once for the document).',
  kind: 'advice',
  defaultLevel: 'note',
  defaultOptions: {},
  optionsSchema: { type: 'object', properties: {}, additionalProperties: false },
  messages,
  check({ document }) {
    const x = document.extraction;
    if (x.statements.some((s) => s.kind === 'spread')) return [];
    const out: RuleFinding[] = [];
    for (const g of x.summaries) {
      if (g.spread?.kind !== 'unstated') continue;
      out.push({
        messageId: 'unstated-spread',
        span: g.span,
        message: fill(messages['unstated-spread'], { reported: g.printed }),
        reported: g.printed,
        check: 'Say once what ± stands for ("values are mean ± SD"), or label each value.',
        block: g.block,
      });
    }
    return out;
  },
};
