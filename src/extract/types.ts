import type { Span } from '../parse/types.js';
import type { TestTopic } from './topic.js';

/** A number as printed: its text, value, decimals (for its rounding interval) and place. */
export interface ReportedNumber {
  /** As printed, after spelling variants are folded (Unicode minus → "-"). */
  printed: string;
  value: number;
  /** Digits after the decimal point of the printed number (of the mantissa in scientific form). */
  decimals: number;
  /** Power of ten for scientific notation (3.2 × 10^-6 → −6); 0 otherwise. */
  exponent: number;
  span: Span;
  /**
   * Set only when the printed number lies beyond a double (`p = 1e-400` underflows to 0, a
   * 400-digit t overflows to Infinity): `log10` is the decimal logarithm of its magnitude as
   * printed, `mantissa` the printed digits before the exponent (absent when they overflow too).
   */
  beyondDouble?: { log10: number; mantissa?: number };
  /** The sign is printed as an ASCII hyphen-minus (`-2.10`), not a minus sign; set for a t in prose only. */
  hyphenMinus?: boolean;
}

export type Comparison = '=' | '<' | '<=' | '>' | '>=' | '~';

export type AdjustMethod = 'bonferroni' | 'holm' | 'hochberg' | 'sidak' | 'tukey' | 'fdr' | 'unspecified';

export interface ReportedP {
  /** `value`: p with a comparison and a number; `ns`: "n.s." with no number. */
  kind: 'value' | 'ns';
  op: Comparison;
  number?: ReportedNumber;
  /** From the p symbol to the end of its number. */
  span: Span;
  printed: string;
  /** The p is said to be adjusted for multiple comparisons (`p_adj`, `Bonferroni-corrected p`). */
  adjusted?: { method: AdjustMethod; span: Span; printed: string; comparisons?: number };
  /** Tails written in the p's own label: `p(2-t)`, `p (one-tailed)`. */
  statedSidedness?: Sidedness;
  /** Read from significance stars (`5.63***`), with the bound they stand for and where that came from. */
  stars?: { count: number; symbol: string; basis: 'legend' | 'lenient-convention'; legend?: Span };
}

export type Sidedness = 'one' | 'two';

/** A statement about tails or alpha found in the prose, with where it was said. */
export interface ContextStatement {
  kind: 'sidedness' | 'alpha' | 'equivalence' | 'spread' | 'multiplicity';
  sidedness?: Sidedness;
  alpha?: number;
  /** For `spread`: what "mean ± x" stands for ("values are mean ± SEM"). */
  spread?: 'SD' | 'SE';
  /** For `spread`: "±" said to stand for neither an SD nor an SE ("mean ± 2 SE", "± half-width of the 95% CI"). */
  spreadOther?: true;
  /**
   * For `sidedness` and `alpha`: said in words about every test ("All tests were two-tailed"),
   * not of one. For `multiplicity`: said of every p, near the correction's name ("All p values
   * were Bonferroni-corrected", "the three t-tests were Holm-adjusted").
   */
  general?: boolean;
  /**
   * For `sidedness` and `alpha`: said in a sentence that plans the study (a power or sample-size
   * calculation), which fixes how the study was sized, not how its tests were run.
   */
  planning?: boolean;
  /**
   * For `sidedness` and `alpha`: said in a sentence that limits it to some of the tests ("for the
   * secondary outcomes", "in Study 2", "except …", "where a direction was predicted"): it speaks
   * of the results of its own sentence only, and of no other that can be told.
   */
  restricted?: true;
  /**
   * For `sidedness`: its sentence speaks of the authors' own work ("we", "our", "this study"). In
   * an introduction or discussion only such a sentence declares this study's tails: "Earlier
   * trials often relied on one-tailed tests" is about others.
   */
  ownWork?: true;
  /** For `sidedness` and `alpha`: said of one test ("the hypothesis was tested one-tailed"), in no words about every test. */
  single?: true;
  /**
   * For `sidedness`: the tails word labels a p value printed right after it ("one-tailed p =
   * .037", `after`) or right before it ("p = .037 one-tailed", `before`): that p's tails, not
   * another's.
   */
  labelsP?: 'after' | 'before';
  /** For `multiplicity`: the correction named, and the number of comparisons when printed. */
  method?: AdjustMethod;
  comparisons?: number;
  /** For `multiplicity`: said without naming a correction ("adjusted for multiple comparisons"); `method` is then `unspecified`. */
  unnamed?: true;
  /**
   * For `multiplicity`: the correction is not one of the p values: denied ("We did not correct
   * the p values", "would not survive a Bonferroni correction", "uncorrected"), or of alpha ("a
   * Bonferroni-corrected alpha of .017").
   */
  notOfP?: true;
  span: Span;
  segment: number;
  block: number;
  /** Index of the sentence within the segment's text. */
  sentence: number;
  printed: string;
}

