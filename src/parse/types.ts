/** A half-open range of UTF-16 offsets into the original source text. */
export interface Span {
  start: number;
  end: number;
}

/** 1-based line and column (column in UTF-16 code units, tabs count one), as SARIF's default. */
export interface Position {
  line: number;
  column: number;
}

export type SegmentKind = 'paragraph' | 'heading' | 'tableCell' | 'code' | 'math' | 'text';

export interface TablePlace {
  /** Which table of the document (0-based). */
  table: number;
  /** Row within the table; row 0 is the header row. */
  row: number;
  /** Column within the table, counted after earlier cells' spans (HTML `rowspan`/`colspan`). */
  column: number;
  /** Rows the cell covers, when more than one (a label cell beside two rows of results). */
  rowSpan?: number;
  /** Columns the cell covers, when more than one (a group header over its M and SD columns). */
  colSpan?: number;
}

/** A paragraph that belongs to a table: its caption (`Table 2 …`) or a note below it. */
export interface TableLegend {
  table: number;
  role: 'caption' | 'note';
}

/**
 * One run of prose, with a map from each of its characters back to the source. `text` has
 * markup removed (emphasis markers, escapes, links, LaTeX text commands) and spelling
 * variants folded (Unicode minus, superscript exponents, middle-dot decimals, no-break
 * spaces), so the extractor sees one spelling; `starts[i]`/`ends[i]` give the source
 * range that produced `text[i]`.
 */
export interface Segment {
  id: number;
  /** Segments from the same block (paragraph with its inline code, one table cell) share it. */
  block: number;
  kind: SegmentKind;
  text: string;
  /** Int32Array, not number[]: 4 bytes a character rather than 8 and more (see `offsetArray`). */
  starts: Int32Array;
  ends: Int32Array;
  table?: TablePlace;
  /** Heading text of the section the segment sits in (nearest heading above), if any. */
  section?: string;
  /** Set when the segment is a table's caption or one of its notes. */
  legendOf?: TableLegend;
}

/** An HTML comment addressed to plumbline, e.g. `<!-- plumbline quiet RULE: reason -->`. */
export interface Directive {
  span: Span;
  verb: string;
  ruleIds: string[];
  reason: string;
  /** The block the directive applies to (the next block after it), or -1 if none follows. */
  appliesToBlock: number;
}

export interface FrontMatter {
  /** Parsed YAML, or undefined when absent or malformed. */
  data: unknown;
  span: Span;
  /** Parser message when the YAML could not be read. */
  error?: string;
}

export type SourceFormat = 'markdown' | 'text' | 'latex' | 'docx' | 'pdf';

/**
 * A stretch of the extracted text of a binary document (Word, PDF) and where it sits in the
 * original file: a Word paragraph, or a line of a PDF page.
 */
export interface OriginalUnit {
  /** [start, end) in ParsedDocument.source. */
  start: number;
  end: number;
  /** Word: 1-based, as Word's navigation counts paragraphs (which ones count: see src/parse/docx/read.ts). */
  paragraph?: number;
  /** PDF: 1-based physical page. */
  page?: number;
  /** PDF: 1-based line on that page (after running heads and line numbers are removed). */
  line?: number;
  /** Word: the paragraph is the `paragraph`th of this footnote or endnote (numbered as Word shows it), not of the body. */
  note?: { kind: 'footnote' | 'endnote'; number: number };
  /** Offset inside the paragraph or line of the unit's first character (usually 0). */
  charOffset?: number;
  /** The first words of the paragraph or the line, for a person to search for. */
  opening: string;
}

/** Where each stretch of a binary document's extracted text sits in the original file. */
export interface OriginalMap {
  kind: 'docx' | 'pdf';
  /** In source order, not overlapping. */
  units: OriginalUnit[];
  /** Word: the file held tracked changes (read as accepted). */
  trackedChanges?: boolean;
}

export interface ParsedDocument {
  path: string;
  source: string;
  format: SourceFormat;
  segments: Segment[];
  directives: Directive[];
  frontMatter?: FrontMatter;
  /** Whether the source began with a byte-order mark (stripped before parsing). */
  hadBom: boolean;
  /** What plumbline could not read as written (undecodable bytes, nesting past the parser's limits). */
  readNotes?: ReadNote[];
  /**
   * For a document read from a binary file (Word, PDF): `source` is the extracted text, and this
   * says where each stretch of it sits in the original file.
   */
  original?: OriginalMap;
}

/** Something about reading the file that a user should know: the findings may be incomplete there. */
export interface ReadNote {
  kind: 'replaced-bytes' | 'deep-nesting' | 'parser-limit' | 'dense-markup' | 'encoding-guessed' | 'slow-shape' | 'invisible-characters' | 'include-not-read' | 'tracked-changes' | 'macro-not-expanded' | 'glyphs-not-read';
  message: string;
  span: Span;
}
