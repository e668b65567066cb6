import { fill, inferDesign, numberInterval, showInterval, tInterval, type Rule, type RuleFinding, NO_OPTIONS, descriptiveDoubts, isWholeDf, ownGroupsDf, modelDoubt, pooledErrorDoubt, transformedDoubt, withDoubt } from '../src/rule-api/index.js';
import { pairedImpliedCorrelation, type Box } from '../src/stats/index.js';

const messages = {
  'correlation-above-one': 'Reported {reported} for one group measured twice ({inputs}, n = {n}). These imply a correlation of {r} between the two measurements, above 1: the SD of the differences would have to be smaller than any pair of SDs allows.',
  'correlation-below-minus-one': 'Reported {reported} for one group measured twice ({inputs}, n = {n}). These imply a correlation of {r} between the two measurements, below −1: t is too small for these means and SDs.',
};

/** For a paired design, means, SDs, n and t imply a correlation inside [−1, 1]. */
export const pairedCorrelationIsPossible: Rule = {
  id: 'paired-correlation-is-possible',
  summary: 'For a paired design, the means, SDs, n and t imply a correlation between the measurements inside [−1, 1].',
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const result of document.results) {
      const r = result.report;
      const link = result.context.descriptives;
      if (!link || link.groups.length !== 2 || r.tOp !== '=' || inferDesign(result) !== 'paired') continue;
      const [g1, g2] = link.groups;
      if (!g1?.mean || !g1.spread || !g2?.mean || !g2.spread) continue;
      const n = g1.n?.value ?? g2.n?.value ?? (r.df && isWholeDf(r.df) ? r.df.value + 1 : undefined);
      if (!n) continue;
      const sd = (g: typeof g1, kind: string): Box => {
        const b = numberInterval((g.spread as NonNullable<typeof g.spread>).number);
        return kind === 'SE' ? [b[0] * Math.sqrt(n), b[1] * Math.sqrt(n)] : b;
      };
      const [tl, th] = tInterval(r);
      const absT: Box = [tl <= 0 && th >= 0 ? 0 : Math.min(Math.abs(tl), Math.abs(th)), Math.max(Math.abs(tl), Math.abs(th))];
      const range = pairedImpliedCorrelation(numberInterval(g1.mean), sd(g1, link.spreadKinds[0] ?? 'SD'), numberInterval(g2.mean), sd(g2, link.spreadKinds[1] ?? 'SD'), n, absT);
      const id = range.low > 1 ? 'correlation-above-one' : range.high < -1 ? 'correlation-below-minus-one' : undefined;
      if (!id) continue;
      out.push(withDoubt({
        messageId: id,
        span: r.span,
        message: fill(messages[id], { reported: r.printed, inputs: `${g1.printed}; ${g2.printed}`, n, r: showInterval(range.low, range.high) }),
        reported: r.printed,
        recomputed: { quantity: 'implied correlation between the paired measurements', low: range.low, high: range.high, inputs: [g1.printed, g2.printed, `n = ${n}`, r.printed], assumptions: ['paired design', `spreads read as ${link.spreadKinds.join(' and ')}`] },
        check: 'Check the means, SDs, n and t against the output, and whether the SDs are of the measurements or of the differences.',
        figure: { kind: 'correlation', implied: { low: range.low, high: range.high } },
        resultId: r.id,
        block: r.block,
        ...descriptiveDoubts(result),
      }, pooledErrorDoubt(result, ownGroupsDf(result)), transformedDoubt(result), modelDoubt(result)));
    }
    return out;
  },
};
