import { dirname, isAbsolute, relative, resolve } from 'node:path';
import { ConfigError, ConfigFinder, readConfigFile, type Config } from '../config/index.js';
import { ruleDoc, rulePageUrl, toolVersion } from '../engine/docs.js';
import { formatForPath, RULE_IDS, RULES, type CheckOptions, type FileFailure, type FileReport, type ReadNote } from '../engine/index.js';
import type { RuleInfo, RunReport } from '../report/index.js';
import { applyBaseline, type Baseline } from './baseline.js';
import { expandArguments } from './files.js';
import { IncludeFollower, realOrUndefined } from './includes.js';
import { identity } from './output.js';
import { checkAll, DEFAULT_BUDGET, threadsFor, type Budget, type Job } from './pool.js';
import { DEFAULT_MAX_FILE_BYTES, decodeManuscript, readManuscript, type ReadOutcome } from './read.js';

/** What a file-level run is asked to do (the command line's options, as data). */
export interface RunnerOptions {
  /** Relative paths are taken from here (default: the process's working folder). */
  cwd?: string;
  /** Significance level where the text and front matter state none. */
  alpha?: number;
  /** Tails where the text and front matter say nothing. */
  sidedness?: 'one' | 'two';
  /** Also assess the reporting checklist (default: as configured). */
  checklist?: boolean;
  /** A configuration file to use instead of discovering one per manuscript. */
  configFile?: string;
  /** Files larger than this are not checked (default: configuration, then 50 MiB). */
  maxFileBytes?: number;
  /** Worker threads (default: chosen from the number of files and cores). */
  jobs?: number;
  /** What one document may cost (default DEFAULT_BUDGET). */
  budget?: Budget;
  /** Standard input as a manuscript under this name; `over` when it was longer than that limit and reading stopped. */
  stdin?: { name: string; bytes: Uint8Array; over?: number };
  /** Findings held in this baseline are not reported (counted in `hidden.baseline`). */
  baseline?: Baseline;
  /** Report errors only. */
  errorsOnly?: boolean;
  /** Read .gitignore files when walking folders (default true). */
  gitignore?: boolean;
  /** Follow symbolic links that lead outside a folder walked (default: skip them, listed in `skippedLinks`). */
  followLinksOutside?: boolean;
  /**
   * The extensions read when walking a folder (`md`, `.tex`), overriding the configuration's
   * `extensions` and the default list (MANUSCRIPT_EXTENSIONS).
   */
  extensions?: readonly string[];
  /**
   * Files this run writes (the CLI's --output and --write-baseline, as real paths). When one is
   * also an input — named, met in a folder or matched by a glob — nothing is checked and the run
   * is refused (`outputClash`): writing it would destroy a manuscript.
   */
  writes?: string[];
  /** Rule pages are read into the report's rule list (SARIF carries them). */
  withRulePages?: boolean;
  /** Called after each document, for a progress display. */
  onProgress?: (done: number, total: number) => void;
  /**
   * Called with each file of the report as it will be in `report.files` (the very object), in
   * input order, as soon as it and every file before it are checked: a formatter can lay it out
   * while later files are checked. Not called when a baseline is given (it is applied to all
   * files once they are in).
   */
  onFile?: (file: FileReport, index: number) => void;
}

export interface FileRun {
  report: RunReport;
  /** Every finding before the baseline and the errors-only filter (for --write-baseline). */
  unfiltered: FileReport[];
  /** Baseline entries that matched no finding (fixed since, or their text edited). */
  staleBaselineEntries: number;
  /** An input is a file this run writes: nothing was checked. */
  outputClash?: string;
  /** Symbolic links met in folder walks and globs that lead outside them, not followed. */
  skippedLinks: string[];
}

/**
 * Check files, folders and globs as the command line does: configuration discovered per
 * manuscript (or the one given), folders walked with their ignore rules, each bad configuration
 * reported once, unreadable files named, a baseline applied. Never writes anything.
 */
