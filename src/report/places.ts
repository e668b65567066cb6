import type { OriginalPlace, Place } from '../engine/types.js';

/**
 * How the formats name a place of a Word or PDF file for a person: `¶34 (“Recall was higher
 * with …”) char 112` (Word: the paragraph as Word's navigation counts it, its first words and the
 * 1-based character inside it) or `p. 7 line 23 (“… words around …”)` (PDF).
 */
export function originalName(o: OriginalPlace): string {
  return o.kind === 'paragraph' ? `${originalShort(o)} (“${o.opening}”) char ${o.char}` : `p. ${o.page} line ${o.line} (“${o.around}”)`;
}

/** The short form, for lists of places: `¶34`, `p. 7 line 23`. */
export function originalShort(o: OriginalPlace): string {
  if (o.kind === 'page') return `p. ${o.page} line ${o.line}`;
  return o.note ? `${o.note.kind} ${o.note.number} ¶${o.paragraph}` : `¶${o.paragraph}`;
}

/** A place's short name in lists: the original's (`¶34`) when the file has one, else `line 12`. */
export function shortPlace(p: Place): string {
  return p.original ? originalShort(p.original) : `line ${p.start.line}`;
}

/** The label of a line of extracted text where a paragraph or printed line starts, for a report's gutter: `¶34`, `fn 1 ¶2`, `p7:23`. */
export function lineLabel(u: { paragraph?: number; note?: { kind: 'footnote' | 'endnote'; number: number }; page?: number; line?: number }): string {
  if (u.page !== undefined) return `p${u.page}:${u.line ?? 0}`;
  return u.note ? `${u.note.kind === 'footnote' ? 'fn' : 'en'} ${u.note.number} ¶${u.paragraph ?? 0}` : `¶${u.paragraph ?? 0}`;
}
