import { descriptiveDoubts, evaluateDescriptives, fill, numberInterval, type LinkedResult, type Rule, type RuleFinding, NO_OPTIONS, isWholeDf } from '../src/rule-api/index.js';
import { welchDfRange } from '../src/stats/index.js';

const messages = {
  'paired-analysed-as-independent': 'Reported {reported} for a design the text describes as paired ("{words}"), with {n} pairs ({nSource}); but df = {df} is 2n − 2 = n1 + n2 − 2, the df of two independent groups; a paired test has n − 1 = {pairedDf}.',
  'paired-t-equals-independent': 'Reported {reported} for a design the text describes as paired ("{words}"), but the t is what two independent groups with these descriptives give ({attempt}).',
  'independent-analysed-as-paired': 'Reported {reported} for groups the text describes as independent ("{words}"), with {n} in each group ({nSource}); but df = {df} is n − 1, the df of a paired or one-sample test; two groups of n have 2n − 2 = {independentDf}{welchNote}.',
};

/** The analysis fits the design: paired data analysed as paired, independent groups as independent. */
export const designMatchesAnalysis: Rule = {
  id: 'design-matches-analysis',
  summary: 'The analysis fits the design the text describes: paired data as paired, independent groups as independent.',
  kind: 'doubtful',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const result of document.results) {
      const r = result.report;
      const design = result.context.design;
      if (!r.df || !isWholeDf(r.df) || design.basis === 'default' || design.basis === 'structure') continue;
      const link = result.context.descriptives;
      const words = design.printed ?? (r.namedVariant ?? design.value);
      const base = { span: r.span, reported: r.printed, resultId: r.id, block: r.block, ...(design.span ? { related: [{ span: design.span, message: 'the words that describe the design' }] } : {}) };
      const size = unitsPerCondition(result);
      const df = r.df.value;
      if (design.value === 'paired') {
        // two conditions printed with different sizes are not one set of units measured twice:
        // the paragraph's design words are about another comparison
        const groupNs = (link?.groups ?? []).flatMap((g) => (g.n ? [g.n.value] : []));
        if (groupNs.length === 2 && groupNs[0] !== groupNs[1]) continue;
        if (size && size.n > 2 && df === 2 * size.n - 2) {
          out.push({ ...base, ...size.doubts, messageId: 'paired-analysed-as-independent', message: fill(messages['paired-analysed-as-independent'], { reported: r.printed, words, n: size.n, nSource: size.source, df: r.df.printed, pairedDf: size.n - 1 }), check: 'Check whether a paired test was run; with paired data it has n − 1 df and usually a larger t.' });
          continue;
        }
        if (!link || link.groups.length !== 2) continue;
        // the independent-groups t reproduces the printed t: the pairing was probably ignored
        const asIndependent = evaluateDescriptives({ ...result, context: { ...result.context, design: { value: 'independent', basis: 'default' } } });
        const fit = asIndependent?.attempts.find((a) => a.fits && a.reading === 'as labelled' && a.variant === 'student' && a.nSource.startsWith('n ='));
        if (fit) {
          // A paired t equals the independent-groups t whenever the two measurements are
          // uncorrelated: a question to ask, never a certain mismatch.
          const doubts = [...(descriptiveDoubts(result).uncertain ?? []), 'a paired t equals the independent-groups t whenever the two measurements are uncorrelated'];
          out.push({ ...base, uncertain: doubts, messageId: 'paired-t-equals-independent', message: fill(messages['paired-t-equals-independent'], { reported: r.printed, words, attempt: `Student's t with n = ${fit.ns.join(' and ')}` }), check: 'Check whether a paired test was run on the paired data.' });
        }
      } else if (design.value === 'independent') {
        if (!size || size.n < 3 || df !== size.n - 1 || welchCouldGive(result, size.n)) continue;
        out.push({
          ...base,
          ...size.doubts,
          messageId: 'independent-analysed-as-paired',
          message: fill(messages['independent-analysed-as-paired'], { reported: r.printed, words, n: size.n, nSource: size.source, df: r.df.printed, independentDf: 2 * size.n - 2, welchNote: sdsPrinted(result) ? ", and the SDs printed exclude a Welch df that rounds to it" : '' }),
          check: 'Check whether an independent-samples test was run; two groups of n have 2n − 2 df (Student) or a Welch df between n − 1 and 2n − 2.',
        });
      }
    }
    return out;
  },
};

