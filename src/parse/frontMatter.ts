import { parse as parseYaml } from 'yaml';
import type { FrontMatter, Span } from './types.js';

/**
 * YAML front matter as plain data: the core schema only (no custom tags, no aliases
 * expanded beyond a small limit), so nothing in a manuscript can make plumbline run code.
 */
export function readFrontMatter(yaml: string, span: Span): FrontMatter {
  try {
    const data: unknown = parseYaml(yaml, { schema: 'core', customTags: [], maxAliasCount: 50, prettyErrors: false });
    return { data, span };
  } catch (e) {
    return { data: undefined, span, error: e instanceof Error ? e.message.split('\n')[0] ?? 'malformed YAML' : 'malformed YAML' };
  }
}
