import type { LinkedDocument, LinkedResult, LinkedStatistic } from '../link/types.js';
import type { Span } from '../parse/types.js';

export type Level = 'error' | 'warning' | 'note';
export type LevelSetting = Level | 'off';

/** inconsistency: the numbers cannot all be true · doubtful: wrong unless an unstated assumption holds · advice */
export type RuleKind = 'inconsistency' | 'doubtful' | 'advice';

/** A value or interval plumbline recomputed, with how. */
export interface Recomputed {
  /** What was recomputed, e.g. "two-tailed p". */
  quantity: string;
  low: number;
  high: number;
  /** The printed inputs it was computed from, e.g. ["t = 2.10 → [2.095, 2.105]", "df = 28"]. */
  inputs: string[];
  /** Assumptions made, e.g. ["two-tailed (default)"]. */
  assumptions: string[];
  /** The same range as decimal logarithms, when it was computed on that scale (a p below 1e-300, which low and high round to 0). */
  log10?: { low: number; high: number };
}

export interface Gap {
  /** Distance between what was reported and the nearest recomputed value. */
  absolute: number;
  /** The same in units of the reported value's last printed digit, when it has one. */
  lastDigitUnits?: number;
  /** Half a unit of the last digit: what rounding alone can explain. */
  roundingAllowance?: number;
}

/** A closed range of values: a printed number's rounding interval, or a recomputed range. */
export interface ValueRange {
  low: number;
  high: number;
}

/**
 * The numbers a picture of a finding draws, on the scale of the finding's own quantity. A
 * formatter draws them as they are and computes nothing; a finding without one gets no picture.
 */
export type Figure = PFigure | IntervalFigure | DfFigure | LatticeFigure | CorrelationFigure;

/** The result's reported p against the p its statistic and dfs allow (both are on the result itself: a t result or an F, χ², r or z result). */
export interface PFigure {
  kind: 'p';
}

/** A confidence interval against its estimate and against the interval the reported t implies. */
export interface IntervalFigure {
  kind: 'interval';
  /** Confidence level, e.g. 0.95. */
  level: number;
  /** The printed limits, each as the values its rounding allows. */
  lower: ValueRange;
  upper: ValueRange;
  /** The printed limits' midpoint. */
  midpoint: ValueRange;
  /** The estimate the interval should be centred on, and where it came from ("as printed", "difference of the means", "midpoint"). */
  estimate: ValueRange;
  estimateSource: string;
  /** The interval the reported t implies: estimate ± critical value × |estimate| / |t|, each limit as a range; absent when t may be 0. */
  fromT?: { lower: ValueRange; upper: ValueRange };
  /** The test value subtracted from the printed limits when they are read as the interval of a mean. */
  shiftedBy?: number;
  /** A value the finding is about, marked on the axis (zero, for an interval that should exclude or include it). */
  reference?: { value: number; label: string };
}

/** The printed df against the df the group sizes allow. */
export interface DfFigure {
  kind: 'df';
  /** The printed df (a fractional df as its rounding interval). */
  reported: ValueRange;
  /** Each df or range of df the sizes allow, with what gives it ("n1 + n2 − 2"). */
  allowed: Array<ValueRange & { label: string }>;
}

/** GRIM: the means n whole-number scores can have, near a printed mean none of them rounds to. */
export interface LatticeFigure {
  kind: 'lattice';
  /** The values the printed mean's rounding allows. */
  reported: ValueRange;
  /** n × items: every possible mean is a multiple of 1/denominator. */
  denominator: number;
  /** The possible means around the printed one, in order. */
  possible: number[];
}

/** The correlation a paired result implies against the correlations that exist, [−1, 1]. */
export interface CorrelationFigure {
  kind: 'correlation';
  implied: ValueRange;
}

/**
 * One change of a fix: in the source text at `span`, `find` must occur exactly once, and is
 * replaced by `text`. The applier checks this against the source and leaves the fix out when it
 * does not hold (the text was edited, or printed differently than it was read), so a rule, which
 * never sees the source, can only ask for a change of characters it read.
 */
export interface FixEdit {
  span: Span;
  find: string;
  text: string;
}

/**
 * A formatting change that never changes what a number means (rules/*.md list each with why it
 * is safe). A number that is wrong never has one: the author has to look at the analysis.
 */
