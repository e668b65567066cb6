import { parseMarkdown } from './markdown.js';
import { parsePlainText } from './plainText.js';
import { exceedsNesting, DEPTH_LIMIT } from './depth.js';
import type { ParsedDocument, ReadNote } from './types.js';

export { decodeBytes, type Decoded } from './decode.js';

export { LineIndex } from './lines.js';
export { mayHoldStatistics } from './prefilter.js';
export type * from './types.js';

/** How a path is read: `.txt` as plain text, R Markdown / Quarto with their code chunks skipped. */
export function formatForPath(path: string): 'markdown' | 'rmarkdown' | 'text' {
  const lower = path.toLowerCase();
  if (lower.endsWith('.txt')) return 'text';
  if (lower.endsWith('.rmd') || lower.endsWith('.qmd')) return 'rmarkdown';
  return 'markdown';
}

/** Source text of a document into segments, by the format its path implies (or `format`). */
export function parseDocument(path: string, source: string, format = formatForPath(path)): ParsedDocument {
  if (format === 'text') return parsePlainText(path, source);
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
