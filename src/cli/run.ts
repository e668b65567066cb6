import type { Readable } from 'node:stream';
import { resolve } from 'node:path';
import { ruleDoc } from '../engine/docs.js';
import { RULE_IDS, RULES, ruleById, type CheckOptions } from '../engine/index.js';
// the formatters load when the run knows which one it needs (write, below): start-up stays small
import { CAUTIONS, SKIPPED_LINK_REASON, countRun, type RunReport } from '../report/types.js';
import { say, terminalSafe } from '../report/text.js';
import { inChunks, wholeText } from '../report/chunks.js';
import { parseArguments, type CliOptions } from './args.js';
import type { SingleBar } from 'cli-progress';
import { applyBaseline, baselineText, BaselineError, readBaseline, recordBaseline, type Baseline } from './baseline.js';
import { runBatch } from './batch.js';
import { describeError } from './files.js';
import { identity, openDestination, openRegularFile, type Destination } from './output.js';
import { checkFiles, configMessage } from './runner.js';
import { fixFiles } from './fixFiles.js';
import { ConfigError, ConfigFinder, readConfigFile, type Config } from '../config/index.js';
import { DEFAULT_MAX_FILE_BYTES, type ReadOutcome } from './read.js';
import { DEFAULT_BUDGET, IN_THREAD_MAX_CHARS, type Budget, type Job } from './pool.js';
import type { FileReport } from '../engine/index.js';

export interface Io {
  /** Write to standard output; resolves once the stream can take more (back-pressure). */
  stdout: (s: string) => void | Promise<void>;
  stderr: (s: string) => void;
  stdin: Readable;
  cwd: string;
  env: NodeJS.ProcessEnv;
  isTTY: boolean;
  /** Standard error is a terminal: only then is a progress bar drawn. */
  stderrIsTTY?: boolean;
  columns?: number | undefined;
}

/** Files from which a run on a terminal shows a progress bar. */
const PROGRESS_FROM = 50;

/** Exit codes: 0 clean, 1 findings over the limits, 2 usage, configuration or read errors. */
export const EXIT = { clean: 0, findings: 1, trouble: 2 } as const;

/** What load.ts asks of a run once it is over: the results this thread checked (pool.ts). */
export { resultsCheckedHere } from './pool.js';

