import { describeAttempt, dfInterval, evaluateDescriptives, spreadReadings, fill, numberInterval, showInterval, type Rule, type RuleFinding, NO_OPTIONS, descriptiveDoubts, isWholeDf, ownGroupsDf, modelDoubt, pooledErrorDoubt, transformedDoubt, withDoubt } from '../src/rule-api/index.js';
import { pairedImpliedCorrelation } from '../src/stats/index.js';

const messages = {
  mismatch: 'Reported {reported}. Recomputed from the descriptives ({inputs}): {attempts}. None reproduces the reported |t| ({tRange}) within rounding{pairedNote}.',
  'named-variant-mismatch': "Reported {reported} as {named}. Recomputed from the descriptives ({inputs}): {attempts}. Only {other} reproduces it.",
};

/** The reported t follows from the means, spreads and sizes reported with it. */
export const tFollowsFromDescriptives: Rule = {
  id: 't-follows-from-descriptives',
  summary: 'The reported t follows from the means, SDs (or SEs) and group sizes reported with it.',
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const result of document.results) {
      const e = evaluateDescriptives(result);
      if (!e || e.fitsOnlyAgainstLabel) continue;
      const r = result.report;
      const labelled = e.attempts.filter((a) => a.reading === 'as labelled' || e.kinds.every((k) => k === 'unstated'));
      const inputs = e.groups.map((g) => `"${g.printed.trim()}"`).join('; ');
      const values = {
        reported: r.printed,
        inputs,
        attempts: labelled.map(describeAttempt).join('; '),
        tRange: showInterval(e.reportedAbsT.low, e.reportedAbsT.high),
      };
      if (e.fitsAsLabelled) {
        const named = r.namedVariant;
        const fitting = new Set(labelled.filter((a) => a.fits).map((a) => a.variant));
        if ((named === 'welch' && !fitting.has('welch') && fitting.has('student')) || (named === 'student' && !fitting.has('student') && fitting.has('welch'))) {
          out.push(withDoubt({
            messageId: 'named-variant-mismatch',
            span: r.span,
            message: fill(messages['named-variant-mismatch'], { ...values, named: named === 'welch' ? "Welch's test" : "Student's test", other: named === 'welch' ? "Student's pooled t" : "Welch's t" }),
            reported: r.printed,
            check: 'Check which test was run and name that one; the df should match it too.',
            resultId: r.id,
            block: r.block,
            ...descriptiveDoubts(result),
          }, pooledErrorDoubt(result, ownGroupsDf(result)), transformedDoubt(result), modelDoubt(result)));
        }
        continue;
      }
      // Two groups of unknown design may be one group measured twice: then the descriptives
      // cannot give t without the SD of the differences; stay quiet if that reading is possible.
      let pairedNote = '';
      if (e.groups.length === 2 && e.design === 'unknown' && r.df && isWholeDf(r.df)) {
        const [g1, g2] = e.groups;
        const n = r.df.value + 1;
        // Spreads labelled SE are SD/√n of each measurement; unstated ones may be either.
        const sdReadings = spreadReadings(e.kinds);
        const possible = sdReadings.some((asSE) => {
          const sd = (g: typeof g1): [number, number] => {
            const b = numberInterval(g!.spread!.number);
            return asSE ? [b[0] * Math.sqrt(n), b[1] * Math.sqrt(n)] : b;
          };
          const rRange = pairedImpliedCorrelation(numberInterval(g1!.mean!), sd(g1), numberInterval(g2!.mean!), sd(g2), n, [e.reportedAbsT.low, e.reportedAbsT.high]);
          return rRange.low <= 1 && rRange.high >= -1;
        });
        if (possible) continue;
        pairedNote = '; read as one group measured twice, the implied correlation would lie outside [−1, 1]';
      }
      out.push(withDoubt({
        messageId: 'mismatch',
        span: r.span,
        message: fill(messages.mismatch, { ...values, pairedNote }),
        reported: r.printed,
        recomputed: {
          quantity: '|t| from the descriptives',
          low: Math.min(...labelled.map((a) => a.absT.low)),
          high: Math.max(...labelled.map((a) => a.absT.high)),
          inputs: e.groups.map((g) => g.printed),
          assumptions: [...new Set(labelled.map((a) => `${a.variant} (${a.nSource})`)), ...e.limits, ...(r.df ? [`df ${dfInterval(r.df).join(' to ')}`] : [])],
        },
        check: 'Check the means, SDs and group sizes against the analysis output, and whether the spread printed is an SD.',
        resultId: r.id,
        block: r.block,
        ...descriptiveDoubts(result),
      }, pooledErrorDoubt(result, ownGroupsDf(result)), transformedDoubt(result), modelDoubt(result)));
    }
    return out;
  },
};

