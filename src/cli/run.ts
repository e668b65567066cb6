import type { Readable } from 'node:stream';
import { Presets, SingleBar } from 'cli-progress';
import yargs from 'yargs';
import { ConfigError, ConfigFinder, readConfigFile, type Config } from '../config/index.js';
import { ruleDoc, toolVersion } from '../engine/docs.js';
import { RULE_IDS, RULES, ruleById, type CheckOptions, type FileFailure, type FileReport } from '../engine/index.js';
import { countRun, formatChecklist, formatHtml, formatHuman, formatJson, formatSarif, type RuleInfo, type RunReport } from '../report/index.js';
import { describeError, expandArguments } from './files.js';
import { AtomicOutput, identity } from './output.js';
import type { ReadNote } from '../engine/index.js';
import { checkAll, type Job } from './pool.js';
import { runBatch } from './batch.js';
import { DEFAULT_MAX_FILE_BYTES, decodeManuscript, readManuscript, type ReadOutcome } from './read.js';
import { availableParallelism } from 'node:os';
import { resolve } from 'node:path';

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

const FORMATS = ['human', 'json', 'sarif', 'checklist', 'html'] as const;
/** Files from which a run on a terminal shows a progress bar. */
const PROGRESS_FROM = 50;
type Format = (typeof FORMATS)[number];

/** Exit codes: 0 clean, 1 findings over the limits, 2 usage, configuration or read errors. */
export const EXIT = { clean: 0, findings: 1, trouble: 2 } as const;

function parserFor(argv: string[], columns: number | undefined, onFail: (message: string) => void) {
  return yargs(argv)
    .scriptName('plumbline')
    .usage('$0 [files…]\n\nChecks the t-tests a manuscript reports: recomputes p from t and df (rounding-aware) and reports each inconsistency at its line.')
    .command('$0 [files..]', 'check manuscripts (Markdown, R Markdown, Quarto, plain text; folders and globs)', (y) =>
      y.positional('files', { type: 'string', array: true, describe: 'files, folders or globs; "-" reads standard input' }),
    )
    .command('explain <rule>', "print a rule's page", (y) => y.positional('rule', { type: 'string', demandOption: true }))
    .command('rules', 'list the rules with their default levels')
    .command('batch', 'read paths or NDJSON documents {id, text, format?} from standard input, one per line; write one NDJSON line per document')
    .option('format', { alias: 'f', choices: FORMATS, default: 'human' as Format, describe: 'output format' })
    .option('alpha', { type: 'number', describe: 'significance level where the text states none (default .05)' })
    .option('tails', { choices: ['one', 'two'] as const, describe: 'tails assumed where the text says nothing (default two)' })
    .option('max-warnings', { type: 'number', describe: 'exit 1 when more warnings than this (default: no limit)' })
    .option('config', { alias: 'c', type: 'string', describe: 'use this configuration file instead of searching for one' })
    .option('stdin-name', { type: 'string', default: 'stdin.md', describe: 'file name (and so format) for "-"' })
    .option('checklist', { type: 'boolean', describe: 'also check the write-up against reporting guidelines (on with --format checklist)' })
    .option('jobs', { alias: 'j', type: 'number', describe: 'worker threads for many files (default: the cores available; 1: none)' })
    .option('max-file-bytes', { type: 'number', describe: `skip files larger than this (default ${DEFAULT_MAX_FILE_BYTES}, or maxFileBytes in configuration)` })
    .option('output', { alias: 'o', type: 'string', describe: 'write the report to this file (atomically; never over an input file)' })
    .option('color', { type: 'boolean', describe: 'colour the human format (default: on a terminal, unless NO_COLOR is set)' })
    .strict()
    .help()
    .version(toolVersion())
    .wrap(Math.min(100, columns ?? 100))
    .exitProcess(false)
    .fail((msg, err) => {
      onFail(msg || err?.message || 'invalid arguments');
    });
}

