import { documentFromBlocks, type Block, type BlockNote } from '../blocks.js';
import type { BinaryOutcome } from '../binary.js';
import type { ParsedDocument, Span } from '../types.js';
import { DEFAULT_PDF_LIMITS, PdfRefusal, readPdfText, type PdfText } from './read.js';
import type { CharBox, PdfLimits, PdfPiece } from './types.js';

export { DEFAULT_PDF_LIMITS, PDF_MAX_OBJECTS, PDF_MAX_PAGES, PDF_MAX_RUNS, PdfRefusal, countObjects, loadPdfJs, readPdfText, type PdfText } from './read.js';
export { layoutPages } from './layout.js';
export { BoxList } from './boxes.js';
export type * from './types.js';

/** A PDF's blocks in the shared shape: one piece per printed line, with its page, line and first words. */
export function pdfBlocks(text: PdfText): Block[] {
  return text.blocks.map((b) => ({
    kind: b.kind,
    ...(b.table ? { table: b.table } : {}),
    pieces: b.pieces.map((p) => ({ text: p.text, unit: { page: p.page, line: p.line, charOffset: p.charOffset, opening: p.opening } })),
  }));
}

/** A PDF read into segments: pdf.js's text in reading order (see layout.ts), or the reason it was not read. */
export async function readPdf(path: string, bytes: Uint8Array, limits: PdfLimits = DEFAULT_PDF_LIMITS): Promise<BinaryOutcome> {
  try {
    const text = await readPdfText(bytes, limits);
    const notes = unreadableNotes(text);
    return { ok: true, document: documentFromBlocks(path, 'pdf', pdfBlocks(text), notes.length > 0 ? { notes } : {}) };
  } catch (e) {
    if (e instanceof PdfRefusal) return { ok: false, message: `${e.reason === 'damaged' ? 'cannot read' : 'skipped'}: ${e.message}` };
    throw e;
  }
}

/**
 * One note naming the pages that hold characters that could not be read (their font gives them no
 * Unicode, see glyphs.ts), placed at the first block of the first such page.
 */
export function unreadableNotes(text: PdfText): BlockNote[] {
  const first = text.unreadable[0];
  if (!first) return [];
  const block = text.blocks.findIndex((b) => b.pieces.some((p) => p.page >= first.page));
  const fonts = [...new Set(text.unreadable.flatMap((u) => u.fonts))];
  const pages = text.unreadable.map((u) => u.page);
  const message = `${pages.length === 1 ? 'page' : 'pages'} ${pages.join(', ')} (counted in the file) ${pages.length === 1 ? 'holds' : 'hold'} characters set in ${fonts.length === 1 ? 'the font' : 'the fonts'} ${fonts.join(', ')} that carry no Unicode: they were read as the font's codes, which may not be the characters printed`;
  return [{ kind: 'glyphs-not-read', message, ...(block >= 0 ? { block } : {}) }];
}

/** The boxes on one page that a span of the extracted text covers. */
export interface PageBoxes {
  page: number;
  boxes: CharBox[];
}

/**
 * Where the characters of `span` (offsets into the document read from `text`, see
 * `documentFromBlocks`) are printed: their boxes, by page. The document's units follow the
 * non-empty pieces one for one, and each piece's text sits verbatim in the source.
 */
export function boxesOfSpan(text: PdfText, doc: ParsedDocument, span: Span): PageBoxes[] {
  const units = doc.original?.units ?? [];
  const pieces: PdfPiece[] = [];
  for (const b of text.blocks) for (const p of b.pieces) if (p.text !== '') pieces.push(p);
  const out: PageBoxes[] = [];
  units.forEach((u, k) => {
    if (u.end <= span.start || u.start >= span.end) return;
    const piece = pieces[k];
    if (!piece) return;
    const a = Math.max(span.start, u.start) - u.start;
    const z = Math.min(span.end, u.end) - u.start;
    const boxes = piece.boxes.boxes(a, z).filter((b) => b.x1 > b.x0);
    const last = out.at(-1);
    if (last && last.page === piece.page) last.boxes.push(...boxes);
    else out.push({ page: piece.page, boxes });
  });
  return out;
}
