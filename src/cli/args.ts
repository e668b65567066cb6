import yargs from 'yargs';
import { toolVersion } from '../engine/docs.js';
import { DEFAULT_BUDGET } from './pool.js';
import { DEFAULT_MAX_FILE_BYTES } from './read.js';

export const FORMATS = ['human', 'lines', 'json', 'sarif', 'checklist', 'html'] as const;
export type Format = (typeof FORMATS)[number];
export const RULES_FORMATS = ['human', 'json'] as const;

/** What the command line asks for, validated. */
export interface CliOptions {
  command: 'check' | 'rules' | 'explain' | 'batch' | 'lsp';
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
  /** Per-document budgets (MB of heap, seconds). */
  memoryBudget?: number;
  timeBudget?: number;
  output?: string;
  color?: boolean;
  quiet: boolean;
  baseline?: string;
  writeBaseline?: string;
  /** Folder walks follow symbolic links that lead outside the folder named (--follow-links-outside). */
  followLinksOutside?: boolean;
  /** Re-check the files named whenever they change, until interrupted. */
  watch?: boolean;
  /** Apply the safe formatting fixes (`apply`), or print them as a unified diff (`diff`). */
  fix?: 'apply' | 'diff';
}

export type ParseOutcome = { kind: 'run'; options: CliOptions } | { kind: 'help' | 'version'; text: string } | { kind: 'error'; message: string };

/** Options that take a value, for "needs a value" and "given twice" messages. */
const VALUE_OPTIONS = ['format', 'alpha', 'tails', 'max-warnings', 'config', 'stdin-name', 'jobs', 'max-file-bytes', 'memory-budget', 'time-budget', 'output', 'baseline', 'write-baseline'] as const;
const SHORT: Record<string, string> = { f: 'format', c: 'config', j: 'jobs', o: 'output', q: 'quiet', h: 'help', v: 'version' };

/** The options, once: yargs is configured from this list and the help text is written from it. */
const OPTIONS: Array<{ name: string; short?: string; type: 'string' | 'number' | 'boolean'; value?: string; describe: string }> = [
  { name: 'format', short: 'f', type: 'string', value: 'NAME', describe: `output format: ${FORMATS.join(', ')} (default human; "rules" takes human or json)` },
  { name: 'output', short: 'o', type: 'string', value: 'FILE', describe: 'write the report to FILE (a regular file atomically, through symbolic links; a FIFO or device directly; never over an input file)' },
  { name: 'quiet', short: 'q', type: 'boolean', describe: 'report errors only: warnings and notes are neither shown nor counted' },
  { name: 'max-warnings', type: 'number', value: 'N', describe: 'exit 1 when more than N warnings are reported (default: no limit)' },
  { name: 'baseline', type: 'string', value: 'FILE', describe: 'report only findings that are not in this baseline file, and count only them' },
  { name: 'write-baseline', type: 'string', value: 'FILE', describe: 'record the current findings in FILE (reasons already given there are kept)' },
  { name: 'checklist', type: 'boolean', describe: 'also check the write-up against reporting guidelines (on with --format checklist)' },
  { name: 'alpha', type: 'number', value: 'N', describe: 'significance level where the text and its front matter state none (default .05)' },
  { name: 'tails', type: 'string', value: 'one|two', describe: 'tails assumed where the text and its front matter say nothing (default two)' },
  { name: 'config', short: 'c', type: 'string', value: 'FILE', describe: 'use this configuration file instead of searching for one' },
  { name: 'stdin-name', type: 'string', value: 'NAME', describe: 'file name (and so format) for "-" (default stdin.md)' },
  { name: 'jobs', short: 'j', type: 'number', value: 'N', describe: 'worker threads (default: chosen from the number and size of the files; a single small document is checked without one)' },
  { name: 'memory-budget', type: 'number', value: 'MB', describe: `heap a document may use before it is reported as not checked (default ${DEFAULT_BUDGET.memoryMb})` },
  { name: 'time-budget', type: 'number', value: 'S', describe: `seconds a document may take before it is reported as not checked (default ${DEFAULT_BUDGET.seconds})` },
  { name: 'max-file-bytes', type: 'number', value: 'N', describe: `skip files larger than N bytes (default ${DEFAULT_MAX_FILE_BYTES}, or maxFileBytes in configuration)` },
  { name: 'follow-links-outside', type: 'boolean', describe: 'when walking a folder or a glob, follow symbolic links that lead outside it (default: skip them and say so; a link named on the command line is always read)' },
  { name: 'fix', type: 'boolean', describe: 'apply the safe formatting fixes (each listed on its rule\'s page) to the files, written atomically; a wrong number is never changed' },
  { name: 'fix-dry-run', type: 'boolean', describe: 'print the safe formatting fixes as a unified diff; change nothing' },
  { name: 'watch', type: 'boolean', describe: 'check again whenever a file named (or in a folder named) changes, until interrupted' },
  { name: 'stdio', type: 'boolean', describe: 'for lsp: speak over standard input and output (its only transport; accepted because editors\' LSP clients pass it)' },
  { name: 'color', type: 'boolean', describe: 'colour the human format (default: on a terminal, unless NO_COLOR is set); --no-color turns it off' },
  { name: 'help', short: 'h', type: 'boolean', describe: 'show this help' },
  { name: 'version', short: 'v', type: 'boolean', describe: 'show the version' },
];

