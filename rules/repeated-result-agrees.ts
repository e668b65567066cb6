import { fill, numberInterval, type LinkedResult, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  'numbers-differ': 'The abstract reports {first}, but the same comparison in "{section}" reads {second}.',
};

const SUMMARY_SECTION = /abstract|summary|highlights/i;

/** A comparison reported twice (abstract and results, text and table) has the same numbers both times. */
export const repeatedResultAgrees: Rule = {
  id: 'repeated-result-agrees',
  summary: 'A comparison reported twice (in the abstract and in the results, or in the text and in a table) has the same t, df and p both times.',
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const x = document.extraction;
    const out: RuleFinding[] = [];
    const inSummary = document.results.filter((r) => SUMMARY_SECTION.test(x.sections[r.report.segment] ?? ''));
    const elsewhere = document.results.filter((r) => !SUMMARY_SECTION.test(x.sections[r.report.segment] ?? ''));
    for (const a of inSummary) {
      const df = a.report.df;
      if (!df) continue;
      // the same comparison: the one result elsewhere with the same df and the same sign of t
      const same = elsewhere.filter((b) => b.report.df?.printed === df.printed && Math.sign(b.report.t.value) === Math.sign(a.report.t.value));
      if (same.length === 0) continue;
      // the abstract's numbers match one of them: nothing to say
      if (same.some((b) => agrees(a, b))) continue;
      if (same.length !== 1) continue; // several candidates: which one is meant is a guess
      const b = same[0] as LinkedResult;
      out.push({
        messageId: 'numbers-differ',
        span: a.report.span,
        message: fill(messages['numbers-differ'], { first: a.report.printed, second: b.report.printed, section: x.sections[b.report.segment] ?? 'the results' }),
        reported: a.report.printed,
        check: 'Check both against the analysis output and make them the same.',
        related: [{ span: b.report.span, message: 'the same comparison in the results' }],
        resultId: a.report.id,
        block: a.report.block,
      });
    }
    return out;
  },
};

/** Two reports of one comparison agree when their t and p intervals overlap. */
function agrees(a: LinkedResult, b: LinkedResult): boolean {
  const ta = numberInterval(a.report.t);
  const tb = numberInterval(b.report.t);
  if (!(ta[0] <= tb[1] && tb[0] <= ta[1])) return false;
  const pa = a.report.p?.number;
  const pb = b.report.p?.number;
  if (!pa || !pb || a.report.p?.op !== '=' || b.report.p?.op !== '=') return true;
  const ia = numberInterval(pa);
  const ib = numberInterval(pb);
  return ia[0] <= ib[1] && ib[0] <= ia[1];
}
