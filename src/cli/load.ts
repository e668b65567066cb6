import { isAscii } from 'node:buffer';
import { existsSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname } from 'node:path';
import { fileURLToPath } from 'node:url';
import vm from 'node:vm';
import { cacheFolder, cacheIdentity, cacheKind, outgrown, readCache, writeCache } from './codeCache.js';
import { growHeapSlowly } from './heap.js';
import { compileRegexpsAtOnce } from './regexps.js';

type Run = (typeof import('./run.js'))['run'];
type Checked = (typeof import('./run.js'))['resultsCheckedHere'];

/** The command line's run, and what to do once it is over. */
export interface LoadedRun {
  run: Run;
  /** Writes the code cache when this run had none it could use, or outgrew it (call once the run is over). */
  save: () => void;
}

/**
 * The start-up bundle (scripts/build-cli.mjs): run.ts and all it may load, as one CommonJS
 * script beside the command's entry. Only the bundle has it; compiled by tsc, run.js is imported.
 */
const BUNDLE = new URL('./run.cjs', import.meta.url);

/**
 * The wrapper the bundle is compiled in: CommonJS's own parameters, and the one through which
 * it imports the ES modules built beside it (pdf.js, pdf-lib: scripts/build-cli.mjs), since a
 * script compiled by `vm.Script` cannot `import()` without an experimental flag.
 */
const WRAP_START = '(function (exports, require, module, __filename, __dirname, __plumblineImport) {';
const WRAP_END = '\n})';

/**
 * Loads the command line's run. In the bundle it compiles run.cjs with the V8 code cache of
 * the last run of the same kind (codeCache.ts), so its functions are not parsed and compiled
 * again; `save` makes that cache when there was none, or when this run checked much more in this
 * thread than the run that made it (`outgrown`).
 */
export async function loadRun(argv: readonly string[], env: NodeJS.ProcessEnv = process.env): Promise<LoadedRun> {
  const kind = cacheKind(argv);
  // a batch run's heap policy (heap.ts), set before anything is compiled: the code cache is the flags' too
  if (kind?.startsWith('batch:') === true) growHeapSlowly(process.execArgv, env.NODE_OPTIONS);
  // every run: regular expressions compiled on first use (regexps.ts), set before any is made
  compileRegexpsAtOnce(process.execArgv, env.NODE_OPTIONS);
  const file = fileURLToPath(BUNDLE);
  if (!existsSync(file)) return { run: (await import('./run.js')).run, save: () => undefined };
  const bytes = readFileSync(file);
  const folder = kind === undefined ? undefined : cacheFolder(env);
  const id = folder !== undefined && kind !== undefined ? cacheIdentity([WRAP_START, bytes, WRAP_END], kind, env) : undefined;
  const cached = folder !== undefined && id !== undefined ? readCache(folder, id) : undefined;
  // esbuild writes ASCII (charset 'ascii'): read as Latin-1, the text is the same and V8 takes it as is
  const text = isAscii(bytes) ? bytes.toString('latin1') : bytes.toString('utf8');
  const script = new vm.Script(`${WRAP_START}${text}${WRAP_END}`, { filename: file, ...(cached ? { cachedData: cached.payload } : {}) });
  const accepted = cached !== undefined && !script.cachedDataRejected;
  const module: { exports: { run?: Run; resultsCheckedHere?: Checked } } = { exports: {} };
  const importBeside = (specifier: string): Promise<unknown> => import(new URL(specifier, BUNDLE).href);
  (script.runInThisContext() as (...args: unknown[]) => void)(module.exports, createRequire(file), module, file, dirname(file), importBeside);
  const { run, resultsCheckedHere } = module.exports;
  if (typeof run !== 'function') throw new Error(`plumbline: ${file} does not export the command line's run`);
  if (typeof resultsCheckedHere !== 'function') throw new Error(`plumbline: ${file} does not export resultsCheckedHere`);
  return {
    run,
    save: () => {
      if (folder === undefined || id === undefined) return;
      const checked = resultsCheckedHere();
      if (accepted && !outgrown(cached.checked, checked)) return;
      // another run of the same kind may have written its cache while this one ran: one that
      // checked as much or more stays (the file this run read, or found unusable, does not count)
      const onDisk = readCache(folder, id);
      if (onDisk !== undefined && (cached === undefined || !onDisk.payload.equals(cached.payload)) && !outgrown(onDisk.checked, checked)) return;
      try {
        writeCache(folder, id, script.createCachedData(), Date.now(), checked);
      } catch {
        // a cache is only a speed-up
      }
    },
  };
}