export async function checkFiles(args: readonly string[], options: RunnerOptions = {}): Promise<FileRun> {
  const cwd = options.cwd ?? process.cwd();
  let explicit: Config | undefined;
  let explicitError: ConfigError | undefined;
  if (options.configFile !== undefined) {
    try {
      explicit = readConfigFile(resolve(cwd, options.configFile), RULE_IDS);
    } catch (e) {
      if (!(e instanceof ConfigError)) throw e;
      explicitError = e;
    }
  }
  const failures: FileFailure[] = [];
  const finder = new ConfigFinder(RULE_IDS);
  const explicitIgnores = explicit?.ignore?.length ? [{ base: dirname(resolve(cwd, options.configFile as string)), patterns: explicit.ignore }] : [];
  const expansion = expandArguments([...args], cwd, {
    ignoresFor: (folder) => (options.configFile !== undefined ? explicitIgnores : finder.forFolder(folder).ignores),
    ...(options.extensions ? { extensions: options.extensions } : {}),
    extensionsFor: (folder) => (options.configFile !== undefined ? explicit?.extensions : finder.forFolder(folder).config.extensions),
    ...(options.gitignore === false ? { gitignore: false } : {}),
    ...(options.followLinksOutside ? { followLinksOutside: true } : {}),
  });
  const skippedLinks = expansion.skippedLinks;
  // the reports list them too (JSON, SARIF, HTML), not only standard error
  const linksSaid = skippedLinks.length > 0 ? { skippedLinks } : {};
  const rules = RULES.map((r): RuleInfo => {
    const helpUri = options.withRulePages ? rulePageUrl(r.id) : undefined;
    return { id: r.id, summary: r.summary, kind: r.kind, defaultLevel: r.defaultLevel, doc: options.withRulePages ? ruleDoc(r.id) : '', ...(helpUri ? { helpUri } : {}) };
  });
  const empty = (): FileRun => ({ report: { tool: { name: 'plumbline', version: toolVersion() }, files: [], failures, rules, ...linksSaid }, unfiltered: [], staleBaselineEntries: 0, skippedLinks });
  const writes = new Set(options.writes ?? []);
  if (writes.size > 0) {
    const clash = expansion.files.find((f) => writes.has(identity(f, cwd)));
    if (clash !== undefined) return { ...empty(), outputClash: clash };
  }
  if (explicitError) {
    failures.push({ ...configFailure(explicitError, cwd), notChecked: [...(options.stdin ? [options.stdin.name] : []), ...expansion.files] });
    return empty();
  }

  // a bad configuration file: one failure for it, naming the manuscripts it kept from being checked
  const badConfigs = new Map<string, { error: ConfigError; paths: string[] }>();
  const base: CheckOptions = {
    ...(options.alpha !== undefined ? { alpha: options.alpha } : {}),
    ...(options.sidedness ? { sidedness: options.sidedness } : {}),
    ...(options.checklist !== undefined ? { checklist: options.checklist } : {}),
  };
  const jobFor = async (path: string, configFrom: string, source: (maxBytes: number) => ReadOutcome | Promise<ReadOutcome>): Promise<Job | undefined> => {
    let config: Config;
    try {
      config = explicit ?? finder.forFile(configFrom).config;
    } catch (e) {
      if (!(e instanceof ConfigError)) return { path, error: e instanceof Error ? e.message : String(e) };
      const seen = badConfigs.get(e.file) ?? { error: e, paths: [] };
      seen.paths.push(path);
      badConfigs.set(e.file, seen);
      return undefined;
    }
    const outcome = await source(options.maxFileBytes ?? config.maxFileBytes ?? DEFAULT_MAX_FILE_BYTES);
    if (!outcome.ok) return { path, error: outcome.message };
    const readNotes: ReadNote[] = outcome.notes;
    return { path, source: outcome.text, options: { ...base, config, ...(readNotes.length > 0 ? { readNotes } : {}), ...(outcome.document ? { document: outcome.document } : {}) } };
  };

  // A LaTeX manuscript's \input and \include files are checked as documents of their own, right
  // after it, each once in the run (see includes.ts); the files named or walked are in it already.
  const inRun = new Set<string>();
  for (const path of expansion.files) {
    const real = realOrUndefined(resolve(cwd, path));
    if (real !== undefined) inRun.add(real);
  }
  const withIncludes = async (job: Job | undefined): Promise<Job[]> => {
    if (!job || !('source' in job) || formatForPath(job.path) !== 'latex') return job ? [job] : [];
    const absolute = resolve(cwd, job.path);
    const follower = new IncludeFollower(dirname(absolute), dirname(job.path), inRun);
    const expand = async (j: Job, chain: string[]): Promise<Job[]> => {
      if (!('source' in j)) return [j];
      const { files, notes } = follower.follow(j.source, chain);
      if (notes.length > 0) j.options = { ...j.options, readNotes: [...(j.options.readNotes ?? []), ...notes] };
      const out: Job[] = [j];
      for (const f of files) {
        // undefined: its configuration is bad, and the failure for that names it
        const child = await jobFor(f.path, f.absolute, (max) => readManuscript(f.absolute, max));
        if (child) out.push(...(await expand(child, [...chain, f.real])));
      }
      return out;
    };
    return await expand(job, [realOrUndefined(absolute) ?? absolute]);
  };

  const jobs: Job[] = [];
  if (options.stdin) {
    const { name, bytes, over } = options.stdin;
    const job = await jobFor(name, resolve(cwd, name), (max) =>
      over !== undefined ? { ok: false, message: `skipped: longer than the limit of ${over} bytes; reading stopped there (--max-file-bytes)` } : decodeManuscript(bytes, max, name),
    );
    jobs.push(...(await withIncludes(job)));
  }
  for (const m of expansion.missing) failures.push({ path: m.path, message: m.message });
  for (const path of expansion.files) {
    const job = await jobFor(path, resolve(cwd, path), (max) => readManuscript(resolve(cwd, path), max));
    jobs.push(...(await withIncludes(job)));
  }
  for (const [, { error, paths }] of badConfigs) {
    const shown = paths.slice(0, 5).join(', ') + (paths.length > 5 ? `, and ${paths.length - 5} more` : '');
    const f = configFailure(error, cwd);
    failures.push({ ...f, message: `${f.message} (not checked because of it: ${shown})`, notChecked: paths });
  }

  const reports: FileReport[] = [];
  // without a baseline, each file is shown as soon as it is in (with --quiet, its errors only)
  const shownNow: FileReport[] = [];
  const errorsOf = (r: FileReport): FileReport => ({ ...r, findings: r.findings.filter((f) => f.level === 'error') });
  let done = 0;
  await checkAll(
    jobs,
    options.jobs ?? defaultThreads(jobs),
    (o, i) => {
    if ('report' in o) {
      reports.push(o.report);
      if (!options.baseline) {
        const file = options.errorsOnly ? errorsOf(o.report) : o.report;
        options.onFile?.(file, shownNow.length);
        shownNow.push(file);
      }
    } else failures.push({ path: (jobs[i] as Job).path, message: o.error });
    done += 1;
    options.onProgress?.(done, jobs.length);
    },
    options.budget ?? DEFAULT_BUDGET,
    // this thread keeps every report of the run (its old generation grows with them, and each
    // collection there costs more): it checks nothing itself, unlike batch's (pool.ts, `here`)
  );

  let shown = shownNow;
  let stale = 0;
  if (options.baseline) {
    const applied = applyBaseline(reports, options.baseline, cwd);
    shown = options.errorsOnly ? applied.reports.map(errorsOf) : applied.reports;
    stale = applied.unmatched;
  }
  return { report: { tool: { name: 'plumbline', version: toolVersion() }, files: shown, failures, rules, ...linksSaid }, unfiltered: reports, staleBaselineEntries: stale, skippedLinks };
}

/** Worker threads by the number and size of the documents (threadsFor in pool.ts). */
function defaultThreads(jobs: readonly Job[]): number {
  const chars = jobs.reduce((sum, j) => sum + ('source' in j ? j.source.length : 0), 0);
  return threadsFor(jobs.filter((j) => 'source' in j).length, chars);
}

/** A configuration problem as a failure: the file and place, the problem in words. */
function configFailure(e: ConfigError, cwd: string): FileFailure {
  // named as the manuscripts are: relative to the working folder when inside it
  const rel = relative(cwd, e.file);
  return {
    path: rel !== '' && !rel.startsWith('..') && !isAbsolute(rel) ? rel : e.file,
    ...(e.line !== undefined ? { line: e.line } : {}),
    ...(e.line !== undefined && e.column !== undefined ? { column: e.column } : {}),
    message: /configuration/.test(e.message) ? e.message : `configuration: ${e.message}`,
  };
}

export function configMessage(e: unknown): string {
  if (e instanceof ConfigError) {
    const at = e.line !== undefined ? `:${e.line}${e.column !== undefined ? `:${e.column}` : ''}` : '';
    return `configuration ${e.file}${at}: ${e.message}`;
  }
  return e instanceof Error ? e.message : String(e);
}