/** The command line, as a function of its arguments and I/O so tests can call it in-process. */
export async function run(argv: string[], io: Io): Promise<number> {
  let usageError: string | undefined;
  const parser = parserFor(argv, io.columns, (m) => {
    usageError = m;
  });
  let parsed;
  let helpText = '';
  try {
    parsed = await parser.parseAsync(argv, {}, (_err, _argv, output) => {
      helpText = output;
    });
  } catch (e) {
    usageError ??= e instanceof Error ? e.message : String(e);
  }
  if (usageError) {
    io.stderr(`plumbline: ${usageError}\nRun "plumbline --help" for usage.\n`);
    return EXIT.trouble;
  }
  if (helpText) {
    await io.stdout(`${helpText}\n`);
    return EXIT.clean;
  }
  if (!parsed) return EXIT.trouble;
  const command = String(parsed._[0] ?? '');

  if (command === 'rules') {
    for (const r of RULES) await io.stdout(`${r.id.padEnd(30)} ${String(r.defaultLevel).padEnd(8)} ${r.summary}\n`);
    return EXIT.clean;
  }
  if (command === 'explain') {
    const id = String(parsed.rule);
    if (!ruleById(id)) {
      io.stderr(`plumbline: no rule "${id}". Rules: ${RULE_IDS.join(', ')}\n`);
      return EXIT.trouble;
    }
    await io.stdout(ruleDoc(id));
    return EXIT.clean;
  }

  const outputPath = parsed.output;
  if (outputPath === undefined || outputPath === '-') return check(parsed, command, argv, io);
  let output: AtomicOutput;
  try {
    output = new AtomicOutput(outputPath, io.cwd);
  } catch (e) {
    io.stderr(`plumbline: cannot write ${outputPath}: ${describeError(e)}\n`);
    return EXIT.trouble;
  }
  try {
    const code = await check(parsed, command, argv, { ...io, stdout: (s) => output.write(s), isTTY: false }, identity(outputPath, io.cwd));
    if (code === REFUSED) {
      output.abort();
      return EXIT.trouble;
    }
    output.commit();
    return code;
  } catch (e) {
    output.abort();
    throw e;
  }
}

/** Returned when the run must not produce output at all (the output file is one of the inputs). */
const REFUSED = -1;

type Parsed = Awaited<ReturnType<ReturnType<typeof parserFor>['parseAsync']>>;