/** Which way the statistic was written; kept so a reader can see what was recognised. */
export type ReportStyle =
  | 'bracketed-df' // t(28) = 2.10
  | 'attached-df' // t28 = 2.10 (df flattened from a subscript)
  | 'labelled-df' // t = 2.10, df = 28
  | 'table-columns'; // t, df and p in table columns

/** One reported t-test result, as found on the page. */
export interface TTestReport {
  /** Stable within a document: `segment:offset`. */
  id: string;
  segment: number;
  block: number;
  sentence: number;
  /** From the t symbol to the end of the last part read (p, or t's number). */
  span: Span;
  printed: string;
  style: ReportStyle;
  /** `ts(22) > 4.72, ps ≤ .0001`: several tests summarised by one bound. */
  plural: boolean;
  /** Read from inline code or a code block (only complete reports are kept there). */
  inCode: boolean;
  tOp: Comparison;
  t: ReportedNumber;
  df?: ReportedNumber;
  p?: ReportedP;
  /**
   * A list of p values printed after a list of t values that this report ends (`t(38) = 2.35 and
   * t(38) = 0.88 (p = .024, p = .03 and p = .38)`), where the p values are not as many as the t
   * values without a p of their own: which is this test's cannot be told, so it has none.
   */
  listedPs?: { span: Span; printed: string; count: number; tests: number };
  /** An adjusted p printed beside the unadjusted one (`p = .045, Bonferroni-corrected p = .135`). */
  adjustedP?: ReportedP;
  /** Tails stated inside the report itself, e.g. `p = .03, one-tailed`. */
  statedSidedness?: { value: Sidedness; span: Span };
  /** The test name given right before the statistic (e.g. "Welch's t"), lower-case. */
  namedVariant?: 'welch' | 'student' | 'paired' | 'one-sample' | 'independent';
  /** Printed in a table: its row, the table's name ("Table 2" from its caption, else its place) and the row's label. */
  table?: TableRow & { name?: string; rowLabel?: string };
  /**
   * The test's own lead in prose: from the last clause boundary of its sentence (or the sentence
   * start) to its statistic, with its content words (src/extract/topic.ts).
   */
  lead?: { start: number; words: string[] };
}

/** A p value in a sentence that names a t-test but gives no t statistic. */
export interface PWithoutT {
  segment: number;
  block: number;
  p: ReportedP;
  mention: Span;
  /** The words that name the test, as printed. */
  mentionPrinted: string;
}

export type OtherStatisticKind = 'F' | 'chi-square' | 'correlation' | 'r-squared' | 'z' | 'beta' | 'eta-squared' | 'association' | 'ratio' | 'rank-or-other';

