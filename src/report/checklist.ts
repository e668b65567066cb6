import type { FileReport, Finding } from '../engine/types.js';
import { GUIDELINE_NAMES, guidelineRefs, missingWhere, resultHeading, summariseChecklist, type ItemSummary } from './checklistSummary.js';
import { CAUTIONS, type RunReport } from './types.js';
import { terminalLine } from './text.js';
import { joined, wholeText } from './chunks.js';
import { resultCount, resultsInReadingOrder } from './readingOrder.js';
import { shortPlace } from './places.js';

const CONSISTENCY_RULES = new Set(['sample-size-agrees-with-df', 'group-sizes-sum-to-total', 'repeated-result-agrees']);
const STATUS = { found: 'found', missing: '**missing**', 'not-applicable': 'not applicable' } as const;

/**
 * Quoted text (manuscript words, file names, messages) as inert Markdown inside a table cell or
 * list item: terminal-safe on one line, no pipes, no raw HTML, and nothing that renders as an
 * image, a link, an autolink or emphasis, so a review system that renders the pasted report
 * fetches nothing and links nowhere. Brackets, `!`, emphasis marks and `&` are escaped, and `<`
 * wherever it could open a tag or an autolink. GFM finds literal autolinks (`http://`, `www.`,
 * `name@host`) in the text after escapes are resolved, so those are defanged in what is shown,
 * as `http[:]//`, `www[.]` and `name[@]host`.
 */
function cell(s: string): string {
  return terminalLine(s)
    .replace(/[\\|[\]!*_~&#]/g, '\\$&')
    // '<' stays readable ("p < .001") and is escaped only where it could open a tag or autolink
    .replace(/<(?=[A-Za-z!/?])/g, '&lt;')
    .replace(/(?<=[A-Za-z]):(?=\/\/)/g, '\\[:\\]')
    .replace(/(?<=[Ww][Ww][Ww])\./g, '\\[.\\]')
    .replace(/@/g, '\\[@\\]')
    .replace(/`/g, "'");
}


/**
 * A Markdown report a referee can paste into a review: per document the checklist's document
 * items (found with their line, missing, not applicable), then one line per per-result item
 * with how many results meet it and where it is missing, then the results read, consistency
 * across the document, the number-level findings in brief, and the cautions.
 */
export function formatChecklist(run: RunReport): string {
  return wholeText(formatChecklistChunks(run));
}

/** The same text as formatChecklist, piece by piece in order: the command line writes these. */
export function formatChecklistChunks(run: RunReport): Iterable<string> {
  return joined(checklistLines(run), '\n');
}

/** The report's lines, to be joined by line breaks (the last is empty: the text ends with one). */
function* checklistLines(run: RunReport): Generator<string> {
  for (const file of run.files) yield* fileSection(file);
  for (const f of run.failures) yield* [`Not checked: ${cell(f.path)} (${cell(f.message)}).`, ''];
  yield* ['---', '', ...CAUTIONS.map((c) => `*${cell(c)}*`), '', `Prepared with ${run.tool.name} ${run.tool.version}.`, ''];
}

function fileSection(file: FileReport): string[] {
  const out = [`# Reporting checklist: ${cell(file.path)}`, ''];
  const others = file.statistics?.length ?? 0;
  const found = `${file.results.length} t-test result${file.results.length === 1 ? '' : 's'}${others > 0 ? ` and ${others} F, χ², r or z result${others === 1 ? '' : 's'}` : ''} found.`;
  out.push(`Items follow ${file.guidelines.map((g) => GUIDELINE_NAMES[g] ?? g).join(', ')}. ${found}`, '');
  const items = summariseChecklist(file);
  out.push('## The document', '', '| Item | Guideline | Status | Where | Detail |', '| --- | --- | --- | --- | --- |');
  for (const s of items) if (s.scope === 'document') out.push(`| ${cell(s.record.item)} | ${refs(s)} | ${STATUS[s.status]} | ${s.line !== undefined ? cell(s.where ?? `line ${s.line}`) : ''} | ${cell(s.detail)} |`);
  out.push('');
  if (resultCount(file) > 0) {
    out.push('## Each result', '', '| Item | Guideline | Met | Missing for |', '| --- | --- | --- | --- |');
    for (const s of items) {
      if (s.scope !== 'result') continue;
      const met = s.applicable === 0 ? 'not applicable' : `${s.found} of ${s.applicable}`;
      out.push(`| ${cell(s.record.item)} | ${refs(s)} | ${met} | ${cell(missingWhere(s))} |`);
    }
    out.push('', '### Results read', '');
    resultsInReadingOrder(file).forEach((r, i) => out.push(`${i + 1}. ${cell(resultHeading(r.record))}`));
    out.push('');
  }
  const consistency = file.findings.filter((f) => CONSISTENCY_RULES.has(f.ruleId));
  out.push('## Consistency across the document', '');
  if (consistency.length === 0) out.push('No disagreement found between the sample sizes, the df and repeated results.', '');
  else for (const f of consistency) out.push(`- ${at(f)}: ${cell(f.message)}${relatedText(f)}`);
  out.push('');
  const checklistIds = new Set(file.checklist.map((c) => c.ruleId));
  const numbers = file.findings.filter((f) => !CONSISTENCY_RULES.has(f.ruleId) && !checklistIds.has(f.ruleId));
  out.push('## Numbers that do not agree', '');
  if (numbers.length === 0) out.push('None found.', '');
  else for (const f of numbers) out.push(`- ${at(f)} (${f.level}, ${f.ruleId}): ${cell(f.message)}`);
  out.push('');
  return out;
}

function refs(s: ItemSummary): string {
  return guidelineRefs(s.record)
    .map((r) => `${r.guideline}: ${cell(r.ref)}`)
    .join('; ');
}

/** A finding's line; a finding said of the whole document has none. */
function at(f: Finding): string {
  return f.scope === 'document' ? 'the document' : shortPlace(f);
}

function relatedText(f: Finding): string {
  return f.related?.length ? ` (see ${f.related.map(shortPlace).join(', ')})` : '';
}
