import { readdirSync, realpathSync, statSync } from 'node:fs';
import { dirname, isAbsolute, join, relative, resolve, sep } from 'node:path';
import ignore, { type Ignore } from 'ignore';
import { globSync } from 'tinyglobby';
import { readRegularFile } from '../config/index.js';

/** Extensions read when a folder is given. */
export const MANUSCRIPT_EXTENSIONS = ['.md', '.markdown', '.txt', '.rmd', '.qmd', '.tex', '.docx', '.pdf'] as const;

/**
 * Folders never walked: dependencies, and the rendered output of Quarto, R Markdown sites and
 * bookdown (which repeats the manuscript's text). Dot-folders and dot-files are skipped too.
 */
export const SKIPPED_FOLDERS = ['node_modules', '_site', '_book', '_freeze', '_bookdown_files'] as const;

export interface Expansion {
  files: string[];
  /** Arguments that matched nothing, with why. */
  missing: Array<{ path: string; message: string }>;
  /**
   * Symbolic links met while walking a folder or expanding a glob that lead outside it, not
   * followed (see `ExpandOptions.followLinksOutside`), as paths like the files'.
   */
  skippedLinks: string[];
}

/** Ignore patterns (.gitignore syntax) and the folder they are relative to. */
export interface IgnoreSource {
  base: string;
  patterns: string[];
}

export interface ExpandOptions {
  /** The extensions read when walking a folder, overriding configuration and the default (from --extensions). */
  extensions?: readonly string[];
  /** The extensions configured for a folder (absolute path), if any: the nearest configuration's `extensions`. */
  extensionsFor?: (folder: string) => readonly string[] | undefined;
  /** Patterns from configuration that apply in a folder (absolute path), nearest last. */
  ignoresFor?: (folder: string) => IgnoreSource[];
  /** Read .gitignore files in the folders walked and above them up to the repository's root (default true). */
  gitignore?: boolean;
  /**
   * Follow symbolic links that lead outside the folder walked (or a glob's fixed part). Off by
   * default: a stranger's repository could link to / or to a secret, which would be read and
   * quoted in the report. A link named as an argument is always read.
   */
  followLinksOutside?: boolean;
}

/** An extension as written (`md`, `.MD`) in the form names are compared with (`.md`). */
export function normalExtension(e: string): string {
  const lower = e.toLowerCase();
  return lower.startsWith('.') ? lower : `.${lower}`;
}

const isManuscript = (name: string, extensions: readonly string[]) => {
  const lower = name.toLowerCase();
  return extensions.some((e) => lower.endsWith(e) && lower.length > e.length);
};
const GLOB_CHARS = /[*?[\]{}]/;
/** A .gitignore larger than this is not read (a repository could hold anything). */
const MAX_GITIGNORE_BYTES = 1024 * 1024;

/**
 * Arguments into files, in a stable order: a file as given (any extension, never ignored); a
 * folder walked recursively for manuscript extensions (skipping SKIPPED_FOLDERS, dot-folders,
 * Word's `~$` owner files of an open document,
 * what .gitignore files and the configuration's `ignore` patterns exclude, and following
 * symbolic links once: a link loop is visited only once); a glob expanded, less what is
 * ignored. Relative arguments are taken from `cwd` and reported as given. Symbolic links that
 * lead outside the folder walked (or the glob's fixed part) are skipped and listed, unless
 * `followLinksOutside`; a glob follows no link to a folder then.
 */
