import type { DescriptiveLink, Linked, LinkedResult } from '../link/index.js';
import type { Span } from '../parse/types.js';

/**
 * Why a tie between a result and the numbers a rule uses is not certain, in words for the
 * note the finding becomes (empty when every tie is certain).
 */
export function linkDoubts(parts: { descriptives?: DescriptiveLink | undefined; linked?: Array<Linked<{ printed: string }> | undefined> }): string[] {
  const out: string[] = [];
  const d = parts.descriptives;
  if (d && !d.certain) {
    out.push(
      d.doubt ??
      (d.scope === 'table'
        ? 'the table of descriptives sits beside the test, not in it'
        : `another statistic is reported in the same ${d.scope} as the descriptives, so they may be its`),
    );
  }
  for (const l of parts.linked ?? []) {
    if (l && !l.certain) out.push(l.doubt ? `"${l.item.printed.trim()}" ${l.doubt}` : `"${l.item.printed.trim()}" is tied to the test only by its ${l.basis}`);
  }
  return out;
}

/** `{ uncertain }` for a finding that rests on the result's descriptives, when their tie is not certain. */
export function descriptiveDoubts(result: LinkedResult): { uncertain?: string[] } {
  const d = linkDoubts({ descriptives: result.context.descriptives });
  return d.length > 0 ? { uncertain: d } : {};
}

/**
 * Why a finding that holds a t to its two groups (its df to n1 + n2 − 2 or n − 1, its t to their
 * descriptives) is not certain, where the text says the t may be a comparison within a larger
 * analysis of variance (result.pooledError): such a t takes the analysis's pooled error term, whose
 * df counts every group (N − k, or (n − 1)(k − 1) within subjects), so it is never below the two
 * groups' own. Nothing when the t's own words name Welch's test (which pools nothing), or when
 * its df is at most `ownDf`, the most its two groups give (undefined when their sizes are not
 * printed): a smaller df is wrong whatever the error term.
 */
export function pooledErrorDoubt(result: LinkedResult, ownDf?: number): { uncertain: string[]; related: Array<{ span: Span; message: string }> } | undefined {
  const p = result.pooledError;
  const df = result.report.df;
  if (!p || !df || result.testName?.variant === 'welch' || (ownDf !== undefined && df.value <= ownDf)) return undefined;
  const text =
    p.basis === 'error-df'
      ? `an F with the same error df is reported ("${p.printed.trim()}"), so the t may be a comparison within that analysis, whose pooled error term counts every group`
      : `the text speaks of comparisons within a larger analysis ("${p.printed.trim()}"), so the t may take that analysis's pooled error term, which counts every group`;
  return { uncertain: [text], related: [{ span: p.span, message: p.basis === 'error-df' ? 'the F with the same error df' : 'the words about comparisons' }] };
}

/** A finding with doubts (pooledErrorDoubt, transformedDoubt, modelDoubt) added to its own uncertainty and related places, those that there are. */
export function withDoubt<F extends { uncertain?: string[]; related?: Array<{ span: Span; message: string }> }>(finding: F, ...doubts: Array<{ uncertain: string[]; related: Array<{ span: Span; message: string }> } | undefined>): F {
  const some = doubts.filter((d): d is NonNullable<typeof d> => d !== undefined);
  if (some.length === 0) return finding;
  return Object.assign({}, finding, { uncertain: [...(finding.uncertain ?? []), ...some.flatMap((d) => d.uncertain)], related: [...(finding.related ?? []), ...some.flatMap((d) => d.related)] });
}

/**
 * `{ uncertain, related }` for a finding on an effect size where the text says effect sizes are
 * standardised by another SD than the groups' (result.dStandardiser): that SD is not printed
 * beside the result, so the d cannot be recomputed.
 */
export function standardiserDoubt(result: LinkedResult): { uncertain: string[]; related: Array<{ span: Span; message: string }> } | undefined {
  const m = result.dStandardiser;
  if (!m) return undefined;
  return { uncertain: [`the text names another SD as the effect sizes' standardiser ("${m.printed.trim()}"), which is not printed with this result, so its d cannot be recomputed`], related: [{ span: m.span, message: 'the words about the standardiser' }] };
}

/**
 * `{ uncertain, related }` for a finding that recomputes a t from the printed means and SDs, where
 * the text says values were transformed for the analysis (result.transformed): the t may be of the
 * transformed values, which the printed, untransformed descriptives do not give.
 */
export function transformedDoubt(result: LinkedResult): { uncertain: string[]; related: Array<{ span: Span; message: string }> } | undefined {
  const m = result.transformed;
  if (!m) return undefined;
  return { uncertain: [`the text says values were transformed for the analysis ("${m.printed.trim()}"), so the t may be of transformed values, which the printed descriptives do not give`], related: [{ span: m.span, message: 'the words about the transformation' }] };
}

/**
 * `{ uncertain, related }` for a finding that holds a t to its two groups (its t to their
 * descriptives, its df to their sizes), where the text says comparisons were estimated from a
 * model (result.modelBased): a mixed model's, a regression's or an adjusted t need not follow from
 * them.
 */
export function modelDoubt(result: LinkedResult): { uncertain: string[]; related: Array<{ span: Span; message: string }> } | undefined {
  const m = result.modelBased;
  if (!m) return undefined;
  return { uncertain: [`the text says comparisons were estimated from a model ("${m.printed.trim()}"), so the t and its df need not follow from the two groups' descriptives and sizes alone`], related: [{ span: m.span, message: 'the words about the model' }] };
}
