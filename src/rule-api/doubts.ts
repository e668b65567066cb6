import type { DescriptiveLink, Linked, LinkedResult } from '../link/index.js';

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
