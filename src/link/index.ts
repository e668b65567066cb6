import type { ContextStatement, EstimateReport, Extraction, IntegerStatement, Mention, OtherStatistic, ReportedNumber, Sidedness, TableDimensions, TTestReport } from '../extract/types.js';
import type { Linked } from './descriptives.js';
import type { Directive, Span } from '../parse/types.js';
import type { DocumentSettings, LinkedDocument, LinkedResult, LinkedStatistic, PooledError, Setting } from './types.js';

export type * from './types.js';
export type { DescriptiveLink, Design, IntervalLink, IntervalTarget, LinkBasis, Linked, ResultContext } from './descriptives.js';
export { groupBy } from './descriptives.js';
export { repeatDoubt } from './repeats.js';
import { contextJoiner, fGroupsJoiner, groupBy, spreadStatements } from './descriptives.js';
import { sentenceKey, sentenceKeyOf } from './clauses.js';
import { testNames } from './testNames.js';
import { OWN_P_LABEL_GAP } from '../extract/statements.js';
import { measureStems } from '../extract/mentions.js';
export type { TestName, TestNameBasis } from './testNames.js';

/** Default alpha when nothing sets one: .05 (common practice, no source). */
export const DEFAULT_ALPHA = 0.05;

/**
 * Gives every reported t-test its tails and alpha, from the most specific place that says so
 * about the analysis: the report itself (`p = .03, one-tailed`), its sentence (the nearest
 * test takes the words), an equivalence test named in its sentence or the one before (either
 * reading then fits), a sentence of its paragraph that reports no test and plans no study (the
 * tails and alpha of a power calculation size the study; they are untied), a statement about
 * every test of the document ("All tests were two-tailed"), front matter, configuration, and
 * last the default (two-tailed, alpha .05). A statement about one test elsewhere in the
 * document cannot be tied to a result and is not used (it is kept as `untied` so a note can
 * say the text mentions it). Directives are passed through for the engine, which applies them.
 */
