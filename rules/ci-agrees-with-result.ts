import { fill, linkDoubts, numberInterval, showBound, showInterval, showNumber, resultDfInterval, tInterval, type IntervalFigure, type LinkedResult, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';
import { sideOfAlpha, twoSidedCriticalT, twoSidedPRange, type Box } from '../src/stats/index.js';

const messages = {
  'not-centred': 'Reported {ci} with estimate {estimate}: a t-based CI is centred on its estimate, but the midpoint is {mid}.',
  'width-vs-t': 'Reported {ci} and {reported}. From the CI, SE = width / (2 × critical value) and t = estimate / SE: |t| {impliedT} with the t critical value ({tCrit}) or {impliedZ} with the normal one (1.96 for 95%); the reported |t| is {tRange}. The implied p is {impliedP} (Altman & Bland 2011).',
  'zero-vs-p': 'Reported {ci} and {p}: a {level} CI {zero} zero exactly when p {side} {alpha}, but here it {actual}.',
};

/** Confidence interval, estimate, t and p of one result agree. */
export const ciAgreesWithResult: Rule = {
  id: 'ci-agrees-with-result',
  summary: 'A confidence interval reported with a t-test is centred on the estimate, has the width t implies, and excludes zero exactly when p < alpha.',
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const result of document.results) {
      const r = result.report;
      const link = result.context.interval;
      if (!link || !r.df || r.tOp !== '=') continue;
      const ci = link.item;
      const lo = numberInterval(ci.low);
      const hi = numberInterval(ci.high);
      // The estimate: printed with a label, else from the linked means, else the midpoint.
      const estimate = estimateBox(result, midpointOf(lo, hi));
      let found = judge(result, ci, lo, hi, estimate, undefined);
      if (!found) continue;
      // A one-sample test's interval is often that of the mean rather than of the difference
      // from the test value: with the test value printed, that reading is checked too; without
      // it, the interval cannot be read either way with certainty.
      const ofMean = meanReading(result);
      if (ofMean?.mu !== undefined) {
        const shift = (b: Box): Box => [b[0] - (ofMean.mu as number), b[1] - (ofMean.mu as number)];
        const [slo, shi] = [shift(lo), shift(hi)];
        const asMean = judge(result, ci, slo, shi, ofMean.estimate ?? { box: midpointOf(slo, shi), printed: showInterval(...midpointOf(slo, shi)), source: 'midpoint' }, ofMean.mu);
        if (!asMean) continue;
        // centred on the mean, the interval is the mean's: what is wrong with it is said that way
        if (asMean.messageId !== 'not-centred') found = asMean;
      }
      const fromMeans = estimate.source === 'difference of the means' || estimate.source === 'mean minus the reference value';
      const doubts = [
        ...linkDoubts({ descriptives: fromMeans ? result.context.descriptives : undefined, linked: [link, estimate.source === 'as printed' ? result.context.estimate : undefined] }),
        ...(ofMean && ofMean.mu === undefined ? ['the test may be a one-sample test whose interval is that of the mean, and no test value is printed to turn it into the interval of the difference'] : []),
        // an interval by another method (bootstrap, Wilson, exact) need not be estimate ± t × SE
        ...(ci.method !== undefined ? [`the interval is a ${ci.method} interval, which need not be the estimate ± t × SE`] : []),
        // its width and its side of zero depend on the level; its centre does not
        ...(ci.levelAssumed && found.messageId !== 'not-centred' ? ["the interval's level is printed neither with it nor in its table's caption, and 95% was assumed"] : []),
        // words of a model in the result's own sentence ("adjusted difference 1.9 kg (95% CI …)"):
        // the interval may be the adjusted estimate's, not the t's (a coefficient's t and CI are
        // both the model's: no doubt there)
        ...(result.modelBased && result.modelBased.segment === r.segment && result.modelBased.sentence === r.sentence && result.context.estimate?.item.kind !== 'coefficient' && !result.context.coefficient ? [`the sentence speaks of a model ("${result.modelBased.printed.trim()}"), so the interval may be of an adjusted estimate rather than of the difference the t tests`] : []),
      ];
      out.push({
        ...found,
        span: ci.span,
        reported: `${ci.printed}; ${r.printed}`,
        resultId: r.id,
        block: r.block,
        related: [{ span: r.span, message: 'the test this interval belongs to' }],
        ...(doubts.length > 0 ? { uncertain: doubts } : {}),
      });
    }
    return out;
  },
};

type Estimate = { box: Box; printed: string; source: string };
type Verdict = Pick<RuleFinding, 'messageId' | 'message' | 'check' | 'recomputed' | 'figure'>;

const midpointOf = (lo: Box, hi: Box): Box => [(lo[0] + hi[0]) / 2, (lo[1] + hi[1]) / 2];

