import type { ResultRecord } from '../engine/index.js';

/** A range as the report shows it: shortest exact digits, ∞ for an open end. */
function num(x: number): string {
  if (x === Number.POSITIVE_INFINITY) return '∞';
  if (x === 0) return '0';
  const a = Math.abs(x);
  return a >= 1e-4 && a < 1e6 ? String(Number(x.toPrecision(4))) : x.toExponential(3);
}

const setting = (s: { value: unknown; basis: string; printed?: string }) => `${String(s.value)} (${s.basis}${s.printed ? `: “${s.printed}”` : ''})`;

/**
 * What plumbline read and recomputed for one result, as Markdown for an editor's hover: the
 * engine's result record shown as it is (no statistic is computed here).
 */
export function hoverText(r: ResultRecord): string {
  const lines: string[] = [`**plumbline read** \`${r.printed.replaceAll('`', "'")}\``, ''];
  const read = [`t ${r.t.op} ${r.t.printed}`];
  if (r.df) read.push(`df = ${r.df.printed}`);
  if (r.p) read.push(r.p.printed);
  lines.push(`- read: ${read.join(' · ')}`);
  lines.push(`- tails: ${setting(r.sidedness)}; alpha: ${setting(r.alpha)}`);
  if (r.recomputed) {
    const two = r.recomputed.twoTailed;
    const one = r.recomputed.oneTailed;
    lines.push(`- recomputed from t and df within their rounding: two-tailed p in [${num(two.low)}, ${num(two.high)}], one-tailed p in [${num(one.low)}, ${num(one.high)}]`);
    lines.push(`- standing: ${r.recomputed.standing}`);
  } else lines.push('- recomputed: nothing (t, df and p do not all allow it)');
  const c = r.context;
  lines.push(`- design: ${setting(c.design)}`);
  if (c.descriptives) {
    const groups = c.descriptives.groups.map((g) => `${g.label ? `${g.label}: ` : ''}${g.printed} (${g.spreadKind})`).join('; ');
    lines.push(`- descriptives (${c.descriptives.scope}, ${c.descriptives.certain ? 'certain' : `not certain: ${c.descriptives.doubt ?? ''}`}): ${groups}`);
  } else if (c.unlinked) lines.push(`- descriptives: none tied (${c.unlinked})`);
  for (const i of c.intervals ?? (c.interval ? [c.interval] : [])) lines.push(`- interval of ${i.of}: ${i.printed} (${i.basis}${i.certain ? '' : `, not certain: ${i.doubt ?? ''}`})`);
  if (c.estimate) lines.push(`- estimate: ${c.estimate.printed}`);
  for (const e of c.effectSizes) lines.push(`- effect size: ${e.printed} (${e.basis}${e.certain ? '' : `, not certain: ${e.doubt ?? ''}`})`);
  if (c.reference) lines.push(`- reference value: ${c.reference.printed}`);
  return lines.join('\n');
}
