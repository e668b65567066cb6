import { createHash, randomBytes } from 'node:crypto';
import { lstatSync, mkdirSync, readdirSync, readFileSync, renameSync, unlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/**
 * A V8 code cache for the command line's start-up bundle (dist/bin/run.cjs, see load.ts): the
 * bytecode of every function a run compiled, kept in a file so the next run of the same kind
 * skips parsing and compiling them. Node 20 has no compile cache for ES modules, so the bundle
 * is a CommonJS script compiled through `vm.Script`, which takes and makes such data.
 *
 * A cache file is used only when everything it rests on is the same as now: its header names
 * the bundle (SHA-256 of its bytes), Node's and V8's versions, the architecture, the flags the
 * process runs with and the kind of run; its payload has the length and SHA-256 the header
 * gives. Anything else — another build, another Node, a file cut short or altered — is ignored
 * and replaced after the run, and V8 still rejects data it cannot use (`cachedDataRejected`).
 * A cache that a run outgrew (`outgrown`) is replaced too.
 * Every failure to read or write the cache is silent: a cache is only ever a speed-up.
 */

/** The first line of every cache file; the number changes with the layout. */
const MAGIC = 'plumbline code cache 1\n';

/** What a cache file must have been made by to be used. */
export interface CacheIdentity {
  /** SHA-256 (hex) of the script's text: the bundle and the wrapper around it. */
  bundle: string;
  node: string;
  v8: string;
  arch: string;
  /** The process's flags (execArgv and NODE_OPTIONS): V8 rejects a cache made under other flags. */
  flags: string;
  /** The kind of run (cacheKind): each kind compiles different functions, so each has its own cache. */
  kind: string;
}

interface Header extends CacheIdentity {
  bytes: number;
  sha256: string;
  /**
   * Results and statistics the run that made the cache checked in its own thread (pool.ts),
   * which bound the functions it compiled; absent in files made before it was recorded (read as 0).
   */
  checked?: number;
}

/** A cache file's payload, and what the run that made it checked (Header.checked). */
export interface CacheRead {
  payload: Buffer;
  checked: number;
}

/**
 * A cache holds the functions compiled by the run that made it. A run that checks in a worker
 * (a document over 1 MB, a tight budget) or reads a text without statistics compiles little
 * beyond the loader, and every later run of its kind then compiled the rest again: on one
 * machine a check of a 50 KB manuscript took 350 ms with the cache a worker-checked run had made
 * (490 KB), 265 ms with one made by such a check (1.7 MB), and 355 ms with none. So a run that
 * used a cache and checked results in a higher decade than the run that made it (none, 1-9,
 * 10-99, 100 or more: `outgrown`) writes its own in its place: a kind's cache is replaced three
 * times at most, and a run that checked less does not replace a fuller one, even one another
 * run wrote while it ran (load.ts reads the file again before it writes). The count stands in
 * for the code a run compiled: a run in the same band that used other rules or readers keeps
 * the cache it found, and compiles what that lacks. Results, not
 * bytecode: V8 counts the bytecode in the heap only by walking all of it (2-3 ms after a 50 KB
 * check, far more after a large one), while the count is kept as the check goes.
 */
export function outgrown(made: number, now: number): boolean {
  return band(now) > band(made);
}

const band = (results: number): number => (results <= 0 ? 0 : results < 10 ? 1 : results < 100 ? 2 : 3);

const sha256 = (b: Uint8Array | string) => createHash('sha256').update(b).digest('hex');

/** The identity of a cache for the script made of `parts` (the bundle and its wrapper) in this process, for a run of `kind`. */
export function cacheIdentity(parts: ReadonlyArray<Uint8Array | string>, kind: string, env: NodeJS.ProcessEnv = process.env): CacheIdentity {
  const hash = createHash('sha256');
  for (const part of parts) hash.update(part);
  return {
    bundle: hash.digest('hex'),
    node: process.version,
    v8: process.versions.v8,
    arch: process.arch,
    flags: `${process.execArgv.join(' ')}|${env.NODE_OPTIONS ?? ''}`,
    kind,
  };
}

const FORMAT_EQUALS = /^--format=(.*)$/;
const PLAIN_WORD = /^[a-z]{1,16}$/;
const NOT_LETTER = /[^a-z]/g;

/** Commands whose first word names them; anything else is a check of files. */
const COMMANDS = new Set(['check', 'rules', 'explain', 'batch', 'summarize', 'lsp']);

/**
 * The kind of run `argv` asks for, as far as the raw arguments tell: the command and the output
 * format (`check:json`, `rules:human`), or undefined for a run that watches files and never ends
 * by itself. Only the choice of cache file rests on it, so a misreading costs speed, not output.
 */
export function cacheKind(argv: readonly string[]): string | undefined {
  let command = 'check';
  let format = 'human';
  let first = true;
  for (let i = 0; i < argv.length; i += 1) {
    const a = argv[i] as string;
    if (a === '--') break;
    if (a === '--watch' || a === '-w') return undefined;
    const eq = FORMAT_EQUALS.exec(a);
    if (eq) format = eq[1] as string;
    else if ((a === '--format' || a === '-f') && i + 1 < argv.length) {
      format = argv[i + 1] as string;
      i += 1;
    } else if (first && !a.startsWith('-')) {
      if (COMMANDS.has(a)) command = a;
      first = false;
    }
  }
  return `${command}:${PLAIN_WORD.test(format) ? format : 'other'}`;
}

/**
 * The folder of cache files: PLUMBLINE_CODE_CACHE when it names one, none when it is `off`, else
 * a folder of this user's in the system's temporary folder. The folder is used only when it is
 * a real folder (not a symbolic link) that no one else can write to and, where the system has
 * user ids, this user owns: a cache is code this process runs.
 */
export function cacheFolder(env: NodeJS.ProcessEnv = process.env): string | undefined {
  const set = env.PLUMBLINE_CODE_CACHE;
  if (set === 'off') return undefined;
  const uid = typeof process.getuid === 'function' ? process.getuid() : undefined;
  const folder = set !== undefined && set !== '' ? set : join(tmpdir(), `plumbline-code-cache-${uid ?? 'user'}`);
  try {
    mkdirSync(folder, { recursive: true, mode: 0o700 });
    const st = lstatSync(folder);
    if (!st.isDirectory()) return undefined;
    if (uid !== undefined && st.uid !== uid) return undefined;
    if (process.platform !== 'win32' && (st.mode & 0o022) !== 0) return undefined;
    return folder;
  } catch {
    return undefined;
  }
}

/** The cache file for an identity, in `folder`. */
export function cacheFile(folder: string, id: CacheIdentity): string {
  const key = sha256(JSON.stringify([id.bundle, id.node, id.v8, id.arch, id.flags, id.kind])).slice(0, 24);
  return join(folder, `${id.kind.replace(NOT_LETTER, '-')}-${key}.bin`);
}

/** A cache file's bytes: the magic line, the header as one JSON line, the payload. `checked`: Header.checked. */
export function encodeCache(id: CacheIdentity, payload: Uint8Array, checked = 0): Buffer {
  const header: Header = { ...id, bytes: payload.length, sha256: sha256(payload), checked };
  return Buffer.concat([Buffer.from(`${MAGIC}${JSON.stringify(header)}\n`, 'utf8'), payload]);
}

/** The payload of a cache file's bytes, with Header.checked, when they are whole and were made for `id`; undefined otherwise. */
export function decodeCache(bytes: Buffer, id: CacheIdentity): CacheRead | undefined {
  if (bytes.length < MAGIC.length || bytes.toString('latin1', 0, MAGIC.length) !== MAGIC) return undefined;
  const end = bytes.indexOf(0x0a, MAGIC.length);
  // a header is a few hundred bytes: a file without a line end early on is not one of ours
  if (end < 0 || end - MAGIC.length > 4096) return undefined;
  let header: Partial<Header>;
  try {
    header = JSON.parse(bytes.toString('utf8', MAGIC.length, end)) as Partial<Header>;
  } catch {
    return undefined;
  }
  if (header === null || typeof header !== 'object') return undefined;
  for (const key of ['bundle', 'node', 'v8', 'arch', 'flags', 'kind'] as const) if (header[key] !== id[key]) return undefined;
  const payload = bytes.subarray(end + 1);
  if (header.bytes !== payload.length || header.sha256 !== sha256(payload)) return undefined;
  const checked = typeof header.checked === 'number' && Number.isFinite(header.checked) && header.checked >= 0 ? header.checked : 0;
  return { payload, checked };
}

/** The validated payload of the cache file for `id` in `folder`, with Header.checked, or undefined (none, unreadable, stale, damaged). */
export function readCache(folder: string, id: CacheIdentity): CacheRead | undefined {
  try {
    return decodeCache(readFileSync(cacheFile(folder, id)), id);
  } catch {
    return undefined;
  }
}

/** Cache files not rewritten for this long are removed when another is written. */
const KEEP_MS = 30 * 24 * 3600 * 1000;
/** At most this many cache files are kept (the newest). */
const KEEP_FILES = 64;

/**
 * Writes the cache file for `id` atomically: a temporary file of its own, renamed over the
 * cache file, so a reader sees the old file or the new one whole. Then removes old files.
 * Never throws.
 */
export function writeCache(folder: string, id: CacheIdentity, payload: Uint8Array, now = Date.now(), checked = 0): void {
  const target = cacheFile(folder, id);
  const temporary = `${target}.${process.pid}.${randomBytes(6).toString('hex')}.tmp`;
  try {
    writeFileSync(temporary, encodeCache(id, payload, checked), { flag: 'wx', mode: 0o600 });
    renameSync(temporary, target);
  } catch {
    try {
      unlinkSync(temporary);
    } catch {
      // never written
    }
    return;
  }
  prune(folder, now);
}

function prune(folder: string, now: number): void {
  try {
    const files: Array<{ path: string; mtime: number }> = [];
    for (const name of readdirSync(folder)) {
      if (!name.endsWith('.bin') && !name.endsWith('.tmp')) continue;
      const path = join(folder, name);
      const mtime = lstatSync(path).mtimeMs;
      // a temporary file an hour old belongs to a writer that stopped
      if (now - mtime > (name.endsWith('.tmp') ? 3600 * 1000 : KEEP_MS)) unlinkSync(path);
      else if (name.endsWith('.bin')) files.push({ path, mtime });
    }
    files.sort((a, b) => b.mtime - a.mtime);
    for (const f of files.slice(KEEP_FILES)) unlinkSync(f.path);
  } catch {
    // another run pruned at the same time, or the folder went away: nothing to do
  }
}
