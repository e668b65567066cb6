import type { ChecklistRecord, FileReport, Finding, ResultRecord } from '../engine/types.js';
import { CAUTIONS, type RunReport } from './types.js';

const GUIDELINE_NAMES: Record<string, string> = {
  sampl: 'SAMPL (Lang & Altman)',
  'jars-quant': 'APA JARS-Quant (2018)',
  consort: 'CONSORT 2010',
};
const CONSISTENCY_RULES = new Set(['sample-size-agrees-with-df', 'group-sizes-sum-to-total', 'repeated-result-agrees']);
const STATUS = { found: 'found', missing: '**missing**', 'not-applicable': 'not applicable' } as const;

/** Markdown text safe inside a table cell or list item: no pipes, no line breaks, no raw HTML. */
function cell(s: string): string {
  // '<' stays readable ("p < .001") and is escaped only where it could open an HTML tag
  return s.replace(/\\/g, '\\\\').replace(/\|/g, '\\|').replace(/<(?=[A-Za-z!/?])/g, '&lt;').replace(/[\r\n]+/g, ' ').replace(/`/g, "'");
}

const at = (p?: { start: { line: number } }) => (p ? `line ${p.start.line}` : '');

/**
 * A Markdown report a referee can paste into a review: per document the checklist (found,
 * missing, not applicable, each with its line), then consistency across the document, then the
 * number-level findings in brief, then the cautions.
 */
export function formatChecklist(run: RunReport): string {
  const out: string[] = [];
  for (const file of run.files) out.push(...fileSection(file));
  for (const f of run.failures) out.push(`Not checked: ${cell(f.path)} (${cell(f.message)}).`, '');
  out.push('---', '', ...CAUTIONS.map((c) => `*${cell(c)}*`), '', `Prepared with ${run.tool.name} ${run.tool.version}.`, '');
  return out.join('\n');
}

function fileSection(file: FileReport): string[] {
  const out = [`# Reporting checklist: ${cell(file.path)}`, ''];
  out.push(`Items follow ${file.guidelines.map((g) => GUIDELINE_NAMES[g] ?? g).join(', ')}. ${file.results.length} t-test result${file.results.length === 1 ? '' : 's'} found.`, '');
  const documentItems = file.checklist.filter((c) => c.entries.some((e) => e.scope === 'document'));
  const resultItems = file.checklist.filter((c) => c.entries.some((e) => e.scope === 'result'));
  out.push('## The document', '', '| Item | Guideline | Status | Where | Detail |', '| --- | --- | --- | --- | --- |');
  for (const c of documentItems) {
    for (const e of c.entries.filter((x) => x.scope === 'document')) out.push(`| ${cell(c.item)} | ${refs(c)} | ${STATUS[e.status]} | ${at(e.place)} | ${cell(e.detail)} |`);
  }
  out.push('');
  if (file.results.length > 0) {
    out.push('## Each result', '');
    file.results.forEach((r, i) => out.push(...resultBlock(r, i + 1, resultItems)));
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

function resultBlock(r: ResultRecord, n: number, items: ChecklistRecord[]): string[] {
  const lines = [`### ${n}. Line ${r.start.line}: ${cell(r.printed)}`, ''];
  for (const c of items) {
    const e = c.entries.find((x) => x.resultId === r.id);
    if (!e) continue;
    const mark = e.status === 'found' ? '[x]' : e.status === 'missing' ? '[ ]' : '[–]';
    lines.push(`- ${mark} ${cell(c.item)} — ${STATUS[e.status]}${e.place && e.status === 'found' ? ` (${at(e.place)})` : ''}: ${cell(e.detail)}`);
  }
  lines.push('');
  return lines;
}

function refs(c: ChecklistRecord): string {
  return Object.entries(c.guidelines)
    .map(([g, ref]) => `${GUIDELINE_NAMES[g]?.split(' (')[0] ?? g}: ${cell(ref)}`)
    .join('; ');
}

function relatedText(f: Finding): string {
  return f.related?.length ? ` (see ${f.related.map((r) => at(r)).join(', ')})` : '';
}