/** The statistic of a test other than t (F, χ², r, z, β, η², an odds ratio, U, W, H): it ends a t-test's clause. */
export interface OtherStatistic {
  kind: OtherStatisticKind;
  segment: number;
  block: number;
  sentence: number;
  /** From the symbol to the end of its value. */
  span: Span;
  printed: string;
  value?: ReportedNumber;
  /** How the statistic was compared with its value: `F < 1` is `<`. */
  op?: Comparison;
  /** As printed: `F`, `χ2`, `r`, `rs`, `ρ`, `z`, `Z`, … */
  symbol?: string;
  /** For F, χ² and r: the degrees of freedom printed with the statistic (F: [df1, df2]; χ², r: [df]). */
  dfs?: ReportedNumber[];
  /** For χ² the `N = 120` inside its bracket, else one printed in its clause; for r an `n = 50` printed in its clause. */
  n?: ReportedNumber;
  /** For F, χ², r and z: the p printed in the statistic's own clause, read as for a t-test. */
  p?: ReportedP;
  /** Named beside an F's dfs: a Greenhouse–Geisser or Huynh–Feldt correction (fractional dfs are then expected). */
  dfCorrection?: 'greenhouse-geisser' | 'huynh-feldt';
  /**
   * Words or a statistic in the clause that make the p's tie to this statistic less than certain
   * (a rank test's U or W before a z, whose p may be exact; a partial or rank correlation).
   */
  doubt?: string;
  /**
   * For F: words of its sentence (up to its clause's end) that name an analysis other than a
   * one-way between-groups ANOVA (`repeated`, `ANCOVA`, `Welch`, `interaction`, …), as printed.
   */
  analysisWords?: string;
  /**
   * For F: the first words of its whole paragraph that name such another analysis (the
   * paragraph may say "we computed ANCOVAs" sentences before the F), as printed.
   */
  paragraphAnalysisWords?: string;
  /**
   * For F, in a paragraph that names a table: the stems of the content words of its sentence
   * (src/extract/topic.ts), which the link layer compares with the table's caption.
   */
  sentenceStems?: string[];
  /**
   * For the one F of a paragraph that reports no other statistic: the stems of its lead's content
   * words (its sentence up to it, from the last clause boundary), without the words that name the
   * one-way ANOVA itself, so the link layer can tell whether groups printed in the paragraph
   * before are of what the F is about.
   */
  leadStems?: string[];
  /** For F: an η² printed in its clause (`ηp2 = .10`, `partial η2 = .10`), and whether it is said to be partial. */
  etaSquared?: { partial: boolean; op: Comparison; value: ReportedNumber; span: Span; printed: string };
  /**
   * For F: the id of the t-test its words say it is the same comparison as (`t(38) = 2.05
   * (equivalently F(1, 38) = 4.20)`), so F = t² and F's df1 = 1.
   */
  sameAsT?: string;
  /** For χ²: a φ or Cramér's V printed in its clause (`φ = .21`, `Cramér's V = .18`, `V = .18`). */
  association?: { kind: 'phi' | 'V'; op: Comparison; value: ReportedNumber; span: Span; printed: string };
  /**
   * For χ²: the words that name it a test whose df or association is not that of Pearson's χ² on
   * the whole table (McNemar, goodness of fit, trend, Mantel–Haenszel, a continuity correction).
   */
  namedAs?: string;
  /** From the symbol to the end of the last part read (its p, else its value), and its text. */
  reportSpan?: Span;
  reportPrinted?: string;
}

/** A contingency table's size as the text states it (`a 2 × 3 contingency table`). */
export interface TableDimensions {
  segment: number;
  block: number;
  sentence: number;
  span: Span;
  printed: string;
  rows: number;
  cols: number;
}

export interface Extraction {
  /** How the document writes its decimal mark (numbers below are read under it). */
  decimalConvention: 'point' | 'comma';
  tests: TTestReport[];
  /** Statistics of other tests, which end a t-test's clause. */
  otherStatistics: OtherStatistic[];
  /** Contingency tables whose size the text states. */
  tableDimensions: TableDimensions[];
  statements: ContextStatement[];
  pWithoutT: PWithoutT[];
  summaries: GroupSummary[];
  sampleSizes: SampleSize[];
  /** Every count of people or units the text prints, in digits or words (see UnitCount). */
  unitCounts: UnitCount[];
  /** Two groups' sizes printed together, without their descriptives. */
  groupSizes: GroupSizes[];
  intervals: IntervalReport[];
  estimates: EstimateReport[];
  effectSizes: EffectSizeReport[];
  designs: DesignStatement[];
  /** Randomised groups named in the text. */
  assignments: GroupAssignment[];
  references: ReferenceValue[];
  integerMeasures: IntegerStatement[];
  /** Sentences that name a measure declared whole-number (by its declared name). */
  measureMentions: MeasureMention[];
  counts: CountPercent[];
  powerStatements: PowerStatement[];
  mentions: Mention[];
  /** The heading each segment sits under (by segment id), for abstract-versus-results checks. */
  sections: Array<string | undefined>;
  /** What each t-test of an abstract, and each test elsewhere with a df it may share, is about (src/extract/topic.ts). */
  topics: TestTopic[];
  /** The rows of each measure in long tables, and the sentences near a table that name one. */
  tableBlocks: TableBlockRecord[];
  tableMentions: Array<{ table: number; label: string; segment: number; sentence: number }>;
  /** Blocks each table spans, so results can be joined to the table next to them. */
  tables: Array<{ table: number; firstBlock: number; lastBlock: number }>;
  /** Prose that names a table by its caption's number ("see Table 2"), src/extract/tableReferences.ts. */
  tableReferences: TableReference[];
  /** Each captioned table's name and the stems of its caption's content words. */
  tableCaptions: TableCaption[];
  /**
   * Sentences of a paragraph that names a table which name one of that table's row or block
   * labels (its measures), found in every such paragraph however far from the table.
   */
  tableLabelMentions: Array<{ table: number; label: string; segment: number; sentence: number }>;
}

