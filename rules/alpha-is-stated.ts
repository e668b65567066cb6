import { checklistRule } from '../src/rule-api/index.js';

/** The document states its significance level. */
export const alphaIsStated = checklistRule({
  id: 'alpha-is-stated',
  summary: 'The document states the significance level (alpha) its tests use.',
  item: 'Alpha (the significance level) is stated',
  guidelines: { sampl: 'sections "Primary analyses" and "Reporting hypothesis tests"', 'jars-quant': 'Table 1, Results, "Statistics and data analysis"' },
  missingMessage: 'Not said: {detail}.',
  check: 'State the significance level once, e.g. "alpha was set at .05".',
  assess(document) {
    if (document.results.length === 0) return [{ scope: 'document', status: 'not-applicable', detail: 'no t-test reported' }];
    const st = document.extraction.statements.find((s) => s.kind === 'alpha');
    if (st) return [{ scope: 'document', status: 'found', span: st.span, detail: st.printed, block: st.block }];
    return [{ scope: 'document', status: 'missing', detail: 'the significance level (alpha)' }];
  },
});
