import { fill, groupBy, numberInterval, repeatDoubt, type LinkedResult, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  'numbers-differ': 'The abstract reports {first}, but the same comparison in "{section}" reads {second}.',
};

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
    // the topics of an abstract's tests and of the tests elsewhere that may share their df
    const topics = new Map(x.topics.map((t) => [t.test, t]));
    const inSummary = document.results.filter((r) => topics.get(r.report)?.inSummary === true);
    const elsewhere = document.results.filter((r) => topics.get(r.report)?.inSummary === false);
    const severalStudies = x.mentions.find((m) => m.kind === 'several-studies');
    // the results elsewhere by their printed df, and the Welch ones by their df rounded (once:
    // an abstract of many results would otherwise scan them all for each)
    const byDf = groupBy(elsewhere.filter((b) => b.report.df !== undefined), (b) => b.report.df?.printed);
    const welchByDf = groupBy(elsewhere.filter((b) => b.report.df !== undefined && !Number.isInteger(b.report.df.value)), (b) => Math.round(b.report.df?.value ?? NaN));
    for (const a of inSummary) {
      const df = a.report.df;
      if (!df) continue;
      // the candidates: the results elsewhere with the same df printed
      const same = byDf.get(df.printed) ?? [];
      // the abstract's numbers match one of them (either sign of t: the groups may be named the
      // other way round), or a Welch df that rounds to its whole one with t of the same sign:
      // nothing to say
      const rounded = Number.isInteger(df.value) ? (welchByDf.get(df.value) ?? []).filter((b) => Math.sign(b.report.t.value) === Math.sign(a.report.t.value)) : [];
      if (same.some((b) => agrees(a, b)) || rounded.some((b) => agrees(a, b))) continue;
      const sameSign = same.filter((b) => Math.sign(b.report.t.value) === Math.sign(a.report.t.value));
      if (sameSign.length !== 1) continue; // none, or several candidates: which one is meant is a guess
      const b = sameSign[0] as LinkedResult;
      // in a report of several studies the abstract may speak of another one
      const section = x.sections[b.report.segment] ?? 'the results';
      // the df alone does not tie them: the words around both must name one comparison
      const unlike = repeatDoubt(topics.get(a.report), topics.get(b.report), section);
      const uncertain = [
        ...(severalStudies ? [`the text reports several studies ("${severalStudies.printed}"), and the abstract may report another study's result`] : []),
        ...(unlike !== undefined ? [unlike] : []),
      ];
      out.push({
        messageId: 'numbers-differ',
        span: a.report.span,
        message: fill(messages['numbers-differ'], { first: a.report.printed, second: b.report.printed, section }),
        reported: a.report.printed,
        check: 'Check both against the analysis output and make them the same.',
        related: [{ span: b.report.span, message: 'the same comparison in the results' }],
        resultId: a.report.id,
        block: a.report.block,
        ...(uncertain.length > 0 ? { uncertain } : {}),
      });
    }
    return out;
  },
};

/**
 * Two reports of one comparison agree when their |t| and p intervals overlap; a p labelled
 * one-tailed beside one labelled two-tailed or unlabelled is compared at twice its value.
 */
function agrees(a: LinkedResult, b: LinkedResult): boolean {
  const abs = (i: [number, number]): [number, number] => (i[0] <= 0 && i[1] >= 0 ? [0, Math.max(-i[0], i[1])] : [Math.min(Math.abs(i[0]), Math.abs(i[1])), Math.max(Math.abs(i[0]), Math.abs(i[1]))]);
  const ta = abs(numberInterval(a.report.t));
  const tb = abs(numberInterval(b.report.t));
  if (!(ta[0] <= tb[1] && tb[0] <= ta[1])) return false;
  const pa = a.report.p?.number;
  const pb = b.report.p?.number;
  if (!pa || !pb || a.report.p?.op !== '=' || b.report.p?.op !== '=') return true;
  const one = (r: LinkedResult) => r.sidedness.value === 'one' && r.sidedness.basis === 'in-report';
  const scale = (r: LinkedResult) => (one(r) && !one(r === a ? b : a) ? 2 : 1);
  const ia = numberInterval(pa).map((v) => v * scale(a));
  const ib = numberInterval(pb).map((v) => v * scale(b));
  return (ia[0] as number) <= (ib[1] as number) && (ib[0] as number) <= (ia[1] as number);
}
