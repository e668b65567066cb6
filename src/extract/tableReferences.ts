import type { Segment } from '../parse/types.js';
import { sentenceOf, sentenceStarts, sourceSpan } from './numbers.js';
import { CAPTION_NUMBER, labelsNamedIn } from './tables.js';
import { stem, topicWords } from './topic.js';
import type { TableBlockRecord, TableCaption, TableReference } from './types.js';
import { matchesOf } from './matches.js';

/**
 * A table named in prose: "Table 2", "Tables 2 and 3", "Tab. 4", "Table S1", "Table IV". The
 * number is the one a caption prints (CAPTION_NUMBER); bounded quantifiers only.
 */
const TABLE_REFERENCE = /(?<![\p{L}\p{N}])(Tables?|TABLES?|Tab\.)[ \u00A0]{0,2}([A-Z]?\d{1,3}|[IVXLC]{1,7})(?![\p{L}\p{N}])/gu;

/**
 * Words of a caption that name no measure: what a table of descriptives holds and how it is laid
 * out (common practice, no source). The rest of the caption ("Recall by room") says what the
 * table is about.
 */
const CAPTION_WORDS = new Set(
  'table descriptive descriptives statistics statistic standard deviation deviations error errors sd sds se sem participants participant per function variable variables measure measures outcome outcomes characteristics summary'
    .split(' ')
    .map((w) => w.slice(0, 5)),
);

/** Each captioned table's name ("Table 2") and the stems of its caption's content words. */
export function readCaptions(segments: readonly Segment[]): TableCaption[] {
  const out: TableCaption[] = [];
  const seen = new Set<number>();
  for (const s of segments) {
    if (s.legendOf?.role !== 'caption' || seen.has(s.legendOf.table)) continue;
    seen.add(s.legendOf.table);
    const m = CAPTION_NUMBER.exec(s.text);
    if (!m) continue;
    const words = topicWords(s.text.slice(m[0].length)).filter((w) => !CAPTION_WORDS.has(stem(w)));
    out.push({ table: s.legendOf.table, name: `Table ${m[1] as string}`, words, stems: words.map(stem) });
  }
  return out;
}

/**
 * Every "Table N" of the prose (not of a table's own cells or legends, nor of code), resolved to
 * the table whose caption gives that number when exactly one caption does.
 */
export function findTableReferences(segments: readonly Segment[], captions: readonly TableCaption[]): TableReference[] {
  const out: TableReference[] = [];
  const byName = new Map<string, number | null>();
  for (const c of captions) byName.set(c.name.toLowerCase(), byName.has(c.name.toLowerCase()) ? null : c.table);
  for (const seg of segments) {
    if (seg.table || seg.legendOf || seg.kind === 'code') continue;
    if (!seg.text.includes('Tab') && !seg.text.includes('TAB')) continue;
    let starts: number[] | undefined;
    for (const m of matchesOf(TABLE_REFERENCE, seg.text)) {
      starts ??= sentenceStarts(seg.text);
      const word = m[1] as string;
      const plural = /s$/iu.test(word);
      const table = plural ? undefined : byName.get(`table ${(m[2] as string).toLowerCase()}`);
      const at = m.index;
      out.push({
        segment: seg.id,
        block: seg.block,
        sentence: sentenceOf(starts, at),
        span: sourceSpan(seg, at, at + m[0].length),
        printed: m[0],
        plural,
        ...(table !== undefined && table !== null ? { table } : {}),
      });
    }
  }
  return out;
}

const LETTER_OR_DIGIT = /[\p{L}\p{N}]/u;

/** Labels read per table, and tables per paragraph: bounds that keep the scan linear in the text. */
const MAX_LABELS = 64;
const MAX_TABLES_NAMED = 3;

/**
 * The sentences of the paragraphs that name a table which name one of its row or block labels
 * (whole words, case folded, three characters or more), so the link layer can tell which of the
 * table's measures an F is about however far the paragraph is from the table.
 */
export function findLabelMentions(segments: readonly Segment[], references: readonly TableReference[], blocks: readonly TableBlockRecord[]): Array<{ table: number; label: string; segment: number; sentence: number }> {
  const out: Array<{ table: number; label: string; segment: number; sentence: number }> = [];
  if (references.length === 0 || blocks.length === 0) return out;
  const labels = new Map<number, Set<string>>();
  for (const b of blocks) {
    if ((labels.get(b.table)?.size ?? 0) >= MAX_LABELS) continue;
    const key = b.label.toLowerCase();
    if (key.length < 3 || !/\p{L}/u.test(key)) continue;
    const set = labels.get(b.table) ?? new Set<string>();
    set.add(key);
    labels.set(b.table, set);
  }
  const bySegment = new Map<number, Set<number>>();
  for (const r of references) {
    if (r.table === undefined || !labels.has(r.table)) continue;
    const set = bySegment.get(r.segment) ?? new Set<number>();
    set.add(r.table);
    bySegment.set(r.segment, set);
  }
  for (const seg of segments) {
    const tables = bySegment.get(seg.id);
    // a tie needs one table named: a paragraph naming many is not read (and stays linear)
    if (!tables || tables.size > MAX_TABLES_NAMED) continue;
    // the t link's scan (findTableMentions), here over the paragraphs that name the table, however
    // far from it; a digit joins a word too ("Fig. 10" is not "Fig. 1")
    for (const table of tables) labelsNamedIn(seg, table, labels.get(table) ?? [], out, LETTER_OR_DIGIT);
  }
  return out;
}