export function link(extraction: Extraction, directives: Directive[], settings: DocumentSettings = {}): LinkedDocument {
  // Said of every test, in a sentence that reports none (one that reports a test speaks of it).
  const sentencesWithTests = new Set(extraction.tests.map(sentenceKey));
  // (in an introduction or discussion, only words of the authors' own work: "Earlier trials often
  // relied on one-tailed tests" is about other studies)
  const general = extraction.statements.filter((s) => s.general === true && !sentencesWithTests.has(sentenceKey(s)) && (s.kind !== 'sidedness' || s.ownWork === true || !OTHER_STUDIES_SECTION.test(extraction.sections[s.segment] ?? '')));
  const documentSidedness = agreeing(general.filter((s) => s.kind === 'sidedness'), (s) => s.sidedness as Sidedness, 'document-text')
    ?? settings.sidedness ?? { value: 'two' as Sidedness, basis: 'default' as const };
  const documentAlpha = agreeing(general.filter((s) => s.kind === 'alpha'), (s) => s.alpha as number, 'document-text')
    ?? settings.alpha ?? { value: DEFAULT_ALPHA, basis: 'default' as const };

  const join = contextJoiner(extraction);
  const statementsBySegment = groupBy(extraction.statements, (s) => s.segment);
  const testsBySegment = groupBy(extraction.tests, (t) => t.segment);
  // Statements their paragraph's results do not take: a power calculation's, one limited to some
  // tests, or one that names a single test ("the hypothesis was tested one-tailed") in a paragraph
  // that reports several (which of them it is cannot be told); "We tested one-tailed" names none.
  const apart = (s: ContextStatement) => s.planning === true || s.restricted === true || (s.single === true && (testsBySegment.get(s.segment)?.length ?? 0) > 1);
  // The statements of each paragraph's sentences that report no test (computed once per segment).
  // and the tails and alpha they agree on
  const paragraphStatements = new Map<number, ParagraphReading>();
  const paragraphOf = (segment: number): ParagraphReading => {
    let reading = paragraphStatements.get(segment);
    if (!reading) {
      const withTests = new Set((testsBySegment.get(segment) ?? []).map((t) => t.sentence));
      // a power calculation's tails and alpha size the study, and other statements stand `apart` (above)
      const list = (statementsBySegment.get(segment) ?? []).filter((s) => !withTests.has(s.sentence) && !apart(s));
      const sided = agreeing(list.filter((s) => s.kind === 'sidedness'), (s) => s.sidedness as Sidedness, 'paragraph');
      const alpha = agreeing(list.filter((s) => s.kind === 'alpha'), (s) => s.alpha as number, 'paragraph');
      reading = { ...(sided ? { sided } : {}), ...(alpha ? { alpha } : {}) };
      paragraphStatements.set(segment, reading);
    }
    return reading;
  };
  const bySentence = new Map<string, ContextStatement[]>();
  for (const st of extraction.statements) {
    const k = sentenceKey(st);
    const list = bySentence.get(k);
    if (list) list.push(st);
    else bySentence.set(k, [st]);
  }
  const testsBySentence = new Map<string, TTestReport[]>();
  for (const t of extraction.tests) {
    const k = sentenceKey(t);
    const list = testsBySentence.get(k);
    if (list) list.push(t);
    else testsBySentence.set(k, [t]);
  }
  const generalSet = new Set(general);
  const names = testNames(extraction);
  // One-tailed words in a sentence without a test, said of no particular result: where they
  // cannot be tied to a result, a note says so rather than "nothing says one-tailed".
  const untied = extraction.statements.filter((s) => s.kind === 'sidedness' && !generalSet.has(s) && !sentencesWithTests.has(sentenceKey(s)));
  // The first one-tailed statement said of no result that is not in a given paragraph (or
  // plans a study): the first of them, or else the first that breaks from the first's paragraph.
  const untiedOne = untied.filter((s) => s.sidedness === 'one');
  const firstUntied = untiedOne[0];
  const otherUntied = firstUntied ? untiedOne.find((s) => s.segment !== firstUntied.segment || apart(s)) : undefined;
  const untiedOutside = (segment: number) => (firstUntied && (firstUntied.segment !== segment || apart(firstUntied)) ? firstUntied : otherUntied);
  // What each sentence says of tails and alpha, read once per sentence (a sentence of thousands
  // of results would otherwise be searched again for each).
  const sentenceReadings = new Map<string, SentenceReading>();
  const readingOf = (k: string, segment: number, sentence: number): SentenceReading => {
    let r = sentenceReadings.get(k);
    if (!r) {
      const own = bySentence.get(k) ?? [];
      const previous = bySentence.get(sentenceKeyOf(segment, sentence - 1)) ?? [];
      const peers = testsBySentence.get(k) ?? [];
      const sided = own.filter((s) => s.kind === 'sidedness');
      r = {
        sided,
        // each tails word's distance to the nearest test of the sentence: the test at that distance takes it
        nearestDistance: sided.map((s) => peers.reduce((d, t) => Math.min(d, distance(s, t)), Infinity)),
        equivalence: own.find((s) => s.kind === 'equivalence') ?? previous.find((s) => s.kind === 'equivalence'),
        alpha: own.find((s) => s.kind === 'alpha'),
      };
      sentenceReadings.set(k, r);
    }
    return r;
  };
  const sentencesWithStatistics = new Set([...sentencesWithTests, ...extraction.otherStatistics.map(sentenceKey)]);
  const adjustmentOf = adjustmentJoiner(extraction, sentencesWithStatistics);
  const resampledOf = resampledJoiner(extraction, sentencesWithStatistics);
  const approximateDfOf = mentionJoiner(extraction, sentencesWithStatistics, 'approximate-df');
  const pooledErrorOf = pooledErrorJoiner(extraction);
  const transformedOf = scopedMentionJoiner(extraction, sentencesWithStatistics, 'transformed');
  const modelBasedOf = scopedMentionJoiner(extraction, sentencesWithStatistics, 'model-based');
  const standardiserOf = scopedMentionJoiner(extraction, sentencesWithStatistics, 'd-standardiser');
  // cluster means said in the result's own sentence only: elsewhere they may be of another analysis
  const clusterMeansBySentence = groupBy(extraction.mentions.filter((m) => m.kind === 'cluster-means'), sentenceKey);
  // Welch's test named where no test is reported ("Welch's t-tests were used throughout")
  // (as a test: not "Welch's method" or "Welch's ANOVA", and not in a sentence that negates it)
  // (and none where the text also names Student's test so: it then says which test its results are)
  const generalName = (variant: 'welch' | 'student') =>
    extraction.mentions.find((m) => m.kind === 'test-name' && m.test?.variant === variant && m.negated !== true && (variant === 'student' || m.test.namesTest === true) && !sentencesWithTests.has(sentenceKey(m)));
  const generalStudent = generalName('student');
  const generalWelch = generalStudent ? undefined : generalName('welch');
  const results: LinkedResult[] = extraction.tests.map((report) => {
    const k = sentenceKey(report);
    const reading = readingOf(k, report.segment, report.sentence);
    const sidedness = sidednessFor(report.statedSidedness, report, reading, paragraphOf(report.segment), documentSidedness);
    const elsewhere = sidedness.basis === 'default' ? untiedOutside(report.segment) : undefined;
    const named = names.get(report);
    return {
      report,
      sidedness,
      alpha: alphaFor(reading, paragraphOf(report.segment), documentAlpha),
      context: join(report),
      ...(named ? { testName: named } : {}),
      ...(elsewhere ? { untiedSidedness: elsewhere } : {}),
      ...(generalWelch && named?.variant === undefined ? { untiedWelch: generalWelch } : {}),
      ...(generalStudent && named?.variant === undefined ? { untiedStudent: generalStudent } : {}),
      ...withAdjustment(adjustmentOf(report)),
      ...withResampled(resampledOf(report)),
      ...withApproximateDf(approximateDfOf(report)),
      ...withPooledError(pooledErrorOf(report)),
      ...withTransformed(transformedOf(report)),
      ...withModelBased(modelBasedOf(report)),
      ...withStandardiser(standardiserOf(report)),
      ...withClusterMeans(clusterMeansBySentence.get(k)?.[0]),
    };
  });
  const statistics: LinkedStatistic[] = [];
  const dimensionsOf = tableDimensionsJoiner(extraction);
  const groupsOf = fGroupsJoiner(extraction);
  const coefficientOf = coefficientBeforeJoiner(extraction);
  const repeatedMeasuresOf = repeatedMeasuresJoiner(extraction);
  // an exact test or a corrected χ² named in a χ²'s sentence, or in a sentence that reports no
  // statistic ("Fisher's exact test was used where expected counts were below 5"): its p may be that test's
  const exactOf = mentionJoiner(extraction, sentencesWithStatistics, 'exact-test');
  const exactDoubt = (o: OtherStatistic): string[] => {
    const m = o.kind === 'chi-square' ? exactOf(o) : undefined;
    return m ? [`"${m.printed.trim()}" is named beside χ², so its p may be that test's rather than the upper tail of the χ² printed`] : [];
  };
  for (const o of extraction.otherStatistics) {
    if (o.kind !== 'F' && o.kind !== 'chi-square' && o.kind !== 'correlation' && o.kind !== 'z') continue;
    const report = o as LinkedStatistic['report'];
    const reading = readingOf(sentenceKey(o), o.segment, o.sentence);
    const sidedness = sidednessFor(report.p?.statedSidedness !== undefined ? { value: report.p.statedSidedness, span: report.p.span } : undefined, report, reading, paragraphOf(o.segment), documentSidedness);
    const elsewhere = sidedness.basis === 'default' ? untiedOutside(o.segment) : undefined;
    const dimensions = o.kind === 'chi-square' ? dimensionsOf(o) : undefined;
    const groups = o.kind === 'F' ? groupsOf(o) : undefined;
    const coefficient = o.kind === 'z' ? coefficientOf(o) : undefined;
    const repeatedMeasures = o.kind === 'F' ? repeatedMeasuresOf(o) : undefined;
    statistics.push({
      id: `stat:${o.segment}:${o.span.start}`,
      report,
      alpha: alphaFor(reading, paragraphOf(o.segment), documentAlpha),
      sidedness,
      ...(elsewhere ? { untiedSidedness: elsewhere } : {}),
      doubts: [...(o.doubt ? [o.doubt] : []), ...exactDoubt(o)],
      ...(dimensions ? { dimensions } : {}),
      ...(groups ? { groups } : {}),
      ...(coefficient ? { coefficient } : {}),
      ...(repeatedMeasures ? { repeatedMeasures } : {}),
      ...withAdjustment(adjustmentOf(o)),
      ...withResampled(resampledOf(o)),
    });
  }
  return {
    results,
    statistics,
    integerDeclarations: integerDeclarations(extraction),
    derivedMeans: derivedMeans(extraction, sentencesWithStatistics),
    inferredSizes: inferredSizes(results),
    spreadKinds: spreadKinds(extraction),
    pWithoutT: extraction.pWithoutT,
    directives,
    extraction,
    ...(settings.integerMeasure ? { integerMeasure: settings.integerMeasure } : {}),
    ...(settings.frontMatterError ? { frontMatterError: settings.frontMatterError } : {}),
    ...(settings.readNotes ? { readNotes: settings.readNotes } : {}),
    statements: extraction.statements,
    documentAlpha,
    documentSidedness,
  };
}


