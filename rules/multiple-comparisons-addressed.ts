import { checklistRule } from '../src/rule-api/index.js';

/** Documents that report many tests say how multiplicity was handled. */
const MANY = 5; // common practice, no source: five or more tests make multiplicity worth a word

export const multipleComparisonsAddressed = checklistRule({
  id: 'multiple-comparisons-addressed',
  summary: 'A document that reports many t-tests (five or more) says how multiple comparisons were handled.',
  item: 'Multiple comparisons are addressed',
  guidelines: { sampl: 'sections "Primary analyses" and "Reporting hypothesis tests"', 'jars-quant': 'Table 1, Method, "Analytic strategy"' },
  missingMessage: 'Not said: {detail}.',
  check: 'Say how multiplicity was handled (a correction such as Holm or Bonferroni, or why none was needed).',
  assess(document) {
    const n = document.results.length;
    if (n < MANY) return [{ scope: 'document', status: 'not-applicable', detail: `${n} t-test${n === 1 ? '' : 's'} reported` }];
    const m = document.extraction.mentions.find((x) => x.kind === 'multiplicity');
    if (m) return [{ scope: 'document', status: 'found', span: m.span, detail: m.printed, block: m.block }];
    return [{ scope: 'document', status: 'missing', detail: `how the ${n} t-tests were corrected for multiple comparisons, if at all` }];
  },
});
