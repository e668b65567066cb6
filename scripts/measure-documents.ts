/**
 * Measures plumbline's Word and PDF reading on ../shared/documents (beside the project): real
 * .docx and .pdf files with every reported t statistic a careful reader finds listed in the set's
 * expected.jsonl. Per file kind: how many expected t-tests were extracted with their printed t
 * (and df) at the right place (Word: the paragraph; PDF: the page), and the errors and warnings
 * raised on the consistent ones (goal 0), on the not-checkable ones (goal 0) and on the
 * inconsistent one. The files are third-party: read from there at run time, never copied here.
 *
 *   npx tsx scripts/measure-documents.ts [--verbose]
 */
import { existsSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { binaryKindOf, checkSource, readBinaryDocument, type FileReport, type ResultRecord } from '../src/engine/index.js';

interface Expected {
  file: string;
  kind: 'docx' | 'pdf';
  /** Word: the position among all w:p of the body (table cells included), in document order, 0-based. */
  paragraph_index?: number;
  page?: number;
  t: string;
  df?: string;
  verdict: 'consistent' | 'inconsistent' | 'not-checkable';
}

export interface DocumentFigures {
  lines: string[];
  /** Per file kind and verdict: expected t-tests, extracted at their place, and those with an error or warning. */
  byKind: Record<string, Record<string, { n: number; extracted: number; flagged: number }>>;
}

const shared = resolve(import.meta.dirname, '../../shared/documents');

/** A printed number as compared: minus signs of any kind as `-`, spacing dropped. */
const plain = (s: string | undefined) => (s ?? '').replace(/[\u2212\u2013\u2012\u2011]/g, '-').replace(/\s+/g, '').replace(/^-/, '');

export async function measureDocuments(verbose: boolean): Promise<DocumentFigures> {
  const lines: string[] = [];
  const byKind: DocumentFigures['byKind'] = {};
  if (!existsSync(join(shared, 'expected.jsonl'))) return { lines: ['(../shared/documents not found: skipped)'], byKind };
  const expected = readFileSync(join(shared, 'expected.jsonl'), 'utf8')
    .split('\n')
    .filter((l) => l.trim() !== '')
    .map((l) => JSON.parse(l) as Expected);
  const files = [...new Set(expected.map((e) => e.file))];
  for (const file of files) {
    const path = join(shared, file);
    const bytes = readFileSync(path);
    const kind = binaryKindOf(path, bytes);
    const mine = expected.filter((e) => e.file === file);
    let report: FileReport | undefined;
    let refusal: string | undefined;
    const t0 = performance.now();
    if (kind) {
      const read = await readBinaryDocument(file, bytes, kind);
      if (read.ok) report = checkSource(file, read.document.source, { document: read.document });
      else refusal = read.message;
    }
    const ms = performance.now() - t0;
    const used = new Set<string>();
    let found = 0;
    for (const e of mine) {
      const slot = ((byKind[e.kind] ??= {})[e.verdict] ??= { n: 0, extracted: 0, flagged: 0 });
      slot.n += 1;
      const r = report?.results.find((x) => !used.has(x.id) && atPlace(x, e) && plain(x.t.printed) === plain(e.t) && (e.df === undefined || x.df === undefined || plain(x.df.printed) === plain(e.df)));
      if (!r || !report) {
        if (verbose) lines.push(`  missed ${file} ${e.kind === 'docx' ? `¶${(e.paragraph_index ?? -1) + 1}` : `p. ${e.page}`} t = ${e.t}${e.df ? ` df ${e.df}` : ''}`);
        continue;
      }
      used.add(r.id);
      found += 1;
      slot.extracted += 1;
      const flags = report.findings.filter((f) => f.resultId === r.id && (f.level === 'error' || f.level === 'warning'));
      if (flags.length > 0) {
        slot.flagged += 1;
        if (verbose || e.verdict !== 'inconsistent') lines.push(`  ${e.verdict} result flagged: ${file} ${r.printed} (${flags.map((f) => f.ruleId).join(', ')})`);
      }
    }
    lines.push(`${file}: ${refusal ? `not read (${refusal})` : `${found} of ${mine.length} expected t-tests extracted at their place; read and checked in ${Math.round(ms)} ms`}`);
  }
  for (const [kind, verdicts] of Object.entries(byKind)) {
    for (const [verdict, s] of Object.entries(verdicts)) lines.push(`${kind}, ${verdict}: ${s.extracted} of ${s.n} extracted, ${s.flagged} flagged (error or warning)`);
  }
  return { lines, byKind };
}

/** Whether a result sits where the key says: Word paragraph_index is 0-based among the body's w:p, ours 1-based; PDF by page. */
function atPlace(r: ResultRecord, e: Expected): boolean {
  const o = r.original;
  if (!o) return false;
  if (e.kind === 'docx') return o.kind === 'paragraph' && o.note === undefined && o.paragraph === (e.paragraph_index ?? -2) + 1;
  return o.kind === 'page' && o.page === e.page;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const figures = await measureDocuments(process.argv.includes('--verbose'));
  console.log(figures.lines.join('\n'));
}