/**
 * The correction for multiple comparisons that may have been applied to a result's p without
 * the p saying so: one named in the result's own sentence, else the first named in words about
 * every test or p ("All p values were Holm-adjusted") in a sentence that reports no statistic.
 * Tukey's HSD is not one, nor one denied or said of alpha (`notOfP`: "would not survive a
 * Bonferroni correction", "a Bonferroni-corrected alpha"). None where any p of the text is labelled
 * adjusted (`p_adj`, "Bonferroni-corrected p = …"): such a text labels its adjusted p values,
 * so an unlabelled p is not one.
 */
function adjustmentJoiner(extraction: Extraction, withStatistics: ReadonlySet<string>): (at: { segment: number; sentence: number }) => ContextStatement | undefined {
  const labelled = extraction.tests.some((t) => t.adjustedP !== undefined || t.p?.adjusted !== undefined) || extraction.otherStatistics.some((o) => o.p?.adjusted !== undefined);
  // Tukey's HSD is a procedure of its own for an ANOVA's pairs, not a correction of other tests' p
  const said = labelled ? [] : extraction.statements.filter((s) => s.kind === 'multiplicity' && s.method !== 'tukey' && s.notOfP !== true);
  if (said.length === 0) return () => undefined;
  const bySentence = new Map<string, ContextStatement>();
  for (const s of said) if (!bySentence.has(sentenceKey(s))) bySentence.set(sentenceKey(s), s);
  const general = said.find((s) => s.general === true && !withStatistics.has(sentenceKey(s)));
  return (at) => bySentence.get(sentenceKey(at)) ?? general;
}

const withAdjustment = (s: ContextStatement | undefined) => (s ? { adjustmentSaid: s } : {});

/**
 * The words saying a result's p came from resampling: a permutation or randomization test, or
 * words about p values, in its own sentence; else the first words about p values in a sentence
 * that reports no statistic. A permutation test named elsewhere (for another analysis) says
 * nothing of this p.
 */
