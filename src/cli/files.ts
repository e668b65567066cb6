import { readdirSync, realpathSync, statSync } from 'node:fs';
import { isAbsolute, join, resolve } from 'node:path';
import { globSync } from 'tinyglobby';

/** Extensions read when a folder is given. */
export const MANUSCRIPT_EXTENSIONS = ['.md', '.markdown', '.txt', '.rmd', '.qmd'] as const;

export interface Expansion {
  files: string[];
  /** Arguments that matched nothing, with why. */
  missing: Array<{ path: string; message: string }>;
}

const isManuscript = (name: string) => MANUSCRIPT_EXTENSIONS.some((e) => name.toLowerCase().endsWith(e));
const GLOB_CHARS = /[*?[\]{}]/;

/**
 * Arguments into files, in a stable order: a file as given (any extension); a folder walked
 * recursively for manuscript extensions (skipping node_modules and dot-folders, following
 * symbolic links once: a link loop is visited only once); a glob expanded. Relative
 * arguments are taken from `cwd` and reported as given.
 */
export function expandArguments(args: string[], cwd = process.cwd()): Expansion {
  const at = (p: string) => resolve(cwd, p);
  const files: string[] = [];
  const missing: Expansion['missing'] = [];
  const seen = new Set<string>();
  const add = (f: string) => {
    if (!seen.has(f)) {
      seen.add(f);
      files.push(f);
    }
  };
  for (const arg of args) {
    let stat;
    try {
      stat = statSync(at(arg));
    } catch (e) {
      if (GLOB_CHARS.test(arg)) {
        const matched = globSync(arg, { cwd, onlyFiles: true, dot: false, absolute: isAbsolute(arg), ignore: ['**/node_modules/**'] }).sort();
        if (matched.length === 0) missing.push({ path: arg, message: 'no file matches this pattern' });
        matched.forEach(add);
      } else {
        missing.push({ path: arg, message: describeError(e) });
      }
      continue;
    }
    if (stat.isDirectory()) walk(arg, new Set(), add, at);
    else add(arg);
  }
  return { files, missing };
}

function walk(dir: string, visited: Set<string>, add: (f: string) => void, at: (p: string) => string): void {
  let real: string;
  try {
    real = realpathSync(at(dir));
  } catch {
    return;
  }
  if (visited.has(real)) return;
  visited.add(real);
  let entries;
  try {
    entries = readdirSync(at(dir), { withFileTypes: true });
  } catch {
    return;
  }
  entries.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
  for (const e of entries) {
    if (e.name.startsWith('.') || e.name === 'node_modules') continue;
    const path = join(dir, e.name);
    let isDir = e.isDirectory();
    let isFile = e.isFile();
    if (e.isSymbolicLink()) {
      try {
        const s = statSync(at(path));
        isDir = s.isDirectory();
        isFile = s.isFile();
      } catch {
        continue; // dangling link
      }
    }
    if (isDir) walk(path, visited, add, at);
    else if (isFile && isManuscript(e.name)) add(path);
  }
}

export function describeError(e: unknown): string {
  const code = (e as NodeJS.ErrnoException).code;
  switch (code) {
    case 'ENOENT':
      return 'no such file or folder';
    case 'EACCES':
    case 'EPERM':
      return 'permission denied';
    case 'EISDIR':
      return 'is a folder';
    case 'ELOOP':
      return 'too many levels of symbolic links';
    default:
      return e instanceof Error ? e.message : String(e);
  }
}
