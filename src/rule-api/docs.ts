import type { LinkedDocument } from '../link/types.js';
import type { Span } from '../parse/types.js';

/** Where a document-wide missing item is reported: the first t-test result (or the top of the file). */
export function documentAnchor(document: LinkedDocument): { span: Span; block?: number } {
  const first = document.results[0]?.report;
  return first ? { span: first.span, block: first.block } : { span: { start: 0, end: 0 } };
}
