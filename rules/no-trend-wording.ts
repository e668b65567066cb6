import { checklistRule, numberInterval, type ChecklistEntry } from '../src/rule-api/index.js';

/** A p just above alpha is not described as a trend or as marginally significant. */
const UPPER = 0.1; // common practice, no source: "trend" wording clusters between alpha and .10

export const noTrendWording = checklistRule({
  id: 'no-trend-wording',
  summary: 'A p between alpha and .10 is not described as a "trend" or as "marginally significant".',
  item: 'Non-significant results are not called trends',
  guidelines: { sampl: 'section "Reporting hypothesis tests"' },
  missingMessage: 'Reported {detail}.',
  check: 'Report the result as not significant at the stated alpha, with its effect size and CI.',
  assess(document) {
    const trends = document.extraction.mentions.filter((m) => m.kind === 'trend');
    return document.results.map((result): ChecklistEntry => {
      const r = result.report;
      const base = { scope: 'result' as const, resultId: r.id, block: r.block };
      const p = r.p?.number;
      if (!p || r.p?.kind !== 'value' || r.p.op !== '=') return { ...base, status: 'not-applicable', detail: 'no exact p' };
      const [lo, hi] = numberInterval(p);
      if (!(hi > result.alpha.value && lo <= UPPER)) return { ...base, status: 'not-applicable', detail: `p = ${p.printed}` };
      const word = trends.find((m) => m.segment === r.segment && Math.abs(m.sentence - r.sentence) <= 0);
      if (word) return { ...base, status: 'missing', span: word.span, detail: `"${word.printed}" for ${r.printed}, which is not significant at alpha ${result.alpha.value}` };
      return { ...base, status: 'found', span: r.span, detail: `${r.printed} not described as a trend` };
    });
  },
});