/**
 * "Table 2" named in prose. `table` is the table whose caption gives it that number, when
 * exactly one does; a plural ("Tables 2 and 3") or a number no caption gives leaves it open.
 */
export type { TestTopic } from './topic.js';

export interface TableReference {
  segment: number;
  block: number;
  sentence: number;
  span: Span;
  printed: string;
  table?: number;
  /** "Tables 2 and 3", "Tables 2–4": several tables named at once. */
  plural: boolean;
}

export interface TableCaption {
  table: number;
  /** "Table 2", from the caption's own number. */
  name: string;
  /** The caption's content words (lower case, each once), and the stem of each, in the same order. */
  words: string[];
  stems: string[];
}

/** The kind of spread printed after a mean. */
export type SpreadKind = 'SD' | 'SE' | 'unstated';

/** The rows of one measure in a long table: its name, and the rows it spans. */
export interface TableBlockRecord {
  table: number;
  label: string;
  firstRow: number;
  lastRow: number;
}

/** A row of a table: results, groups and intervals printed there belong together. */
export interface TableRow {
  table: number;
  row: number;
}

/** A group's (or condition's) descriptives as printed: mean, spread and n, any of them missing. */
export interface GroupSummary {
  id: string;
  segment: number;
  block: number;
  sentence: number;
  span: Span;
  printed: string;
  mean?: ReportedNumber;
  spread?: { number: ReportedNumber; kind: SpreadKind; kindSpan?: Span; printedKind?: string };
  n?: ReportedNumber;
  /** Its n is said to count those randomised, allocated or enrolled ("randomised n = 32"), who need not be those analysed. */
  nAssigned?: true;
  /** Up to a few words before the descriptives, e.g. "in the standing weeks". */
  label?: string;
  /** The words right after the descriptives when they say whose they are: "in the usual-routine group". */
  labelAfter?: string;
  /**
   * The occasion the numbers were measured on, when the words at the label's end or right
   * after the numbers name one ("from baseline (M = …)", "… (4.8) at week 8"): lower case, without
   * hyphens and spaces ("baseline", "week8", "posttest").
   */
  occasion?: string;
  /** The numbers were printed as percentages (`59.1% ± 9.1%`). */
  percent: boolean;
  /** For table rows: which table and row. */
  table?: TableRow;
  /** Prose: the stems of the content words from its sentence's start to its end (src/extract/topic.ts). */
  topic?: string[];
  /** Its label's last words name a reference a sample is tested against ("than the published norm", "the published reference for women aged 70–79"). */
  asReference?: true;
  /** Prose: the first words of its paragraph that name an analysis other than a one-way ANOVA ("adjusted for age"). */
  paragraphAnalysisWords?: string;
}

/** A sample size printed on its own: `N = 60`, `(n = 30 per group)`, `24 participants`. */
export interface SampleSize {
  segment: number;
  block: number;
  sentence: number;
  n: ReportedNumber;
  /** `subset`: a part of some group (`n = 12 of the choir arm`), never a group of a total. */
  scope: 'total' | 'per-group' | 'subset' | 'unspecified';
  /** Said to count those randomised, allocated or enrolled ("randomised n = 32"), who need not be those analysed. */
  assigned?: true;
  span: Span;
  printed: string;
}

/**
 * A count of people or units as printed, in digits or spelled out ("24 nurses", "Forty
 * participants", "Twelve wards"), whatever it counts: a total, a group, those excluded, another
 * kind of unit than the tests'. Never a sample size on its own word; rules read these counts
 * only to find that the text accounts for a number otherwise unexplained (a test's units,
 * another sample), never to speak of a number.
 */
export interface UnitCount {
  segment: number;
  block: number;
  sentence: number;
  value: number;
  /** Spelled out in words, not digits. */
  worded: boolean;
  /** A number of cluster means compared ("the 12 school means"): the units a test of them counts are the clusters. */
  clusterMeans?: true;
  span: Span;
  printed: string;
}

