import { checklistRule, documentAnchor } from '../src/rule-api/index.js';

/** The assumptions of the t-tests are mentioned. */
export const assumptionsAreChecked = checklistRule({
  id: 'assumptions-are-checked',
  summary: "The document says how the t-tests' assumptions were checked (normality of the differences or residuals; equal variances for Student's test).",
  item: 'Assumption checks are mentioned',
  guidelines: { sampl: 'Confirm that the assumptions of the test were met (from memory)', 'jars-quant': 'Methods: assumptions and their checks (from memory)' },
  missingMessage: 'Not said: {detail}.',
  check: "Say how normality (of the differences or residuals) and, for Student's test, equal variances were checked, or why Welch's test was used.",
  assess(document) {
    if (document.results.length === 0) return [{ scope: 'document', status: 'not-applicable', detail: 'no t-test reported' }];
    const m = document.extraction.mentions.find((x) => x.kind === 'assumption' || (x.kind === 'test-name' && /welch/i.test(x.printed)));
    if (m) return [{ scope: 'document', status: 'found', span: m.span, detail: m.printed, block: m.block }];
    return [{ scope: 'document', status: 'missing', ...documentAnchor(document), detail: 'how the assumptions of the t-tests (normality, equal variances) were checked' }];
  },
});