const COMMANDS: Array<[string, string]> = [
  ['plumbline [files…]', 'check manuscripts: files, folders (walked for .md .markdown .txt .Rmd .qmd) and globs; "-" reads standard input; after "--" every word is a file'],
  ['plumbline explain RULE', "print a rule's page"],
  ['plumbline rules', 'list the rules (--format json: with kind, default level and options schema)'],
  ['plumbline lsp', 'a language server over standard input and output, for editors (see the README)'],
  ['plumbline batch', 'read paths or NDJSON documents {id, text, format?} from standard input, one per line; write one NDJSON line per document'],
];

const ABOUT = 'Checks the t-tests a manuscript reports: recomputes p from t and df, rounding-aware, and reports each inconsistency at its place.';
const EXIT_STATUS = 'Exit status: 0 when no finding is at error level and warnings are within --max-warnings; 1 otherwise; 2 for usage, configuration or read problems.';

/** The help text, wrapped at word boundaries to `columns` (two columns when wide enough). */
export function helpText(columns: number | undefined): string {
  const width = Math.max(8, Math.min(columns ?? 100, 120));
  const out: string[] = [...wrapWords(ABOUT, width), ''];
  const termWidth = Math.max(...COMMANDS.map(([c]) => c.length), ...OPTIONS.map((o) => optionTerm(o).length));
  const twoColumns = width >= 60;
  const gutter = Math.min(termWidth + 4, Math.floor(width * 0.45));
  const entry = (term: string, text: string) => {
    if (twoColumns) {
      const lines = wrapWords(text, width - gutter);
      if (term.length + 2 + 2 <= gutter) {
        out.push(`  ${term.padEnd(gutter - 2)}${lines[0] ?? ''}`);
        for (const l of lines.slice(1)) out.push(`${' '.repeat(gutter)}${l}`);
      } else {
        out.push(...wrapWords(term, width - 2).map((l) => `  ${l}`));
        for (const l of lines) out.push(`${' '.repeat(gutter)}${l}`);
      }
    } else {
      out.push(...wrapWords(term, width - 2).map((l) => `  ${l}`));
      out.push(...wrapWords(text, width - 6).map((l) => `      ${l}`));
    }
  };
  out.push('Usage:');
  for (const [c, d] of COMMANDS) entry(c, d);
  out.push('', 'Options:');
  for (const o of OPTIONS) entry(optionTerm(o), o.describe);
  out.push('', ...wrapWords(EXIT_STATUS, width));
  return `${out.join('\n')}\n`;
}

const optionTerm = (o: (typeof OPTIONS)[number]) => `${o.short ? `-${o.short}, ` : ''}--${o.name}${o.value ? ` ${o.value}` : ''}`;

/** Words into lines of at most `width` characters; a word is never split (one longer than the width stands alone). */
export function wrapWords(text: string, width: number): string[] {
  const lines: string[] = [];
  let current = '';
  for (const word of text.split(/\s+/).filter(Boolean)) {
    if (current === '') current = word;
    else if (current.length + 1 + word.length <= width) current += ` ${word}`;
    else {
      lines.push(current);
      current = word;
    }
  }
  if (current !== '') lines.push(current);
  return lines;
}