/**
 * Whether the result may be a one-sample test (stated so, or of unknown design with at most one
 * group tied to it) whose interval is printed without a labelled estimate, and if so the test value and the estimate M − μ0 for reading its interval
 * as the interval of the mean.
 */
function meanReading(result: LinkedResult): { mu?: number; estimate?: Estimate } | undefined {
  const c = result.context;
  const groups = c.descriptives?.groups ?? [];
  // an estimate printed with its label ("mean difference = −0.08") is what the interval is of
  if (c.estimate) return undefined;
  const oneSample = c.design.value === 'one-sample' || (c.design.value === 'unknown' && groups.length <= 1);
  if (!oneSample) return undefined;
  const mu = c.reference?.value.value;
  if (mu === undefined) return {};
  const mean = groups.length === 1 ? groups[0]?.mean : undefined;
  if (!mean) return { mu };
  const a = numberInterval(mean);
  return { mu, estimate: { box: [a[0] - mu, a[1] - mu], printed: `${mean.printed} − ${mu}`, source: 'mean minus the reference value' } };
}

/** The interval read with one estimate: centred on it, as wide as t implies, on the side of zero p says. */
function judge(result: LinkedResult, ci: LinkedResult['context']['intervals'][number]['item'], lo: Box, hi: Box, estimate: Estimate, shiftedBy: number | undefined): Verdict | undefined {
  const r = result.report;
  if (!r.df) return undefined;
  const midBox = midpointOf(lo, hi);
  const df = r.df.value;
  const [dfLow, dfHigh] = resultDfInterval(result);
  // a fractional (Welch) df, or a whole one of a test named Welch's, was rounded: the critical value spans its interval
  const tCrit = twoSidedCriticalT(1 - ci.level, df);
  const tCritRange: Box = [twoSidedCriticalT(1 - ci.level, dfHigh), twoSidedCriticalT(1 - ci.level, dfLow)];
  const absEst: Box = estimate.box[0] <= 0 && estimate.box[1] >= 0 ? [0, Math.max(-estimate.box[0], estimate.box[1])] : [Math.min(Math.abs(estimate.box[0]), Math.abs(estimate.box[1])), Math.max(Math.abs(estimate.box[0]), Math.abs(estimate.box[1]))];
  const [tl, th] = tInterval(r);
  const absT: Box = [tl <= 0 && th >= 0 ? 0 : Math.min(Math.abs(tl), Math.abs(th)), Math.max(Math.abs(tl), Math.abs(th))];
  const figure = (reference?: IntervalFigure['reference']): IntervalFigure => intervalFigure(ci.level, lo, hi, midBox, estimate, tCritRange, absEst, absT, shiftedBy, reference);
  // Intervals from profile likelihood or the bootstrap need not be exactly symmetric, so a
  // gap up to 5% of the half-width is tolerated beyond rounding.
  const slack = 0.05 * Math.max(0, (hi[0] - lo[1]) / 2);
  if (estimate.source !== 'midpoint' && !overlapsEitherSign(estimate.box, [midBox[0] - slack, midBox[1] + slack])) {
    return { messageId: 'not-centred', message: fill(messages['not-centred'], { ci: ci.printed, estimate: `${estimate.printed} (${estimate.source})`, mid: showInterval(midBox[0], midBox[1]) }), check: 'Check the interval limits and the estimate against the output: one limit or the estimate may be mistyped.', figure: figure() };
  }
  const zCrit = twoSidedCriticalT(1 - ci.level, 1e9);
  const width: Box = [Math.max(hi[0] - lo[1], Number.MIN_VALUE), hi[1] - lo[0]];
  // A model coefficient's interval may come from the profile likelihood or the bootstrap
  // rather than estimate ± critical value × SE: a gap of a few per cent is allowed there.
  const modelSlack = estimate.source === 'as printed' && COEFFICIENT.test(result.context.estimate?.item.printed ?? '') ? 0.05 : 0;
  const implied = (crit: Box): Box => [((absEst[0] * 2 * crit[0]) / width[1]) * (1 - modelSlack), ((absEst[1] * 2 * crit[1]) / width[0]) * (1 + modelSlack)];
  const meets = (a: Box) => a[0] <= absT[1] && a[1] >= absT[0];
  const viaT = implied(tCritRange);
  const viaZ = implied([zCrit, zCrit]);
  if (!meets(viaT) && !meets(viaZ)) {
    const p = twoSidedPRange(viaT[0], viaT[1], dfLow, dfHigh);
    return {
      messageId: 'width-vs-t',
      message: fill(messages['width-vs-t'], { ci: ci.printed, reported: r.printed, impliedT: showInterval(viaT[0], viaT[1]), tCrit: tCrit.toFixed(3), impliedZ: showInterval(viaZ[0], viaZ[1]), tRange: absT[0] === absT[1] ? showNumber(absT[0]) : `${showBound(absT[0], r.t.decimals, r.t.exponent)} to ${showBound(absT[1], r.t.decimals, r.t.exponent)}`, impliedP: showInterval(p.low, p.high) }),
      recomputed: { quantity: '|t| implied by the CI', low: viaT[0], high: viaT[1], inputs: [ci.printed, `estimate ${estimate.printed} (${estimate.source})`, `df = ${r.df.printed}`], assumptions: [`${Math.round(ci.level * 100)}% interval from the t distribution (or the normal)`, ...(modelSlack > 0 ? ['a model coefficient: 5% allowed for profile or bootstrap intervals'] : [])] },
      check: 'Check the interval, the estimate and t against the output; a CI built with the SD instead of the SE is a common cause.',
      figure: figure(),
    };
  }
  const p = r.p;
  const alpha = result.alpha.value;
  // A Wald (normal) interval beside a t-based p may legitimately disagree about zero at small df.
  if (p?.kind === 'value' && p.number && meets(viaT) && Math.abs(1 - ci.level - alpha) < 1e-9) {
    const excludes = lo[0] > 0 || hi[1] < 0;
    const includes = lo[1] < 0 && hi[0] > 0;
    const pv = numberInterval(p.number);
    const reportedLow = p.op === '<' || p.op === '<=' ? 0 : pv[0];
    const reportedHigh = p.op === '>' || p.op === '>=' ? 1 : pv[1];
    const side = sideOfAlpha(reportedLow, reportedHigh, alpha, p.op === '<');
    if ((excludes && side === 'above') || (includes && side === 'below')) {
      return {
        messageId: 'zero-vs-p',
        message: fill(messages['zero-vs-p'], { ci: ci.printed, p: p.printed, level: `${Math.round(ci.level * 100)}%`, zero: 'excludes', side: '<', alpha, actual: excludes ? 'excludes zero and p is not below alpha' : 'includes zero and p is below alpha' }),
        check: 'Check the interval and p against the output; they come from the same estimate and SE.',
        figure: figure({ value: 0, label: 'zero' }),
      };
    }
  }
  return undefined;
}

