import { fill, groupBy, type ReportedNumber, type Rule, type RuleFinding, type SampleSize, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  'sum-differs': 'Reported {total} and groups of {ns} with it: the groups add up to {sum}, not {n}{why}.',
};

/** Whether two or more of the sizes (at most 16 are tried) add up to the total exactly. */
function someAddUpTo(sizes: number[], total: number): boolean {
  const k = Math.min(sizes.length, 16);
  for (let mask = 0; mask < 1 << k; mask++) {
    let count = 0;
    let sum = 0;
    for (let i = 0; i < k; i++) if (mask & (1 << i)) { count++; sum += sizes[i] as number; }
    if (count >= 2 && sum === total) return true;
  }
  return false;
}

/** Group sizes stated with a total add up to it. */
export const groupSizesSumToTotal: Rule = {
  id: 'group-sizes-sum-to-total',
  summary: 'Group sizes printed with a total N add up to it (or the paragraph says why not).',
  kind: 'doubtful',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const x = document.extraction;
    const out: RuleFinding[] = [];
    const totals = x.sampleSizes.filter((s) => s.scope === 'total');
    const totalsBySegment = groupBy(totals, (t) => t.segment);
    // The group sizes of one sentence: lower-case n (`n = 36`) and the n of each group's
    // descriptives, each printed number once.
    const key = (segment: number, sentence: number) => `${segment}:${sentence}`;
    const summariesBySentence = groupBy(x.summaries.filter((g) => g.n), (g) => key(g.segment, g.sentence));
    const lowerCaseN = groupBy(x.sampleSizes.filter((s) => s.scope === 'unspecified'), (s) => key(s.segment, s.sentence));
    const withExclusions = new Set(x.mentions.filter((m) => m.kind === 'exclusion').map((m) => m.segment));
    const groupsOf = (segment: number, sentence: number, total: SampleSize) => {
      const byStart = new Map<number, ReportedNumber>();
      for (const g of summariesBySentence.get(key(segment, sentence)) ?? []) if (g.n && !(g.span.start <= total.span.start && total.span.end <= g.span.end)) byStart.set(g.n.span.start, g.n);
      for (const s of lowerCaseN.get(key(segment, sentence)) ?? []) byStart.set(s.n.span.start, s.n);
      byStart.delete(total.n.span.start);
      return [...byStart.values()];
    };
    const perGroupSentences = new Set(x.sampleSizes.filter((s) => s.scope === 'per-group').map((s) => key(s.segment, s.sentence)));
    // sizes said to be those randomised or enrolled ("randomised n = 32"), by the place of their number
    const assigned = new Set([...x.summaries.filter((g) => g.nAssigned && g.n).map((g) => g.n?.span.start as number), ...x.sampleSizes.filter((s) => s.assigned).map((s) => s.n.span.start)]);
    for (const total of totals) {
      // A size stated for each group ("n = 32 to each arm") says how the total splits; the other
      // sizes of that sentence are parts of the groups, not the groups.
      if (perGroupSentences.has(key(total.segment, total.sentence))) continue;
      // Only groups printed in the total's own sentence are certainly its parts.
      const groups = groupsOf(total.segment, total.sentence, total);
      if (groups.length < 2) continue;
      const sum = groups.reduce((s, n) => s + n.value, 0);
      if (sum === total.n.value) continue;
      // More sizes than groups ("n = 30 in each of two arms …; n = 14 of the gardeners …"):
      // when some of them add up to the total, the rest may be parts of those groups.
      if (groups.length > 2 && someAddUpTo(groups.map((n) => n.value), total.n.value)) continue;
      // "14 participants were assigned to A (N = 14, …)": a number of people equal to a group's
      // n is that group's size, not a total; and where the sentence states the total the
      // groups add up to, the other counts are parts of it.
      if (groups.some((n) => n.value === total.n.value)) continue;
      if ((totalsBySegment.get(total.segment) ?? []).some((t) => t.n.value === sum)) continue;
      const excluded = withExclusions.has(total.segment);
      if (excluded && sum < total.n.value) continue;
      // groups counted as randomised beside a total that is not (or the other way round) count
      // two stages of the study: they need not add up
      const stages = groups.some((n) => assigned.has(n.span.start) !== assigned.has(total.n.span.start));
      out.push({
        messageId: 'sum-differs',
        span: total.span,
        message: fill(messages['sum-differs'], { total: total.printed, ns: groups.map((n) => n.printed).join(' + '), sum, n: total.n.value, why: sum < total.n.value ? ', and the paragraph does not say who was left out' : '' }),
        reported: total.printed,
        check: 'Check the total and the group sizes; say how many were excluded and why.',
        related: groups.map((n) => ({ span: n.span, message: 'a group size' })),
        block: total.block,
        ...(stages ? { uncertain: ['the group sizes and the total count different stages (those randomised or enrolled, and those analysed or reported), which need not agree'] } : {}),
      });
    }
    return out;
  },
};