export function expandArguments(args: string[], cwd = process.cwd(), options: ExpandOptions = {}): Expansion {
  const at = (p: string) => resolve(cwd, p);
  const files: string[] = [];
  const missing: Expansion['missing'] = [];
  const skippedLinks: string[] = [];
  const outside = options.followLinksOutside === true;
  const seen = new Set<string>();
  const ignored = new IgnoreRules(options);
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
        const found = globSync(arg, { cwd, onlyFiles: true, dot: false, absolute: isAbsolute(arg), followSymbolicLinks: outside, ignore: SKIPPED_FOLDERS.map((f) => `**/${f}/**`) }).sort();
        const within = outside ? undefined : realOrUndefined(at(globBase(arg)));
        const all = found.filter((f) => {
          if (within === undefined || isInside(realOrUndefined(at(f)), within)) return true;
          skippedLinks.push(f);
          return false;
        });
        const matched = all.filter((f) => !ignored.test(at(f), false, cwd));
        if (matched.length === 0) missing.push({ path: arg, message: all.length === 0 ? 'no file matches this pattern' : 'every file this pattern matches is ignored (.gitignore or the configuration\'s "ignore")' });
        matched.forEach(add);
      } else {
        missing.push({ path: arg, message: describeError(e) });
      }
      continue;
    }
    if (stat.isDirectory()) {
      const top = at(arg);
      walk(arg, new Set(), add, at, ignored, top, outside ? undefined : { root: realOrUndefined(top) ?? top, skipped: skippedLinks }, extensionsIn(options));
    }
    else add(arg);
  }
  return { files, missing, skippedLinks };
}

/** The ignore patterns in force: configuration `ignore` lists and .gitignore files, each read once. */
class IgnoreRules {
  private readonly gitignores = new Map<string, Ignore | undefined>();
  private readonly configs = new Map<string, Ignore>();
  private readonly gitRoots = new Map<string, string | undefined>();

  constructor(private readonly options: ExpandOptions) {}

  /**
   * Whether an absolute path is ignored (a folder when `isDir`). `top` is the folder walked (or
   * the working folder, for a glob): .gitignore files apply from the repository's root down, or
   * from `top` down outside a repository.
   */
  test(path: string, isDir: boolean, top: string): boolean {
    const folder = dirname(path);
    let state = false;
    if (this.options.gitignore !== false) {
      const root = this.gitRoot(folder) ?? top;
      const chain: string[] = [];
      for (let d = folder; ; d = dirname(d)) {
        chain.unshift(d);
        if (d === root || dirname(d) === d) break;
      }
      // outside the root (a file above the folder walked): only its own folder's .gitignore
      if (chain[0] !== root) chain.splice(0, chain.length - 1);
      for (const base of chain) state = this.apply(this.gitignore(base), base, path, isDir, state);
    }
    let sources: IgnoreSource[] = [];
    try {
      sources = this.options.ignoresFor?.(folder) ?? [];
    } catch {
      // a bad configuration is reported when its files are checked
    }
    for (const s of sources) state = this.apply(this.config(s), s.base, path, isDir, state);
    return state;
  }

  private apply(matcher: Ignore | undefined, base: string, path: string, isDir: boolean, state: boolean): boolean {
    if (!matcher) return state;
    const rel = relative(base, path);
    if (rel === '' || rel.startsWith('..') || isAbsolute(rel)) return state;
    const r = matcher.test(rel.split(sep).join('/') + (isDir ? '/' : ''));
    return r.ignored ? true : r.unignored ? false : state;
  }

  private config(s: IgnoreSource): Ignore {
    const k = `${s.base}\u0000${s.patterns.join('\u0000')}`;
    let m = this.configs.get(k);
    if (!m) {
      m = ignore().add(s.patterns);
      this.configs.set(k, m);
    }
    return m;
  }

  private gitignore(folder: string): Ignore | undefined {
    if (this.gitignores.has(folder)) return this.gitignores.get(folder);
    const text = readSmallRegularFile(join(folder, '.gitignore'), MAX_GITIGNORE_BYTES);
    const m = text === undefined ? undefined : ignore().add(text);
    this.gitignores.set(folder, m);
    return m;
  }

  /** The nearest folder at or above `folder` holding .git, if any. */
  private gitRoot(folder: string): string | undefined {
    if (this.gitRoots.has(folder)) return this.gitRoots.get(folder);
    let root: string | undefined;
    try {
      statSync(join(folder, '.git'));
      root = folder;
    } catch {
      const parent = dirname(folder);
      root = parent === folder ? undefined : this.gitRoot(parent);
    }
    this.gitRoots.set(folder, root);
    return root;
  }
}