function resampledJoiner(extraction: Extraction, withStatistics: ReadonlySet<string>): (at: { segment: number; sentence: number; span: Span; p?: { span: Span } }) => Mention | undefined {
  const said = extraction.mentions.filter((m) => m.kind === 'resampled-p' || m.kind === 'resampling-test');
  if (said.length === 0) return () => undefined;
  const bySentence = groupBy(said, sentenceKey);
  const general = said.find((m) => m.kind === 'resampled-p' && !withStatistics.has(sentenceKey(m)));
  // in its sentence, only words before its p speak of it ("A permutation test gave t(28) = …,
  // p = …", "t(28) = …, permutation p = …"); words after it are another p's ("…, p = .072,
  // whereas the permutation test gave p = .02")
  return (at) => bySentence.get(sentenceKey(at))?.find((m) => m.span.start < (at.p?.span.start ?? at.span.end)) ?? general;
}

const withResampled = (m: Mention | undefined) => (m ? { resampledP: m } : {});
const withApproximateDf = (m: Mention | undefined) => (m ? { approximateDf: m } : {});

/**
 * The words saying dfs were approximated (Satterthwaite, Kenward–Roger), or naming an exact test
 * beside a χ² (`kind`), that speak of a result: in its own sentence, else the first in a sentence
 * that reports no statistic. Such words only ever make a finding less certain, as a whole df may
 * then be a rounded one, or a p an exact test's.
 */
function mentionJoiner(extraction: Extraction, withStatistics: ReadonlySet<string>, kind: 'approximate-df' | 'exact-test'): (at: { segment: number; sentence: number }) => Mention | undefined {
  const said = extraction.mentions.filter((m) => m.kind === kind);
  if (said.length === 0) return () => undefined;
  const bySentence = groupBy(said, sentenceKey);
  // an exact test said of a whole text only with small counts or χ² ("Fisher's exact test was used
  // where expected counts were below 5"), not of baseline characteristics or a proportion
  const general = said.find((m) => !withStatistics.has(sentenceKey(m)) && (kind !== 'exact-test' || m.aboutTests === true));
  return (at) => bySentence.get(sentenceKey(at))?.[0] ?? general;
}

const withTransformed = (m: Mention | undefined) => (m ? { transformed: m } : {});
const withModelBased = (m: Mention | undefined) => (m ? { modelBased: m } : {});
const withStandardiser = (m: Mention | undefined) => (m ? { dStandardiser: m } : {});
const withClusterMeans = (m: Mention | undefined) => (m ? { clusterMeans: m } : {});

/** Sections that speak of other studies or of future work: an introduction, a background, a discussion, a conclusion. */
const OTHER_STUDIES_SECTION = /introduction|background|discussion|conclusion|limitation|future|related work|literature/i;

/**
 * Where words that make a finding less certain may speak of a result, by kind, beyond its own
 * sentence: its paragraph, and a sentence of the text that reports no statistic and stands in no
 * introduction or discussion, which must say it is about the tests or comparisons or not.
 * - transformed (extract's `transformed`: "t-tests were performed on log-transformed values"):
 *   its paragraph (a table's note is a paragraph of its own); elsewhere, words about the tests;
 * - model-based ("All group comparisons were estimated by linear regression adjusted for age"):
 *   not its paragraph, whose model words are often about another analysis ("In a regression
 *   adjusting for age, ..."); elsewhere, words about the tests;
 * - d-standardiser ("Effect sizes were standardised by the pooled baseline SD"): its paragraph;
 *   elsewhere any such sentence, which defines every d of the report (extract reads the words
 *   only in a sentence about an effect size that neither plans the study nor speaks of others).
 * Transformations and models said of a measure also reach a result whose own lead opens with
 * that measure (Mention.measure).
 */
const MENTION_SCOPES = {
  transformed: { paragraph: true, aboutTests: true },
  'model-based': { paragraph: false, aboutTests: true },
  'd-standardiser': { paragraph: true, aboutTests: false },
} as const;