/** The command line, as a function of its arguments and I/O so tests can call it in-process. */
export async function run(argv: string[], rawIo: Io): Promise<number> {
  // every diagnostic reaches standard error terminal-safe, whatever path or message it quotes
  const io: Io = { ...rawIo, stderr: (s) => rawIo.stderr(terminalSafe(s)) };
  const parsed = await parseArguments(argv, io.columns);
  if (parsed.kind === 'error') {
    io.stderr(`plumbline: ${parsed.message}\nRun "plumbline --help" for usage.\n`);
    return EXIT.trouble;
  }
  if (parsed.kind !== 'run') {
    await io.stdout(`${parsed.text}\n`);
    return EXIT.clean;
  }
  const options = parsed.options;

  if (options.command === 'rules') {
    if (options.format === 'json') await io.stdout((await import('../report/rules.js')).formatRulesJson(RULES.map((r) => ({ id: r.id, summary: r.summary, kind: r.kind, defaultLevel: r.defaultLevel, optionsSchema: r.optionsSchema, ...(r.fixes ? { fixes: r.fixes } : {}) }))));
    else for (const r of RULES) await io.stdout(`${r.id.padEnd(30)} ${String(r.defaultLevel).padEnd(8)} ${r.summary}${r.fixes ? ` Safe fix: ${Object.keys(r.fixes).join(', ')}.` : ''}\n`);
    return EXIT.clean;
  }
  if (options.command === 'explain') {
    const id = String(options.rule);
    if (!ruleById(id)) {
      io.stderr(`plumbline: no rule "${id}". Rules: ${RULE_IDS.join(', ')}\n`);
      return EXIT.trouble;
    }
    await io.stdout(ruleDoc(id));
    return EXIT.clean;
  }
  if (options.command === 'lsp') {
    // loaded only here: the language server's modules cost nothing to a batch run
    const { serve, SERVER_BUDGET } = await import('../lsp/server.js');
    return serve({ memoryMb: options.memoryBudget ?? SERVER_BUDGET.memoryMb, seconds: options.timeBudget ?? SERVER_BUDGET.seconds });
  }
  if (options.watch && options.command === 'check') {
    const { watch } = await import('./watch.js');
    return watch(options, io, (o, i) => check(o, i, []));
  }
  if (options.command === 'check' && options.files.length === 0 && !options.stdin) {
    io.stderr('plumbline: name at least one file, folder or glob ("-" for standard input). Run "plumbline --help" for usage.\n');
    return EXIT.trouble;
  }

  const writes: string[] = [];
  if (options.writeBaseline !== undefined) writes.push(identity(options.writeBaseline, io.cwd));
  if (options.annotate !== undefined) writes.push(identity(options.annotate, io.cwd));
  if (options.output === undefined || options.output === '-') return settled(await check(options, io, writes));

  let destination: Destination;
  try {
    destination = openDestination(options.output, io.cwd);
  } catch (e) {
    io.stderr(`plumbline: cannot write ${options.output}: ${describeError(e)}\n`);
    return EXIT.trouble;
  }
  if ('stream' in destination) {
    // standard output or error by name: the run writes there as it would without -o
    const stream = destination.stream === 'stdout' ? io.stdout : rawIo.stderr;
    return settled(await check(options, { ...io, stdout: stream, isTTY: destination.stream === 'stdout' ? io.isTTY : false }, writes));
  }
  const sink = destination.sink;
  const target = identity(sink.target, io.cwd);
  if (writes.includes(target)) {
    sink.abort();
    io.stderr(`plumbline: --output and --write-baseline name the same file; give them different files\n`);
    return EXIT.trouble;
  }
  let wrote = false;
  let failure: unknown;
  const write = (s: string) => {
    if (failure !== undefined) return;
    try {
      sink.write(s);
      wrote = true;
    } catch (e) {
      failure = e;
    }
  };
  let code: number;
  try {
    code = await check(options, { ...io, stdout: write, isTTY: false }, [...writes, target], true);
  } catch (e) {
    sink.abort();
    throw e;
  }
  // nothing written (refused, or stopped before checking): an earlier report stays as it was
  if (code === REFUSED || !wrote || failure !== undefined) {
    sink.abort();
    if (failure !== undefined) io.stderr(`plumbline: cannot write ${options.output}: ${describeError(failure)}\n`);
    return code === REFUSED || failure !== undefined ? EXIT.trouble : code;
  }
  try {
    sink.commit();
  } catch (e) {
    sink.abort();
    io.stderr(`plumbline: cannot write ${options.output}: ${describeError(e)}\n`);
    return EXIT.trouble;
  }
  return code;
}

/** Returned when the run must not produce output at all (the output file is one of the inputs). */
const REFUSED = -1;
const settled = (code: number) => (code === REFUSED ? EXIT.trouble : code);

/**
 * Check the files (or the batch on standard input), writing the report through `io.stdout`.
 * `writes` are the real paths this run writes, never read as manuscripts.
 */
