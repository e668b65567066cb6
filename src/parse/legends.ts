import type { Segment } from './types.js';

/** `Table 2`, `Table S1`, `TABLE IV`, `Tab. 3`, and the PDF-glued `Table1Site …`. */
const CAPTION = /^(?:Table|TABLE|Tab\.)[ \u00A0]{0,2}(?:[A-Z]?[0-9]{1,3}|[IVXLC]{1,7}(?![A-Za-z]))/;
/** `Note.`, `Notes:`, a footnote mark (`*`, `†`, `ᵃ`, `^a` from `<sup>a</sup>`, `a `). */
const NOTE = /^(?:Notes?\b|NOTES?\b|[*†‡§¶]|[ᵃᵇᶜᵈᵉᶠ]|\^[a-z]|[a-f][ )\]])/u;
const STAR_LEGEND = /\*{1,3} ?\\?[pP] ?(?:<|&lt;|≤)/;
const NOTE_LABEL = /^Notes?[.:]?$/i;

/**
 * Marks each table's caption (the paragraph right before it starting with `Table N`) and notes
 * (the paragraphs right after it starting with `Note`, a footnote mark or holding a star
 * legend; a bare `Note:` takes the paragraph after it along). `source` is the text the
 * segments' offsets index after subtracting `shift` (a stripped byte-order mark): the stars of
 * a legend, which Markdown may have read as emphasis, are looked for there.
 */
export function markLegends(segments: Segment[], source: string, shift = 0): void {
  const spans = new Map<number, { first: number; last: number }>();
  segments.forEach((s, i) => {
    if (!s.table) return;
    const span = spans.get(s.table.table);
    if (span) span.last = i;
    else spans.set(s.table.table, { first: i, last: i });
  });
  const raw = (seg: Segment) => seg.text.trimStart();
  const prose = (seg: Segment | undefined) => seg !== undefined && (seg.kind === 'paragraph' || seg.kind === 'text') && seg.table === undefined;
  for (const [table, { first, last }] of spans) {
    let before = first - 1;
    while (before >= 0 && segments[before]?.kind === 'code') before -= 1;
    const caption = segments[before];
    if (caption && prose(caption) && !caption.legendOf && CAPTION.test(raw(caption))) caption.legendOf = { table, role: 'caption' };
    lastRowNote(segments, first, last, table);
    let takeNext = false;
    for (let i = last + 1; i < segments.length; i += 1) {
      const seg = segments[i] as Segment;
      if (seg.kind === 'code') continue;
      if (!prose(seg) || seg.legendOf) break;
      const text = raw(seg);
      if (!takeNext && !NOTE.test(text) && !STAR_LEGEND.test(sourceOf(seg, source, shift))) break;
      seg.legendOf = { table, role: 'note' };
      takeNext = NOTE_LABEL.test(seg.text.trim());
    }
  }
}

/** The first few hundred source characters a segment covers. */
function sourceOf(seg: Segment, source: string, shift: number): string {
  const a = (seg.starts[0] as number) - shift;
  const b = Math.min((seg.ends.at(-1) as number) - shift, a + 400);
  return source.slice(a, b);
}

/**
 * A GFM table takes a `Note.` line written right below it as one more row: a last row whose
 * only cell starts with `Note` is the table's note.
 */
function lastRowNote(segments: Segment[], first: number, last: number, table: number): void {
  const cell = segments[last];
  const row = cell?.table?.row;
  if (!cell || row === undefined || row === 0 || cell.table?.column !== 0) return;
  for (let i = last - 1; i >= first; i -= 1) {
    const s = segments[i] as Segment;
    if (s.table?.row === row) return;
    if (s.table && s.table.row < row) break;
  }
  if (/^Notes?\b/.test(cell.text.trimStart())) cell.legendOf = { table, role: 'note' };
}
