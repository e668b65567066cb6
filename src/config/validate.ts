import schema from '../../schema/config.schema.json' with { type: 'json' };
import { validateSchema } from './schemaValidator.js';
import type { Config } from './types.js';

/** Rule ids the schema knows; kept equal to the registry by a test. */
export const SCHEMA_RULE_IDS: readonly string[] = Object.keys(schema.properties.rules.properties);

/**
 * Check a parsed configuration object. Returns plain-language problems, each naming the key
 * (an unknown rule id gets the nearest known id suggested); empty when valid.
 */
export function configProblems(data: unknown, knownRuleIds: readonly string[]): string[] {
  if (validateSchema(data)) return [];
  const problems: string[] = [];
  for (const e of validateSchema.errors ?? []) {
    const where = e.instancePath === '' ? 'the top level' : `"${e.instancePath.slice(1).replace(/\//g, '.')}"`;
    if (e.keyword === 'additionalProperties') {
      const key = String((e.params as { additionalProperty: string }).additionalProperty);
      if (e.instancePath === '/rules') {
        const near = nearest(key, knownRuleIds);
        problems.push(`unknown rule "${key}" in "rules"${near ? ` (did you mean "${near}"?)` : ''}`);
      } else {
        const near = nearest(key, Object.keys(schema.properties));
        problems.push(`unknown key "${key}" at ${where}${near ? ` (did you mean "${near}"?)` : ''}`);
      }
    } else if (e.keyword === 'enum') {
      const allowed = (e.params as { allowedValues: unknown[] }).allowedValues.map(String).join(', ');
      problems.push(`${where} must be one of: ${allowed}`);
    } else {
      problems.push(`${where} ${e.message ?? 'is not valid'}`);
    }
  }
  return [...new Set(problems)];
}

export function isConfig(data: unknown, knownRuleIds: readonly string[]): data is Config {
  return configProblems(data, knownRuleIds).length === 0;
}

/** Nearest string by edit distance, if within a third of its length (at least 2 edits). */
function nearest(word: string, candidates: readonly string[]): string | undefined {
  let best: string | undefined;
  let bestDistance = Infinity;
  for (const c of candidates) {
    const d = editDistance(word, c);
    if (d < bestDistance) {
      best = c;
      bestDistance = d;
    }
  }
  return bestDistance <= Math.max(2, Math.floor(word.length / 3)) ? best : undefined;
}

function editDistance(a: string, b: string): number {
  const row = Array.from({ length: b.length + 1 }, (_, i) => i);
  for (let i = 1; i <= a.length; i += 1) {
    let prev = row[0] as number;
    row[0] = i;
    for (let j = 1; j <= b.length; j += 1) {
      const tmp = row[j] as number;
      row[j] = Math.min((row[j] as number) + 1, (row[j - 1] as number) + 1, prev + (a[i - 1] === b[j - 1] ? 0 : 1));
      prev = tmp;
    }
  }
  return row[b.length] as number;
}