async function check(options: CliOptions, io: Io, writes: string[], toFile = false): Promise<number> {
  if (options.command === 'batch') return batch(options, io, writes);
  if (options.command === 'summarize') {
    // loaded only when asked for: a check run does not pay for it
    const { runSummarize } = await import('./summarize.js');
    return runSummarize(options, io, writes);
  }

  let baseline: Baseline | undefined;
  if (options.baseline !== undefined) {
    try {
      baseline = readBaseline(resolve(io.cwd, options.baseline));
    } catch (e) {
      io.stderr(`plumbline: baseline ${options.baseline}: ${e instanceof BaselineError ? e.message : describeError(e)}\n`);
      return EXIT.trouble;
    }
  }
  // standard input is read up to the size limit and no further (`- < /dev/zero` must end)
  const stdin = options.stdin ? { name: options.stdinName, ...(await readAtMost(io.stdin, options.maxFileBytes ?? DEFAULT_MAX_FILE_BYTES)) } : undefined;
  let bar: SingleBar | undefined;
  let barLoading: Promise<void> | undefined;
  let latest = 0;
  // the JSON report's files are laid out as they come in, while later ones are checked; not when
  // the report's files are made again after the run (a new baseline) or the run is redone (--fix)
  const early = options.format === 'json' && options.fix === undefined && options.writeBaseline === undefined ? await jsonFilesAsTheyCome() : undefined;
  const run = await checkFiles(options.files, {
    cwd: io.cwd,
    ...(options.alpha !== undefined ? { alpha: options.alpha } : {}),
    ...(options.tails ? { sidedness: options.tails } : {}),
    ...(options.checklist !== undefined || options.format === 'checklist' ? { checklist: options.checklist ?? true } : {}),
    ...(options.config !== undefined ? { configFile: options.config } : {}),
    ...(options.maxFileBytes !== undefined ? { maxFileBytes: options.maxFileBytes } : {}),
    ...(options.extensions !== undefined ? { extensions: options.extensions } : {}),
    ...(options.jobs !== undefined ? { jobs: options.jobs } : {}),
    budget: budgetOf(options),
    ...(options.followLinksOutside ? { followLinksOutside: true } : {}),
    ...(stdin ? { stdin } : {}),
    writes,
    ...(baseline ? { baseline } : {}),
    errorsOnly: options.quiet,
    withRulePages: options.format === 'sarif',
    ...(early ? { onFile: early.add } : {}),
    onProgress: (done, total) => {
      // a progress bar on standard error for long runs, only on a terminal and never in CI; its
      // module loads then, and the bar starts at the count reached by the time it has loaded
      if (done === 1 && io.stderrIsTTY && !io.env.CI && total >= PROGRESS_FROM) {
        barLoading = import('cli-progress').then(({ Presets, SingleBar }) => {
          if (latest >= total) return;
          bar = new SingleBar({ stream: process.stderr, format: 'checking {bar} {value}/{total} files', clearOnComplete: true, hideCursor: true }, Presets.shades_classic);
          bar.start(total, latest);
        });
      }
      latest = done;
      bar?.update(done);
      if (done === total) bar?.stop();
    },
  });
  await barLoading;
  if (run.outputClash !== undefined) {
    io.stderr(`plumbline: refusing to write over an input file: ${run.outputClash} (write the report outside the files checked, or under a name plumbline does not read, such as report.html)\n`);
    return REFUSED;
  }
  if (options.fix !== undefined) {
    const fixed = fixFiles(run.unfiltered, io.cwd, options.fix, options.stdin ? options.stdinName : undefined);
    for (const line of fixed.said) io.stderr(`${line}\n`);
    if (options.fix === 'diff') {
      await io.stdout(fixed.diff);
      return fixed.failed ? EXIT.trouble : EXIT.clean;
    }
    if (fixed.failed) return EXIT.trouble;
    // the report is of the files as they are now
    return check({ ...options, fix: undefined }, io, writes, toFile);
  }

  let report = run.report;
  if (options.annotate !== undefined) {
    const { annotate } = await import('./annotate.js');
    const said = await annotate(options.annotate, report, io.cwd, stdin ? { name: stdin.name, bytes: stdin.bytes } : undefined);
    io.stderr(`plumbline: ${said.message}\n`);
    if (!said.ok) return EXIT.trouble;
  }
  if (options.writeBaseline !== undefined) {
    const target = resolve(io.cwd, options.writeBaseline);
    let previous: Baseline | undefined;
    try {
      previous = readBaseline(target);
    } catch {
      previous = undefined; // none yet, or unreadable: written afresh
    }
    const recordedNow = recordBaseline(run.unfiltered, target, io.cwd, previous);
    try {
      const sink = openRegularFile(target, io.cwd);
      try {
        sink.write(baselineText(recordedNow));
        sink.commit();
      } catch (e) {
        sink.abort();
        throw e;
      }
    } catch (e) {
      io.stderr(`plumbline: cannot write the baseline ${options.writeBaseline}: ${describeError(e)}\n`);
      return EXIT.trouble;
    }
    const recorded = run.unfiltered.reduce((n, r) => n + r.findings.length, 0);
    io.stderr(`plumbline: recorded ${recorded} finding${recorded === 1 ? '' : 's'} in ${options.writeBaseline}\n`);
    // from now on they are the baseline: the report shows what is not in it (nothing, this run)
    report = { ...report, files: applyBaseline(run.unfiltered, recordedNow, io.cwd).reports };
  } else if (baseline && run.staleBaselineEntries > 0) {
    const n = run.staleBaselineEntries;
    io.stderr(`plumbline: ${n} baseline entr${n === 1 ? 'y matches' : 'ies match'} no finding any more (fixed, or its text edited); --write-baseline ${options.baseline} records the current findings\n`);
  }

  for (const link of run.skippedLinks) io.stderr(say`plumbline: ${link}: ${SKIPPED_LINK_REASON}\n`);
  // diagnostics go to standard error in every format; reports carry them as data too
  for (const f of report.failures) io.stderr(say`plumbline: ${f.path}${f.line !== undefined ? `:${f.line}${f.column !== undefined ? `:${f.column}` : ''}` : ''}: ${f.message}\n`);
  await write(report, options, io, toFile, early?.made);

  const counts = countRun(report);
  if (report.failures.length > 0) return EXIT.trouble;
  if (counts.error > 0 || (options.maxWarnings !== undefined && !options.quiet && counts.warning > options.maxWarnings)) return EXIT.findings;
  return EXIT.clean;
}