/** The sizes of two groups printed together: `n = 25 and 23`, `in 26 and 28 employees`. */
export interface GroupSizes {
  segment: number;
  block: number;
  sentence: number;
  ns: [ReportedNumber, ReportedNumber];
  span: Span;
  printed: string;
}

/** A confidence interval as printed: `95% CI [a, b]`. */
export interface IntervalReport {
  segment: number;
  block: number;
  sentence: number;
  level: number;
  low: ReportedNumber;
  high: ReportedNumber;
  span: Span;
  printed: string;
  /** Printed in a table: its row. */
  table?: TableRow;
  /** A table's interval whose level neither its column header nor the table's caption prints: 95% is assumed. */
  levelAssumed?: true;
  /** A method other than estimate ± t × SE named right before it ("bootstrap 95% CI"), as printed. */
  method?: string;
  /**
   * The label of another estimate it is the interval of, printed right before it or heading its
   * table column ("ICC = 0.86 (95% CI …)", "SMD", "AUC"; src/extract/otherEstimates.ts).
   */
  ofOther?: string;
}

/** An estimate printed with a label: `difference = 10.31`, `b = 2.48`, `MD = 3.1`. */
export interface EstimateReport {
  segment: number;
  block: number;
  sentence: number;
  value: ReportedNumber;
  span: Span;
  printed: string;
  /** A regression coefficient (`b =`, `B =`, `β =`), whose t has the model's df, not a t-test's. */
  kind?: 'coefficient';
  /** A coefficient's standard error printed right after it (`b = 0.42, SE = 0.15`, `B = 0.42 (SE = 0.15)`). */
  se?: ReportedNumber;
  /** Printed in a table: its row. */
  table?: TableRow;
}

/** An effect size as printed: `d = 0.53`, `Cohen's d = 0.73`, `g = 0.41`, `dz = 0.6`. */
export interface EffectSizeReport {
  segment: number;
  block: number;
  sentence: number;
  kind: 'd' | 'g' | 'dz' | 'dav';
  value: ReportedNumber;
  span: Span;
  printed: string;
  /** Printed in a table: its row. */
  table?: TableRow;
}

/** Words about the design: one group measured twice, two independent groups, one sample. */
export interface DesignStatement {
  segment: number;
  block: number;
  sentence: number;
  design: 'paired' | 'independent' | 'one-sample';
  span: Span;
  printed: string;
  /** Its sentence names one study or experiment ("Experiment 2 used …"): the design is that study's. */
  namesStudy?: boolean;
}

/**
 * Two named groups that different units were put in ("randomly assigned to the incentive group
 * or the no-incentive group"): a comparison of these two groups is between independent groups.
 */
export interface GroupAssignment {
  segment: number;
  block: number;
  sentence: number;
  /** The two groups' names, in lower case. */
  names: [string, string];
  span: Span;
  printed: string;
}

/** The reference value of a one-sample test: `compared with 50`, `chance (50%)`, `test value 7`. */
export interface ReferenceValue {
  segment: number;
  block: number;
  sentence: number;
  value: ReportedNumber;
  span: Span;
  printed: string;
}

/** Integer-valued measures stated in the text (`a single item scored 1–7`, `number of …`). */
export interface IntegerStatement {
  segment: number;
  block: number;
  sentence: number;
  span: Span;
  printed: string;
  /** Integer items a score averages ("the mean of four items" → 4, "a 10-item scale" → 10); 1 for a single item, a count or a sum. */
  items: number;
  /** The measures declared, as lower-case singular words ("the number of errors" → "error"), when the sentence names them. */
  measures?: string[];
}

/** A sentence that names a measure some declaration made whole-number. */
export interface MeasureMention {
  measure: string;
  segment: number;
  sentence: number;
  /** Named in a table cell: its row (the row's groups are that measure's). */
  table?: TableRow;
}

/** A count with its percentage: `12 (40%)`. */
export interface CountPercent {
  segment: number;
  block: number;
  sentence: number;
  count: ReportedNumber;
  percent: ReportedNumber;
  /** The denominator printed with it: `5 (24%) of the 21 beds`, `Of the 14 beds …, 5 (36%)`. */
  of?: ReportedNumber;
  /** Said of one group right after it (`18 (60%) in the sock arm`): a percentage of that group's size, which is not printed with it. */
  inGroup?: true;
  /**
   * Its base may be a part named before it ("Of 120 invited, 80 responded; 60 (75%) …", "24
   * reported pain, and 18 (75%) of them"): not certainly the sentence's n.
   */
  baseOpen?: true;
  span: Span;
  printed: string;
}