function parser() {
  let y = yargs()
    .help(false)
    .version(false)
    .scriptName('plumbline')
    .command('$0 [files..]', 'check', (c) => c.positional('files', { type: 'string', array: true }))
    .command('explain <rule>', 'explain', (c) => c.positional('rule', { type: 'string', demandOption: true }))
    .command('rules', 'rules')
    .command('batch', 'batch')
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
  for (const [name, short] of [['max-warnings'], ['jobs', 'j'], ['max-file-bytes'], ['memory-budget'], ['time-budget']] as const) {
    if (parsed[name] === undefined) continue;
    const raw = rawValue(words, name, short);
    if (raw !== undefined && !/^\d{1,15}$/.test(raw)) parsed[name] = Number.NaN;
  }
  const str = (name: string) => (parsed[name] === undefined ? undefined : String(parsed[name]));
  const num = (name: string) => parsed[name] as number | undefined;

  const format = str('format') ?? 'human';
  const command = String((parsed._ as unknown[])[0] ?? 'check') as CliOptions['command'];
  const formats: readonly string[] = command === 'rules' ? RULES_FORMATS : FORMATS;
  if (!formats.includes(format)) return { kind: 'error', message: `--format must be one of ${formats.join(', ')}${command === 'rules' ? ' for "rules"' : ''}; got "${format}"` };
  const tails = str('tails');
  if (tails !== undefined && tails !== 'one' && tails !== 'two') return { kind: 'error', message: `--tails must be one or two; got "${tails}"` };
  const alpha = num('alpha');
  if (alpha !== undefined && !(alpha > 0 && alpha < 1)) return { kind: 'error', message: `--alpha must be a number between 0 and 1 (exclusive); got "${rawValue(words, 'alpha') ?? parsed.alpha}"` };
  const maxWarnings = num('max-warnings');
  if (maxWarnings !== undefined && !(Number.isInteger(maxWarnings) && maxWarnings >= 0))
    return { kind: 'error', message: `--max-warnings must be a whole number, 0 or more; got "${rawValue(words, 'max-warnings') ?? ''}"` };
  const jobs = num('jobs');
  if (jobs !== undefined && !(Number.isInteger(jobs) && jobs >= 1)) return { kind: 'error', message: `--jobs must be a whole number, 1 or more; got "${rawValue(words, 'jobs', 'j') ?? ''}"` };
  const maxFileBytes = num('max-file-bytes');
  if (maxFileBytes !== undefined && !(Number.isInteger(maxFileBytes) && maxFileBytes >= 1))
    return { kind: 'error', message: `--max-file-bytes must be a whole number of bytes, 1 or more; got "${rawValue(words, 'max-file-bytes') ?? ''}"` };
  const memoryBudget = num('memory-budget');
  if (memoryBudget !== undefined && !(Number.isInteger(memoryBudget) && memoryBudget >= 64))
    return { kind: 'error', message: `--memory-budget must be a whole number of megabytes, 64 or more; got "${rawValue(words, 'memory-budget') ?? ''}"` };
  const timeBudget = num('time-budget');
  if (timeBudget !== undefined && !(Number.isInteger(timeBudget) && timeBudget >= 1))
    return { kind: 'error', message: `--time-budget must be a whole number of seconds, 1 or more; got "${rawValue(words, 'time-budget') ?? ''}"` };
  for (const name of ['output', 'baseline', 'write-baseline', 'config', 'stdin-name'] as const) if (str(name) === '') return { kind: 'error', message: `--${name} needs a value` };
  if (parsed.fix === true && parsed['fix-dry-run'] === true) return { kind: 'error', message: '--fix and --fix-dry-run do not go together; give one' };

  const positional = ((parsed.files as string[] | undefined) ?? []).map(String);
  // yargs sets a lone "-" aside from the positionals; it means standard input
  const stdin = namesStandardInput(words);
  const options: CliOptions = {
    command,
    files: [...positional.filter((f) => f !== '-'), ...literalFiles],
    stdin,
    format: format as Format,
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
    ...(memoryBudget !== undefined ? { memoryBudget } : {}),
    ...(timeBudget !== undefined ? { timeBudget } : {}),
    ...(str('output') !== undefined ? { output: str('output') as string } : {}),
    ...(typeof parsed.color === 'boolean' ? { color: parsed.color } : {}),
    ...(parsed['follow-links-outside'] === true ? { followLinksOutside: true } : {}),
    ...(parsed.watch === true ? { watch: true } : {}),
    ...(parsed['fix-dry-run'] === true ? { fix: 'diff' as const } : parsed.fix === true ? { fix: 'apply' as const } : {}),
    ...(str('baseline') !== undefined ? { baseline: str('baseline') as string } : {}),
    ...(str('write-baseline') !== undefined ? { writeBaseline: str('write-baseline') as string } : {}),
  };
  return { kind: 'run', options };
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
