import { linesOf, wholeText } from './chunks.js';
import { originalName } from './places.js';
import { terminalSafe } from './text.js';
import type { RunReport } from './types.js';

/**
 * One finding per line, `path:line:column: level rule-id message — check: what to check` (a
 * finding said of the whole document, a missing checklist item, has no line and column), for
 * editors' quick-fix lists, grep and CI logs. The message is kept on one line (line breaks and
 * runs of spaces become one space; control characters are made visible). No summary and no
 * cautions on standard output: the command line says the cautions on a terminal.
 */
export function formatLines(run: RunReport): string {
  return wholeText(formatLinesChunks(run));
}

/** The same text as formatLines, piece by piece in order: the command line writes these. */
export function formatLinesChunks(run: RunReport): Iterable<string> {
  return linesOf(findingLines(run));
}

function* findingLines(run: RunReport): Generator<string> {
  for (const file of run.files) {
    const path = oneLine(file.path);
    // a finding said of the whole document has no line: `path: level rule-id message`
    // a Word or PDF file: `paper.docx ¶34 (“Recall was …”) char 112: …`, the place in the file itself
    for (const f of file.findings) yield `${path}${f.scope === 'document' ? '' : f.original ? ` ${oneLine(originalName(f.original))}` : `:${f.start.line}:${f.start.column}`}: ${f.level} ${f.ruleId} ${oneLine(f.message)} — check: ${oneLine(f.check)}`;
  }
}

function oneLine(s: string): string {
  return terminalSafe(s.replace(/[\r\n\u2028\u2029\t]+/g, ' ')).replace(/ {2,}/g, ' ').trim();
}
