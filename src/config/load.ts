import { existsSync } from 'node:fs';
import { readRegularFile } from './regularFile.js';
import { dirname, join, resolve } from 'node:path';
import { parseDocument as parseYamlDocument } from 'yaml';
import { ConfigError, type Config } from './types.js';
import { YAML_LIMITS, yamlOverLimits } from '../parse/frontMatter.js';
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
      // never echo the file's content: V8's message may quote it ("Unexpected token 's', "secret…" is not valid JSON")
      const cut = message.search(/ in JSON at position \d/);
      let said = cut >= 0 ? message.slice(0, cut) : message;
      if (/^Unexpected token/.test(said)) said = 'unexpected character';
      else if (/ is not valid JSON$/.test(said)) said = 'not JSON';
      throw new ConfigError(`invalid JSON: ${said}`, file, at?.line, at?.column);
    }
    // JSON.parse keeps the last of two equal keys without a word; YAML refuses them, and so do we
    const twice = duplicateJsonKey(text);
    if (twice) throw new ConfigError(`duplicate key ${quoteKey(twice.key)} (JSON keeps only the last; write it once)`, file, twice.line, twice.column);
  } else {
    const over = yamlOverLimits(text);
    if (over !== undefined) throw new ConfigError(`YAML not read: ${over}`, file);
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

/**
 * The most YAML handed to the yaml library: the limits front matter has (src/parse/frontMatter.ts,
 * one check for both). The library checks each new key of a mapping against every earlier one
 * (n² for n keys: 100,000 keys took minutes).
 */
export const CONFIG_YAML_LIMITS = YAML_LIMITS;

/** A key as a message shows it: JSON-quoted (control characters escaped), cut at 80 characters. */
function quoteKey(key: string): string {
  return JSON.stringify(key.length > 80 ? `${key.slice(0, 80)}…` : key);
}

/**
 * The first key that appears twice in one object of valid JSON text, with the line and column
 * of its second appearance; one pass over the text. Keys are compared decoded (`"a"` and
 * `"\u0061"` are the same key, as JSON.parse sees them).
 */
export function duplicateJsonKey(text: string): { key: string; line: number; column: number } | undefined {
  // one entry per open container: the keys seen so far in an object, null in an array
  const stack: Array<Set<string> | null> = [];
  let expectKey = false;
  let line = 1;
  let lineStart = 0;
  for (let i = 0; i < text.length; i += 1) {
    const c = text[i];
    if (c === '\n') {
      line += 1;
      lineStart = i + 1;
    } else if (c === '{') {
      stack.push(new Set());
      expectKey = true;
    } else if (c === '[') {
      stack.push(null);
      expectKey = false;
    } else if (c === '}' || c === ']') {
      stack.pop();
      expectKey = false;
    } else if (c === ',') {
      expectKey = stack[stack.length - 1] instanceof Set;
    } else if (c === '"') {
      const start = i;
      for (i += 1; i < text.length && text[i] !== '"'; i += 1) if (text[i] === '\\') i += 1;
      const keys = stack[stack.length - 1];
      if (expectKey && keys instanceof Set) {
        const key = JSON.parse(text.slice(start, i + 1)) as string;
        if (keys.has(key)) return { key, line, column: start - lineStart + 1 };
        keys.add(key);
        expectKey = false;
      }
    }
  }
  return undefined;
}

/** A configuration file larger than this is refused, unread (it may come from a stranger's repository). */
export const MAX_CONFIG_BYTES = 1024 * 1024;

/**
 * Read a configuration file: only a regular file within MAX_CONFIG_BYTES (never a FIFO, device
 * or link to one, which could block or never end), with a byte-order mark allowed. Errors say
 * what is wrong in words and never echo the file's content.
 */
export function readConfigFile(file: string, knownRuleIds: readonly string[]): Config {
  const r = readRegularFile(file, MAX_CONFIG_BYTES);
  if (!r.ok) {
    const why = r.problem === 'folder' ? 'it is a folder' : r.problem === 'not-regular' ? 'not a regular file' : r.problem === 'too-large' ? `${r.size} bytes is over the limit of ${MAX_CONFIG_BYTES}` : readProblem(r.error);
    throw new ConfigError(`cannot read configuration: ${why}`, file);
  }
  return parseConfigText(r.bytes.toString('utf8').replace(/^\uFEFF/, ''), file, knownRuleIds);
}

function readProblem(e: unknown): string {
  switch ((e as NodeJS.ErrnoException).code) {
    case 'ENOENT':
      return 'no such file';
    case 'EACCES':
    case 'EPERM':
      return 'permission denied';
    case 'ELOOP':
      return 'too many levels of symbolic links';
    case 'ENOTDIR':
      return 'a part of its path is not a folder';
    default:
      return 'the file could not be read';
  }
}

/**
 * Configuration that applies to a file: the nearest configuration file from the file's
 * folder upward, merged over those above it until one says `root: true`. Results are cached
 * per folder, so a batch reads each configuration file once.
 */
export class ConfigFinder {
  /** Each folder's outcome, an error included: a bad file is read (and reported) once per run. */
  private readonly cache = new Map<string, FoundConfig | ConfigError>();

  constructor(private readonly knownRuleIds: readonly string[]) {}

  forFile(path: string): FoundConfig {
    return this.forFolder(dirname(resolve(path)));
  }

  forFolder(folder: string): FoundConfig {
    const cached = this.cache.get(folder);
    if (cached instanceof ConfigError) throw cached;
    if (cached) return cached;
    let result: FoundConfig;
    try {
      const name = CONFIG_NAMES.map((n) => join(folder, n)).find((f) => existsSync(f));
      const own = name ? readConfigFile(name, this.knownRuleIds) : undefined;
      const parent = dirname(folder);
      const above: FoundConfig = own?.root || parent === folder ? { config: {}, files: [], ignores: [] } : this.forFolder(parent);
      result =
        own && name
          ? { config: mergeConfig(above.config, own), files: [...above.files, name], ignores: own.ignore?.length ? [...above.ignores, { base: folder, patterns: own.ignore }] : above.ignores }
          : above;
    } catch (e) {
      if (e instanceof ConfigError) this.cache.set(folder, e);
      throw e;
    }
    this.cache.set(folder, result);
    return result;
  }
}

/** The configuration that applies in a folder, the files it came from, and their ignore patterns (each with its own folder). */
export interface FoundConfig {
  config: Config;
  files: string[];
  ignores: Array<{ base: string; patterns: string[] }>;
}

/** Later wins, key by key; rule levels merge per rule. */
export function mergeConfig(base: Config, over: Config): Config {
  const { root: _root, ignore: _ignore, ...rest } = over;
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
