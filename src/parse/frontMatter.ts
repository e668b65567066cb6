import { parse as parseYaml } from 'yaml';
import type { FrontMatter, Span } from './types.js';

/**
 * The most YAML handed to the yaml library, in characters and in places a key can start (lines,
 * and commas, which separate flow entries). The library checks each new key of a mapping against
 * every earlier one, so a mapping of n keys costs n²: 100,000 keys took minutes, 2,000 take a
 * few hundredths of a second. Front matter (title, authors, abstract, settings) is far smaller.
 * Counting lines and commas over-counts keys, never under-counts them, and takes one pass.
 * src/config/load.ts applies the same limits to `.plumbline.yaml` (a test keeps them equal).
 */
export const YAML_LIMITS = { characters: 256 * 1024, keyPlaces: 2000 } as const;

/** Why this YAML is not handed to the library, or undefined when it is within YAML_LIMITS. */
export function yamlOverLimits(yaml: string): string | undefined {
  if (yaml.length > YAML_LIMITS.characters) return `${yaml.length} characters is over the limit of ${YAML_LIMITS.characters}`;
  let places = 1;
  for (let i = 0; i < yaml.length; i += 1) {
    const c = yaml.charCodeAt(i);
    if (c === 10 || c === 44) places += 1; // LF, comma
  }
  if (places > YAML_LIMITS.keyPlaces) return `${places} lines and commas is over the limit of ${YAML_LIMITS.keyPlaces} (very many keys make the YAML reader slow)`;
  return undefined;
}

/**
 * YAML front matter as plain data: the core schema only (no custom tags, no aliases
 * expanded beyond a small limit), so nothing in a manuscript can make plumbline run code.
 * YAML over YAML_LIMITS is not read: the error says so, and the rest of the text is checked.
 */
export function readFrontMatter(yaml: string, span: Span): FrontMatter {
  const over = yamlOverLimits(yaml);
  if (over !== undefined) return { data: undefined, span, error: `not read: ${over}` };
  try {
    const data: unknown = parseYaml(yaml, { schema: 'core', customTags: [], maxAliasCount: 50, prettyErrors: false });
    return { data, span };
  } catch (e) {
    return { data: undefined, span, error: e instanceof Error ? e.message.split('\n')[0] ?? 'malformed YAML' : 'malformed YAML' };
  }
}
