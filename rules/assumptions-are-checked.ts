import { checklistRule } from '../src/rule-api/index.js';

/**
 * The document says that the t-tests' assumptions were checked. Only statements of a check
 * count (the extractor reads them: a named check, or normality or equal variances with a verb
 * of checking, not negated); naming Welch's test is a choice of test, not a check.
 */
export const assumptionsAreChecked = checklistRule({
  id: 'assumptions-are-checked',
  summary: "The document says how the t-tests' assumptions were checked (normality of the differences or residuals; equal variances for Student's test).",
  item: 'Assumption checks are mentioned',
  guidelines: {
    sampl: 'sections "Primary analyses" and "Reporting hypothesis tests"',
    'jars-quant': 'Table 1, Method, "Data diagnostics", and Results, "Statistics and data analysis"',
  },
  missingMessage: 'Not said: {detail}.',
  check: "Say how normality (of the differences or residuals) and, for Student's test, equal variances were checked, e.g. \"Q–Q plots of the differences\" or \"Levene's test\".",
  assess(document) {
    if (document.results.length === 0) return [{ scope: 'document', status: 'not-applicable', detail: 'no t-test reported' }];
    const m = document.extraction.mentions.find((x) => x.kind === 'assumption');
    if (m) return [{ scope: 'document', status: 'found', span: m.span, detail: m.printed, block: m.block }];
    return [{ scope: 'document', status: 'missing', detail: 'how the assumptions of the t-tests (normality, equal variances) were checked' }];
  },
});
