import type { ContextStatement, EstimateReport, Extraction, GroupSummary, IntegerStatement, Mention, OtherStatistic, PWithoutT, ReportedNumber, Sidedness, SpreadKind, TableDimensions, TTestReport } from '../extract/types.js';
import type { Directive, ReadNote, Span } from '../parse/types.js';
import type { DescriptiveLink, Linked, ResultContext } from './descriptives.js';
import type { TestName } from './testNames.js';
export type { IntervalTarget, LinkBasis, Linked } from './descriptives.js';

/** Where a setting that applies to a result came from, most specific first. */
export type SettingBasis = 'in-report' | 'sentence' | 'paragraph' | 'equivalence-test' | 'methods' | 'document-text' | 'structure' | 'front-matter' | 'command-line' | 'configuration' | 'default';

export interface Setting<T> {
  value: T;
  basis: SettingBasis;
  /** The words in the manuscript that set it, when it was set there. */
  span?: Span;
  printed?: string;
}

/** A reported t-test with the context that decides how to check it. */
export interface LinkedResult {
  report: TTestReport;
  sidedness: Setting<Sidedness>;
  alpha: Setting<number>;
  /** Descriptives, design, CI, effect sizes and sample sizes that belong with the result. */
  context: ResultContext;
  /** The test's name as the result's own words give it (its clause, sentence, table or output header). */
  testName?: TestName;
  /** A one-tailed statement elsewhere in the text that could not be tied to this result. */
  untiedSidedness?: ContextStatement;
  /**
   * Welch's test named in a sentence of the text that reports no test ("Welch's t-tests were
   * used"), for a result whose own words name neither Welch's nor Student's: a whole df of it may
   * be a Welch df printed rounded, which cannot be told from the text.
   */
  untiedWelch?: Mention;
  /**
   * Student's test named in a sentence of the text that reports no test ("Student's t-tests were
   * used"), for a result whose own words name neither Welch's nor Student's: the text then says
   * which test its results are, and a whole df is read as Student's count.
   */
  untiedStudent?: Mention;
  /**
   * A correction for multiple comparisons named in its sentence, or in a sentence that reports
   * no statistic ("All p values were Bonferroni-corrected"), in a text that labels no p as
   * adjusted: its p may be an adjusted one, which cannot be told from the text.
   */
  adjustmentSaid?: ContextStatement;
  /**
   * Words saying its p came from resampling: a permutation or randomization test named in its
   * sentence, or words about p values ("p values were obtained from 10,000 permutations") there
   * or in a sentence that reports no statistic. Such a p need not follow from the statistic.
   */
  resampledP?: Mention;
  /**
   * Words saying dfs were approximated rather than counted (Satterthwaite's or Kenward and Roger's
   * dfs of a mixed model), in its sentence or in a sentence that reports no statistic: a whole df
   * may then be such a df printed rounded, which cannot be told from the text.
   */
  approximateDf?: Mention;
  /**
   * A sign that the t may be a comparison within a larger analysis of variance, whose pooled
   * error term sets its df (N − k) and its SE: an F whose error df is the t's df, or words of
   * contrasts or post hoc comparisons (link/index.ts pooledErrorJoiner). Its df and t then need not
   * follow from its two groups alone.
   */
  pooledError?: PooledError;
  /**
   * Words saying values were transformed for the analysis ("log-transformed for the t-tests",
   * "geometric means"), in its sentence, its paragraph or a sentence that reports no statistic:
   * its t may be of the transformed values, which the untransformed descriptives do not give.
   */
  transformed?: Mention;
  /**
   * Words saying comparisons were estimated from a model (a mixed model, regression, ANCOVA,
   * "adjusted for age, sex and BMI"), in its sentence, its paragraph or a sentence that reports no
   * statistic: its t need not follow from the groups' descriptives, nor its df from their sizes.
   */
  modelBased?: Mention;
  /**
   * Words saying effect sizes are standardised by another SD than the groups' own ("standardised
   * by the pooled baseline SD"), in its sentence, its paragraph or a sentence that reports no
   * statistic: its d need not follow from its t or from the SDs printed beside it.
   */
  dStandardiser?: Mention;
  /**
   * Words in its sentence saying the test compares cluster means ("on school means", "at the
   * cluster level"): its df counts the clusters, not the group sizes printed beside it.
   */
  clusterMeans?: Mention;
}

/** What says a t may take a larger analysis's pooled error term: an F with its df as error df, or words of contrasts. */
export interface PooledError {
  basis: 'error-df' | 'words';
  span: Span;
  printed: string;
  /** For `error-df`: the number of groups the F compares (its df1 + 1), whose pooled error df is N − groups. */
  groups?: number;
}

