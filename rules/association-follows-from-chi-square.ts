import { fill, numberInterval, showBound, showInterval, showNumber, type Rule, type RuleContext, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';
import { associationRange, distanceBetween, type Interval } from '../src/stats/index.js';

type LinkedStatistic = RuleContext<unknown>['document']['statistics'][number];

const messages = {
  mismatch:
    'Reported {reported} with {chi}. Recomputed {quantity} from {inputs}: {range}. Gap {gap}. No χ² within its rounding gives the printed {symbol}.',
};

/** A φ or Cramér's V printed with a χ² follows from the χ², N and the table's size. */
export const associationFollowsFromChiSquare: Rule = {
  id: 'association-follows-from-chi-square',
  summary: "A φ or Cramér's V printed with a χ² equals √(χ²/N) or √(χ²/(N·(min(r, c) − 1))), within rounding.",
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const linked of document.statistics) {
      const s = linked.report;
      const a = s.association;
      const n = s.n;
      if (s.kind !== 'chi-square' || !a || !s.value || !n || (s.op !== undefined && s.op !== '=') || s.namedAs) continue;
      if (n.decimals !== 0 || !(n.value > 0) || s.value.value < 0) continue;
      if (a.value.value < -1 || a.value.value > 1) continue;
      // V's divisor min(r, c) − 1: from the stated size, else every k with k² ≤ df that divides df
      const ks = a.kind === 'phi' ? [1] : divisorsFor(linked);
      if (ks.length === 0) continue;
      const [x0, x1] = numberInterval(s.value);
      const readings = ks.map((k) => ({ k, range: associationRange(x0, x1, n.value, n.value, k) }));
      if (readings.some((r) => Number.isNaN(r.range.low) || Number.isNaN(r.range.high))) continue;
      // φ may carry the sign of the 2 × 2 table's diagonal: its magnitude is compared
      const v = Math.abs(a.value.value);
      const [r0, r1] = numberInterval({ ...a.value, value: v });
      const [e0, e1] = a.op === '<' || a.op === '<=' ? [0, v] : a.op === '>' || a.op === '>=' ? [v, 1] : [Math.max(0, r0), r1];
      const gaps = readings.map((r) => distanceBetween(r.range, e0, e1));
      if (gaps.some((g) => g <= 0)) continue;
      const best = gaps.indexOf(Math.min(...gaps));
      const nearest = readings[best] as { k: number; range: Interval };
      const symbol = a.kind === 'phi' ? 'φ' : 'V';
      const quantity = a.kind === 'phi' ? '|φ| = √(χ²/N)' : `V = √(χ²/(N·${nearest.k}))`;
      const inputs = [
        `χ² = ${s.value.printed.trim()} (read as ${showBound(x0, s.value.decimals, s.value.exponent)} to ${showBound(x1, s.value.decimals, s.value.exponent)})`,
        `N = ${n.printed}`,
        ...(a.kind === 'V' ? [kSource(linked, ks)] : []),
      ];
      out.push({
        messageId: 'mismatch',
        span: a.span,
        message: fill(messages.mismatch, {
          reported: a.printed.trim(),
          chi: s.printed.trim(),
          quantity,
          inputs: inputs.join(', '),
          range: showInterval(nearest.range.low, nearest.range.high),
          gap: showNumber(gaps[best] as number),
          symbol,
        }),
        reported: a.printed,
        recomputed: {
          quantity,
          low: nearest.range.low,
          high: nearest.range.high,
          inputs,
          assumptions: ["Pearson's χ² without a continuity correction, on the whole table", ...(a.kind === 'V' ? ['no bias correction of V'] : [])],
        },
        gap: { absolute: gaps[best] as number },
        check: `Check that the ${symbol} and the χ² come from the same table and that the χ² printed is the uncorrected Pearson χ².`,
        resultId: linked.id,
        block: s.block,
        ...(linked.doubts.length > 0 ? { uncertain: linked.doubts } : {}),
      });
    }
    return out;
  },
};

/**
 * The divisors min(r, c) − 1 a V may have been computed with: the stated table's, or, without
 * one, every k that (r − 1)(c − 1) = df allows with k the smaller factor (k ≤ √df, k | df).
 */
function divisorsFor(linked: LinkedStatistic): number[] {
  const size = linked.dimensions;
  if (size) return [Math.min(size.item.rows, size.item.cols) - 1];
  const df = linked.report.dfs?.[0];
  if (!df || df.decimals !== 0 || !(df.value >= 1) || df.value > 1e6) return [];
  const out: number[] = [];
  for (let k = 1; k * k <= df.value; k += 1) if (df.value % k === 0) out.push(k);
  return out;
}

function kSource(linked: LinkedStatistic, ks: number[]): string {
  const size = linked.dimensions;
  if (size) return `min(r, c) − 1 = ${ks[0]} (${size.item.printed.trim()})`;
  return `min(r, c) − 1 in {${ks.join(', ')}} (every table the df ${linked.report.dfs?.[0]?.printed ?? ''} allows)`;
}