/**
 * What a picture of the interval draws: the printed limits, their midpoint, the estimate, and the
 * interval the reported t implies around the estimate, estimate ± critical value × |estimate| / |t|
 * (the same relation the width check inverts), each end over the rounding of every input.
 */
function intervalFigure(level: number, lo: Box, hi: Box, mid: Box, estimate: Estimate, tCrit: Box, absEst: Box, absT: Box, shiftedBy: number | undefined, reference: IntervalFigure['reference']): IntervalFigure {
  const range = (b: Box) => ({ low: b[0], high: b[1] });
  const halfWidth: Box = absT[0] > 0 ? [(tCrit[0] * absEst[0]) / absT[1], (tCrit[1] * absEst[1]) / absT[0]] : [Number.NaN, Number.NaN];
  return {
    kind: 'interval',
    level,
    lower: range(lo),
    upper: range(hi),
    midpoint: range(mid),
    estimate: range(estimate.box),
    estimateSource: estimate.source,
    ...(absT[0] > 0 && Number.isFinite(halfWidth[1]) ? { fromT: { lower: { low: estimate.box[0] - halfWidth[1], high: estimate.box[1] - halfWidth[0] }, upper: { low: estimate.box[0] + halfWidth[0], high: estimate.box[1] + halfWidth[1] } } } : {}),
    ...(shiftedBy !== undefined ? { shiftedBy } : {}),
    ...(reference ? { reference } : {}),
  };
}

/** A labelled model coefficient (`b = 0.37`, `B = 1.2`, `β = .21`, `estimate = 0.4`). */
const COEFFICIENT = /^(?:b|B|β|estimate)(?![\p{L}])/u;

function overlapsEitherSign(a: Box, b: Box): boolean {
  return (a[0] <= b[1] && a[1] >= b[0]) || (-a[1] <= b[1] && -a[0] >= b[0]);
}

function estimateBox(result: LinkedResult, midpoint: Box): Estimate {
  const c = result.context;
  if (c.estimate) return { box: numberInterval(c.estimate.item.value), printed: c.estimate.item.value.printed, source: 'as printed' };
  const groups = c.descriptives?.groups ?? [];
  if (groups.length === 2 && groups[0]?.mean && groups[1]?.mean) {
    const a = numberInterval(groups[0].mean);
    const b = numberInterval(groups[1].mean);
    return { box: [a[0] - b[1], a[1] - b[0]], printed: `${groups[0].mean.printed} − ${groups[1].mean.printed}`, source: 'difference of the means' };
  }
  if (groups.length === 1 && groups[0]?.mean) {
    const a = numberInterval(groups[0].mean);
    const mu = c.reference?.value.value ?? 0;
    return { box: [a[0] - mu, a[1] - mu], printed: `${groups[0].mean.printed} − ${mu}`, source: 'mean minus the reference value' };
  }
  return { box: midpoint, printed: showInterval(midpoint[0], midpoint[1]), source: 'midpoint' };
}
