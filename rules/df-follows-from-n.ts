import { dfInterval, fill, inferDesign, modelDoubt, pooledErrorDoubt, withDoubt, numberInterval, showInterval, showNumber, type DfFigure, type Rule, type RuleFinding, NO_OPTIONS, descriptiveDoubts, type LinkedResult, isWholeDf, type ReportedNumber, welchDfInterval } from '../src/rule-api/index.js';
import { welchDfRange, type Interval } from '../src/stats/index.js';

const messages = {
  'one-group': 'Reported df = {df} for one group of n = {n}; a one-sample or paired t has n − 1 = {expected} df.',
  'student': "Reported df = {df} for two groups of n = {n1} and {n2}; Student's t has n1 + n2 − 2 = {expected} df.",
  'paired': 'Reported df = {df} for a paired design with n = {n}; a paired t has n − 1 = {expected} df.',
  'welch-range': "Reported df = {df} for two groups of n = {n1} and {n2}; Welch's df lies between min(n1, n2) − 1 = {low} and n1 + n2 − 2 = {high}.",
  'welch-sds': "Reported df = {df}; the Welch–Satterthwaite df from the SDs and ns ({inputs}) is {expected}.",
};

/** The df agrees with the group sizes (and, for Welch's test, with the SDs). */
export const dfFollowsFromN: Rule = {
  id: 'df-follows-from-n',
  summary: "The df agrees with the group sizes: n − 1, n1 + n2 − 2, or the Welch–Satterthwaite value from the SDs.",
  kind: 'inconsistency',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    // the numbers of cluster means each sentence says are compared ("the 12 school means"), once
    const clusterMeans = new Map<string, Array<{ value: number; printed: string }>>();
    for (const c of document.extraction.unitCounts) {
      if (!c.clusterMeans) continue;
      const k = `${c.segment}:${c.sentence}`;
      clusterMeans.set(k, [...(clusterMeans.get(k) ?? []), { value: c.value, printed: c.printed }]);
    }
    for (const result of document.results) {
      const r = result.report;
      const link = result.context.descriptives;
      if (!r.df) continue;
      if (!link) {
        const df = r.df.value;
        const base = { span: r.df.span, reported: r.printed, resultId: r.id, block: r.block };
        const pair = result.context.groupSizes;
        if (pair && isWholeDf(r.df) && result.context.design.value !== 'paired') {
          // two groups' sizes printed with the test ("n = 25 and 23", "in 26 and 28 employees")
          const [n1, n2] = [pair[0].value, pair[1].value];
          if (df !== n1 + n2 - 2 && !(n1 === n2 && df === n1 - 1)) {
            const welch = wholeWelch(df, n1, n2);
            if (result.testName?.variant === 'welch') {
              // its own words name Welch's test: the df is Welch's, printed whole
              if (!welch.fits) out.push({ ...base, ...welchRangeFinding(r.df, n1, n2), related: [{ span: pair[0].span, message: 'the group sizes' }] });
              continue;
            }
            const doubt = result.testName?.variant === undefined && welch.fits && result.untiedWelch ? welchDoubt(result, welch) : undefined;
            out.push(withDoubt({ ...base, ...(doubt ? { uncertain: [doubt.text] } : {}), messageId: 'student', message: fill(messages.student, { df: r.df.printed, n1, n2, expected: n1 + n2 - 2 }), check: 'Check the df and the group sizes against the output.', related: [{ span: pair[0].span, message: 'the group sizes' }, ...(doubt?.related ?? [])], figure: dfFigure(r.df, studentAllowed(n1, n2)) }, pooledErrorDoubt(result, n1 + n2 - 2), modelDoubt(result)));
          }
          continue;
        }
        // A paired or one-sample design stated in words, with the units counted once in the
        // result's own sentence ("the same 24 employees … t(21) = …", "the walking group
        // (n = 24) was above the target of 4"): such a test has n − 1 df.
        const units = unitsInSentence(result);
        if (units !== undefined && isWholeDf(r.df) && df !== units.n - 1 && df !== 2 * units.n - 2) {
          const id = result.context.design.value === 'paired' ? 'paired' : 'one-group';
          out.push(withDoubt({ ...base, messageId: id, message: fill(messages[id], { df: r.df.printed, n: units.n, expected: units.n - 1 }), check: id === 'paired' ? 'Check the df against the number of pairs.' : 'Check the df and n against the output; an n that counts excluded participants is a common cause.', related: [{ span: units.span, message: id === 'paired' ? 'the number of pairs' : 'the group size' }], figure: dfFigure(r.df, [{ label: 'n − 1', low: units.n - 1, high: units.n - 1 }]) }, pooledErrorDoubt(result, units.n - 1), modelDoubt(result)));
        }
        continue;
      }
      const perGroup = result.context.sampleSizes.find((s) => s.scope === 'per-group')?.n.value;
      const ns = link.groups.map((g) => g.n?.value ?? perGroup);
      if (ns.some((n) => n === undefined)) continue;
      const df = r.df.value;
      const [dfLow, dfHigh] = dfInterval(r.df);
      // a sample tested against a reference printed with its own N ("the published norm (M = 21.5,
      // SD = 7.0, N = 1200)"): a one-sample test, whose df is the sample's n − 1
      if (link.groups.length === 2 && inferDesign(result) !== 'independent' && link.groups.some((g) => g.asReference) && link.groups.some((g) => !g.asReference && g.n !== undefined && g.n.value - 1 === df)) continue;
      // sizes said to be those randomised ("randomised n = 32") need not be those analysed
      const assigned = link.groups.find((g) => g.nAssigned);
      // a test of cluster means ("comparing the 12 school means, t(10)") counts the clusters
      const dfValue = r.df.value;
      const clusters = (clusterMeans.get(`${r.segment}:${r.sentence}`) ?? []).find((c) => c.value === dfValue + 2 || c.value === dfValue + 1);
      const doubts = [
        ...(descriptiveDoubts(result).uncertain ?? []),
        ...(assigned ? [`the group sizes printed are those randomised or enrolled ("${assigned.printed.trim()}"), who need not be those analysed`] : []),
        ...(clusters ? [`the sentence compares cluster means ("${clusters.printed}"), whose number the df may count rather than the group sizes`] : []),
        // (without their number, only where the df is far below the people counted: fewer clusters than either group's size)
        ...(!clusters && result.clusterMeans && ns.every((n) => n !== undefined && dfValue + 2 < n) ? [`the sentence says the test is of cluster means ("${result.clusterMeans.printed}"), whose number the df counts rather than the group sizes`] : []),
      ];
      const base = { span: r.df.span, reported: r.printed, resultId: r.id, block: r.block, ...(doubts.length > 0 ? { uncertain: doubts } : {}) };
      const design = inferDesign(result);
      if (ns.length === 1) {
        const n = ns[0] as number;
        if (isWholeDf(r.df) && df !== n - 1) {
          out.push(withDoubt({ ...base, messageId: 'one-group', message: fill(messages['one-group'], { df: r.df.printed, n, expected: n - 1 }), check: 'Check the df and n against the output; an n that counts excluded participants is a common cause.', figure: dfFigure(r.df, [{ label: 'n − 1', low: n - 1, high: n - 1 }]) }, pooledErrorDoubt(result, n - 1), modelDoubt(result)));
        }
        continue;
      }
      const [n1, n2] = ns as [number, number];
      if (design === 'paired') {
        if (n1 === n2 && df !== n1 - 1) {
          // df = 2n − 2 is design-matches-analysis' finding, not a df typo
          if (df !== n1 + n2 - 2) out.push(withDoubt({ ...base, messageId: 'paired', message: fill(messages.paired, { df: r.df.printed, n: n1, expected: n1 - 1 }), check: 'Check the df against the number of pairs.', figure: dfFigure(r.df, [{ label: 'n − 1', low: n1 - 1, high: n1 - 1 }]) }, pooledErrorDoubt(result, n1 - 1), modelDoubt(result)));
        }
        continue;
      }
      if (isWholeDf(r.df)) {
        const sds = welchFromSpreads(link, n1, n2);
        const welch = wholeWelch(df, n1, n2, sds);
        if (result.testName?.variant === 'welch') {
          // its own words name Welch's test: the df is Welch's, printed whole (rounded or cut),
          // held to the SDs' Welch–Satterthwaite df even where it is n1 + n2 − 2
          if (!welch.fits) out.push({ ...base, ...(sds && welch.by === 'sds' ? welchSdsFinding(r.df, link, sds) : welchRangeFinding(r.df, n1, n2)) });
          continue;
        }
        if (df !== n1 + n2 - 2 && !(design === 'independent' && n1 === n2 && df === n1 - 1) && !(n1 === n2 && df === n1 - 1)) {
          // named by no words, its own or the text's, the test is taken for Student's; a df that the
          // SDs give as Welch's, printed whole, or one within Welch's range where the text names
          // Welch's test elsewhere, leaves that reading open: the finding then rests on an
          // uncertain link and is a note
          const doubt = result.testName?.variant === undefined && !result.untiedStudent && welch.fits && (welch.by === 'sds' || result.untiedWelch) ? welchDoubt(result, welch) : undefined;
          out.push(withDoubt({ ...base, ...(doubt ? { uncertain: [...(base.uncertain ?? []), doubt.text] } : {}), messageId: 'student', message: fill(messages.student, { df: r.df.printed, n1, n2, expected: n1 + n2 - 2 }), check: 'Check the df and the group sizes against the output.', ...(doubt?.related ? { related: doubt.related } : {}), figure: dfFigure(r.df, studentAllowed(n1, n2)) }, pooledErrorDoubt(result, n1 + n2 - 2), modelDoubt(result)));
        }
        continue;
      }
      if (dfHigh < Math.min(n1, n2) - 1 || dfLow > n1 + n2 - 2) {
        out.push({ ...base, ...welchRangeFinding(r.df, n1, n2) });
        continue;
      }
      const sds = welchFromSpreads(link, n1, n2);
      if (sds && sds.ranges.every((x) => x.high < dfLow || x.low > dfHigh)) out.push({ ...base, ...welchSdsFinding(r.df, link, sds) });
    }
    return out;
  },
};

