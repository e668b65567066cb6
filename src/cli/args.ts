import yargs from 'yargs';
import { toolVersion } from '../engine/docs.js';
import { FORMATS, helpText, OPTIONS, RULES_FORMATS, SUMMARY_FORMATS, SUMMARY_TABLES, type Command, type Format } from './help.js';

export { FORMATS, helpText, RULES_FORMATS, SUMMARY_FORMATS, SUMMARY_TABLES, wrapWords, type Format } from './help.js';

/** What the command line asks for, validated. */
export interface CliOptions {
  command: Command;
  files: string[];
  /** `-` was given: read standard input. */
  stdin: boolean;
  rule?: string;
  format: Format;
  alpha?: number;
  tails?: 'one' | 'two';
  maxWarnings?: number;
  config?: string;
  stdinName: string;
  checklist?: boolean;
  jobs?: number;
  maxFileBytes?: number;
  /** Extensions read when walking a folder, as given to --extensions (`md`, `.tex`). */
  extensions?: string[];
  /** Per-document budgets (MB of heap, seconds). */
  memoryBudget?: number;
  timeBudget?: number;
  output?: string;
  color?: boolean;
  quiet: boolean;
  baseline?: string;
  writeBaseline?: string;
  /** Write a copy of the one Word file checked with the findings as comments. */
  annotate?: string;
  /** Folder walks follow symbolic links that lead outside the folder named (--follow-links-outside). */
  followLinksOutside?: boolean;
  /** batch: the number of the first input line (a chunk of a larger input keeps the whole input's line numbers). */
  firstLine?: number;
  /** summarize: the format (csv or html) and, for CSV, the table. */
  summaryFormat?: (typeof SUMMARY_FORMATS)[number];
  table?: (typeof SUMMARY_TABLES)[number];
  /** Re-check the files named whenever they change, until interrupted. */
  watch?: boolean;
  /** Apply the safe formatting fixes (`apply`), or print them as a unified diff (`diff`). */
  fix?: 'apply' | 'diff';
}

export type ParseOutcome = { kind: 'run'; options: CliOptions } | { kind: 'help' | 'version'; text: string } | { kind: 'error'; message: string };

/** Options that take a value, for "needs a value" and "given twice" messages. */
/** One file name ending for --extensions: letters and digits, a leading dot optional (as the configuration's `extensions`). */
const EXTENSION = /^\.?[A-Za-z0-9]{1,16}$/;
const VALUE_OPTIONS = ['format', 'alpha', 'tails', 'max-warnings', 'config', 'stdin-name', 'jobs', 'max-file-bytes', 'memory-budget', 'time-budget', 'output', 'baseline', 'write-baseline', 'first-line', 'table', 'annotate', 'extensions'] as const;
const SHORT: Record<string, string> = { f: 'format', c: 'config', j: 'jobs', o: 'output', q: 'quiet', h: 'help', v: 'version' };

function parser() {
  let y = yargs()
    .help(false)
    .version(false)
    .scriptName('plumbline')
    .command('$0 [files..]', 'check', (c) => c.positional('files', { type: 'string', array: true }))
    .command('explain <rule>', 'explain', (c) => c.positional('rule', { type: 'string', demandOption: true }))
    .command('rules', 'rules')
    .command('batch', 'batch')
    .command('summarize [files..]', 'summarize', (c) => c.positional('files', { type: 'string', array: true }))
    .command('lsp', 'lsp');
  for (const o of OPTIONS) y = y.option(o.name, { type: o.type, ...(o.short ? { alias: o.short } : {}), ...(o.type !== 'boolean' ? { requiresArg: true } : {}) });
  return y.strict().exitProcess(false);
}

