import { fill, linkDoubts, numberInterval, showInterval, showNumber, type LinkedStatistic, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';
import { oneWayFRange, type GroupBox, type Interval } from '../src/stats/index.js';

const messages = {
  mismatch:
    'Reported {reported} with {k} groups printed {where}. Recomputed the one-way F = MS between / MS within from their means, spreads and sizes ({inputs}), over the rounding of each mean and spread: {attempts}. Gap {gap}. No means and spreads within their rounding give the printed F.',
  df: 'Reported {reported} with {k} groups printed {where}, of sizes {sizes} (N = {total}). A one-way ANOVA of these groups has dfs (k − 1, N − k) = ({df1}, {df2}).',
};

type Group = NonNullable<LinkedStatistic['groups']>['groups'][number];

/** One reading of the groups' spreads: every unstated spread as an SD, or every one as an SE. */
interface Reading {
  name: string;
  range: Interval;
}

/**
 * An F printed with k groups' means, spreads and sizes is the one-way ANOVA F those summaries
 * give within their rounding, and its dfs are (k − 1, N − k).
 */
export const fFollowsFromGroupSummaries: Rule = {
  id: 'f-follows-from-group-summaries',
  summary: "An F printed with k groups' means, SDs (or SEs) and sizes is the one-way ANOVA F they give, with dfs (k − 1, N − k), within rounding.",
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const linked of document.statistics) {
      const s = linked.report;
      const link = linked.groups;
      if (s.kind !== 'F' || !link || !s.value || !Number.isFinite(s.value.value)) continue;
      if (s.op === '>' || s.op === '>=' || s.sameAsT) continue;
      const groups = link.groups;
      if (!groups.every(complete)) continue;
      // percentages and plain scores are not one measure
      if (groups.some((g) => g.percent) && !groups.every((g) => g.percent)) continue;
      const k = groups.length;
      const sizes = groups.map((g) => (g.n as NonNullable<Group['n']>).value);
      const total = sizes.reduce((a, b) => a + b, 0);
      const doubts = [...linkDoubts({ descriptives: link }), ...linked.doubts];
      if (s.analysisWords) doubts.push(`"${s.analysisWords}" is said of the analysis, so the F need not be the one-way between-groups F of these groups`);
      if (s.dfCorrection) doubts.push('a sphericity correction is named beside the F, which belongs to a repeated-measures design');
      const tie = link.tableTie;
      const where = tie
        ? `in ${tie.name} (named "${tie.named.printed}" in its ${tie.named.basis}; ${tie.outcome.by === 'label' ? `the row "${tie.outcome.words.join(' ')}" its sentence names` : 'its one set of groups'})`
        : link.scope === 'previous-paragraph'
          ? 'in the paragraph before it'
          : 'beside it';
      const base = { reported: s.printed.trim(), k: String(k), where };
      const related = groups.map((g) => ({ span: g.span, message: `group: ${g.printed.trim()}` }));
      if (tie) related.unshift({ span: tie.named.span, message: `the table named: ${tie.named.printed}` });
      const [df1, df2] = s.dfs ?? [];
      if (df1 && df2) {
        if (df1.decimals > 0 || df2.decimals > 0) continue; // a corrected or Welch df: not the classic one-way F
        if (df1.value !== k - 1 || df2.value !== total - k) {
          const dfDoubts = [...doubts];
          if (df1.value !== k - 1) dfDoubts.push(`df1 = ${df1.printed} says the F compares ${df1.value + 1} groups, not the ${k} printed, so these may not be its groups`);
          out.push({
            messageId: 'df',
            span: s.span,
            message: fill(messages.df, { ...base, sizes: sizes.join(', '), total: String(total), df1: String(k - 1), df2: String(total - k) }),
            reported: s.printed,
            recomputed: { quantity: 'dfs of a one-way F', low: total - k, high: total - k, inputs: groups.map((g) => g.printed.trim()), assumptions: ['a one-way between-groups ANOVA of the printed groups, every unit in one group'] },
            gap: { absolute: Math.abs(df2.value - (total - k)) + Math.abs(df1.value - (k - 1)) },
            check: 'Check the group sizes against the analysis (units excluded or missing change N − k), and that the F is the one-way ANOVA of these groups.',
            resultId: linked.id,
            block: s.block,
            related,
            ...(dfDoubts.length > 0 ? { uncertain: dfDoubts } : {}),
          });
          continue;
        }
      } else doubts.push(`no dfs are printed with the F to confirm it is the one-way ANOVA of these ${k} groups`);
      const reported = reportedInterval(s);
      const readings = spreadReadings(groups, link.spreadKinds);
      if (readings.length === 0) continue;
      const ranges = readings.map((r) => ({ name: r.name, range: oneWayFRange(r.boxes) }));
      if (ranges.some((r) => !Number.isFinite(r.range.low) || Number.isNaN(r.range.high))) continue;
      if (ranges.some((r) => r.range.low <= reported.high && r.range.high >= reported.low)) continue;
      const gap = Math.min(...ranges.map((r) => (r.range.high < reported.low ? reported.low - r.range.high : r.range.low - reported.high)));
      const inputs = groups.map((g) => `"${g.printed.trim()}"`).join('; ');
      out.push({
        messageId: 'mismatch',
        span: s.span,
        message: fill(messages.mismatch, { ...base, inputs, attempts: ranges.map(describe).join('; '), gap: showNumber(gap) }),
        reported: s.printed,
        recomputed: {
          quantity: 'one-way F from the group summaries',
          low: Math.min(...ranges.map((r) => r.range.low)),
          high: Math.max(...ranges.map((r) => r.range.high)),
          inputs: groups.map((g) => g.printed.trim()),
          assumptions: ['one-way between-groups ANOVA, every unit in one group', ...readings.map((r) => r.name)],
        },
        gap: { absolute: gap },
        check: 'Check the means, SDs and group sizes against the analysis output, whether the spreads printed are SDs, and that the F is the one-way ANOVA of these groups.',
        resultId: linked.id,
        block: s.block,
        related,
        ...(doubts.length > 0 ? { uncertain: doubts } : {}),
      });
    }
    return out;
  },
};

