import type { ChecklistRecord, FileReport, Finding, Place, ResultRecord } from '../engine/types.js';
import type { Level } from '../rule-api/types.js';
import { originalShort } from './places.js';

/**
 * The reporting checklist as people read it, shared by the formatters: one line per item, the
 * per-result items counted with the places where they are missing (so a paper of forty results
 * gives one line per item, not forty), document items without a line when they are missing,
 * and results named the way a reader finds them. Layout only: it counts and names what the
 * report already holds.
 */

export const GUIDELINE_NAMES: Record<string, string> = {
  sampl: 'SAMPL (Lang & Altman)',
  'jars-quant': 'APA JARS-Quant (2018)',
  consort: 'CONSORT 2010',
};

/** One place where a per-result item is missing. */
export interface MissingPlace {
  line: number;
  /** A Word or PDF file's own place (`¶34`, `p. 7 line 23`), said instead of the line of the extracted text. */
  where?: string;
  /** The result's table and row, when it was printed in a table. */
  table?: { name: string; row?: string };
  /** The result as printed, when its line holds results that meet the item: the line alone would not say which. */
  printed?: string;
}

export interface DocumentItem {
  scope: 'document';
  record: ChecklistRecord;
  status: 'found' | 'missing' | 'not-applicable';
  detail: string;
  /** Where it was found; a missing document item has no line. */
  line?: number;
  /** A Word or PDF file's own place of `line` (`¶34`). */
  where?: string;
}

export interface ResultItem {
  scope: 'result';
  record: ChecklistRecord;
  found: number;
  missing: number;
  notApplicable: number;
  /** Results the item applies to (found or missing). */
  applicable: number;
  places: MissingPlace[];
}

export type ItemSummary = DocumentItem | ResultItem;

/** A result as the checklist names it: a t result, or an F, χ², r or z (which has no table). */
type Named = Place & { id: string; printed: string; table?: ResultRecord['table'] };

/** The file's results, t and others, by id. */
function resultsById(file: FileReport): Map<string, Named> {
  const byId = new Map<string, Named>(file.results.map((r) => [r.id, r]));
  for (const s of file.statistics ?? []) byId.set(s.id, s);
  return byId;
}

/** Each checklist item of a file, document items first, in the order the rules run. */
export function summariseChecklist(file: FileReport): ItemSummary[] {
  const byId = resultsById(file);
  const out: ItemSummary[] = [];
  for (const record of file.checklist) {
    const doc = record.entries.find((e) => e.scope === 'document');
    if (doc) {
      out.push({ scope: 'document', record, status: doc.status, detail: doc.detail, ...(doc.place && doc.status !== 'missing' ? { line: doc.place.start.line, ...(doc.place.original ? { where: originalShort(doc.place.original) } : {}) } : {}) });
      continue;
    }
    const entries = record.entries.filter((e) => e.scope === 'result');
    const count = (s: string) => entries.filter((e) => e.status === s).length;
    const places = pinpoint(file, entries.filter((e) => e.status === 'missing').map((e) => placeOf(e.resultId ? byId.get(e.resultId) : undefined, e.place)));
    out.push({ scope: 'result', record, found: count('found'), missing: count('missing'), notApplicable: count('not-applicable'), applicable: count('found') + count('missing'), places });
  }
  return [...out.filter((s) => s.scope === 'document'), ...out.filter((s) => s.scope === 'result')];
}

function placeOf(r: Named | undefined, fallback: Place | undefined): MissingPlace & { result?: Named } {
  const line = r?.start.line ?? fallback?.start.line ?? 0;
  const original = r?.original ?? fallback?.original;
  return { line, ...(original ? { where: originalShort(original) } : {}), ...(r?.table ? { table: r.table } : {}), ...(r ? { result: r } : {}) };
}

/** Names the result where its line also holds results the item does not miss. */
function pinpoint(file: FileReport, places: Array<MissingPlace & { result?: Named }>): MissingPlace[] {
  const onLine = new Map<number, number>();
  for (const r of file.results) if (!r.table) onLine.set(r.start.line, (onLine.get(r.start.line) ?? 0) + 1);
  for (const s of file.statistics ?? []) onLine.set(s.start.line, (onLine.get(s.start.line) ?? 0) + 1);
  const missingOn = new Map<number, number>();
  for (const p of places) if (!p.table) missingOn.set(p.line, (missingOn.get(p.line) ?? 0) + 1);
  return places.map(({ result, ...p }) => (!p.table && result && (missingOn.get(p.line) ?? 0) < (onLine.get(p.line) ?? 0) ? { ...p, printed: result.printed } : p));
}

/**
 * The places in reading order, lines grouped: `lines 19, 20, 30 (2 results); Table 1, rows
 * 'Eye strain' and 'Back pain'`.
 */