/** Check the files (or the batch on standard input), writing the report through `io.stdout`. */
async function check(parsed: Parsed, command: string, argv: string[], io: Io, outputIdentity?: string): Promise<number> {
  const alpha = parsed.alpha;
  if (alpha !== undefined && !(alpha > 0 && alpha < 1)) {
    io.stderr('plumbline: --alpha must be a number between 0 and 1 (exclusive)\n');
    return EXIT.trouble;
  }
  // yargs sets a lone "-" aside from the positionals; it means standard input.
  const files = command === 'batch' ? [] : [...((parsed.files as string[] | undefined) ?? []), ...(argv.includes('-') && !((parsed.files as string[] | undefined) ?? []).includes('-') ? ['-'] : [])];
  if (files.length === 0 && command !== 'batch') {
    io.stderr('plumbline: name at least one file, folder or glob ("-" for standard input). Run "plumbline --help" for usage.\n');
    return EXIT.trouble;
  }

  let explicitConfig: Config | undefined;
  if (parsed.config) {
    try {
      explicitConfig = readConfigFile(resolve(io.cwd, parsed.config), RULE_IDS);
    } catch (e) {
      io.stderr(`plumbline: ${configMessage(e)}\n`);
      return EXIT.trouble;
    }
  }
  const finder = new ConfigFinder(RULE_IDS);
  const reports: FileReport[] = [];
  const failures: FileFailure[] = [];
  const checklist = parsed.checklist ?? (parsed.format === 'checklist' ? true : undefined);
  const options = { ...(alpha !== undefined ? { alpha } : {}), ...(parsed.tails ? { sidedness: parsed.tails } : {}), ...(checklist !== undefined ? { checklist } : {}) };

  const threads = Math.max(1, Math.floor(parsed.jobs ?? availableParallelism()));
  const configFor = (configPath: string): Config => explicitConfig ?? finder.forFile(configPath).config;
  const maxFileBytes = parsed['max-file-bytes'];
  if (maxFileBytes !== undefined && !(maxFileBytes >= 1)) {
    io.stderr('plumbline: --max-file-bytes must be a positive number\n');
    return EXIT.trouble;
  }
  /** A document into a job: its configuration found, its text read (from disk when `source` is a reader). */
  const jobFor = (path: string, source: string | ((maxBytes: number) => ReadOutcome), configPath: string, format?: CheckOptions['format']): Job => {
    let config: Config;
    try {
      config = configFor(configPath);
    } catch (e) {
      return { path, error: configMessage(e) };
    }
    let text: string;
    let readNotes: ReadNote[] = [];
    if (typeof source === 'string') text = source;
    else if (outputIdentity !== undefined && identity(path, io.cwd) === outputIdentity) return { path, error: 'not checked: this is the output file (--output), which plumbline never reads as input' };
    else {
      const outcome = source(maxFileBytes ?? config.maxFileBytes ?? DEFAULT_MAX_FILE_BYTES);
      if (!outcome.ok) return { path, error: outcome.message };
      text = outcome.text;
      readNotes = outcome.notes;
    }
    return { path, source: text, options: { ...options, config, ...(format ? { format } : {}), ...(readNotes.length > 0 ? { readNotes } : {}) } };
  };

  if (command === 'batch') return runBatch(io, jobFor, threads);

  const jobs: Job[] = [];
  const named = files.filter((f) => f !== '-');
  if (files.includes('-')) {
    const name = String(parsed['stdin-name']);
    const bytes = await readAll(io.stdin);
    jobs.push(jobFor(name, (max) => decodeManuscript(bytes, max), `${io.cwd}/${name}`));
  }
  const expansion = expandArguments(named, io.cwd);
  if (outputIdentity !== undefined) {
    const clash = expansion.files.find((f) => identity(f, io.cwd) === outputIdentity);
    if (clash !== undefined) {
      io.stderr(`plumbline: refusing to write the report over an input file: ${clash}\n`);
      return REFUSED;
    }
  }
  for (const m of expansion.missing) failures.push({ path: m.path, message: m.message });
  for (const path of expansion.files) jobs.push(jobFor(path, (max) => readManuscript(resolve(io.cwd, path), max), resolve(io.cwd, path)));
  // A progress bar on standard error for long runs, only on a terminal and never in CI.
  const bar = io.stderrIsTTY && !io.env.CI && jobs.length >= PROGRESS_FROM ? new SingleBar({ stream: process.stderr, format: 'checking {bar} {value}/{total} files', clearOnComplete: true, hideCursor: true }, Presets.shades_classic) : undefined;
  bar?.start(jobs.length, 0);
  await checkAll(jobs, threads, (o, i) => {
    if ('report' in o) reports.push(o.report);
    else failures.push({ path: (jobs[i] as Job).path, message: o.error });
    bar?.increment();
  });
  bar?.stop();

  const runReport: RunReport = {
    tool: { name: 'plumbline', version: toolVersion() },
    files: reports,
    failures,
    // the pages are read only for SARIF, the one format that carries them
    rules: RULES.map((r): RuleInfo => ({ id: r.id, summary: r.summary, kind: r.kind, defaultLevel: r.defaultLevel, doc: parsed.format === 'sarif' ? ruleDoc(r.id) : '' })),
  };
  const format = parsed.format as Format;
  if (format === 'json') await io.stdout(formatJson(runReport));
  else if (format === 'sarif') await io.stdout(formatSarif(runReport, io.cwd));
  else if (format === 'checklist') await io.stdout(formatChecklist(runReport));
  else if (format === 'html') await io.stdout(formatHtml(runReport));
  else {
    const color = parsed.color ?? (io.isTTY && !('NO_COLOR' in io.env && io.env.NO_COLOR !== ''));
    await io.stdout(formatHuman(runReport, { color, width: io.columns ?? 100 }));
  }
  if (format !== 'human') for (const f of failures) io.stderr(`plumbline: ${f.path}: ${f.message}\n`);

  const counts = countRun(runReport);
  const maxWarnings = parsed['max-warnings'];
  if (failures.length > 0) return EXIT.trouble;
  if (counts.error > 0 || (maxWarnings !== undefined && counts.warning > maxWarnings)) return EXIT.findings;
  return EXIT.clean;
}

function configMessage(e: unknown): string {
  if (e instanceof ConfigError) {
    const at = e.line !== undefined ? `:${e.line}${e.column !== undefined ? `:${e.column}` : ''}` : '';
    return `configuration ${e.file}${at}: ${e.message}`;
  }
  return e instanceof Error ? e.message : String(e);
}

async function readAll(stream: Readable): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(typeof chunk === 'string' ? Buffer.from(chunk) : (chunk as Buffer));
  return Buffer.concat(chunks);
}