/** The descriptives tied to a result. */
type DescriptiveLink = NonNullable<LinkedResult['context']['descriptives']>;

/** The Welch–Satterthwaite df of two groups from their printed spreads, for each way the spreads can be read (SEs are SD/√n; spreads of unstated kind are tried both ways). */
interface WelchFromSpreads {
  /** For each reading, whether the spreads were read as SEs. */
  readings: boolean[];
  ranges: Interval[];
  inputs: [string, string];
}

function welchFromSpreads(link: DescriptiveLink, n1: number, n2: number): WelchFromSpreads | undefined {
  const [g1, g2] = link.groups;
  if (!g1?.spread || !g2?.spread) return undefined;
  const kinds = link.spreadKinds;
  const readings = kinds.every((k) => k === 'SD') ? [false] : kinds.every((k) => k === 'SE') ? [true] : kinds.every((k) => k === 'unstated') ? [false, true] : [];
  if (readings.length === 0) return undefined;
  const sd = (b: [number, number], n: number, asSE: boolean): [number, number] => (asSE ? [b[0] * Math.sqrt(n), b[1] * Math.sqrt(n)] : b);
  const [s1, s2] = [g1.spread.number, g2.spread.number];
  return { readings, ranges: readings.map((asSE) => welchDfRange(sd(numberInterval(s1), n1, asSE), n1, sd(numberInterval(s2), n2, asSE), n2)), inputs: [g1.printed, g2.printed] };
}

