import type { BoxList } from './boxes.js';

/** A character's box on its page, in PDF user-space points (origin bottom left). */
export interface CharBox {
  x0: number;
  x1: number;
  y0: number;
  y1: number;
}

/** A run of text as the PDF draws it: one text item of the page's text content. */
export interface TextRun {
  str: string;
  /** Left end of the baseline. */
  x: number;
  /** Baseline height. */
  y: number;
  width: number;
  /** Font size (the text matrix's vertical scale). */
  size: number;
  /** Whether the run is drawn upright (rotated runs, such as margin stamps, are not read). */
  upright: boolean;
}

/** One page's text runs and size. */
export interface PageRuns {
  /** 1-based physical page number. */
  page: number;
  width: number;
  height: number;
  runs: TextRun[];
}

/**
 * A printed line as read: its text (ligatures spelled out, exponents as superscript
 * characters, footnote markers dropped) and the box of each of its characters.
 */
export interface PdfLine {
  page: number;
  /** 1-based line on the page in reading order, after running heads, footers and line numbers are removed. */
  line: number;
  text: string;
  boxes: BoxList;
  x0: number;
  x1: number;
  /** Baseline. */
  y: number;
  /** The line's main font size. */
  size: number;
}

/** A place in a table: which table of the document, row, column (0-based; row 0 is the first row). */
export interface PdfTablePlace {
  table: number;
  row: number;
  column: number;
}

/** A stretch of one printed line inside a block, with the boxes of its characters. */
export interface PdfPiece {
  text: string;
  boxes: BoxList;
  page: number;
  line: number;
  /** Offset of the piece's first character in its printed line's text. */
  charOffset: number;
  /** The line's words, for a person to search for it. */
  opening: string;
}

/** A paragraph, heading or table cell of the PDF, in reading order, as printed lines. */
export interface PdfBlock {
  kind: 'paragraph' | 'heading' | 'tableCell';
  table?: PdfTablePlace;
  pieces: PdfPiece[];
}

/** Limits on what a PDF may make the reader do. */
export interface PdfLimits {
  /** Pages read at most; a longer PDF is refused. */
  maxPages: number;
  /** Text runs read at most over the whole file; more is refused. */
  maxRuns: number;
}