/**
 * The number of units in each condition: both groups' printed n when equal, a per-group n,
 * or, for a paired design, the units counted in the result's sentence (else its paragraph)
 * when that is a single number ("the same 24 employees"); for two independent groups, half an
 * even total stated there.
 */
function unitsPerCondition(result: LinkedResult): { n: number; source: string; doubts: { uncertain?: string[] } } | undefined {
  const groups = result.context.descriptives?.groups ?? [];
  if (groups.length === 2 && groups[0]?.n && groups[1]?.n) {
    const [a, b] = [groups[0].n.value, groups[1].n.value];
    return a === b ? { n: a, source: `n = ${groups[0].n.printed} in each`, doubts: descriptiveDoubts(result) } : undefined;
  }
  const pair = result.context.groupSizes;
  if (pair) return pair[0].value === pair[1].value ? { n: pair[0].value, source: `n = ${pair[0].printed} and ${pair[1].printed}`, doubts: {} } : undefined;
  const sizes = result.context.sampleSizes;
  const perGroup = sizes.find((s) => s.scope === 'per-group');
  if (perGroup) return { n: perGroup.n.value, source: perGroup.printed, doubts: {} };
  const r = result.report;
  // the units counted in the result's own sentence, else in its paragraph: one number only
  const own = sizes.filter((s) => s.segment === r.segment && s.sentence === r.sentence && s.scope !== 'per-group' && s.scope !== 'subset');
  // the paragraph's count is the result's only when the paragraph reports no other test
  const near = own.length > 0 ? own : result.context.testsInParagraph === 1 ? sizes.filter((s) => s.segment === r.segment && s.scope !== 'per-group' && s.scope !== 'subset') : [];
  const values = new Set(near.map((s) => s.n.value));
  const only = near[0];
  if (!only || values.size !== 1) return undefined;
  if (result.context.design.value === 'paired') return { n: only.n.value, source: only.printed, doubts: {} };
  // half a total: only one printed with the result itself (the study's total may not be the test's)
  return own.length > 0 && only.n.value % 2 === 0 ? { n: only.n.value / 2, source: `half of ${only.printed}`, doubts: {} } : undefined;
}

function sdsPrinted(result: LinkedResult): boolean {
  const d = result.context.descriptives;
  return d !== undefined && d.groups.length === 2 && d.groups.every((g) => g.spread) && d.spreadKinds.every((k) => k === 'SD');
}

/**
 * Whether a Welch df rounded to a whole number could be n − 1 for two groups of n: Welch's df
 * reaches n − 1 only as one group's variance dominates. With both SDs printed the
 * Welch–Satterthwaite range decides; without them it cannot be ruled out only in that limit,
 * which a printed whole df of exactly n − 1 does not suggest, so it is not assumed.
 */
function welchCouldGive(result: LinkedResult, n: number): boolean {
  if (!sdsPrinted(result)) return false;
  const [g1, g2] = (result.context.descriptives?.groups ?? []) as [NonNullable<LinkedResult['context']['descriptives']>['groups'][number], NonNullable<LinkedResult['context']['descriptives']>['groups'][number]];
  const range = welchDfRange(numberInterval(g1.spread!.number), n, numberInterval(g2.spread!.number), n);
  const df = result.report.df?.value as number;
  return range.low <= df + 0.5 && range.high >= df - 0.5;
}
