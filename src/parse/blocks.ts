import { MappedText, offsetArray } from './builder.js';
import { markLegends } from './legends.js';
import { normalize } from './normalize.js';
import type { OriginalMap, OriginalUnit, ParsedDocument, ReadNote, Segment, TableLegend, TablePlace } from './types.js';

/** A stretch of a block's text and where it sits in the original file (a Word paragraph, a PDF line). */
export interface BlockPiece {
  text: string;
  unit: Omit<OriginalUnit, 'start' | 'end'>;
}

/**
 * What a binary front end (Word, PDF) hands over: a paragraph, a heading or a table cell, as
 * pieces of text in reading order. Pieces of one block are joined by a line break in the
 * extracted text, which the normaliser reads as a space (so a front end undoes end-of-line
 * hyphenation itself, before).
 */
export interface Block {
  kind: 'paragraph' | 'heading' | 'tableCell';
  table?: TablePlace;
  legendOf?: TableLegend;
  pieces: BlockPiece[];
}

/** A read note of a front end, placed at the start of a block (or of the document). */
export interface BlockNote {
  kind: ReadNote['kind'];
  message: string;
  /** Index into the blocks; the note's span is the start of that block's text (0 when absent). */
  block?: number;
}

export interface BlocksOptions {
  notes?: BlockNote[];
  /** Word: the file held tracked changes, read as accepted. */
  trackedChanges?: boolean;
}

/**
 * A binary document's blocks into a ParsedDocument: `source` is the extracted text (pieces
 * joined by a line break, blocks by a blank line), segments are made through the same
 * normaliser the text readers use (so extraction sees the same spellings), table captions and
 * notes are marked as in the other readers (`Table 2 …` before a table, `Note.` after it), and
 * `original.units` says where each piece sits in the original file. Linear in the text.
 */
export function documentFromBlocks(path: string, format: 'docx' | 'pdf', blocks: readonly Block[], options: BlocksOptions = {}): ParsedDocument {
  const parts: string[] = [];
  let length = 0;
  const units: OriginalUnit[] = [];
  const segments: Segment[] = [];
  const blockStarts: number[] = [];
  let section: string | undefined;
  let blockId = 0;
  const put = (s: string) => {
    parts.push(s);
    length += s.length;
  };
  for (const block of blocks) {
    const pieces = block.pieces.filter((p) => p.text !== '');
    if (pieces.length === 0) {
      blockStarts.push(length);
      continue;
    }
    if (length > 0) put('\n\n');
    blockStarts.push(length);
    const raw = new MappedText();
    pieces.forEach((piece, i) => {
      if (i > 0) {
        raw.pushVerbatim('\n', length);
        put('\n');
      }
      raw.pushVerbatim(piece.text, length);
      units.push({ ...piece.unit, start: length, end: length + piece.text.length });
      put(piece.text);
    });
    const text = normalize(raw).trimmed();
    if (text.text === '') continue;
    blockId += 1;
    const seg: Segment = {
      id: segments.length,
      block: blockId,
      kind: block.kind,
      text: text.text,
      starts: offsetArray(text.starts),
      ends: offsetArray(text.ends),
      ...(block.table ? { table: block.table } : {}),
      ...(block.legendOf ? { legendOf: block.legendOf } : {}),
      ...(section !== undefined && block.kind !== 'heading' ? { section } : {}),
    };
    if (block.kind === 'heading') section = seg.text;
    segments.push(seg);
  }
  const source = parts.join('');
  markLegends(segments, source);
  const readNotes: ReadNote[] = (options.notes ?? []).map((n) => {
    const at = n.block === undefined ? 0 : (blockStarts[n.block] ?? 0);
    return { kind: n.kind, message: n.message, span: { start: at, end: at } };
  });
  const original: OriginalMap = { kind: format, units, ...(options.trackedChanges ? { trackedChanges: true } : {}) };
  return { path, source, format, segments, directives: [], hadBom: false, ...(readNotes.length > 0 ? { readNotes } : {}), original };
}

/** Where an offset of a binary document's extracted text sits in the original: its unit, found by binary search. */
export function unitAt(map: OriginalMap, offset: number): OriginalUnit | undefined {
  const units = map.units;
  let lo = 0;
  let hi = units.length - 1;
  let found = -1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    if ((units[mid] as OriginalUnit).start <= offset) {
      found = mid;
      lo = mid + 1;
    } else hi = mid - 1;
  }
  if (found < 0) return units[0];
  const u = units[found] as OriginalUnit;
  // an offset in the blank line after a unit belongs to the next one, where the text resumes
  if (offset > u.end && found + 1 < units.length) return units[found + 1];
  return u;
}

/**
 * The first words of a paragraph or line for a person to search for: up to `words` words and
 * 48 characters, spacing collapsed, with `…` when cut.
 */
export function openingWords(text: string, words = 6): string {
  const collapsed = text.replace(/\s+/g, ' ').trim();
  const list = collapsed.split(' ');
  let out = '';
  for (const w of list.slice(0, words)) {
    const next = out === '' ? w : `${out} ${w}`;
    if (next.length > 48) break;
    out = next;
  }
  if (out === '') out = collapsed.slice(0, 48);
  return out.length < collapsed.length ? `${out} …` : out;
}