/** The words of the command line into options, or a message naming what is wrong. */
export async function parseArguments(argv: string[], columns: number | undefined): Promise<ParseOutcome> {
  // everything after the first "--" is a file, whatever it looks like
  const dashes = argv.indexOf('--');
  const words = dashes < 0 ? argv : argv.slice(0, dashes);
  const literalFiles = dashes < 0 ? [] : argv.slice(dashes + 1);
  let failure: string | undefined;
  let parsed: Record<string, unknown> | undefined;
  try {
    parsed = (await parser()
      .fail((msg, err) => {
        failure ??= msg || err?.message || 'invalid arguments';
      })
      .parseAsync(words)) as Record<string, unknown>;
  } catch (e) {
    failure ??= e instanceof Error ? e.message : String(e);
  }
  if (parsed?.help === true) return { kind: 'help', text: helpText(columns).trimEnd() };
  if (parsed?.version === true) return { kind: 'version', text: toolVersion() };
  if (failure !== undefined) return { kind: 'error', message: ourMessage(failure, words) };
  if (!parsed) return { kind: 'error', message: 'invalid arguments' };

  for (const name of VALUE_OPTIONS) {
    if (Array.isArray(parsed[name])) return { kind: 'error', message: `--${name} is given more than once; give it once` };
    // yargs reads --no-output as output = false; only the on/off options have a --no- form
    if (typeof parsed[name] === 'boolean') return { kind: 'error', message: `unknown option --no-${name} (only --color, --checklist and --quiet have a --no- form)` };
  }
  // numbers as written: whole numbers in plain digits (yargs would take "", "0x1" or "1e3")
  for (const [name, short] of [['max-warnings'], ['jobs', 'j'], ['max-file-bytes'], ['memory-budget'], ['time-budget'], ['first-line']] as const) {
    if (parsed[name] === undefined) continue;
    const raw = rawValue(words, name, short);
    if (raw !== undefined && !/^\d{1,15}$/.test(raw)) parsed[name] = Number.NaN;
  }
  const str = (name: string) => (parsed[name] === undefined ? undefined : String(parsed[name]));
  const num = (name: string) => parsed[name] as number | undefined;

  const command = String((parsed._ as unknown[])[0] ?? 'check') as CliOptions['command'];
  const misplaced = misplacedOptions(parsed, words, command);
  if (misplaced.length > 0) return { kind: 'error', message: misplacedMessage(misplaced, command) };
  const summarize = command === 'summarize';
  const format = str('format') ?? (summarize ? 'csv' : 'human');
  const formats: readonly string[] = command === 'rules' ? RULES_FORMATS : summarize ? SUMMARY_FORMATS : FORMATS;
  if (!formats.includes(format)) return { kind: 'error', message: `--format must be one of ${formats.join(', ')}${command === 'rules' || summarize ? ` for "${command}"` : ''}; got "${format}"` };
  const table = str('table');
  if (table !== undefined && !(SUMMARY_TABLES as readonly string[]).includes(table)) return { kind: 'error', message: `--table must be one of ${SUMMARY_TABLES.join(', ')}; got "${table}"` };
  if (table !== undefined && format !== 'csv') return { kind: 'error', message: '--table chooses a CSV table; the HTML page holds them all' };
  const tails = str('tails');
  if (tails !== undefined && tails !== 'one' && tails !== 'two') return { kind: 'error', message: `--tails must be one or two; got "${tails}"` };
  const alpha = num('alpha');
  if (alpha !== undefined && !(alpha > 0 && alpha < 1)) return { kind: 'error', message: `--alpha must be a number between 0 and 1 (exclusive); got "${rawValue(words, 'alpha') ?? parsed.alpha}"` };
  const maxWarnings = num('max-warnings');
  if (maxWarnings !== undefined && !(Number.isInteger(maxWarnings) && maxWarnings >= 0))
    return { kind: 'error', message: `--max-warnings must be a whole number, 0 or more; got "${rawValue(words, 'max-warnings') ?? ''}"` };
  const jobs = num('jobs');
  if (jobs !== undefined && !(Number.isInteger(jobs) && jobs >= 1)) return { kind: 'error', message: `--jobs must be a whole number, 1 or more; got "${rawValue(words, 'jobs', 'j') ?? ''}"` };
  const extensions = str('extensions')?.split(',').map((e) => e.trim());
  if (extensions !== undefined && (extensions.length === 0 || !extensions.every((e) => EXTENSION.test(e))))
    return { kind: 'error', message: `--extensions takes file name endings separated by commas, such as md,tex,docx; got "${rawValue(words, 'extensions') ?? ''}"` };
  const maxFileBytes = num('max-file-bytes');
  if (maxFileBytes !== undefined && !(Number.isInteger(maxFileBytes) && maxFileBytes >= 1))
    return { kind: 'error', message: `--max-file-bytes must be a whole number of bytes, 1 or more; got "${rawValue(words, 'max-file-bytes') ?? ''}"` };
  const memoryBudget = num('memory-budget');
  if (memoryBudget !== undefined && !(Number.isInteger(memoryBudget) && memoryBudget >= 64))
    return { kind: 'error', message: `--memory-budget must be a whole number of megabytes, 64 or more; got "${rawValue(words, 'memory-budget') ?? ''}"` };
  const timeBudget = num('time-budget');
  if (timeBudget !== undefined && !(Number.isInteger(timeBudget) && timeBudget >= 1))
    return { kind: 'error', message: `--time-budget must be a whole number of seconds, 1 or more; got "${rawValue(words, 'time-budget') ?? ''}"` };
  const firstLine = num('first-line');
  if (firstLine !== undefined && !(Number.isInteger(firstLine) && firstLine >= 1))
    return { kind: 'error', message: `--first-line must be a whole number, 1 or more; got "${rawValue(words, 'first-line') ?? ''}"` };
  for (const name of ['output', 'baseline', 'write-baseline', 'config', 'stdin-name', 'annotate'] as const) if (str(name) === '') return { kind: 'error', message: `--${name} needs a value` };
  if (parsed.fix === true && parsed['fix-dry-run'] === true) return { kind: 'error', message: '--fix and --fix-dry-run do not go together; give one' };

  const positional = ((parsed.files as string[] | undefined) ?? []).map(String);
  // yargs sets a lone "-" aside from the positionals; it means standard input
  const stdin = namesStandardInput(words);
  const options: CliOptions = {
    command,
    files: [...positional.filter((f) => f !== '-'), ...literalFiles],
    stdin,
    // summarize has formats of its own (summaryFormat); the report format stays at its default
    format: (summarize ? 'human' : format) as Format,
    ...(summarize ? { summaryFormat: format as CliOptions['summaryFormat'] & string, table: (table ?? 'rules') as CliOptions['table'] & string } : {}),
    stdinName: str('stdin-name') ?? 'stdin.md',
    quiet: parsed.quiet === true,
    ...(command === 'explain' ? { rule: String(parsed.rule) } : {}),
    ...(alpha !== undefined ? { alpha } : {}),
    ...(tails !== undefined ? { tails } : {}),
    ...(maxWarnings !== undefined ? { maxWarnings } : {}),
    ...(str('config') !== undefined ? { config: str('config') as string } : {}),
    ...(typeof parsed.checklist === 'boolean' ? { checklist: parsed.checklist } : {}),
    ...(jobs !== undefined ? { jobs } : {}),
    ...(maxFileBytes !== undefined ? { maxFileBytes } : {}),
    ...(extensions !== undefined ? { extensions } : {}),
    ...(memoryBudget !== undefined ? { memoryBudget } : {}),
    ...(timeBudget !== undefined ? { timeBudget } : {}),
    ...(str('output') !== undefined ? { output: str('output') as string } : {}),
    ...(typeof parsed.color === 'boolean' ? { color: parsed.color } : {}),
    ...(parsed['follow-links-outside'] === true ? { followLinksOutside: true } : {}),
    ...(firstLine !== undefined ? { firstLine } : {}),
    ...(parsed.watch === true ? { watch: true } : {}),
    ...(parsed['fix-dry-run'] === true ? { fix: 'diff' as const } : parsed.fix === true ? { fix: 'apply' as const } : {}),
    ...(str('baseline') !== undefined ? { baseline: str('baseline') as string } : {}),
    ...(str('write-baseline') !== undefined ? { writeBaseline: str('write-baseline') as string } : {}),
    ...(str('annotate') !== undefined ? { annotate: str('annotate') as string } : {}),
  };
  return { kind: 'run', options };
}

