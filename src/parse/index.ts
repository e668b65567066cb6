import { parseMarkdown } from './markdown.js';
import { parsePlainText } from './plainText.js';
import type { ParsedDocument } from './types.js';

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
  return parseMarkdown(path, source, { chunks: format === 'rmarkdown' });
}
