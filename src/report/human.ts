import type { FileReport, Finding } from '../engine/types.js';
import { CAUTIONS, countRun, type RunReport } from './types.js';
import { terminalLine, terminalSafe } from './text.js';
import { checklistFindingLines, isChecklistFinding, missingText } from './checklistSummary.js';
import { linesOf, wholeText } from './chunks.js';
import { originalName, originalShort, shortPlace } from './places.js';

export interface HumanOptions {
  color: boolean;
  /** Terminal width for wrapping; 100 when unknown. */
  width?: number;
  /** Print the cautions after the summary (default true; the CLI prints them only when something is reported). */
  cautions?: boolean;
  /**
   * Name the files not checked in the report itself (default false: the CLI names them on
   * standard error; it asks for them here when the report goes to a file).
   */
  listFailures?: boolean;
}

const STYLE = {
  error: ['\u001b[31m', '\u001b[39m'],
  warning: ['\u001b[33m', '\u001b[39m'],
  note: ['\u001b[36m', '\u001b[39m'],
  dim: ['\u001b[2m', '\u001b[22m'],
  bold: ['\u001b[1m', '\u001b[22m'],
} as const;

/**
 * The default report: per file, each finding with its place, the source line with the
 * statistic underlined, the message and what to check; then one summary line and the
 * cautions. Colour only when asked for (the CLI asks on a TTY without NO_COLOR).
 */
export function formatHuman(run: RunReport, options: HumanOptions): string {
  return wholeText(formatHumanChunks(run, options));
}

/** The same text as formatHuman, piece by piece in order: the command line writes these. */
export function formatHumanChunks(run: RunReport, options: HumanOptions): Iterable<string> {
  return linesOf(humanLines(run, options));
}

/** The report's lines, each to be followed by a line break. */
function* humanLines(run: RunReport, options: HumanOptions): Generator<string> {
  const paint = (style: keyof typeof STYLE, s: string) => (options.color ? `${STYLE[style][0]}${s}${STYLE[style][1]}` : s);
  const width = Math.max(60, Math.min(options.width ?? 100, 160));
  for (const file of run.files) {
    if (file.findings.length === 0) continue;
    yield paint('bold', terminalLine(file.path));
    // the checklist's missing items are said once per item below, not once per result
    for (const f of file.findings) {
      if (isChecklistFinding(file, f)) continue;
      yield* findingBlock(file, f, paint, width);
      yield '';
    }
    yield* checklistBlock(file, paint, width);
  }
  const c = countRun(run);
  const checklistEntries = run.files.reduce((n, file) => n + file.findings.filter((f) => isChecklistFinding(file, f)).length, 0);
  const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;
  const others = { results: c.statistics, checked: c.statisticsChecked };
  const summary = [
    plural(c.files, 'file'),
    others.results === 0
      ? `${plural(c.results, 'result')} found (${c.checked} with p recomputed)`
      : `${plural(c.results, 't-test result')} and ${plural(others.results, 'F, χ², r or z result')} found (${c.checked + others.checked} with p recomputed)`,
    paint(c.error ? 'error' : 'dim', plural(c.error, 'error')),
    paint(c.warning ? 'warning' : 'dim', plural(c.warning, 'warning')),
    paint(c.note ? 'note' : 'dim', plural(c.note, 'note')) + (checklistEntries > 0 ? ` (${checklistEntries} of the findings are checklist entries, summarised by item)` : ''),
  ];
  if (options.listFailures)
    for (const f of run.failures) yield `${paint('error', 'not checked')} ${terminalLine(f.path)}${f.line !== undefined ? `:${f.line}${f.column !== undefined ? `:${f.column}` : ''}` : ''}: ${terminalLine(f.message)}`;
  if (c.failures) summary.push(paint('error', `${plural(c.failures, 'file')} not checked${options.listFailures ? '' : ' (named on standard error)'}`));
  const hidden = [c.hiddenByQuiet > 0 ? `${c.hiddenByQuiet} by quiet comments` : '', c.hiddenByBaseline > 0 ? `${c.hiddenByBaseline} by the baseline` : ''].filter(Boolean);
  if (hidden.length > 0) summary.push(paint('dim', `${plural(c.hiddenByQuiet + c.hiddenByBaseline, 'finding')} hidden (${hidden.join(', ')})`));
  yield summary.join(', ');
  if (options.cautions !== false) yield paint('dim', wrap(CAUTIONS.join(' '), width).join('\n'));
}