/** How messages name a command, with why an option means nothing to it where that helps. */
const COMMAND_LABEL: Record<Command, { name: string; why: string }> = {
  check: { name: 'checking files', why: '' },
  rules: { name: 'rules', why: ', which lists the rules' },
  explain: { name: 'explain', why: ", which prints a rule's page" },
  batch: { name: 'batch', why: ', which writes one NDJSON line per document' },
  summarize: { name: 'summarize', why: ', which reads batch output and checks nothing' },
  lsp: { name: 'lsp', why: ', whose settings come from the editor' },
};

type OptionEntry = (typeof OPTIONS)[number];
/** A word of short options, such as -q or -qj2. */
const SHORT_CLUSTER = /^-[^-]/;

/**
 * The options given that mean nothing to `command`, in the order first written: refused rather
 * than silently ignored. `--format human` is batch's own output in all but name, so it passes.
 */
function misplacedOptions(parsed: Record<string, unknown>, words: string[], command: Command): OptionEntry[] {
  const given = OPTIONS.filter((o) => parsed[o.name] !== undefined && !o.commands.includes(command) && !(o.name === 'format' && command === 'batch' && parsed.format === 'human'));
  const firstAt = (o: OptionEntry) => {
    const i = words.findIndex((w) => w === `--${o.name}` || w.startsWith(`--${o.name}=`) || w === `--no-${o.name}` || (o.short !== undefined && SHORT_CLUSTER.test(w) && w.slice(1).split('=')[0]!.includes(o.short)));
    return i < 0 ? Number.POSITIVE_INFINITY : i;
  };
  return given.map((o) => ({ o, at: firstAt(o) })).sort((a, b) => a.at - b.at).map(({ o }) => o);
}

