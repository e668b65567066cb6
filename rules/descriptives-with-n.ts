import { checklistRule, type ChecklistEntry } from '../src/rule-api/index.js';

/** Each result comes with means, spreads and sizes for every group or condition. */
export const descriptivesWithN = checklistRule({
  id: 'descriptives-with-n',
  summary: 'Each result comes with the mean, SD (or SE) and n of every group or condition it compares.',
  item: 'Descriptives with n are given for each group',
  guidelines: { sampl: 'section "Reporting numbers and descriptive statistics"', 'jars-quant': 'Table 1, Results, "Statistics and data analysis"', consort: 'item 17a' },
  missingMessage: 'Reported {detail}.',
  check: 'Give the mean, SD and n of each group beside the test or in a table next to it.',
  assess(document) {
    return document.results.map((result): ChecklistEntry => {
      const r = result.report;
      const base = { scope: 'result' as const, resultId: r.id, block: r.block };
      const link = result.context.descriptives;
      if (!link) return { ...base, status: 'missing', span: r.span, detail: `${r.printed} with no means and SDs beside it` };
      const perGroup = result.context.sampleSizes.some((s) => s.scope === 'per-group');
      const lacking = link.groups.filter((g) => !g.mean || !g.spread || (!g.n && !perGroup));
      if (lacking.length === 0) return { ...base, status: 'found', span: link.groups[0]?.span ?? r.span, detail: link.groups.map((g) => g.printed).join('; ') };
      const what = lacking.some((g) => !g.spread) ? 'an SD' : 'the n';
      return { ...base, status: 'missing', span: r.span, detail: `${r.printed} with descriptives lacking ${what} for a group` };
    });
  },
});
