import { checklistRule } from '../src/rule-api/index.js';

/** The document says whether its tests are one- or two-tailed. */
export const tailsAreStated = checklistRule({
  id: 'tails-are-stated',
  summary: 'The document says whether its tests are one- or two-tailed.',
  item: 'Sidedness (one- or two-tailed) is stated',
  guidelines: { sampl: 'sections "Primary analyses" and "Reporting hypothesis tests"' },
  missingMessage: 'Not said: {detail}.',
  check: 'Say once, where the analysis is described, whether the tests were two-tailed (or one-tailed, and why).',
  assess(document) {
    if (document.results.length === 0) return [{ scope: 'document', status: 'not-applicable', detail: 'no t-test reported' }];
    const st = document.extraction.statements.find((s) => s.kind === 'sidedness' || s.kind === 'equivalence');
    if (st) return [{ scope: 'document', status: 'found', span: st.span, detail: st.printed, block: st.block }];
    return [{ scope: 'document', status: 'missing', detail: 'whether the tests were one- or two-tailed' }];
  },
});