/**
 * An F, χ², r or z result with the alpha that applies to it (found as for a t-test: its
 * sentence, its paragraph, the document, the default). Its p is the one printed in its own
 * clause (src/extract/statistics.ts); `doubts` say why that p or its df is not certainly the
 * statistic's own, and a rule resting on it then speaks only as a note.
 */
export interface LinkedStatistic {
  /** Stable within a document: `stat:segment:offset`. */
  id: string;
  report: OtherStatistic & { kind: 'F' | 'chi-square' | 'correlation' | 'z' };
  alpha: Setting<number>;
  /**
   * Its tails, found as for a t-test (its p's own label, a tails word in its sentence, an
   * equivalence test, its paragraph, the document, the default). Only z and r are read either way;
   * an F or χ² has one tail by definition whatever this says.
   */
  sidedness: Setting<Sidedness>;
  /** A one-tailed statement elsewhere in the text that could not be tied to this result. */
  untiedSidedness?: ContextStatement;
  doubts: string[];
  /**
   * For z: a regression coefficient printed with its SE right before it in its sentence (`b =
   * 0.42, SE = 0.15, z = 2.80`), with no other statistic between them; certain only when it is
   * the one coefficient there.
   */
  coefficient?: Linked<EstimateReport & { se: ReportedNumber }>;
  /**
   * For F: the groups whose printed means, spreads and sizes its sentence (or else its paragraph)
   * ties to it (src/link/descriptives.ts `fGroupsJoiner`), with how certainly.
   */
  groups?: DescriptiveLink;
  /** For χ²: the size of the contingency table its sentence (or else its paragraph) states, where nothing else could claim it. */
  dimensions?: Linked<TableDimensions>;
  /**
   * For F: the nearest words naming an analysis with repeated measures or a sphericity
   * correction ("RM ANOVA", "Greenhouse–Geisser"): in its sentence, else its paragraph, else
   * anywhere in the text. Such an F may carry a corrected p beside its uncorrected dfs, so a p
   * that fits only so cannot be called wrong with certainty.
   */
  repeatedMeasures?: { mention: Mention; basis: 'sentence' | 'paragraph' | 'document' };
  /** As LinkedResult.adjustmentSaid: a correction named for its p or for every p, where no p is labelled adjusted. */
  adjustmentSaid?: ContextStatement;
  /** As LinkedResult.resampledP. */
  resampledP?: Mention;
}

export interface DocumentSettings {
  integerMeasure?: Setting<{ items: number }>;
  alpha?: Setting<number>;
  sidedness?: Setting<Sidedness>;
  frontMatterError?: { message: string; span: Span };
  readNotes?: ReadNote[];
}

export interface LinkedDocument {
  results: LinkedResult[];
  /** The F, χ², r and z results, in reading order. */
  statistics: LinkedStatistic[];
  pWithoutT: PWithoutT[];
  directives: Directive[];
  /** Every extracted record, for rules that look at the whole document. */
  extraction: Extraction;
  /** Settings for integer-valued measures (GRIM): from front matter or configuration. */
  integerMeasure?: Setting<{ items: number }>;
  /**
   * Each group's whole-number declaration, where the text ties one to it with certainty: in
   * the group's own sentence, or by the measure's name in that sentence (across sections).
   */
  integerDeclarations: Map<GroupSummary, { statement: IntegerStatement; basis: 'sentence' | 'measure-name' }>;
  /**
   * Words saying a group's mean is not a plain mean of its scores (adjusted for covariates,
   * estimated from a model, pooled over imputations): in its own sentence, or in a sentence that
   * reports no statistic. A whole-number measure's mean of that kind need not be a multiple of 1/n.
   */
  derivedMeans: Map<GroupSummary, Mention>;
  /**
   * The size of a group printed without its n, where a certain link gives it: the other
   * condition of a paired design (the same units), or df + 1 of the paired or one-sample test
   * the group is certainly tied to.
   */
  inferredSizes: Map<GroupSummary, { n: number; because: string }>;
  /** What each group's spread is (SD, SE or unstated), from its label or the text's statements about "±". */
  spreadKinds: Map<GroupSummary, SpreadKind>;
  /** Why the front matter could not be read, when it could not. */
  frontMatterError?: { message: string; span: Span };
  /** What could not be read as written: undecodable bytes, nesting past the parser's limits. */
  readNotes?: ReadNote[];
  statements: ContextStatement[];
  /** The document-wide alpha and tails that apply where a result says nothing itself. */
  documentAlpha: Setting<number>;
  documentSidedness: Setting<Sidedness>;
}