function complete(g: Group): boolean {
  return !!g.mean && !!g.spread && !!g.n && g.n.decimals === 0 && g.n.value >= 1 && Number.isFinite(g.mean.value) && Number.isFinite(g.spread.number.value) && g.spread.number.value >= 0;
}

/** The printed F as an interval: its rounding for `=`, [0, value] for `F < 1`. */
function reportedInterval(s: LinkedStatistic['report']): Interval {
  const v = s.value as NonNullable<LinkedStatistic['report']['value']>;
  if (s.op === '<' || s.op === '<=') return { low: 0, high: v.value };
  const [lo, hi] = numberInterval(v);
  return { low: Math.max(0, lo), high: hi };
}

/**
 * The boxes of each reading: spreads labelled SD or SE are read as labelled (an SE is SD / √n,
 * so SD = SE · √n with the exact n); unstated spreads are read all as SDs, then all as SEs.
 */
function spreadReadings(groups: readonly Group[], kinds: readonly string[]): Array<{ name: string; boxes: GroupBox[] }> {
  const unstated = kinds.some((k) => k === 'unstated');
  const readings: Array<{ name: string; asSE: boolean }> = unstated
    ? [{ name: 'unstated spreads read as SDs', asSE: false }, { name: 'unstated spreads read as SEs', asSE: true }]
    : [{ name: kinds.every((k) => k === 'SD') ? 'spreads as labelled (SD)' : 'spreads as labelled', asSE: false }];
  return readings.map(({ name, asSE }) => ({
    name,
    boxes: groups.map((g, i) => {
      const n = (g.n as NonNullable<Group['n']>).value;
      const [mLo, mHi] = numberInterval(g.mean as NonNullable<Group['mean']>);
      const [sLo, sHi] = numberInterval((g.spread as NonNullable<Group['spread']>).number);
      const kind = kinds[i];
      const factor = kind === 'SE' || (kind === 'unstated' && asSE) ? Math.sqrt(n) : 1;
      return { n, mean: { low: mLo, high: mHi }, sd: { low: Math.max(0, sLo) * factor, high: sHi * factor } };
    }),
  }));
}

function describe(r: Reading): string {
  return `${showInterval(r.range.low, r.range.high)} (${r.name})`;
}

