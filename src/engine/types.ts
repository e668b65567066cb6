import type { Comparison, ReportStyle, Sidedness } from '../extract/types.js';
import type { IntervalTarget, LinkBasis, Setting } from '../link/types.js';
import type { Position, SourceFormat, Span } from '../parse/types.js';
import type { Figure, Fix, Gap, Guideline, Level, Recomputed } from '../rule-api/types.js';

/**
 * Where a place of a binary document's extracted text sits in the original file, for a person
 * to find it: a Word paragraph (1-based, as Word's navigation counts them), the 1-based
 * character inside it and the paragraph's first words; or a PDF page, the line on it and the
 * words around the place.
 */
export type OriginalPlace =
  | { kind: 'paragraph'; paragraph: number; char: number; opening: string; note?: { kind: 'footnote' | 'endnote'; number: number } }
  | { kind: 'page'; page: number; line: number; around: string };

/**
 * A place in a file: offsets and 1-based line/column of both ends (end exclusive). For a Word
 * or PDF file the offsets, lines and columns are those of the extracted text, and `original`
 * says where the place is in the file itself.
 */
export interface Place {
  span: Span;
  start: Position;
  end: Position;
  original?: OriginalPlace;
}

export interface NumberRecord extends Place {
  printed: string;
  /** As a double; a number beyond a double's range is given as the nearest double (0 or ±1.8e308) with `log10`. */
  value: number;
  decimals: number;
  exponent: number;
  /** log10 of the magnitude as printed, for a number no double holds (`1e-400`, a 400-digit t). */
  log10?: number;
}

/** A number tied to a result, with how it was tied (`basis`) and whether that tie is certain. */
export interface LinkedRecord extends Place {
  printed: string;
  basis: LinkBasis;
  certain: boolean;
  /** Why the tie is not certain, when it is not. */
  doubt?: string;
}

/** One extracted result as the output formats show it. */
export interface ResultRecord extends Place {
  id: string;
  printed: string;
  style: ReportStyle;
  inCode: boolean;
  plural: boolean;
  t: NumberRecord & { op: Comparison };
  df?: NumberRecord;
  p?: Place & {
    kind: 'value' | 'ns';
    op: Comparison;
    printed: string;
    number?: NumberRecord;
    /** Said to be adjusted for multiple comparisons: not compared with the p of t and df. */
    adjusted?: { method: string; printed: string };
    /** Read from significance stars, with where their bound came from. */
    stars?: { symbol: string; basis: 'legend' | 'lenient-convention' };
  };
  /** An adjusted p printed beside the unadjusted one. */
  adjustedP?: ResultRecord['p'];
  sidedness: Setting<Sidedness>;
  alpha: Setting<number>;
  /** The descriptives and context joined to this result, so a reader sees which numbers were used. */
  context: {
    design: Setting<string>;
    descriptives?: {
      scope: 'sentence' | 'paragraph' | 'previous-paragraph' | 'table';
      /** Whether the tie is certain enough to warn on (no other statistic shares its sentence or paragraph). */
      certain: boolean;
      /** Why the tie is not certain, when it is not. */
      doubt?: string;
      groups: Array<Place & { printed: string; label?: string; spreadKind: string }>;
      /** For an F's groups in a table: the table, the words naming it, and how the F names its outcome. */
      tableTie?: { name: string; named: Place & { printed: string; basis: 'sentence' | 'paragraph' }; outcome: { by: 'label' | 'caption'; words: string[] } };
    };
    /** Why descriptives nearby were not joined (never a silent guess). */
    unlinked?: string;
    reference?: Place & { printed: string };
    /** The interval of the test's estimate. */
    interval?: LinkedRecord & { of: IntervalTarget };
    /** Every interval tied to the result, with what it is the interval of. */
    intervals?: Array<LinkedRecord & { of: IntervalTarget }>;
    estimate?: LinkedRecord;
    effectSizes: LinkedRecord[];
  };
  /** Printed in a table: the table's name (its caption's number, else its place among the tables) and the row's label. */
  table?: { name: string; row?: string };
  /** Recomputed p ranges for this result, when t, df and p allow it. */
  recomputed?: {
    twoTailed: { low: number; high: number };
    oneTailed: { low: number; high: number };
    standing: string;
  };
}