/**
 * The JSON report's files laid out as the run gives them (each file's text, by the very file
 * object the report shows), so the main thread's share of the report is done while workers
 * check: what is left at the end is the summary and joining. A file longer than
 * IN_THREAD_MAX_CHARS is laid out at the end, straight to the output, so its report's text is
 * never held whole beside its objects (bench figure 13).
 */
async function jsonFilesAsTheyCome(): Promise<{ add: (file: FileReport) => void; made: (file: FileReport) => string | undefined }> {
  const { fileChunks } = await import('../report/json.js');
  const texts = new WeakMap<FileReport, string>();
  return {
    add: (file) => {
      if (file.source.length <= IN_THREAD_MAX_CHARS) texts.set(file, wholeText(fileChunks(file)));
    },
    made: (file) => texts.get(file),
  };
}

async function write(report: RunReport, options: CliOptions, io: Io, toFile: boolean, made?: (file: FileReport) => string | undefined): Promise<void> {
  const counts = countRun(report);
  const shown = counts.error + counts.warning + counts.note;
  // every format in chunks of at most 64 KiB: a report of some 110,000 results in HTML, or
  // 200,000 in JSON, is longer than any one string can be
  const put = async (pieces: Iterable<string>) => {
    for (const chunk of inChunks(pieces)) await io.stdout(chunk);
  };
  switch (options.format) {
    case 'json':
      return put((await import('../report/json.js')).formatJsonChunks(report, made));
    case 'sarif':
      return put((await import('../report/sarif.js')).formatSarifChunks(report, io.cwd));
    case 'checklist':
      return put((await import('../report/checklist.js')).formatChecklistChunks(report));
    case 'html':
      return put((await import('../report/html.js')).formatHtmlChunks(report));
    case 'lines':
      await put((await import('../report/lines.js')).formatLinesChunks(report));
      // the cautions once, for a person at a terminal, and only when there is something to weigh
      if (shown > 0 && io.stderrIsTTY) io.stderr(`${CAUTIONS.join(' ')}\n`);
      return;
    default: {
      const color = options.color ?? (io.isTTY && !('NO_COLOR' in io.env && io.env.NO_COLOR !== ''));
      const { formatHumanChunks } = await import('../report/human.js');
      // a report written to a file names the files not checked too: standard error may be gone by the time it is read
      return put(formatHumanChunks(report, { color, width: io.columns ?? 100, cautions: shown > 0, listFailures: toFile }));
    }
  }
}

