import { DEFAULT_BUDGET, DEFAULT_MAX_FILE_BYTES } from './defaults.js';

/*
 * The options and the help text, in a module that loads nothing else: `plumbline --help` is
 * answered from here without loading yargs or the checker (src/cli/main.ts).
 */

export const FORMATS = ['human', 'lines', 'json', 'sarif', 'checklist', 'html'] as const;
export type Format = (typeof FORMATS)[number];
export const RULES_FORMATS = ['human', 'json'] as const;
export const SUMMARY_FORMATS = ['csv', 'html'] as const;
export const SUMMARY_TABLES = ['rules', 'gaps', 'documents'] as const;

/** The commands: `check` is `plumbline [files…]`. */
export const COMMAND_NAMES = ['check', 'rules', 'explain', 'batch', 'summarize', 'lsp'] as const;
export type Command = (typeof COMMAND_NAMES)[number];
const ALL = COMMAND_NAMES;

/**
 * The options, once: yargs is configured from this list and the help text is written from it.
 * `commands` are those an option means something to; given to any other, it is refused rather
 * than ignored (src/cli/args.ts).
 */
export const OPTIONS: Array<{ name: string; short?: string; type: 'string' | 'number' | 'boolean'; value?: string; commands: readonly Command[]; describe: string }> = [
  { name: 'format', commands: ['check', 'rules', 'summarize'], short: 'f', type: 'string', value: 'NAME', describe: `output format: ${FORMATS.join(', ')} (default human; "rules" takes human or json)` },
  { name: 'output', commands: ['check', 'batch', 'summarize'], short: 'o', type: 'string', value: 'FILE', describe: 'write the report to FILE (a regular file atomically, through symbolic links; a FIFO or device directly; never over an input file)' },
  { name: 'quiet', commands: ['check'], short: 'q', type: 'boolean', describe: 'report errors only: warnings and notes are neither shown nor counted' },
  { name: 'max-warnings', commands: ['check'], type: 'number', value: 'N', describe: 'exit 1 when more than N warnings are reported (default: no limit)' },
  { name: 'baseline', commands: ['check'], type: 'string', value: 'FILE', describe: 'report only findings that are not in this baseline file, and count only them' },
  { name: 'write-baseline', commands: ['check'], type: 'string', value: 'FILE', describe: 'record the current findings in FILE (reasons already given there are kept)' },
  { name: 'annotate', commands: ['check'], type: 'string', value: 'FILE', describe: 'also write a copy of the one Word or PDF file checked: each finding a Word comment on its characters, or in a PDF a highlight over them with a note (atomically; the original is never changed)' },
  { name: 'checklist', commands: ['check', 'batch'], type: 'boolean', describe: 'also check the write-up against reporting guidelines (on with --format checklist)' },
  { name: 'alpha', commands: ['check', 'batch'], type: 'number', value: 'N', describe: 'significance level where the text and its front matter state none (default .05)' },
  { name: 'tails', commands: ['check', 'batch'], type: 'string', value: 'one|two', describe: 'tails assumed where the text and its front matter say nothing (default two)' },
  { name: 'config', commands: ['check', 'batch'], short: 'c', type: 'string', value: 'FILE', describe: 'use this configuration file instead of searching for one' },
  { name: 'stdin-name', commands: ['check'], type: 'string', value: 'NAME', describe: 'file name (and so format) for "-" (default stdin.md)' },
  { name: 'jobs', commands: ['check', 'batch'], short: 'j', type: 'number', value: 'N', describe: 'worker threads (default: one per 1.5 MiB of text, at most one per core and per document; batch adds them as the text read grows; a single small document is checked without one; in batch, from two threads on, this one checks documents up to 256 KiB as one of them)' },
  { name: 'memory-budget', commands: ['check', 'batch', 'lsp'], type: 'number', value: 'MB', describe: `heap a document may use before it is reported as not checked (default ${DEFAULT_BUDGET.memoryMb})` },
  { name: 'time-budget', commands: ['check', 'batch', 'lsp'], type: 'number', value: 'S', describe: `seconds a document may take before it is reported as not checked (default ${DEFAULT_BUDGET.seconds})` },
  { name: 'max-file-bytes', commands: ['check', 'batch'], type: 'number', value: 'N', describe: `skip files larger than N bytes (default ${DEFAULT_MAX_FILE_BYTES}, or maxFileBytes in configuration)` },
  { name: 'extensions', commands: ['check'], type: 'string', value: 'LIST', describe: 'file name endings read when walking a folder, separated by commas (default .md,.markdown,.txt,.rmd,.qmd,.tex,.docx,.pdf, or extensions in configuration); a file named on the command line is always read' },
  { name: 'table', commands: ['summarize'], type: 'string', value: 'NAME', describe: `summarize, CSV: ${SUMMARY_TABLES.join(', ')} (default rules)` },
  { name: 'first-line', commands: ['batch'], type: 'number', value: 'N', describe: 'batch: number the first input line N in messages and names (default 1), so a chunk of a larger input, checked apart, answers as the whole run would' },
  { name: 'follow-links-outside', commands: ['check'], type: 'boolean', describe: 'when walking a folder or a glob, follow symbolic links that lead outside it (default: skip them and say so; a link named on the command line is always read)' },
  { name: 'fix', commands: ['check'], type: 'boolean', describe: 'apply the safe formatting fixes (each listed on its rule\'s page) to the files, written atomically; a wrong number is never changed' },
  { name: 'fix-dry-run', commands: ['check'], type: 'boolean', describe: 'print the safe formatting fixes as a unified diff; change nothing' },
  { name: 'watch', commands: ['check'], type: 'boolean', describe: 'check again whenever a file named (or in a folder named) changes, until interrupted' },
  { name: 'stdio', commands: ['lsp'], type: 'boolean', describe: 'for lsp: speak over standard input and output (its only transport; accepted because editors\' LSP clients pass it)' },
  { name: 'color', commands: ALL, type: 'boolean', describe: 'colour the human format (default: on a terminal, unless NO_COLOR is set); --no-color turns it off' },
  { name: 'help', commands: ALL, short: 'h', type: 'boolean', describe: 'show this help' },
  { name: 'version', commands: ALL, short: 'v', type: 'boolean', describe: 'show the version' },
];

const COMMANDS: Array<[string, string]> = [
  ['plumbline [files…]', 'check manuscripts: files, folders (walked for .md .markdown .txt .Rmd .qmd .tex .docx .pdf) and globs; "-" reads standard input; after "--" every word is a file'],
  ['plumbline explain RULE', "print a rule's page"],
  ['plumbline rules', 'list the rules (--format json: with kind, default level and options schema)'],
  ['plumbline lsp', 'a language server over standard input and output, for editors (see the README)'],
  ['plumbline batch', 'read paths or NDJSON documents {id, text, format?} from standard input, one per line; write one NDJSON line per document'],
  ['plumbline summarize results.ndjson', "a corpus summary of batch output: findings per 100 results by rule, gaps, each document's counts; CSV (--table) or --format html"],
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

