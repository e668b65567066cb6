import { fill, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';

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
  optionsSchema: NO_OPTIONS,
  messages,
  checklist: {
    item: 'The kind of spread after ± (SD or SE) is stated',
    guidelines: { sampl: 'section "Reporting numbers and descriptive statistics"', 'jars-quant': 'Table 1, Results, "Statistics and data analysis"' },
    assess(document) {
      const x = document.extraction;
      const pm = x.summaries.filter((g) => g.spread && (g.spread.kind === 'unstated' || g.spread.printedKind));
      if (pm.length === 0) return [{ scope: 'document', status: 'not-applicable', detail: 'no ± values' }];
      const statement = x.statements.find((st) => st.kind === 'spread');
      if (statement) return [{ scope: 'document', status: 'found', span: statement.span, detail: statement.printed, block: statement.block }];
      const unstated = pm.filter((g) => g.spread?.kind === 'unstated');
      if (unstated.length === 0) return [{ scope: 'document', status: 'found', span: pm[0]?.span ?? { start: 0, end: 0 }, detail: 'each ± value is labelled' }];
      return [{ scope: 'document', status: 'missing', span: unstated[0]?.span ?? { start: 0, end: 0 }, detail: `whether ± gives an SD or an SE (${unstated.length} value${unstated.length === 1 ? '' : 's'})` }];
    },
  },
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