/** The first mention of a kind that speaks of a result, within the kind's scope (MENTION_SCOPES). */
function scopedMentionJoiner(extraction: Extraction, withStatistics: ReadonlySet<string>, kind: keyof typeof MENTION_SCOPES): (report: TTestReport) => Mention | undefined {
  const said = extraction.mentions.filter((m) => m.kind === kind);
  if (said.length === 0) return () => undefined;
  const scope = MENTION_SCOPES[kind];
  const bySentence = groupBy(said, sentenceKey);
  const bySegment = scope.paragraph ? groupBy(said, (m) => m.segment) : undefined;
  // beyond its paragraph, only a sentence that reports no statistic and is not in an introduction
  // or discussion (of other studies, of future work), and for some kinds says it is about the tests
  const apart = (m: Mention) => !withStatistics.has(sentenceKey(m)) && !OTHER_STUDIES_SECTION.test(extraction.sections[m.segment] ?? '');
  const general = said.find((m) => (!scope.aboutTests || m.aboutTests === true) && apart(m));
  // or one said of a measure ("Fatigue was rated weekly and analysed with a linear mixed model"),
  // for a result whose own words open with that measure ("Fatigue was lower with …, t(91.4)")
  // (by the measure's first stem; a result's lead must open with it and name every word of it:
  // "Blood glucose" is not "Blood pressure")
  const ofMeasure = groupBy(said.filter((m) => m.measure !== undefined && apart(m)), (m) => (m.measure as string[])[0]);
  const measureOf = (report: TTestReport) => {
    const words = report.lead?.words;
    // (a comparison at baseline is not the analysis of the outcome's follow-up)
    if (!words || words.length === 0 || ofMeasure.size === 0 || words.some((w) => w.toLowerCase() === 'baseline')) return undefined;
    const stems = measureStems(words);
    const first = stems[0] === undefined ? undefined : ofMeasure.get(stems[0]);
    if (!first) return undefined;
    const lead = new Set(stems);
    return first.find((m) => (m.measure as string[]).every((s) => lead.has(s)));
  };
  return (report) => bySentence.get(sentenceKey(report))?.[0] ?? bySegment?.get(report.segment)?.[0] ?? general ?? measureOf(report);
}

const withPooledError = (p: PooledError | undefined) => (p ? { pooledError: p } : {});

/**
 * What says that a t may be a comparison within a larger analysis of variance, whose pooled error
 * term gives it the analysis's error df (N − k) and SE rather than its two groups' own: an F of
 * more than two groups in its paragraph whose error df is the t's df (`F(2, 87) = 5.10. Planned
 * contrasts: … t(87) = 2.37`); else words of contrasts or post hoc comparisons (`Planned contrasts
 * showed …`) in its sentence or its paragraph (words elsewhere may be about another study or
 * outcome). Such a sign only ever makes a finding less certain: on the df or on the t from two
 * groups' descriptives where the df is more than the two groups give (rule-api pooledErrorDoubt),
 * and on a total N, which such a t may or may not use (sample-size-agrees-with-df).
 */
function pooledErrorJoiner(extraction: Extraction): (report: TTestReport) => PooledError | undefined {
  // by paragraph and error df: an F of another paragraph is of another analysis (the sites of a
  // trial compared at baseline, F(2, 27), beside a paired t(27) of its conditions pages later)
  // (an F of more than two groups: one of two, F(1, 58), is the same comparison as the t, or
  // Levene's test of its variances, whose error df is always the t's)
  const errorDfs = new Map<string, OtherStatistic>();
  for (const o of extraction.otherStatistics) {
    const df2 = o.kind === 'F' && o.dfs?.length === 2 && (o.dfs[0]?.value ?? 0) >= 2 ? o.dfs[1] : undefined;
    const k = df2 && Number.isInteger(df2.value) ? `${o.segment}:${df2.value}` : undefined;
    if (k !== undefined && !errorDfs.has(k)) errorDfs.set(k, o);
  }
  const said = extraction.mentions.filter((m) => m.kind === 'contrast');
  if (errorDfs.size === 0 && said.length === 0) return () => undefined;
  const bySentence = groupBy(said, sentenceKey);
  const bySegment = groupBy(said, (m) => m.segment);
  return (report) => {
    const f = report.df && Number.isInteger(report.df.value) ? errorDfs.get(`${report.segment}:${report.df.value}`) : undefined;
    if (f) return { basis: 'error-df', span: f.span, printed: f.printed, groups: (f.dfs?.[0]?.value ?? 1) + 1 };
    const words = bySentence.get(sentenceKey(report))?.[0] ?? bySegment.get(report.segment)?.[0];
    return words ? { basis: 'words', span: words.span, printed: words.printed } : undefined;
  };
}

/**
 * The words naming a repeated-measures analysis or a sphericity correction nearest to a
 * statistic: the first in its sentence, else in its paragraph, else in the text, unless its own
 * sentence names an analysis between groups only. Such words anywhere in a text make any F of it
 * possibly corrected: they only ever make a finding less certain, never more, so they are read
 * at the widest scope they could have.
 */
function repeatedMeasuresJoiner(extraction: Extraction): (o: OtherStatistic) => LinkedStatistic['repeatedMeasures'] {
  const said = extraction.mentions.filter((m) => m.kind === 'repeated-measures');
  const first = said[0];
  if (!first) return () => undefined;
  // a text saying no sphericity correction was applied, and naming none applied, prints uncorrected p values
  const applied = said.some((m) => m.namesCorrection === true);
  if (!applied && extraction.mentions.some((m) => m.kind === 'no-sphericity-correction')) return () => undefined;
  const betweenMentions = extraction.mentions.filter((m) => m.kind === 'between-subjects');
  const between = new Set(betweenMentions.map(sentenceKey));
  const betweenParagraphs = new Set(betweenMentions.map((m) => m.segment));
  const bySentence = new Map<string, Mention>();
  const bySegment = new Map<number, Mention>();
  for (const m of said) {
    if (!bySentence.has(sentenceKey(m))) bySentence.set(sentenceKey(m), m);
    if (!bySegment.has(m.segment)) bySegment.set(m.segment, m);
  }
  return (o) => {
    const inSentence = bySentence.get(sentenceKey(o));
    if (inSentence) return { mention: inSentence, basis: 'sentence' };
    // its own sentence names an analysis between groups only
    if (between.has(sentenceKey(o))) return undefined;
    const inParagraph = bySegment.get(o.segment);
    if (inParagraph) return { mention: inParagraph, basis: 'paragraph' };
    // its paragraph names an analysis between groups only, and none with repeated measures
    if (betweenParagraphs.has(o.segment)) return undefined;
    return { mention: first, basis: 'document' };
  };
}