/** Batch mode: documents on standard input, one NDJSON line out per document. */
async function batch(options: CliOptions, io: Io, writes: string[]): Promise<number> {
  let explicit: Config | undefined;
  if (options.config !== undefined) {
    try {
      explicit = readConfigFile(resolve(io.cwd, options.config), RULE_IDS);
    } catch (e) {
      io.stderr(`plumbline: ${configMessage(e)}\n`);
      return EXIT.trouble;
    }
  }
  const finder = new ConfigFinder(RULE_IDS);
  const reported = new Set<string>();
  const base: CheckOptions = {
    ...(options.alpha !== undefined ? { alpha: options.alpha } : {}),
    ...(options.tails ? { sidedness: options.tails } : {}),
    ...(options.checklist !== undefined ? { checklist: options.checklist } : {}),
  };
  const jobFor = async (path: string, source: string | ((maxBytes: number) => ReadOutcome | Promise<ReadOutcome>), configPath: string, format?: CheckOptions['format']): Promise<Job> => {
    let config: Config;
    try {
      config = explicit ?? finder.forFile(configPath).config;
    } catch (e) {
      const message = configMessage(e);
      // a bad configuration file is said once on standard error; each document it covers says why it was not checked
      if (e instanceof ConfigError && !reported.has(e.file)) {
        reported.add(e.file);
        io.stderr(`plumbline: ${message}\n`);
      }
      return { path, error: message };
    }
    if (typeof source === 'string') {
      // a document given inline has the same size limit as a file
      const max = options.maxFileBytes ?? config.maxFileBytes ?? DEFAULT_MAX_FILE_BYTES;
      const size = Buffer.byteLength(source, 'utf8');
      if (size > max) return { path, error: `skipped: ${size} bytes is over the limit of ${max} (maxFileBytes in the configuration, or --max-file-bytes)` };
      return { path, source, options: { ...base, config, ...(format ? { format } : {}) } };
    }
    if (writes.includes(identity(path, io.cwd))) return { path, error: 'not checked: this is the output file (--output), which plumbline never reads as input' };
    const outcome = await source(options.maxFileBytes ?? config.maxFileBytes ?? DEFAULT_MAX_FILE_BYTES);
    if (!outcome.ok) return { path, error: outcome.message };
    return { path, source: outcome.text, options: { ...base, config, ...(outcome.notes.length > 0 ? { readNotes: outcome.notes } : {}), ...(outcome.document ? { document: outcome.document } : {}) } };
  };
  return runBatch(io, jobFor, options.jobs ?? 'auto', budgetOf(options), options.maxFileBytes ?? DEFAULT_MAX_FILE_BYTES, options.firstLine ?? 1);
}

function budgetOf(options: CliOptions): Budget {
  return { memoryMb: options.memoryBudget ?? DEFAULT_BUDGET.memoryMb, seconds: options.timeBudget ?? DEFAULT_BUDGET.seconds };
}

/** A stream's bytes up to `max`; past it, reading stops and `over` says so. */
async function readAtMost(stream: Readable, max: number): Promise<{ bytes: Buffer; over?: number }> {
  const chunks: Buffer[] = [];
  let total = 0;
  for await (const chunk of stream) {
    const b = typeof chunk === 'string' ? Buffer.from(chunk) : (chunk as Buffer);
    total += b.length;
    if (total > max) {
      stream.destroy();
      return { bytes: Buffer.alloc(0), over: max };
    }
    chunks.push(b);
  }
  return { bytes: Buffer.concat(chunks) };
}
