import { fill, inferDesign, type Rule, type RuleFinding, NO_OPTIONS, isWholeDf } from '../src/rule-api/index.js';

const messages = {
  'df-imply-other-n': 'The document states {stated} ({where}), but every t-test implies a different number analysed: {implied}. Nothing in the text mentions exclusions or missing data.',
};

const BEFORE_RESULTS = /abstract|summary|method|participant|sample|subject|design|procedure/i;

/** Most groups a contrast said only in words ("Post hoc comparisons …") is taken to come from (common practice, no source: designs of more groups than this are rare). */
const MAX_CONTRAST_GROUPS = 6;

/** Most covariates a model said only in words ("adjusted for age, sex and BMI") is taken to have (common practice, no source). */
const MAX_COVARIATES = 6;

/** The total N stated for the study agrees with the df of the tests, or the text says why not. */
export const sampleSizeAgreesWithDf: Rule = {
  id: 'sample-size-agrees-with-df',
  summary: 'The total N stated in the abstract or methods agrees with the df the results imply, or the text explains the difference (exclusions, missing data).',
  kind: 'doubtful',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const x = document.extraction;
    const totals = x.sampleSizes.filter((s) => s.scope === 'total' && BEFORE_RESULTS.test(x.sections[s.segment] ?? ''));
    const stated = totals[0];
    if (!stated || document.results.length === 0) return [];
    if (x.mentions.some((m) => m.kind === 'exclusion')) return [];
    // Each test implies the number analysed: df + 2 for two independent groups, df + 1 for one
    // group or pairs; with the design unknown, either.
    // A regression coefficient's t (`b = -0.53, SE = 0.26, t(69) = …`) has the model's df,
    // N − k − 1 for k predictors unknown here: it implies no number analysed.
    const tests = document.results.filter((r) => r.context.estimate?.item.kind !== 'coefficient');
    const implied = tests
      .filter((r) => r.report.df && isWholeDf(r.report.df) && !r.report.plural)
      .map((r) => {
        const df = r.report.df?.value as number;
        const d = inferDesign(r);
        const own = d === 'independent' ? [df + 2] : d === 'paired' || d === 'one-sample' ? [df + 1] : [df + 1, df + 2];
        // A t that may be a contrast within a larger analysis of variance takes its error df,
        // N − k: with an F of k groups beside it (its df1 + 1), N = df + k too; with words of
        // contrasts only, any N = df + k for up to MAX_CONTRAST_GROUPS groups.
        const p = r.pooledError;
        const pooled = p === undefined ? [] : p.groups !== undefined ? [df + p.groups] : Array.from({ length: MAX_CONTRAST_GROUPS - 2 }, (_, i) => df + 3 + i);
        // a t from a model with k covariates ("adjusted for age, sex and BMI") has N − 2 − k df
        const model = r.modelBased ? Array.from({ length: MAX_COVARIATES }, (_, i) => df + 3 + i) : [];
        return { result: r, ns: [...new Set([...own, ...pooled, ...model])] };
      });
    if (implied.length === 0) return [];
    const N = stated.n.value;
    // Subgroup analyses use fewer; only when no test uses the whole sample is something unexplained.
    if (implied.some((i) => i.ns.includes(N))) return [];
    // A test implying more than N is not of this sample (another rule speaks to its df); when
    // most tests are, N is not the sample the results analyse.
    const within = implied.filter((i) => i.ns.some((n) => n <= N));
    if (within.length === 0 || within.length * 2 < implied.length) return [];
    // The text may describe, elsewhere, the samples the tests do use (a second study, a
    // subsample, those who returned a questionnaire, the wards of a trial whose ward means are
    // compared): when each test's number is one of them, the N is about something else. Any
    // count of people or units, in digits or words ("Twelve wards … N = 240 patients"), may be
    // it. The group sizes printed with the tests themselves describe no other sample.
    const withTests = new Set(document.results.map((r) => `${r.report.segment}:${r.report.sentence}`));
    const elsewhere = <T extends { segment: number; sentence: number }>(s: T) => !withTests.has(`${s.segment}:${s.sentence}`);
    const statedElsewhere = new Set(x.sampleSizes.filter((s) => s !== stated && elsewhere(s)).map((s) => s.n.value));
    for (const c of x.unitCounts) if (elsewhere(c) && c.span.start !== stated.n.span.start) statedElsewhere.add(c.value);
    if (within.every((i) => i.ns.some((n) => statedElsewhere.has(n)))) return [];
    // a loop, not Math.max(...): one entry per test, and a document may report tens of thousands
    let largest = -Infinity;
    for (const i of within) for (const n of i.ns) if (n <= N && n > largest) largest = n;
    const shown = [...new Set(within.map((i) => i.ns.join(' or ')))].slice(0, 6).join('; ');
    const first = within[0]?.result.report;
    // Signs that no test need use the whole N: several studies, analyses of a part of the sample,
    // three or more groups (a t compares two of them). The N is then not tied to the tests with
    // certainty, and the finding is a note saying why.
    const sign = (kind: 'several-studies' | 'part-of-sample' | 'many-arms') => x.mentions.find((m) => m.kind === kind);
    const studies = sign('several-studies');
    const part = sign('part-of-sample');
    // (three group sizes in one sentence of the abstract or methods that reports no statistic:
    // "randomised to strength training (n = 40), walking (n = 40) or advice (n = 40)"; a
    // statistic's own sentence prints its groups, the sites of an F as well as a t's two)
    const withStatistics = new Set(x.otherStatistics.map((o) => `${o.segment}:${o.sentence}`));
    const bySentence = new Map<string, number>();
    for (const s of x.sampleSizes) {
      const k = `${s.segment}:${s.sentence}`;
      if ((s.scope === 'per-group' || s.scope === 'unspecified') && elsewhere(s) && !withStatistics.has(k) && BEFORE_RESULTS.test(x.sections[s.segment] ?? '')) bySentence.set(k, (bySentence.get(k) ?? 0) + 1);
    }
    const threeSizes = x.sampleSizes.find((s) => (bySentence.get(`${s.segment}:${s.sentence}`) ?? 0) >= 3);
    const arms = sign('many-arms') ?? threeSizes;
    const uncertain = [
      ...(studies ? [`the text reports several studies ("${studies.printed}"), so the total need not be the sample of any one test`] : []),
      ...(part ? [`the text says an analysis uses part of the sample ("${part.printed}")`] : []),
      ...(arms ? [`the text describes three or more groups ("${arms.printed}"), and a t-test compares two of them`] : []),
    ];
    const out: RuleFinding[] = [{
      messageId: 'df-imply-other-n',
      span: stated.span,
      message: fill(messages['df-imply-other-n'], { stated: stated.printed, where: x.sections[stated.segment] ?? 'before the results', implied: shown }),
      reported: stated.printed,
      recomputed: { quantity: 'largest number analysed (df + 1 or df + 2)', low: largest, high: largest, inputs: within.map((i) => i.result.report.printed), assumptions: ['df + 2 for two independent groups, df + 1 for one group or pairs', ...(within.some((i) => i.result.pooledError) ? ['df + k for a contrast within an analysis of variance of k groups'] : []), ...(within.some((i) => i.result.modelBased) ? [`df + 2 + k for a model with k covariates, k up to ${MAX_COVARIATES}`] : [])] },
      check: 'Say how many participants were analysed in each test and why some were left out (a flow diagram helps).',
      related: first ? [{ span: first.span, message: 'the first test' }] : [],
      block: stated.block,
      ...(uncertain.length > 0 ? { uncertain } : {}),
    }];
    return out;
  },
};