function misplacedMessage(options: OptionEntry[], command: Command): string {
  const only = options[0];
  if (options.length === 1 && only !== undefined && only.commands.length === 1) return `--${only.name} applies to ${COMMAND_LABEL[only.commands[0] as Command].name} only`;
  const names = options.map((o) => `--${o.name}`).join(', ');
  const label = COMMAND_LABEL[command];
  return `${names} ${options.length === 1 ? 'does' : 'do'} not apply to ${label.name}${label.why}`;
}

/** The value printed after an option, for messages ("abc" rather than NaN); undefined when it cannot be told (a cluster such as -qj2). */
function rawValue(words: string[], name: string, short?: string): string | undefined {
  for (let i = words.length - 1; i >= 0; i--) {
    const w = words[i] as string;
    if (w === `--${name}` || (short !== undefined && w === `-${short}`)) return words[i + 1] ?? '';
    if (w.startsWith(`--${name}=`)) return w.slice(name.length + 3);
    if (short !== undefined && w.startsWith(`-${short}`) && !w.startsWith('--')) return w.slice(2).replace(/^=/, '');
  }
  return undefined;
}

/** A lone "-" among the words, not the value of an option ("-o -" writes to standard output). */
function namesStandardInput(words: string[]): boolean {
  const takesValue = new Set([...VALUE_OPTIONS.map((n) => `--${n}`), ...Object.entries(SHORT).filter(([, n]) => (VALUE_OPTIONS as readonly string[]).includes(n)).map(([s]) => `-${s}`)]);
  for (let i = 0; i < words.length; i++) {
    const w = words[i] as string;
    if (takesValue.has(w)) {
      i += 1;
      continue;
    }
    if (w === '-') return true;
  }
  return false;
}

/** yargs' messages into ours: each option named once, with its dashes. */
function ourMessage(message: string, words: string[]): string {
  const unknown = /^Unknown arguments?: (.*)$/s.exec(message);
  if (unknown) {
    const names = [...new Set((unknown[1] as string).split(', ').map((n) => n.trim()))];
    const shown = names.map((n) => (words.includes(`-${n}`) && n.length === 1 ? `-${n}` : words.some((w) => w === `--${n}` || w.startsWith(`--${n}=`)) ? `--${n}` : `"${n}"`));
    const options = shown.filter((s) => s.startsWith('-'));
    const others = shown.filter((s) => !s.startsWith('-'));
    const parts = [];
    if (options.length > 0) parts.push(`unknown option${options.length > 1 ? 's' : ''} ${options.join(', ')}`);
    if (others.length > 0) parts.push(`unexpected argument${others.length > 1 ? 's' : ''} ${others.join(', ')}`);
    return parts.join('; ');
  }
  const missing = /^Not enough arguments following: (\S+)$/.exec(message);
  if (missing) {
    const name = SHORT[missing[1] as string] ?? (missing[1] as string);
    return `--${name} needs a value${name === 'format' ? ` (${FORMATS.join(', ')})` : name === 'tails' ? ' (one or two)' : ''}`;
  }
  const notEnough = /^Not enough non-option arguments: got 0, need at least 1$/.exec(message);
  if (notEnough) return 'explain needs a rule id (plumbline rules lists them)';
  return message;
}