/** One value all statements agree on, as a setting with this basis; undefined if none or mixed. */
function agreeing<T>(statements: ContextStatement[], value: (s: ContextStatement) => T, basis: Setting<T>['basis']): Setting<T> | undefined {
  const first = statements[0];
  if (!first) return undefined;
  if (!statements.every((s) => value(s) === value(first))) return undefined;
  return { value: value(first), basis, span: first.span, printed: first.printed };
}

/** What one sentence (and the one before it) says of tails and alpha. */
interface SentenceReading {
  sided: ContextStatement[];
  nearestDistance: number[];
  equivalence?: ContextStatement;
  alpha?: ContextStatement;
}

/** The tails and alpha a paragraph's sentences without tests agree on. */
interface ParagraphReading {
  sided?: Setting<Sidedness>;
  alpha?: Setting<number>;
}

/**
 * A result's tails: said in the report itself, else by the tails word of its sentence nearest to
 * it (distances to the sentence's t-tests decide; a statistic takes a word no t-test is nearer
 * to), an equivalence test, its paragraph, the fallback.
 */
function sidednessFor(stated: { value: Sidedness; span: Span } | undefined, report: { span: Span; p?: { span: Span } }, sentence: SentenceReading, paragraph: ParagraphReading, fallback: Setting<Sidedness>): Setting<Sidedness> {
  if (stated) return { value: stated.value, basis: 'in-report', span: stated.span };
  // With several tests in one sentence, a tails word belongs to the test nearest to it (ties: each);
  // not one that labels a p printed after the result's own ("p = .075 (one-tailed p = .037)"): that
  // is a second p, with tails of its own; one right after the result's own p is that p's ("p =
  // .075 one-tailed (p = .15 two-tailed)")
  const ownP = report.p;
  const labelsAnother = (s: ContextStatement) =>
    ownP !== undefined && ownP.span.end <= s.span.start && (s.labelsP === 'after' || (s.labelsP === 'before' && s.span.start - ownP.span.end > OWN_P_LABEL_GAP));
  const sided = sentence.sided.find((s, i) => !labelsAnother(s) && distance(s, report) <= (sentence.nearestDistance[i] as number));
  if (sided) return { value: sided.sidedness as Sidedness, basis: 'sentence', span: sided.span, printed: sided.printed };
  const equivalence = sentence.equivalence;
  if (equivalence) return { value: 'one', basis: 'equivalence-test', span: equivalence.span, printed: equivalence.printed };
  return paragraph.sided ?? fallback;
}

function distance(s: ContextStatement, t: { span: Span }): number {
  if (s.span.end <= t.span.start) return t.span.start - s.span.end;
  if (s.span.start >= t.span.end) return s.span.start - t.span.end;
  return 0;
}

function alphaFor(sentence: SentenceReading, paragraph: ParagraphReading, fallback: Setting<number>): Setting<number> {
  const inSentence = sentence.alpha;
  if (inSentence) return { value: inSentence.alpha as number, basis: 'sentence', span: inSentence.span, printed: inSentence.printed };
  return paragraph.alpha ?? fallback;
}

/**
 * Ties each group's descriptives to a whole-number declaration: one in the group's own
 * sentence; else the declarations whose measure the group's sentence names, when they agree
 * on the item count. A paragraph's other sentences are not enough ("a large number of
 * structures" says nothing of the ratio reported after it).
 */
