import { existsSync, readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { parseDocument as parseYamlDocument } from 'yaml';
import { ConfigError, type Config } from './types.js';
import { configProblems } from './validate.js';

/** Configuration file names, looked for in this order in each folder. */
export const CONFIG_NAMES = ['.plumbline.json', '.plumbline.yaml', '.plumbline.yml'] as const;

/**
 * Parse configuration text (JSON or YAML by the file name) and validate it. YAML is read
 * with the core schema and no custom tags: data only. Errors carry line and column.
 */
export function parseConfigText(text: string, file: string, knownRuleIds: readonly string[]): Config {
  let data: unknown;
  if (file.endsWith('.json')) {
    try {
      data = JSON.parse(text);
    } catch (e) {
      const message = e instanceof Error ? e.message : String(e);
      const pos = /position (\d+)/.exec(message);
      const at = pos ? lineColumn(text, Number(pos[1])) : undefined;
      const cut = message.search(/ in JSON at position \d/);
      throw new ConfigError(`invalid JSON: ${cut >= 0 ? message.slice(0, cut) : message}`, file, at?.line, at?.column);
    }
  } else {
    const doc = parseYamlDocument(text, { schema: 'core', customTags: [], prettyErrors: true });
    const err = doc.errors[0];
    if (err) {
      const at = err.linePos?.[0];
      throw new ConfigError(`invalid YAML: ${err.message.split('\n')[0] ?? ''}`, file, at?.line, at?.col);
    }
    data = doc.toJS({ maxAliasCount: 50 });
  }
  if (data === null || data === undefined) data = {};
  const problems = configProblems(data, knownRuleIds);
  if (problems.length > 0) throw new ConfigError(problems.join('; '), file);
  return data as Config;
}

export function readConfigFile(file: string, knownRuleIds: readonly string[]): Config {
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (e) {
    throw new ConfigError(`cannot read configuration: ${(e as NodeJS.ErrnoException).code ?? String(e)}`, file);
  }
  return parseConfigText(text, file, knownRuleIds);
}

/**
 * Configuration that applies to a file: the nearest configuration file from the file's
 * folder upward, merged over those above it until one says `root: true`. Results are cached
 * per folder, so a batch reads each configuration file once.
 */
export class ConfigFinder {
  private readonly cache = new Map<string, { config: Config; files: string[] }>();

  constructor(private readonly knownRuleIds: readonly string[]) {}

  forFile(path: string): { config: Config; files: string[] } {
    return this.forFolder(dirname(resolve(path)));
  }

  private forFolder(folder: string): { config: Config; files: string[] } {
    const cached = this.cache.get(folder);
    if (cached) return cached;
    const name = CONFIG_NAMES.map((n) => join(folder, n)).find((f) => existsSync(f));
    const own = name ? readConfigFile(name, this.knownRuleIds) : undefined;
    const parent = dirname(folder);
    const above = own?.root || parent === folder ? { config: {}, files: [] } : this.forFolder(parent);
    const result = own && name ? { config: mergeConfig(above.config, own), files: [...above.files, name] } : above;
    this.cache.set(folder, result);
    return result;
  }
}

/** Later wins, key by key; rule levels merge per rule. */
export function mergeConfig(base: Config, over: Config): Config {
  const { root: _root, ...rest } = over;
  return { ...base, ...rest, rules: { ...base.rules, ...over.rules } };
}

function lineColumn(text: string, offset: number): { line: number; column: number } {
  let line = 1;
  let start = 0;
  for (let i = 0; i < offset && i < text.length; i += 1) {
    if (text[i] === '\n') {
      line += 1;
      start = i + 1;
    }
  }
  return { line, column: offset - start + 1 };
}
