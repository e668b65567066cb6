import { checklistRule, type ChecklistEntry } from '../src/rule-api/index.js';

/** Where a name was found, in words for the report. */
const BASIS_WORDS = {
  'in-report': 'with the statistic',
  clause: 'in its clause',
  sentence: 'in its sentence',
  table: 'in its table',
  'software-output': "in the software's output header",
} as const;

/**
 * The test behind each t is named by the result's own words: with its statistic, in its clause
 * or sentence, in its table's header, row or caption, or in the header software printed above
 * its output. A name said elsewhere (with another result, once in the methods) is the link
 * layer's to place, and gives this result no credit.
 */
export const testIsNamed = checklistRule({
  id: 'test-is-named',
  summary: "Each t-test is named where it is reported: paired, one-sample or independent, and for independent groups Student's or Welch's.",
  item: 'The test is named (paired, one-sample or independent; Student or Welch)',
  guidelines: {
    sampl: 'sections "Primary analyses" and "Reporting hypothesis tests"',
    'jars-quant': 'Table 1, Method, "Analytic strategy"',
    consort: 'item 12a',
  },
  missingMessage: 'Not said: {detail}.',
  check: "Name the test beside the result, in its table or in its sentence, e.g. \"Welch's t(40.2) = 2.31\" or \"a paired t-test showed …\".",
  assess(document) {
    return document.results.map((result): ChecklistEntry => {
      const r = result.report;
      const name = result.testName;
      const base = { scope: 'result' as const, resultId: r.id, block: r.block };
      if (!name) return { ...base, status: 'missing', span: r.span, detail: `which t-test gave ${r.printed}` };
      if (!name.design) return { ...base, status: 'missing', span: r.span, detail: `whether ${r.printed} is from a paired, one-sample or independent-samples test ("${name.printed}" does not say)` };
      if (name.design === 'independent' && !name.variant) return { ...base, status: 'missing', span: r.span, detail: `whether the independent-samples test behind ${r.printed} is Student's or Welch's` };
      const kind = name.design === 'independent' ? `${name.variant === 'welch' ? "Welch's" : "Student's"} independent-samples t-test` : `${name.design} t-test`;
      return { ...base, status: 'found', span: name.span, detail: `${kind}: "${name.printed}" ${BASIS_WORDS[name.basis]}` };
    });
  },
});
