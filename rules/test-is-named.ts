import { checklistRule, type ChecklistEntry } from '../src/rule-api/index.js';

/** The test behind each t is named: paired or independent, and Student's or Welch's. */
export const testIsNamed = checklistRule({
  id: 'test-is-named',
  summary: "Each t-test is named: paired, one-sample or independent, and for independent groups Student's or Welch's.",
  item: 'The test is named (paired, one-sample or independent; Student or Welch)',
  guidelines: { sampl: 'Hypothesis tests: name the test (from memory)', 'jars-quant': 'Results: statistics and data analysis (from memory)', consort: '12a' },
  missingMessage: 'Not said: {detail}.',
  check: "Name the test where it is reported or in the methods, e.g. \"Welch's independent-samples t-test\" or \"paired t-test\".",
  assess(document) {
    const names = document.extraction.mentions.filter((m) => m.kind === 'test-name');
    const saysVariant = names.some((m) => /welch|student/i.test(m.printed));
    return document.results.map((result): ChecklistEntry => {
      const r = result.report;
      const here = names.find((m) => m.segment === r.segment && m.sentence === r.sentence) ?? names.find((m) => m.segment === r.segment);
      const named = r.namedVariant ?? (here ? here.printed : undefined);
      const anywhere = names[0];
      const base = { scope: 'result' as const, resultId: r.id, block: r.block };
      const word = named ?? anywhere?.printed;
      if (!word) return { ...base, status: 'missing', span: r.span, detail: `which t-test gave ${r.printed}` };
      const independent = /independent|unpaired|two-sample|welch|student/i.test(word);
      const paired = /paired|dependent|related|one-sample/i.test(word);
      if (!independent && !paired) return { ...base, status: 'missing', span: r.span, detail: `whether ${r.printed} is from a paired, one-sample or independent-samples test` };
      if (independent && !/welch|student/i.test(word) && !saysVariant) return { ...base, status: 'missing', span: r.span, detail: `whether the independent-samples test behind ${r.printed} is Student's or Welch's` };
      const place = r.namedVariant ? r.span : (here ?? anywhere)?.span;
      return { ...base, status: 'found', ...(place ? { span: place } : {}), detail: word };
    });
  },
});
