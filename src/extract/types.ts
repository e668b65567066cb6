import type { Span } from '../parse/types.js';

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
}

export type Comparison = '=' | '<' | '<=' | '>' | '>=' | '~';

export interface ReportedP {
  /** `value`: p with a comparison and a number; `ns`: "n.s." with no number. */
  kind: 'value' | 'ns';
  op: Comparison;
  number?: ReportedNumber;
  /** From the p symbol to the end of its number. */
  span: Span;
  printed: string;
}

export type Sidedness = 'one' | 'two';

/** A statement about tails or alpha found in the prose, with where it was said. */
export interface ContextStatement {
  kind: 'sidedness' | 'alpha' | 'equivalence';
  sidedness?: Sidedness;
  alpha?: number;
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
  /** Tails stated inside the report itself, e.g. `p = .03, one-tailed`. */
  statedSidedness?: { value: Sidedness; span: Span };
  /** The test name given right before the statistic (e.g. "Welch's t"), lower-case. */
  namedVariant?: 'welch' | 'student' | 'paired' | 'one-sample' | 'independent';
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

export interface Extraction {
  tests: TTestReport[];
  statements: ContextStatement[];
  pWithoutT: PWithoutT[];
}