/** A small regular file's text, or undefined (missing, not regular, too large, unreadable). */
function readSmallRegularFile(path: string, maxBytes: number): string | undefined {
  const r = readRegularFile(path, maxBytes);
  return r.ok ? r.bytes.toString('utf8') : undefined;
}

/** The real path, or undefined when it cannot be resolved. */
function realOrUndefined(path: string): string | undefined {
  try {
    return realpathSync(path);
  } catch {
    return undefined;
  }
}

/** Whether a real path is `root` or lies under it. */
function isInside(real: string | undefined, root: string): boolean {
  if (real === undefined) return false;
  const rel = relative(root, real);
  return rel === '' || (!rel.startsWith('..') && !isAbsolute(rel));
}

/** The folder a glob starts from: its path up to the first part with a glob character. */
function globBase(pattern: string): string {
  const parts = pattern.split(/[\\/]/);
  const fixed: string[] = [];
  for (const p of parts.slice(0, -1)) {
    if (GLOB_CHARS.test(p)) break;
    fixed.push(p);
  }
  const base = fixed.join('/');
  return base === '' ? (pattern.startsWith('/') ? '/' : '.') : base;
}

/** Where a walk may go: links whose real path leaves `root` are listed in `skipped`, not followed. */
interface Bounds {
  root: string;
  skipped: string[];
}

/**
 * The extensions read in a folder walked: --extensions, else the folder's configured list, else
 * MANUSCRIPT_EXTENSIONS. A bad configuration counts as none here (it is reported when its files
 * are checked).
 */
function extensionsIn(options: ExpandOptions): (folder: string) => readonly string[] {
  if (options.extensions) {
    const fixed = options.extensions.map(normalExtension);
    return () => fixed;
  }
  const configured = options.extensionsFor;
  if (!configured) return () => MANUSCRIPT_EXTENSIONS;
  const cache = new Map<string, readonly string[]>();
  return (folder) => {
    let list = cache.get(folder);
    if (!list) {
      let found: readonly string[] | undefined;
      try {
        found = configured(folder);
      } catch {
        found = undefined;
      }
      list = found ? found.map(normalExtension) : MANUSCRIPT_EXTENSIONS;
      cache.set(folder, list);
    }
    return list;
  };
}

function walk(dir: string, visited: Set<string>, add: (f: string) => void, at: (p: string) => string, ignored: IgnoreRules, top: string, bounds: Bounds | undefined, extensions: (folder: string) => readonly string[]): void {
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
    if (e.name.startsWith('.') || (SKIPPED_FOLDERS as readonly string[]).includes(e.name)) continue;
    const path = join(dir, e.name);
    let isDir = e.isDirectory();
    let isFile = e.isFile();
    if (e.isSymbolicLink()) {
      if (bounds && !isInside(realOrUndefined(at(path)), bounds.root)) {
        // a dangling link leads nowhere and is passed over quietly, as before
        if (realOrUndefined(at(path)) !== undefined) bounds.skipped.push(path);
        continue;
      }
      try {
        const s = statSync(at(path));
        isDir = s.isDirectory();
        isFile = s.isFile();
      } catch {
        continue; // dangling link
      }
    }
    if (isDir) {
      if (!ignored.test(at(path), true, top)) walk(path, visited, add, at, ignored, top, bounds, extensions);
    } else if (isFile && isManuscript(e.name, extensions(at(dir))) && !e.name.startsWith('~$') && !ignored.test(at(path), false, top)) add(path);
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
    case 'ENOSPC':
      return 'no space left on the device';
    case 'EROFS':
      return 'read-only file system';
    case 'ENOTDIR':
      return 'a part of the path is not a folder';
    case 'ENXIO':
      return 'no reader on the other end, or no such device';
    case 'EBADF':
    case 'EINVAL':
      return 'not something a report can be written to';
    case 'ENOTREG':
      return 'not a regular file';
    default:
      return e instanceof Error ? e.message : String(e);
  }
}
