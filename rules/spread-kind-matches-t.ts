import { describeAttempt, evaluateDescriptives, fill, type Rule, type RuleFinding, NO_OPTIONS, descriptiveDoubts, ownGroupsDf, modelDoubt, pooledErrorDoubt, transformedDoubt, withDoubt } from '../src/rule-api/index.js';

const messages = {
  'se-labelled-sd': 'Reported {reported} with spreads labelled SD ({inputs}). Read as SDs they give {labelled}; the reported t is reproduced only if they are standard errors: {against}.',
  'sd-labelled-se': 'Reported {reported} with spreads labelled SE ({inputs}). Read as SEs they give {labelled}; the reported t is reproduced only if they are standard deviations: {against}.',
};

/** The kind of spread printed (SD or SE) is the one the reported t was computed with. */
export const spreadKindMatchesT: Rule = {
  id: 'spread-kind-matches-t',
  summary: 'The spread printed with the means is the kind (SD or SE) that reproduces the reported t.',
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const result of document.results) {
      const e = evaluateDescriptives(result);
      if (!e?.fitsOnlyAgainstLabel) continue;
      const labelledAsSD = e.kinds.includes('SD');
      const id = labelledAsSD ? 'se-labelled-sd' : 'sd-labelled-se';
      const r = result.report;
      out.push(withDoubt({
        messageId: id,
        span: r.span,
        message: fill(messages[id], {
          reported: r.printed,
          inputs: e.groups.map((g) => `"${g.printed.trim()}"`).join('; '),
          labelled: e.attempts.filter((a) => a.reading === 'as labelled').map(describeAttempt).join('; '),
          against: e.attempts.filter((a) => a.reading !== 'as labelled' && a.fits).map(describeAttempt).join('; '),
        }),
        reported: r.printed,
        check: labelledAsSD
          ? 'Check whether the values printed as SD are standard errors (SE = SD/√n); relabel them or report the SDs.'
          : 'Check whether the values printed as SE are standard deviations.',
        related: e.groups.map((g) => ({ span: g.spread?.kindSpan ?? g.span, message: 'the spread and its label' })),
        resultId: r.id,
        block: r.block,
        ...descriptiveDoubts(result),
      }, pooledErrorDoubt(result, ownGroupsDf(result)), transformedDoubt(result), modelDoubt(result)));
    }
    return out;
  },
};