function integerDeclarations(x: Extraction): LinkedDocument['integerDeclarations'] {
  const out: LinkedDocument['integerDeclarations'] = new Map();
  if (x.integerMeasures.length === 0) return out;
  const bySentence = new Map<string, IntegerStatement>();
  for (const d of x.integerMeasures) if (!bySentence.has(sentenceKey(d))) bySentence.set(sentenceKey(d), d);
  const byName = new Map<string, IntegerStatement[]>();
  for (const d of x.integerMeasures) {
    for (const name of d.measures ?? []) {
      const list = byName.get(name);
      if (list) list.push(d);
      else byName.set(name, [d]);
    }
  }
  const named = new Map<string, Set<string>>();
  for (const m of x.measureMentions) {
    const k = sentenceKey(m);
    const set = named.get(k) ?? new Set<string>();
    set.add(m.measure);
    named.set(k, set);
  }
  // a measure named in a table row names the groups of that row, and of its block below it
  const byRow = new Map<string, Set<string>>();
  const blockAt = new Map(x.tableBlocks.map((b) => [`${b.table}:${b.firstRow}`, b]));
  for (const m of x.measureMentions) {
    if (!m.table) continue;
    const block = blockAt.get(`${m.table.table}:${m.table.row}`);
    for (let r = m.table.row; r <= (block?.lastRow ?? m.table.row); r += 1) {
      const k = `${m.table.table}:${r}`;
      const set = byRow.get(k) ?? new Set<string>();
      set.add(m.measure);
      byRow.set(k, set);
    }
  }
  const byNames = new Map<Set<string>, IntegerStatement | null>();
  for (const g of x.summaries) {
    if (!g.mean) continue;
    const own = g.table ? undefined : bySentence.get(sentenceKey(g));
    if (own) {
      out.set(g, { statement: own, basis: 'sentence' });
      continue;
    }
    const names = g.table ? byRow.get(`${g.table.table}:${g.table.row}`) : named.get(sentenceKey(g));
    if (!names) continue;
    // the same names give the same answer: decided once per set of names
    let agreed = byNames.get(names);
    if (agreed === undefined) {
      const candidates = [...names].flatMap((name) => byName.get(name) ?? []);
      const first = candidates[0];
      agreed = first && candidates.every((c) => c.items === first.items) ? first : null;
      byNames.set(names, agreed);
    }
    if (agreed) out.set(g, { statement: agreed, basis: 'measure-name' });
  }
  return out;
}

/**
 * Words saying a group's printed mean is not a plain mean of its scores (adjusted, estimated from
 * a model, pooled over imputations; extract's `derived-means`): in the group's own sentence, else
 * in a sentence of the text that reports no statistic ("Missing outcomes were handled by
 * multiple imputation", "model-estimated means are shown"), which may speak of every mean. For
 * every group with a mean (the GRIM rule asks only for whole-number ones).
 */
function derivedMeans(x: Extraction, withStatistics: ReadonlySet<string>): LinkedDocument['derivedMeans'] {
  const out: LinkedDocument['derivedMeans'] = new Map();
  const said = x.mentions.filter((m) => m.kind === 'derived-means');
  if (said.length === 0) return out;
  const bySentence = groupBy(said, sentenceKey);
  const general = said.find((m) => !withStatistics.has(sentenceKey(m)));
  for (const g of x.summaries) {
    if (!g.mean) continue;
    const m = (g.table ? undefined : bySentence.get(sentenceKey(g))?.[0]) ?? general;
    if (m) out.set(g, m);
  }
  return out;
}

/**
 * Sizes of groups printed without n, from certain ties only: in a design stated paired (or a
 * test named paired) both conditions hold the same units, so one printed n is the other's,
 * and a paired or one-sample test of whole df has df + 1 units.
 */
function inferredSizes(results: LinkedResult[]): LinkedDocument['inferredSizes'] {
  const out: LinkedDocument['inferredSizes'] = new Map();
  for (const r of results) {
    const link = r.context.descriptives;
    if (!link?.certain) continue;
    const design = r.context.design;
    const stated = design.basis !== 'default' && design.basis !== 'structure';
    const df = r.report.df;
    const wholeDf = df && df.decimals === 0 && df.exponent === 0 && df.value >= 1 ? df.value : undefined;
    const printedOnce = link.groups.length === 2 && link.groups.filter((g) => g.n).length === 1 ? link.groups.find((g) => g.n)?.n : undefined;
    if (printedOnce && wholeDf === printedOnce.value - 1 && design.value !== 'independent') {
      // df = n − 1 with one condition of n printed: two independent groups would leave the
      // other a single unit, so both conditions are the same n units
      for (const g of link.groups) if (!g.n) out.set(g, { n: printedOnce.value, because: `df = ${wholeDf} is n − 1 for the n = ${printedOnce.printed} printed with the other condition` });
    } else if (link.groups.length === 2 && design.value === 'paired' && stated) {
      const printed = link.groups.find((g) => g.n)?.n;
      for (const g of link.groups) {
        if (g.n) continue;
        if (printed) out.set(g, { n: printed.value, because: `the same units as the other condition (n = ${printed.printed})` });
        else if (wholeDf !== undefined) out.set(g, { n: wholeDf + 1, because: `df + 1 of the paired test (df = ${wholeDf})` });
      }
    } else if (link.groups.length === 1 && wholeDf !== undefined && (design.value === 'one-sample' || (design.value === 'paired' && stated))) {
      const g = link.groups[0];
      if (g && !g.n) out.set(g, { n: wholeDf + 1, because: `df + 1 of the ${design.value} test (df = ${wholeDf})` });
    }
  }
  return out;
}

/** What each group's "±" or bracketed spread stands for, its own label first, then the text's statements about it. */
function spreadKinds(x: Extraction): LinkedDocument['spreadKinds'] {
  const spreads = spreadStatements(x);
  const out: LinkedDocument['spreadKinds'] = new Map();
  for (const g of x.summaries) {
    if (!g.spread) continue;
    out.set(g, g.spread.kind !== 'unstated' ? g.spread.kind : (spreads.kindFor(g)?.spread ?? 'unstated'));
  }
  return out;
}

/**
 * Ties a χ² to the contingency table whose size the text states, only where nothing else could
 * claim either: the sentence holds exactly one χ² and one stated size, or else the paragraph
 * does. Counted once per segment, so linear in the records.
 */