/**
 * A whole df read as a Welch df printed whole, rounded or cut (welchDfInterval: df − 0.5 to df + 1).
 * It fits when the Welch–Satterthwaite df from the spreads (any reading) reaches that span, or,
 * without spreads, when Welch's range min(n1, n2) − 1 to n1 + n2 − 2 does.
 */
function wholeWelch(df: number, n1: number, n2: number, sds?: WelchFromSpreads): { fits: boolean; by: 'sds' | 'range'; low: number; high: number; welch: Interval; bothReadings?: true } {
  const [low, high] = welchDfInterval(df);
  const reaches = (x: Interval) => x.high >= low && x.low < high;
  if (sds) {
    const welch = { low: Math.min(...sds.ranges.map((x) => x.low)), high: Math.max(...sds.ranges.map((x) => x.high)) };
    return { fits: sds.ranges.some(reaches), by: 'sds', low, high, welch, ...(sds.readings.length > 1 ? { bothReadings: true as const } : {}) };
  }
  const welch = { low: Math.min(n1, n2) - 1, high: n1 + n2 - 2 };
  return { fits: reaches(welch), by: 'range', low, high, welch };
}

/** Why a whole df that Student's test does not give may be a Welch df printed whole, in the words of a note. */
function welchDoubt(result: LinkedResult, w: ReturnType<typeof wholeWelch>): { text: string; related?: Array<{ span: { start: number; end: number }; message: string }> } {
  const df = result.report.df?.printed.trim() ?? '';
  const printedWhole = `a Welch df printed whole (rounded or cut: ${showNumber(w.low)} to ${showNumber(w.high)})`;
  const fit = w.by === 'sds' ? `the Welch–Satterthwaite df from the ${w.bothReadings ? 'spreads (read as SDs, and as SEs)' : 'SDs'} and ns, ${showInterval(w.welch.low, w.welch.high)}, can be printed as ${df}` : `${df} lies within Welch's range, min(n1, n2) − 1 = ${w.welch.low} to n1 + n2 − 2 = ${w.welch.high}`;
  const named = result.untiedWelch;
  if (named) {
    return { text: `Welch's test is named elsewhere in the text, “${named.printed}”, not with this result, and its df of ${df} may be ${printedWhole}: ${fit}`, related: [{ span: named.span, message: "Welch's test named here" }] };
  }
  return { text: `the text does not say which t-test gave this result, and its df of ${df} may be ${printedWhole}: ${fit}` };
}

