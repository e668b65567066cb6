import { describeResultDf, describeT, fill, pInterval, resultDfInterval, showInterval, tInterval, type AdjustMethod, type ContextStatement, type LinkedResult, type ReportedP, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';
import { bonferroniAdjusted, oneSidedPRange, sidakAdjusted, twoSidedPRange, type Interval } from '../src/stats/index.js';

const messages = {
  mismatch:
    'Reported {adjusted}, adjusted by {method} for {m} comparisons ("{where}"). From the unadjusted p ({source}: {unadjusted}), the {method}-adjusted p is {formula} = {expected}; the reported value is outside that range within rounding.',
};

/** The number of comparisons, and the words that state it. */
interface Comparisons {
  m: number;
  printed: string;
  span: { start: number; end: number };
}

/** An explicitly adjusted p is the correction of its unadjusted p for the comparisons printed. */
export const adjustedPFollows: Rule = {
  id: 'adjusted-p-follows',
  summary: 'A p labelled as Bonferroni- or Šidák-adjusted equals the correction of its unadjusted p for the number of comparisons printed.',
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    const corrections = document.statements.filter((s) => s.kind === 'multiplicity');
    const withTests = new Set(document.results.map((x) => `${x.report.segment}:${x.report.sentence}`));
    // statements in sentences that report no test are general; one beside a result is that result's
    const general = corrections.filter((c) => c.comparisons !== undefined && !withTests.has(`${c.segment}:${c.sentence}`));
    for (const result of document.results) {
      const r = result.report;
      const adjusted = r.adjustedP ?? (r.p?.adjusted ? r.p : undefined);
      if (!adjusted?.number || !adjusted.adjusted || adjusted.kind !== 'value') continue;
      const method = methodOf(adjusted, corrections);
      if (method !== 'bonferroni' && method !== 'sidak') continue;
      const comparisons = adjusted.adjusted.comparisons !== undefined ? { m: adjusted.adjusted.comparisons, printed: adjusted.adjusted.printed, span: adjusted.adjusted.span } : comparisonsFor(result, corrections, general);
      if (!comparisons) continue;
      const unadjusted = unadjustedP(result);
      if (!unadjusted) continue;
      const expected = method === 'bonferroni' ? bonferroniAdjusted(unadjusted.range, comparisons.m) : sidakAdjusted(unadjusted.range, comparisons.m);
      const reported = pInterval(adjusted, result.alpha.value);
      if (!(Number.isFinite(expected.low) && Number.isFinite(expected.high))) continue;
      if (expected.low <= reported.high && expected.high >= reported.low) continue;
      const name = method === 'bonferroni' ? 'Bonferroni' : 'Šidák';
      out.push({
        messageId: 'mismatch',
        span: adjusted.span,
        message: fill(messages.mismatch, {
          adjusted: adjusted.printed,
          method: name,
          m: comparisons.m,
          where: comparisons.printed,
          source: unadjusted.source,
          unadjusted: showInterval(unadjusted.range.low, unadjusted.range.high),
          formula: method === 'bonferroni' ? `min(1, ${comparisons.m} × p)` : `1 − (1 − p)^${comparisons.m}`,
          expected: showInterval(expected.low, expected.high),
        }),
        reported: adjusted.printed,
        recomputed: { quantity: `${name}-adjusted p`, low: expected.low, high: expected.high, inputs: [unadjusted.source, `${comparisons.m} comparisons`], assumptions: [`${name} correction`, ...(unadjusted.source.startsWith('recomputed') ? [result.sidedness.value === 'one' ? 'one-tailed' : 'two-tailed'] : [])] },
        check: 'Check the number of comparisons and the adjusted p against the output; an adjusted p is the unadjusted one times the number of comparisons (at most 1).',
        related: [{ span: comparisons.span, message: 'where the correction and the number of comparisons are stated' }],
        resultId: r.id,
        block: r.block,
      });
    }
    return out;
  },
};

/** The method named with the p, or, when it only says "adjusted", the one correction the document names (words that name none, "adjusted for multiple comparisons", do not count). */
function methodOf(p: ReportedP, corrections: ContextStatement[]): AdjustMethod | undefined {
  const own = p.adjusted?.method;
  if (own && own !== 'unspecified') return own;
  const methods = new Set(corrections.filter((c) => c.unnamed !== true).map((c) => c.method));
  return methods.size === 1 ? [...methods][0] : undefined;
}

/**
 * The number of comparisons: stated in the result's sentence, else in a sentence of its
 * paragraph that reports no test, else the one number every such sentence of the document
 * agrees on (a number said of one other result is that result's). Several different numbers in
 * scope: no guess.
 */
function comparisonsFor(result: LinkedResult, corrections: ContextStatement[], general: ContextStatement[]): Comparisons | undefined {
  const r = result.report;
  const own = corrections.filter((c) => c.comparisons !== undefined && c.segment === r.segment && c.sentence === r.sentence);
  const scopes = [own, general.filter((c) => c.segment === r.segment), general];
  for (const scope of scopes) {
    const ms = new Set(scope.map((c) => c.comparisons));
    const first = scope[0];
    if (ms.size === 1 && first) return { m: first.comparisons as number, printed: first.printed, span: first.span };
    if (ms.size > 1) return undefined;
  }
  return undefined;
}

/** The unadjusted p: printed beside the adjusted one, else recomputed from t and df. */
function unadjustedP(result: LinkedResult): { range: Interval; source: string } | undefined {
  const r = result.report;
  if (r.adjustedP && r.p?.kind === 'value' && r.p.number && (r.p.op === '=' || r.p.op === '~')) {
    const i = pInterval(r.p, result.alpha.value);
    return { range: { low: i.low, high: i.high }, source: `printed ${r.p.printed}` };
  }
  if (!r.df || r.tOp !== '=') return undefined;
  const [tl, th] = tInterval(r);
  const [dl, dh] = resultDfInterval(result);
  if (!(dl > 0)) return undefined;
  const lo = tl <= 0 && th >= 0 ? 0 : Math.min(Math.abs(tl), Math.abs(th));
  const hi = Math.max(Math.abs(tl), Math.abs(th));
  const range = result.sidedness.value === 'one' && result.sidedness.basis !== 'equivalence-test' ? oneSidedPRange(lo, hi, dl, dh) : twoSidedPRange(lo, hi, dl, dh);
  return { range, source: `recomputed from ${describeT(r)}, ${describeResultDf(result)}` };
}