function findingBlock(file: FileReport, f: Finding, paint: (s: keyof typeof STYLE, t: string) => string, width: number): string[] {
  // a Word or PDF file: the place in the file itself, not in the text extracted from it
  const where = f.original ? terminalLine(originalName(f.original)) : `${f.start.line}:${f.start.column}`;
  const lines = [`  ${paint('dim', where.padEnd(8))} ${paint(f.level, f.level.padEnd(7))} ${paint('dim', f.ruleId)}`];
  lines.push(...excerpt(file.source, f, paint));
  for (const l of wrap(terminalSafe(f.message), width - 4)) lines.push(`    ${l}`);
  for (const l of wrap(`what to check: ${terminalSafe(f.check)}`, width - 4)) lines.push(`    ${paint('dim', l)}`);
  for (const r of f.related ?? []) lines.push(`    ${paint('dim', `see ${r.original ? shortPlace(r) : `${r.start.line}:${r.start.column}`}: ${terminalLine(r.message)}`)}`);
  return lines;
}

/**
 * The reporting checklist's findings, one block per item: a document item without a line
 * (nothing in the text is the place of an absence), a per-result item with its count and its
 * places.
 */
function checklistBlock(file: FileReport, paint: (s: keyof typeof STYLE, t: string) => string, width: number): string[] {
  const lines: string[] = [];
  for (const c of checklistFindingLines(file)) {
    const where = c.document !== undefined ? 'document' : 'results';
    lines.push(`  ${paint('dim', where.padEnd(8))} ${paint(c.level, c.level.padEnd(7))} ${paint('dim', c.ruleId)}`);
    const text = c.document !== undefined ? `${c.item} — not said anywhere in the document: ${c.document}.` : `${c.item} — ${missingText({ missing: c.missing ?? 0, applicable: c.applicable ?? 0, places: c.places ?? [] })}.`;
    for (const l of wrap(terminalSafe(text), width - 4)) lines.push(`    ${l}`);
    lines.push('');
  }
  return lines;
}

/** The finding's first source line, clipped around the span, with the span underlined. */
function excerpt(source: string, f: Finding, paint: (s: keyof typeof STYLE, t: string) => string): string[] {
  const lineStart = f.span.start - (f.start.column - 1);
  let lineEnd = source.slice(lineStart).search(/\r\n|\r|\n/);
  lineEnd = lineEnd < 0 ? source.length : lineStart + lineEnd;
  const line = source.slice(lineStart, lineEnd).replace(/\t/g, ' ');
  const from = f.start.column - 1;
  const to = Math.min(line.length, f.start.line === f.end.line ? f.end.column - 1 : line.length);
  const windowStart = Math.max(0, from - 40);
  const windowEnd = Math.min(line.length, Math.max(to + 20, windowStart + 90));
  const shown = (windowStart > 0 ? '…' : '') + line.slice(windowStart, windowEnd) + (windowEnd < line.length ? '…' : '');
  // measured on the text as shown: a bidi control shown as <U+202E> is wider than one column
  const pad = terminalLine(line.slice(windowStart, from)).length + (windowStart > 0 ? 1 : 0);
  const marked = terminalLine(line.slice(from, to)).length;
  const gutter = f.original ? originalShort(f.original) : String(f.start.line);
  return [
    `    ${paint('dim', `${gutter} |`)} ${terminalLine(shown)}`,
    `    ${' '.repeat(gutter.length)} ${paint('dim', '|')} ${' '.repeat(pad)}${paint(f.level, '^'.repeat(Math.max(1, marked)))}`,
  ];
}

function wrap(text: string, width: number): string[] {
  const words = text.split(/\s+/);
  const lines: string[] = [];
  let current = '';
  for (const w of words) {
    if (current && current.length + 1 + w.length > width) {
      lines.push(current);
      current = w;
    } else current = current ? `${current} ${w}` : w;
  }
  if (current) lines.push(current);
  return lines;
}