/** An F, χ², r or z result as the output formats show it (t results are ResultRecords). */
export interface StatisticRecord extends Place {
  id: string;
  kind: 'F' | 'chi-square' | 'r' | 'z';
  /** The symbol as printed (`F`, `χ^2`, `X2`, `r`, `Z`, …). */
  symbol: string;
  /** From the symbol to its p (or its value when no p was read). */
  printed: string;
  value: NumberRecord & { op: Comparison };
  /** F: [df1, df2]; χ² and r: [df]. */
  dfs?: NumberRecord[];
  /** χ²'s N, or an r's n, printed with it. */
  n?: NumberRecord;
  p?: ResultRecord['p'];
  alpha: Setting<number>;
  /** For F: the groups whose summaries are tied to it, as a t result's descriptives. */
  groups?: ResultRecord['context']['descriptives'];
  /** For z: the coefficient printed with its SE right before it. */
  coefficient?: LinkedRecord;
  /** Its tails, found as for a t-test (only z and r are read either way; F and χ² have one tail by definition). */
  sidedness?: Setting<Sidedness>;
  /** A Greenhouse–Geisser or Huynh–Feldt correction named beside an F. */
  dfCorrection?: 'greenhouse-geisser' | 'huynh-feldt';
  /** Why the p's tie to the statistic is not certain (findings on it are then notes). */
  doubt?: string;
  /** The recomputed p ranges, one per reading, and whether any reproduces the reported p. */
  recomputed?: { readings: Array<{ name: string; low: number; high: number; fits: boolean }>; fits: boolean };
}

export interface Finding extends Place {
  ruleId: string;
  messageId: string;
  level: Level;
  message: string;
  reported: string;
  recomputed?: Recomputed;
  gap?: Gap;
  /** What a picture of this finding draws (see Figure); none when the finding has no picture. */
  figure?: Figure;
  check: string;
  related?: Array<Place & { message: string }>;
  resultId?: string;
  /**
   * A safe formatting fix (src/fix applies it): edits by source offsets, which are JavaScript
   * string indices (UTF-16 code units), as every span is.
   */
  fix?: Fix;
  /** Why the finding is only a note: the links it rests on that are not certain. */
  uncertain?: string[];
  /**
   * Stable across edits elsewhere in the file: a hash of the rule and the flagged text, then
   * ":" and the occurrence among identical ones. Baselines and SARIF partialFingerprints use it.
   */
  fingerprint: string;
  /**
   * `document`: said of the whole document (a reporting-checklist item nothing in the text
   * meets). Its place is the start of the file only because every finding has one; reports for
   * people give it no line.
   */
  scope?: 'document';
}

/** One checklist item for a file: the guideline items it follows and its entries. */
export interface ChecklistRecord {
  ruleId: string;
  item: string;
  guidelines: Partial<Record<Guideline, string>>;
  entries: Array<{ scope: 'document' | 'result'; resultId?: string; status: 'found' | 'missing' | 'not-applicable'; detail: string; place?: Place }>;
}

export interface FileReport {
  path: string;
  format: SourceFormat;
  results: ResultRecord[];
  /** The F, χ², r and z results, in reading order (absent in reports that predate them). */
  statistics?: StatisticRecord[];
  findings: Finding[];
  /** The reporting checklist, for the guidelines selected (all by default). */
  checklist: ChecklistRecord[];
  guidelines: Guideline[];
  alpha: Setting<number>;
  sidedness: Setting<Sidedness>;
  /** Findings not reported: silenced by a quiet comment in the file, or recorded in a baseline. */
  hidden: { quiet: number; baseline: number };
  /** The source text, for formatters that show the line of a finding (for Word and PDF files, the extracted text). */
  source: string;
  /**
   * Word and PDF files: the text was extracted from this kind of file; Word: whether it held
   * tracked changes. `lines`: the line of the extracted text where each paragraph (Word) or
   * printed line (PDF) starts, with its place, so a report can label its lines of text.
   */
  original?: {
    kind: 'docx' | 'pdf';
    trackedChanges?: boolean;
    lines?: Array<{ at: number; paragraph?: number; note?: { kind: 'footnote' | 'endnote'; number: number }; page?: number; line?: number }>;
  };
}

/** A file that could not be checked at all. */
export interface FileFailure {
  path: string;
  message: string;
  /** Where in the file the problem is (a configuration's syntax error). */
  line?: number;
  column?: number;
  /** For a bad configuration file: the manuscripts it kept from being checked. */
  notChecked?: string[];
}
