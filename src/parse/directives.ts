import type { Directive, Span } from './types.js';

/**
 * Reads `<!-- plumbline quiet RULE[, RULE…]: reason -->`. The verb `quiet` silences the
 * named rules for the next block; a directive without a reason is still read (with an empty
 * reason) so the engine can report it rather than obey it silently.
 */
const DIRECTIVE = /^<!--\s*plumbline\s+([a-z-]{1,20})\b([^:>]{0,400}?)(?::([^]{0,2000}?))?\s*-->\s*$/;

export function readDirective(html: string, span: Span): Directive | undefined {
  const m = DIRECTIVE.exec(html.trim());
  if (!m) return undefined;
  const ruleIds = (m[2] ?? '').split(/[\s,]+/).filter(Boolean);
  return { span, verb: m[1] as string, ruleIds, reason: (m[3] ?? '').trim(), appliesToBlock: -1 };
}