function tableDimensionsJoiner(x: Extraction): (o: OtherStatistic) => Linked<TableDimensions> | undefined {
  const sizes = new Map<number, TableDimensions[]>();
  const sizesBySentence = new Map<string, TableDimensions[]>();
  // only whether a sentence or paragraph states exactly one size matters: at most two are kept
  for (const d of x.tableDimensions) {
    sizes.set(d.segment, [...(sizes.get(d.segment) ?? []).slice(0, 1), d]);
    const key = sentenceKey(d);
    sizesBySentence.set(key, [...(sizesBySentence.get(key) ?? []).slice(0, 1), d]);
  }
  if (sizes.size === 0) return () => undefined;
  const chiBySentence = new Map<string, number>();
  const chiBySegment = new Map<number, number>();
  for (const o of x.otherStatistics) {
    if (o.kind !== 'chi-square') continue;
    chiBySentence.set(sentenceKey(o), (chiBySentence.get(sentenceKey(o)) ?? 0) + 1);
    chiBySegment.set(o.segment, (chiBySegment.get(o.segment) ?? 0) + 1);
  }
  return (o) => {
    const list = sizes.get(o.segment);
    if (!list) return undefined;
    const inSentence = sizesBySentence.get(sentenceKey(o)) ?? [];
    if (inSentence.length === 1 && chiBySentence.get(sentenceKey(o)) === 1) return { item: inSentence[0] as TableDimensions, basis: 'sentence', certain: true };
    if (inSentence.length === 0 && list.length === 1 && chiBySegment.get(o.segment) === 1) return { item: list[0] as TableDimensions, basis: 'paragraph', certain: true };
    return undefined;
  };
}

/** How far before its statistic a coefficient may end to be the one it tests (source characters; as a t-test's leading estimate). */
const COEFFICIENT_REACH = 80;
/** Kinds that are another test's statistic: one of them between a coefficient and a z unties them (β, η², R², φ are estimates or effect sizes). */
const TESTS: ReadonlySet<OtherStatistic['kind']> = new Set(['F', 'chi-square', 'correlation', 'z', 'ratio', 'rank-or-other']);

/**
 * Ties a z to the regression coefficient printed with its SE right before it in its sentence
 * (`b = 0.42, SE = 0.15, z = 2.80`), when no t-test or other test's statistic stands between
 * them; certain only when no second coefficient does either. Each sentence's records are
 * grouped and sorted once and looked up by binary search, and the walk back for a second
 * coefficient stays within a bounded reach, so the join is linear in the records.
 */
function coefficientBeforeJoiner(x: Extraction): (o: OtherStatistic) => Linked<EstimateReport & { se: ReportedNumber }> | undefined {
  const coefficients = x.estimates.filter((e) => e.kind === 'coefficient' && !e.table);
  if (coefficients.length === 0) return () => undefined;
  const bySentence = groupBy(coefficients, sentenceKey);
  for (const list of bySentence.values()) list.sort((a, b) => a.span.end - b.span.end);
  const tests = new Map<string, number[]>();
  const addTest = (r: { segment: number; sentence: number; span: Span }) => {
    if (!bySentence.has(sentenceKey(r))) return;
    const list = tests.get(sentenceKey(r));
    if (list) list.push(r.span.start);
    else tests.set(sentenceKey(r), [r.span.start]);
  };
  for (const t of x.tests) addTest(t);
  for (const s of x.otherStatistics) if (TESTS.has(s.kind)) addTest(s);
  for (const list of tests.values()) list.sort((a, b) => a - b);
  /** Whether a test's statistic starts in [from, to). */
  const testBetween = (k: string, from: number, to: number): boolean => {
    const starts = tests.get(k);
    if (!starts) return false;
    let lo = 0;
    let hi = starts.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if ((starts[mid] as number) < from) lo = mid + 1;
      else hi = mid;
    }
    return lo < starts.length && (starts[lo] as number) < to;
  };
  return (o) => {
    const k = sentenceKey(o);
    const list = bySentence.get(k);
    if (!list) return undefined;
    // the last coefficient ending at or before the z
    let lo = 0;
    let hi = list.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if ((list[mid] as EstimateReport).span.end <= o.span.start) lo = mid + 1;
      else hi = mid;
    }
    const last = list[lo - 1];
    if (!last?.se || o.span.start - last.span.end > COEFFICIENT_REACH || testBetween(k, last.span.start, o.span.start)) return undefined;
    const item = { ...last, se: last.se };
    // a second coefficient in the same stretch (no test between it and the z) leaves open whose SE it is
    let others = 0;
    for (let j = lo - 2; j >= 0; j -= 1) {
      const e = list[j] as EstimateReport;
      if (o.span.start - e.span.end > 2 * COEFFICIENT_REACH || testBetween(k, e.span.end, o.span.start)) break;
      others += 1;
    }
    if (others > 0) return { item, basis: 'clause', certain: false, doubt: `shares its clause with ${others} other coefficient${others > 1 ? 's' : ''}, so the SE may be another's` };
    return { item, basis: 'clause', certain: true };
  };
}
