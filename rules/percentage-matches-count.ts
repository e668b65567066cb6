import { fill, numberInterval, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';
import { percentPossible } from '../src/stats/index.js';

const messages = {
  'percent-mismatch': 'Reported {reported}: {count} of {n} is {actual}%, which does not round to {percent}% (n = {n} from "{nPrinted}").',
};

/** A count printed with its percentage agrees with the n it is a percentage of. */
export const percentageMatchesCount: Rule = {
  id: 'percentage-matches-count',
  summary: 'A count printed with its percentage, such as 12 (40%), agrees with the group size in its sentence.',
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const x = document.extraction;
    const out: RuleFinding[] = [];
    const key = (segment: number, sentence: number) => `${segment}:${sentence}`;
    const sizes = new Map<string, Array<{ n: number; printed: string }>>();
    const add = (k: string, v: { n: number; printed: string }) => {
      const list = sizes.get(k);
      if (list) list.push(v);
      else sizes.set(k, [v]);
    };
    for (const s of x.sampleSizes) add(key(s.segment, s.sentence), { n: s.n.value, printed: s.printed });
    for (const g of x.summaries) if (g.n) add(key(g.segment, g.sentence), { n: g.n.value, printed: g.printed });
    for (const c of x.counts) {
      // a count of one group ("18 (60%) in the sock arm") is a percentage of that group, whose size
      // is not the sentence's total (nor an "Of the 60 …" before it): no denominator to check against
      if (c.inGroup) continue;
      // nor one whose base may be a part of the sentence's n ("Of 120 invited, 80 responded; 60 (75%)")
      if (c.baseOpen) continue;
      // the denominator printed with it ("of the 21 beds"), else the one n of its sentence
      const ns = c.of ? [{ n: c.of.value, printed: c.of.printed }] : (sizes.get(key(c.segment, c.sentence)) ?? []).filter((s) => s.n >= c.count.value && s.n > 0);
      if (ns.length !== 1) continue; // none, or several to choose from: no guess
      const only = ns[0] as { n: number; printed: string };
      if (only.n < c.count.value) continue;
      const [lo, hi] = numberInterval(c.percent);
      if (percentPossible(c.count.value, only.n, lo, hi)) continue;
      out.push({
        messageId: 'percent-mismatch',
        span: c.span,
        message: fill(messages['percent-mismatch'], { reported: c.printed, count: c.count.printed, n: only.n, actual: ((100 * c.count.value) / only.n).toFixed(2), percent: c.percent.printed, nPrinted: only.printed }),
        reported: c.printed,
        check: 'Check the count, the percentage and the denominator (missing data often change it).',
        block: c.block,
      });
    }
    return out;
  },
};