export function placeList(places: readonly MissingPlace[]): string {
  const lines = new Map<number, { n: number; printed: string[]; where?: string }>();
  const tables = new Map<string, string[]>();
  for (const p of places) {
    if (p.table) {
      const rows = tables.get(p.table.name) ?? [];
      rows.push(p.table.row ? `'${p.table.row}'` : `the row ${p.where ? `in ${p.where}` : `on line ${p.line}`}`);
      tables.set(p.table.name, rows);
    }
    else {
      const had = lines.get(p.line) ?? { n: 0, printed: [], ...(p.where ? { where: p.where } : {}) };
      had.n += 1;
      if (p.printed) had.printed.push(p.printed);
      lines.set(p.line, had);
    }
  }
  const parts: string[] = [];
  if (lines.size > 0) {
    const list = [...lines]
      .sort((a, b) => a[0] - b[0])
      .map(([line, { n, printed, where }]) => {
        const name = where ?? String(line);
        return printed.length > 0 ? `${name} (${printed.join('; ')})` : n > 1 ? `${name} (${n} results)` : name;
      });
    // a Word or PDF file's places name themselves (`¶34`); lines of text are `lines 19, 20`
    const named = places.some((p) => !p.table && p.where !== undefined);
    parts.push(named ? list.join(', ') : `${list.length === 1 ? 'line' : 'lines'} ${list.join(', ')}`);
  }
  for (const [name, rows] of tables) parts.push(`${name}, ${rows.length === 1 ? 'row' : 'rows'} ${joinAnd(rows)}`);
  return parts.join('; ');
}

/** Where a per-result item is missing: "all 13 results it applies to", or the places. */
export function missingWhere(s: { missing: number; applicable: number; places: readonly MissingPlace[] }): string {
  if (s.missing === 0) return '';
  if (s.missing === s.applicable && s.applicable > 1) return `all ${s.applicable} results it applies to`;
  return placeList(s.places);
}

/** "missing for 11 of 13 results: lines …", or "missing for all 13 results it applies to". */
export function missingText(s: { missing: number; applicable: number; places: readonly MissingPlace[] }): string {
  if (s.missing === s.applicable && s.applicable > 1) return `missing for all ${s.applicable} results it applies to`;
  return `missing for ${s.missing} of ${s.applicable} result${s.applicable === 1 ? '' : 's'}: ${placeList(s.places)}`;
}

/** A result as a reader finds it: `Table 2, row 'Fatigue': t(23) = 2.20, p = .38`, or `line 19: t(23) = 2.47, p = .021`. */
export function resultHeading(r: Pick<Named, 'start' | 'printed' | 'table'>): string {
  if (r.table) return `${r.table.name}, ${r.table.row ? `row '${r.table.row}'` : `line ${r.start.line}`}: ${r.printed}`;
  return `line ${r.start.line}: ${r.printed}`;
}

/** The guideline items an item follows, each under its guideline's short name. */
export function guidelineRefs(record: ChecklistRecord): Array<{ guideline: string; ref: string }> {
  return Object.entries(record.guidelines).map(([g, ref]) => ({ guideline: GUIDELINE_NAMES[g]?.split(' (')[0] ?? g, ref: ref ?? '' }));
}

/**
 * Whether a finding is a checklist entry said again (a missing item of a checklist rule): the
 * formatters that summarise the checklist show it there, once per item, not as a card.
 */
export function isChecklistFinding(file: FileReport, f: Finding): boolean {
  const index = missingIndex(file);
  if (!index.items.has(f.ruleId)) return false;
  if (f.scope === 'document') return true;
  return f.resultId !== undefined && index.missing.has(`${f.ruleId}\u0000${f.resultId}`);
}

/** Per file, once: the checklist's items and its missing per-result entries, for lookups in constant time. */
const indexes = new WeakMap<FileReport, { items: Set<string>; missing: Set<string> }>();
function missingIndex(file: FileReport): { items: Set<string>; missing: Set<string> } {
  let index = indexes.get(file);
  if (!index) {
    index = { items: new Set(file.checklist.map((c) => c.ruleId)), missing: new Set() };
    for (const c of file.checklist) for (const e of c.entries) if (e.status === 'missing' && e.resultId) index.missing.add(`${c.ruleId}\u0000${e.resultId}`);
    indexes.set(file, index);
  }
  return index;
}

/** The most severe level among findings, if any. */
export function worstOf(findings: readonly Finding[]): Level | undefined {
  const rank: Record<Level, number> = { note: 0, warning: 1, error: 2 };
  return findings.reduce<Level | undefined>((w, f) => (!w || rank[f.level] > rank[w] ? f.level : w), undefined);
}

function joinAnd(items: readonly string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} and ${items.at(-1) as string}`;
}

/** The checklist's findings of one item, said once: what a terminal report prints per item. */
export interface ChecklistFindingLine {
  ruleId: string;
  item: string;
  level: Level;
  /** A document item: what is missing, with no line. */
  document?: string;
  /** A per-result item: how many results miss it, of how many it applies to, and where. */
  missing?: number;
  applicable?: number;
  places?: MissingPlace[];
}

/** One line per checklist item with findings (quiet comments and levels applied), in rule order. */
export function checklistFindingLines(file: FileReport): ChecklistFindingLine[] {
  const byId = resultsById(file);
  const out: ChecklistFindingLine[] = [];
  const byRule = new Map<string, Finding[]>();
  for (const f of file.findings) {
    if (!isChecklistFinding(file, f)) continue;
    const list = byRule.get(f.ruleId);
    if (list) list.push(f);
    else byRule.set(f.ruleId, [f]);
  }
  for (const s of summariseChecklist(file)) {
    const findings = byRule.get(s.record.ruleId) ?? [];
    const level = worstOf(findings);
    if (!level) continue;
    const base = { ruleId: s.record.ruleId, item: s.record.item, level };
    if (s.scope === 'document') out.push({ ...base, document: s.detail });
    else out.push({ ...base, missing: findings.length, applicable: s.applicable, places: pinpoint(file, findings.map((f) => placeOf(f.resultId ? byId.get(f.resultId) : undefined, f))) });
  }
  return out;
}