/** A df outside Welch's range for the two group sizes. */
function welchRangeFinding(df: ReportedNumber, n1: number, n2: number): Pick<RuleFinding, 'messageId' | 'message' | 'check' | 'figure'> {
  const low = Math.min(n1, n2) - 1;
  const high = n1 + n2 - 2;
  return { messageId: 'welch-range', message: fill(messages['welch-range'], { df: df.printed, n1, n2, low, high }), check: 'Check the df and the group sizes against the output.', figure: dfFigure(df, [{ label: "Welch's range", low, high }]) };
}

/** A df the Welch–Satterthwaite value from the printed SDs and ns does not reach. */
function welchSdsFinding(df: ReportedNumber, link: DescriptiveLink, sds: WelchFromSpreads): Pick<RuleFinding, 'messageId' | 'message' | 'check' | 'figure' | 'recomputed'> {
  const { readings, ranges } = sds;
  const range = ranges[0] as Interval;
  return {
    messageId: 'welch-sds',
    message: fill(messages['welch-sds'], { df: df.printed, inputs: sds.inputs.join('; '), expected: showInterval(range.low, range.high) }),
    recomputed: { quantity: 'Welch–Satterthwaite df', low: range.low, high: range.high, inputs: [...sds.inputs], assumptions: [readings.length > 1 ? 'spreads read as SDs, and as SEs' : readings[0] ? 'spreads are SEs, as labelled (SD = SE·√n)' : 'spreads are SDs, as labelled', ...(isWholeDf(df) ? [`Welch's test, as its words say: the whole df read as rounded or cut (${welchDfInterval(df.value).map(showNumber).join(' to ')})`] : [])] },
    check: 'Check the df, the SDs and the group sizes against the output.',
    figure: dfFigure(df, ranges.map((x, k) => ({ label: readings.length > 1 ? `Welch–Satterthwaite, ${readings[k] ? 'as SEs' : 'as SDs'}` : 'Welch–Satterthwaite', low: x.low, high: x.high }))),
  };
}

/** What a picture of a df finding draws: the printed df (its rounding, when fractional) and the df the sizes allow. */
function dfFigure(df: ReportedNumber, allowed: DfFigure['allowed']): DfFigure {
  const [low, high] = dfInterval(df);
  return { kind: 'df', reported: { low, high }, allowed };
}

/** The whole df two groups allow: Student's n1 + n2 − 2, and n − 1 where equal sizes may be pairs. */
function studentAllowed(n1: number, n2: number): DfFigure['allowed'] {
  return [{ label: 'n1 + n2 − 2', low: n1 + n2 - 2, high: n1 + n2 - 2 }, ...(n1 === n2 ? [{ label: 'n − 1 (pairs)', low: n1 - 1, high: n1 - 1 }] : [])];
}

/** The number of units of a design stated paired or one-sample in words, printed once in the result's sentence. */
function unitsInSentence(result: LinkedResult): { n: number; span: { start: number; end: number } } | undefined {
  const d = result.context.design;
  if ((d.value !== 'paired' && d.value !== 'one-sample') || d.basis === 'default' || d.basis === 'structure') return undefined;
  const r = result.report;
  const own = result.context.sampleSizes.filter((s) => s.segment === r.segment && s.sentence === r.sentence && s.scope !== 'per-group' && s.scope !== 'subset');
  const first = own[0];
  return first && own.every((s) => s.n.value === first.n.value) ? { n: first.n.value, span: first.span } : undefined;
}