/** A sample-size or power statement: `80% power to detect d = 0.5 at α = .05 needed 64 per group`. */
export interface PowerStatement {
  segment: number;
  block: number;
  sentence: number;
  span: Span;
  printed: string;
  power: ReportedNumber;
  /** The power was printed as a percentage (80%) rather than a proportion (.80). */
  powerPercent: boolean;
  d: ReportedNumber;
  alpha?: number;
  sides?: 1 | 2;
  n?: ReportedNumber;
  nScope: 'per-group' | 'total' | 'unspecified';
  design: 'two-sample' | 'paired' | 'one-sample';
  /** The power is a bound: "more than 80% power", "at least 80%", "over 90%". */
  powerAtLeast?: true;
  /** The n allows for a loss of this proportion ("after allowing for 20% attrition"); NaN when the words give no rate. */
  allowsForLoss?: number;
  /** Groups of unequal sizes ("a 2:1 allocation", "96 intervention and 48 control participants"), which the equal-groups calculation does not model. */
  unequalGroups?: true;
  /**
   * Words of a calculation other than two independent groups' t-test ("design effect 1.9", "ICC
   * 0.05", "With ANCOVA and an assumed baseline–outcome correlation of 0.5", "non-inferiority"):
   * the plain calculation does not give its n.
   */
  otherModel?: string;
}

/**
 * Words that reporting guidelines look for. `assumption` is a statement that an assumption was
 * checked (a named check such as Shapiro–Wilk or Levene's test, or normality or equal variances
 * with a verb of checking), never a negated one ("normality was not checked") nor words about
 * what a test assumes ("Welch's test does not assume equal variances").
 */
export interface Mention {
  kind: 'software' | 'assumption' | 'multiplicity' | 'trend' | 'exclusion' | 'test-name' | 'repeated-measures' | 'between-subjects' | 'no-sphericity-correction' | 'resampled-p' | 'resampling-test' | 'approximate-df' | 'contrast' | 'derived-means' | 'several-studies' | 'part-of-sample' | 'many-arms' | 'transformed' | 'exact-test' | 'model-based' | 'd-standardiser' | 'cluster-means';
  segment: number;
  block: number;
  sentence: number;
  span: Span;
  printed: string;
  /** For software: the version printed with it. */
  version?: string;
  /** For a test name: what the words say of the test. */
  test?: TestNameWords;
  /** Said in a table cell: the cell's table and row (row 0 is the header row). */
  table?: TableRow;
  /** Said in a table's caption or note: that table. */
  legendOf?: number;
  /** For `repeated-measures`: a sphericity correction named as applied (Greenhouse–Geisser, Huynh–Feldt). */
  namesCorrection?: true;
  /** For a test name: the words are denied ("Welch's test was not needed", "instead of Welch's t-test"; mentions.ts deniedAt). */
  negated?: true;
  /**
   * For words that make a finding less certain (a transformation, a model, an exact test): their
   * sentence says what they are about, the tests or comparisons themselves ("All group comparisons
   * were estimated by regression"), or for an exact test small counts or χ². Only such a sentence
   * speaks of results beyond its own paragraph.
   */
  aboutTests?: true;
  /**
   * For a transformation or a model said in a sentence not about the tests: the stems of the
   * measure it is said of, its subject up to its verb ("CRP values were log-transformed": crp;
   * "Blood glucose was … analysed with a linear mixed model": blood, gluco).
   */
  measure?: string[];
}

/** What a test's name says: the design, Student's or Welch's, and whether it names several tests. */
export interface TestNameWords {
  design?: 'paired' | 'independent' | 'one-sample';
  variant?: 'welch' | 'student';
  /** "t-tests", "Welch tests": said of several results. */
  plural: boolean;
  /** `prose`, or the header software prints above a test's output ("Welch Two Sample t-test" in R). */
  source: 'prose' | 'software-output';
  /**
   * The words name a test, not only a person's method: a t or "test" is among them ("Welch's t",
   * "Welch test"; not "Welch's" alone, as in "Welch's method" or "Welch's ANOVA").
   */
  namesTest?: true;
}
