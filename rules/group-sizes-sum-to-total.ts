import { fill, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  'sum-differs': 'Reported {total} and groups of {ns} in the same paragraph: the groups add up to {sum}, not {n}{why}.',
};

/** Group sizes stated with a total add up to it. */
export const groupSizesSumToTotal: Rule = {
  id: 'group-sizes-sum-to-total',
  summary: 'Group sizes printed in the same paragraph as a total N add up to it (or the paragraph says why not).',
  kind: 'doubtful',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const x = document.extraction;
    const out: RuleFinding[] = [];
    const totals = x.sampleSizes.filter((s) => s.scope === 'total');
    for (const total of totals) {
      const groups = x.summaries.filter((g) => g.segment === total.segment && g.n && !(g.span.start <= total.span.start && total.span.end <= g.span.end));
      if (groups.length < 2) continue;
      const sum = groups.reduce((s, g) => s + (g.n?.value ?? 0), 0);
      if (sum === total.n.value) continue;
      // "14 participants were assigned to A (N = 14, …)": a number of people equal to a group's
      // n is that group's size, not a total; and where the paragraph states the total the
      // groups add up to, the other counts are parts of it.
      if (groups.some((g) => g.n?.value === total.n.value)) continue;
      if (totals.some((t) => t.segment === total.segment && t.n.value === sum)) continue;
      const excluded = x.mentions.some((m) => m.kind === 'exclusion' && m.segment === total.segment);
      if (excluded && sum < total.n.value) continue;
      out.push({
        messageId: 'sum-differs',
        span: total.span,
        message: fill(messages['sum-differs'], { total: total.printed, ns: groups.map((g) => g.n?.printed).join(' + '), sum, n: total.n.value, why: sum < total.n.value ? ', and the paragraph does not say who was left out' : '' }),
        reported: total.printed,
        check: 'Check the total and the group sizes; say how many were excluded and why.',
        related: groups.map((g) => ({ span: g.n?.span ?? g.span, message: 'a group size' })),
        block: total.block,
      });
    }
    return out;
  },
};