export interface Fix {
  /** Stable name of the kind of fix, listed on the rule's page. */
  id: string;
  /** What it does, for an editor's menu and the command line ("Write p < .001"). */
  title: string;
  edits: FixEdit[];
}

/** What a rule reports: data first; the engine adds file, level and positions. */
export interface RuleFinding {
  messageId: string;
  span: Span;
  message: string;
  /** The manuscript's text as printed. */
  reported: string;
  recomputed?: Recomputed;
  gap?: Gap;
  /** What a picture of this finding draws; none when no picture says more than the message. */
  figure?: Figure;
  /** One concrete thing to check. */
  check: string;
  related?: Array<{ span: Span; message: string }>;
  resultId?: string;
  /** The block the finding sits in, for `plumbline quiet` directives. */
  block?: number;
  /** A safe formatting fix, when one exists (see Fix). */
  fix?: Fix;
  /**
   * `document`: said of the whole document (an item of the reporting checklist that nothing in
   * the text meets), so it has no place of its own; `span` is then the empty span at offset 0.
   */
  scope?: 'document';
  /**
   * Why a link the finding rests on is not certain (a number tied to the result only by its
   * paragraph, a design the text does not state). A finding with reasons here is said as a
   * note of what could not be checked, never as a warning or error.
   */
  uncertain?: string[];
}

export interface RuleContext<Options> {
  document: LinkedDocument;
  options: Options;
}

/** A JSON Schema (draft 2020-12 subset) for a rule's options; must reject unknown keys. */
export interface OptionsSchema {
  type: 'object';
  properties: Record<string, unknown>;
  additionalProperties: false;
}

/** The options schema of a rule that takes no options. */
export const NO_OPTIONS: OptionsSchema = Object.freeze({ type: 'object', properties: Object.freeze({}), additionalProperties: false }) as OptionsSchema;

export interface Rule<Options extends object = Record<string, never>> {
  id: string;
  summary: string;
  kind: RuleKind;
  defaultLevel: LevelSetting;
  defaultOptions: Options;
  optionsSchema: OptionsSchema;
  /** Message templates keyed by id; `{name}` placeholders. */
  messages: Record<string, string>;
  /** Pure: reads linked results, calls stats, returns findings. */
  check(context: RuleContext<Options>): RuleFinding[];
  /** Present on reporting-checklist rules: their item and its per-document/per-result status. */
  checklist?: ChecklistItem;
  /** Runs only when the checklist is asked for (pure guideline items, no numbers). */
  checklistOnly?: boolean;
  /** The safe fixes its findings may carry: fix id → what it changes (its page says why it is safe). */
  fixes?: Record<string, string>;
}

/** Any rule, whatever its options: what the registry holds. */
// eslint-style escape hatch kept internal: the registry treats options as opaque data.
export type AnyRule = Rule<object>;

export type { LinkedDocument, LinkedResult, LinkedStatistic, Span };
/** Extracted records rules read through the linked document. */
export type { AdjustMethod, ContextStatement, EffectSizeReport, GroupSummary, IntegerStatement, ReportedNumber, ReportedP, SampleSize } from '../extract/types.js';

export type Guideline = 'sampl' | 'jars-quant' | 'consort';

/** One line of the reporting checklist: an item, for the document or one result, and its status. */
export interface ChecklistEntry {
  scope: 'document' | 'result';
  resultId?: string;
  status: 'found' | 'missing' | 'not-applicable';
  /**
   * Where it was found; for a missing per-result item, the result (or the words at fault). A
   * missing document item has none: nothing in the text is the place of an absence.
   */
  span?: Span;
  /** What was found or what is missing, in plain words. */
  detail: string;
  block?: number;
  /** For a missing item: a safe formatting fix that meets it, when one exists. */
  fix?: Fix;
}

/** What a checklist rule adds to a rule: the item, the guideline items it follows, and its assessment. */
export interface ChecklistItem {
  item: string;
  /**
   * The published item of each guideline it follows, as a reader finds it there: its number
   * (CONSORT 2010 "item 17a") or its section (SAMPL and JARS-Quant do not number their items).
   * Shown to people as it stands; where a citation was written from memory, the rule's page
   * says so, not this text.
   */
  guidelines: Partial<Record<Guideline, string>>;
  assess(document: LinkedDocument): ChecklistEntry[];
}
