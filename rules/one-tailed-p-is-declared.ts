import {
  evaluateP, evaluateStatisticP, fill, pLastDigit, pPlaceholders, showInterval, statisticPlaceholders, type LinkedStatistic, type Rule, type RuleFinding, type StatisticPEvaluation, type Gap, type StatisticReading, NO_OPTIONS,
} from '../src/rule-api/index.js';
import { distanceBetween, sideOfAlpha } from '../src/stats/index.js';

const messages = {
  'undeclared-one-tailed':
    'Reported {reported}. It matches the one-tailed p from {inputs} ({oneTailed}), not the two-tailed p ({twoTailed}), and nothing in the text says the test was one-tailed.',
  'undeclared-one-tailed-opposite':
    'Reported {reported}. It matches the one-tailed p against the direction of t from {inputs} ({oneTailedOpposite}), as an equivalence or non-inferiority test reports it, not the two-tailed p ({twoTailed}), and nothing beside it says the test was one-tailed.',
  'one-tailed-stated-elsewhere':
    'Reported {reported}. It matches the one-tailed p from {inputs} ({oneTailed}), not the two-tailed p ({twoTailed}). The text speaks of a one-tailed analysis elsewhere ("{elsewhere}"), but not in the sentence or paragraph of this result, nor of every test, so plumbline could not tie the two.',
  'one-tailed-power-calculation':
    'Reported {reported}. It matches the one-tailed p from {inputs} ({oneTailed}), not the two-tailed p ({twoTailed}). The text sizes the study with a one-tailed power calculation ("{elsewhere}"), which does not say that the test itself was one-tailed.',
  'undeclared-one-tailed-changes-significance':
    'Reported {reported}. It matches the one-tailed p from {inputs} ({oneTailed}), not the two-tailed p ({twoTailed}), and nothing in the text says the test was one-tailed; two-tailed, the result would be {recomputedSide} at alpha {alpha}.',
};

/** A p that only a one-tailed test gives is declared as one-tailed. */
export const oneTailedPIsDeclared: Rule = {
  id: 'one-tailed-p-is-declared',
  summary: 'A p value that matches only the one-tailed reading comes with a statement that the test was one-tailed.',
  kind: 'doubtful',
  defaultLevel: 'note',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const result of document.results) {
      const e = evaluateP(result);
      if (!e || (e.standing !== 'one-tailed-only' && e.standing !== 'one-tailed-opposite-only')) continue;
      const elsewhere = result.untiedSidedness;
      const id = e.standing === 'one-tailed-opposite-only'
        ? 'undeclared-one-tailed-opposite'
        : elsewhere?.planning ? 'one-tailed-power-calculation' : elsewhere ? 'one-tailed-stated-elsewhere' : e.decisionFlips ? 'undeclared-one-tailed-changes-significance' : 'undeclared-one-tailed';
      out.push({
        messageId: id,
        span: result.report.span,
        message: fill(messages[id], { ...pPlaceholders(result, e), elsewhere: elsewhere?.printed ?? '' }),
        ...(elsewhere ? { related: [{ span: elsewhere.span, message: elsewhere.planning ? 'the one-tailed power calculation' : 'the words about one-tailed tests' }] } : {}),
        reported: result.report.printed,
        recomputed: e.recomputed,
        gap: e.gap,
        figure: { kind: 'p' },
        check: 'If the test was one-tailed, say so (and why) where the test is described; otherwise report the two-tailed p.',
        resultId: result.report.id,
        block: result.report.block,
      });
    }
    for (const linked of document.statistics) {
      const finding = statisticFinding(linked);
      if (finding) out.push(finding);
    }
    return out;
  },
};

/** `0.011 to 0.012 (bracket as df)`: a reading's range, with what tells it apart from the others of its tail. */
function showReadings(readings: readonly StatisticReading[]): string {
  return readings.map((r) => `${showInterval(r.range.low, r.range.high)}${r.name.replace(/^(?:one|two)-tailed p/u, '')}`).join('; ');
}

/**
 * A z or r whose p only a one-tailed reading reproduces, with nothing that says the test was
 * one-tailed. The p-follows rules accept either reading of a z or r, so without this the
 * halving would pass unsaid. An F or χ² has one tail by definition and is never read so.
 */
function statisticFinding(linked: LinkedStatistic): RuleFinding | undefined {
  const s = linked.report;
  if (s.kind !== 'z' && s.kind !== 'correlation') return undefined;
  if (linked.sidedness.value === 'one') return undefined;
  const e: StatisticPEvaluation | undefined = evaluateStatisticP(linked);
  if (!e || !e.fits) return undefined;
  const two = e.readings.filter((r) => r.name.startsWith('two-tailed'));
  const one = e.readings.filter((r) => r.name.startsWith('one-tailed'));
  if (two.some((r) => r.fits)) return undefined;
  const fitting = one.filter((r) => r.fits);
  const alpha = linked.alpha.value;
  // two-tailed, the call at alpha would differ when every two-tailed reading lies on the other side
  const sides = new Set(two.map((r) => sideOfAlpha(r.range.low, r.range.high, alpha)));
  const twoSide = sides.size === 1 ? [...sides][0] : 'straddles';
  const flips = e.reportedSide !== 'straddles' && twoSide !== 'straddles' && twoSide !== e.reportedSide;
  const elsewhere = linked.untiedSidedness;
  const id = elsewhere?.planning ? 'one-tailed-power-calculation' : elsewhere ? 'one-tailed-stated-elsewhere' : flips ? 'undeclared-one-tailed-changes-significance' : 'undeclared-one-tailed';
  // what is recomputed and the gap are the two-tailed reading's, as for a t: it is the p the text implies
  const reported = e.reported;
  const nearestTwo = two.reduce((a, b) => (distanceBetween(b.range, reported.low, reported.high) < distanceBetween(a.range, reported.low, reported.high) ? b : a));
  const p = s.p;
  const unit = p?.op === '=' ? pLastDigit(p) : undefined;
  const point = p?.number ? distanceBetween(nearestTwo.range, p.number.value, p.number.value) : distanceBetween(nearestTwo.range, reported.low, reported.high);
  const gap: Gap = unit ? { absolute: point, lastDigitUnits: point / unit, roundingAllowance: unit / 2 } : { absolute: distanceBetween(nearestTwo.range, reported.low, reported.high) };
  return {
    messageId: id,
    span: s.reportSpan ?? s.span,
    message: fill(messages[id], {
      ...statisticPlaceholders(linked, e),
      oneTailed: showReadings(fitting),
      twoTailed: showReadings(two),
      recomputedSide: twoSide === 'below' ? 'significant' : 'not significant',
      elsewhere: elsewhere?.printed ?? '',
    }),
    ...(elsewhere ? { related: [{ span: elsewhere.span, message: elsewhere.planning ? 'the one-tailed power calculation' : 'the words about one-tailed tests' }] } : {}),
    reported: s.reportPrinted ?? s.printed,
    recomputed: { ...e.recomputed, quantity: nearestTwo.name, low: nearestTwo.range.low, high: nearestTwo.range.high, assumptions: [`two-tailed (${linked.sidedness.basis === 'default' ? 'default' : linked.sidedness.basis.replace('-', ' ')})`, ...e.recomputed.assumptions.slice(1)] },
    gap,
    check: 'If the test was one-tailed, say so (and why) where the test is described; otherwise report the two-tailed p.',
    resultId: linked.id,
    block: s.block,
    ...(linked.doubts.length > 0 ? { uncertain: linked.doubts } : {}),
  };
}
