import { parseLatex } from './latex.js';
import { parseMarkdown, reparseEdit } from './markdown.js';
import { parsePlainText } from './plainText.js';
import { exceedsNesting, DEPTH_LIMIT } from './depth.js';
import { INVISIBLE, LOOSE_MARKS } from './normalize.js';
import type { ParsedDocument, ReadNote } from './types.js';

export { decodeBytes, type Decoded } from './decode.js';

export { LineIndex } from './lines.js';
export { parseLatex, readLatexIncludes, type LatexInclude } from './latex.js';
export { mayHoldStatistics } from './prefilter.js';
export { annotateWordDocument, binaryKindOf, isCompoundFile, readBinaryDocument, type BinaryKind, type BinaryOutcome, type WordComment } from './binary.js';
export { documentFromBlocks, openingWords, unitAt, type Block, type BlockNote, type BlockPiece, type BlocksOptions } from './blocks.js';
export type * from './types.js';

/** How a source is read: as Markdown, R Markdown / Quarto (code chunks skipped), plain text or LaTeX. */
export type InputFormat = 'markdown' | 'rmarkdown' | 'text' | 'latex';

/** How a path is read: `.txt` as plain text, `.tex` as LaTeX, R Markdown / Quarto with their code chunks skipped. */
export function formatForPath(path: string): InputFormat {
  const lower = path.toLowerCase();
  if (lower.endsWith('.txt')) return 'text';
  if (lower.endsWith('.tex')) return 'latex';
  if (lower.endsWith('.rmd') || lower.endsWith('.qmd')) return 'rmarkdown';
  return 'markdown';
}

/** Source text of a document into segments, by the format its path implies (or `format`). */
export function parseDocument(path: string, source: string, format = formatForPath(path)): ParsedDocument {
  return withInvisibleNote(parseAs(path, source, format));
}

/**
 * The document `source` as parseDocument reads it, re-read from `prev` (a parse of an earlier
 * text of the same path and format) where only the edited part needs reading again; `undefined`
 * when that cannot be done with certainty, and the whole text must be parsed (see reparseEdit).
 */
export function reparseDocument(prev: ParsedDocument, source: string, format: InputFormat): ParsedDocument | undefined {
  if (format !== 'markdown' && format !== 'rmarkdown') return undefined;
  const doc = reparseEdit(prev, source);
  return doc && withInvisibleNote(doc);
}

function parseAs(path: string, source: string, format: ReturnType<typeof formatForPath>): ParsedDocument {
  if (format === 'text') return parsePlainText(path, source);
  if (format === 'latex') return parseLatex(path, source);
  const deep = exceedsNesting(source);
  if (deep) {
    return asPlainText(path, source, {
      kind: 'deep-nesting',
      message: `block quotes or lists nest more than ${DEPTH_LIMIT} levels deep (line ${deep.line}); the file was read as plain text, so Markdown structure (tables, code) was not recognised`,
      span: { start: deep.offset, end: deep.offset },
    });
  }
  try {
    return parseMarkdown(path, source, { chunks: format === 'rmarkdown' });
  } catch (e) {
    // The Markdown parser or a tree utility recursed past the stack (pathological nesting the
    // estimate above missed). Read the text as plain text rather than lose the file.
    if (!(e instanceof RangeError)) throw e;
    return asPlainText(path, source, {
      kind: 'parser-limit',
      message: `the Markdown parser gave up (${e.message}); the file was read as plain text, so Markdown structure (tables, code) was not recognised`,
      span: { start: 0, end: 0 },
    });
  }
}

function asPlainText(path: string, source: string, note: ReadNote): ParsedDocument {
  const doc = parsePlainText(path, source);
  return { ...doc, format: 'markdown', readNotes: [...(doc.readNotes ?? []), note] };
}

/**
 * The normaliser drops invisible characters and loose combining marks from the text it reads
 * (normalize.ts): say so once, at the first one inside the text read, with how many there were.
 * Matches and segments are both walked in source order, so this is linear.
 */
function withInvisibleNote(doc: ParsedDocument): ParsedDocument {
  const source = doc.source;
  if (!/[\u200E\u200F\u061C\u202A-\u202E\u2066-\u2069\uFEFF\uFE00-\uFE0F\uDB40\u0300-\u036F\u1AB0-\u1AFF\u1DC0-\u1DFF\u20D0-\u20FF\uFE20-\uFE2F]/.test(source)) return doc;
  const ranges = doc.segments
    .filter((s) => s.starts.length > 0)
    .map((s) => [s.starts[0] as number, s.ends[s.ends.length - 1] as number] as const)
    .sort((a, b) => a[0] - b[0]);
  const found: Array<{ start: number; end: number; code: number }> = [];
  for (const pattern of [INVISIBLE, LOOSE_MARKS]) {
    // the normaliser's own expressions (global; it resets lastIndex before each use too)
    const re = pattern;
    re.lastIndex = 0;
    let k = 0;
    let reach = -1; // the furthest end among ranges starting at or before the match
    for (let m = re.exec(source); m; m = re.exec(source)) {
      while (k < ranges.length && (ranges[k] as readonly [number, number])[0] <= m.index) reach = Math.max(reach, (ranges[k++] as readonly [number, number])[1]);
      if (m.index < reach) found.push({ start: m.index, end: m.index + m[0].length, code: m[0].codePointAt(0) as number });
    }
  }
  if (found.length === 0) return doc;
  found.sort((a, b) => a.start - b.start);
  const first = found[0] as { start: number; end: number; code: number };
  let line = 1;
  for (let i = source.indexOf('\n'); i >= 0 && i < first.start; i = source.indexOf('\n', i + 1)) line += 1;
  const codes = [...new Set(found.map((f) => `U+${f.code.toString(16).toUpperCase().padStart(4, '0')}`))];
  const named = codes.slice(0, 4).join(', ') + (codes.length > 4 ? ', …' : '');
  const note: ReadNote = {
    kind: 'invisible-characters',
    message: `${found.length} invisible character${found.length === 1 ? '' : 's'} (${named}; the first at line ${line}) ${found.length === 1 ? 'was' : 'were'} removed before the text was read, so that a statistic they sit in is read as it is shown`,
    span: { start: first.start, end: first.end },
  };
  return { ...doc, readNotes: [...(doc.readNotes ?? []), note] };
}
