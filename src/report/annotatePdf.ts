import { PDFArray, PDFDocument, PDFHexString, PDFName, PDFString, type PDFDict, type PDFPage, type PDFRef } from 'pdf-lib';
import type { FileReport, Finding } from '../engine/types.js';
import { documentFromBlocks } from '../parse/blocks.js';
import { boxesOfSpan, pdfBlocks, readPdfText } from '../parse/pdf/index.js';
import type { CharBox } from '../parse/pdf/types.js';

/** Highlight colours by level (RGB 0–1): errors red, warnings orange, notes yellow. */
const COLOURS: Record<string, [number, number, number]> = { error: [1, 0.55, 0.55], warning: [1, 0.75, 0.4], note: [1, 0.95, 0.45] };

/** What a note on the page says: as the human format words a finding, with its rule and what to check. */
export function noteText(f: Finding): string {
  const where = f.original?.kind === 'page' ? `p. ${f.original.page} line ${f.original.line}: ` : '';
  return `${where}${f.level} ${f.ruleId}\n${f.message}\nWhat to check: ${f.check}\n(plumbline: an inconsistency is a question, not proof of error)`;
}

/**
 * A copy of a PDF with each finding of its report as a highlight over the flagged characters
 * (quad points, one quadrilateral per printed line) and a note (the annotation's contents and a
 * popup) saying what the human format says. The PDF is read again the way the check read it, so
 * the report's spans find their characters' boxes. pdf-lib writes the copy: a well-kept library
 * that edits an existing PDF's objects and saves them as a new file, with no renderer or native
 * code. The original bytes are not changed. Findings said of the whole document (no place) get a note at
 * the top of page 1.
 */
export async function annotatePdf(bytes: Uint8Array, report: FileReport): Promise<{ bytes: Uint8Array; placed: number; unplaced: number }> {
  const text = await readPdfText(bytes);
  const doc = documentFromBlocks(report.path, 'pdf', pdfBlocks(text));
  if (doc.source !== report.source) throw new Error('the PDF read differently this time; no annotated copy was written');
  const pdf = await PDFDocument.load(bytes, { updateMetadata: false });
  const pages = pdf.getPages();
  let placed = 0;
  let unplaced = 0;
  for (const f of report.findings) {
    const where = f.scope === 'document' ? [] : boxesOfSpan(text, doc, f.span);
    const boxes = where.find((w) => w.boxes.length > 0);
    const contents = noteText(f);
    if (!boxes) {
      unplaced += 1;
      const size = text.sizes[0];
      const page = pages[0];
      if (!page || !size) continue;
      addNote(pdf, page, contents, f, { x0: size.x0 + 20, x1: size.x0 + 40, y0: size.y0 + size.height - 40, y1: size.y0 + size.height - 20 });
      continue;
    }
    const page = pages[boxes.page - 1];
    const size = text.sizes[boxes.page - 1];
    if (!page || !size) continue;
    const shifted = boxes.boxes.map((b) => ({ x0: b.x0 + size.x0, x1: b.x1 + size.x0, y0: b.y0 + size.y0, y1: b.y1 + size.y0 }));
    addHighlight(pdf, page, shifted, contents, f);
    placed += 1;
  }
  return { bytes: await pdf.save({ useObjectStreams: false }), placed, unplaced };
}

/** One rectangle per printed line the boxes lie on (boxes of a line share their vertical extent). */
function lineRects(boxes: CharBox[]): CharBox[] {
  const rects: CharBox[] = [];
  for (const b of boxes) {
    const last = rects.at(-1);
    if (last && Math.abs(last.y0 - b.y0) < 0.5 && Math.abs(last.y1 - b.y1) < 0.5 && b.x0 >= last.x0 - 1) {
      last.x1 = Math.max(last.x1, b.x1);
    } else rects.push({ ...b });
  }
  return rects;
}

function text(s: string): PDFHexString {
  return PDFHexString.fromText(s);
}

function addHighlight(pdf: PDFDocument, page: PDFPage, boxes: CharBox[], contents: string, f: Finding): void {
  const rects = lineRects(boxes);
  const x0 = Math.min(...rects.map((r) => r.x0));
  const x1 = Math.max(...rects.map((r) => r.x1));
  const y0 = Math.min(...rects.map((r) => r.y0));
  const y1 = Math.max(...rects.map((r) => r.y1));
  // per quadrilateral: upper left, upper right, lower left, lower right (the order readers use)
  const quads = rects.flatMap((r) => [r.x0, r.y1, r.x1, r.y1, r.x0, r.y0, r.x1, r.y0]);
  const annot = pdf.context.obj({
    Type: 'Annot',
    Subtype: 'Highlight',
    Rect: [x0, y0, x1, y1],
    QuadPoints: quads,
    C: COLOURS[f.level] ?? COLOURS.note,
    F: 4,
    T: text('plumbline'),
    Subj: text(f.ruleId),
    NM: PDFString.of(`plumbline-${f.fingerprint}`),
    Contents: text(contents),
  });
  attach(pdf, page, annot, { x0: x1, x1: x1 + 200, y0: y1 - 100, y1 });
}

function addNote(pdf: PDFDocument, page: PDFPage, contents: string, f: Finding, at: CharBox): void {
  const annot = pdf.context.obj({
    Type: 'Annot',
    Subtype: 'Text',
    Rect: [at.x0, at.y0, at.x1, at.y1],
    Name: 'Comment',
    C: COLOURS[f.level] ?? COLOURS.note,
    F: 4,
    T: text('plumbline'),
    Subj: text(f.ruleId),
    NM: PDFString.of(`plumbline-${f.fingerprint}`),
    Contents: text(contents),
  });
  attach(pdf, page, annot, { x0: at.x1, x1: at.x1 + 200, y0: at.y1 - 100, y1: at.y1 });
}

/** Adds the annotation and its popup (closed) to the page's annotations. */
function attach(pdf: PDFDocument, page: PDFPage, annot: PDFDict, popupAt: CharBox): void {
  const ref: PDFRef = pdf.context.register(annot);
  const popup = pdf.context.obj({ Type: 'Annot', Subtype: 'Popup', Rect: [popupAt.x0, popupAt.y0, popupAt.x1, popupAt.y1], Parent: ref, Open: false, F: 28 });
  const popupRef = pdf.context.register(popup);
  annot.set(PDFName.of('Popup'), popupRef);
  annot.set(PDFName.of('P'), page.ref);
  let annots = page.node.lookup(PDFName.of('Annots'));
  if (!(annots instanceof PDFArray)) {
    annots = pdf.context.obj([]);
    page.node.set(PDFName.of('Annots'), annots as PDFArray);
  }
  (annots as PDFArray).push(ref);
  (annots as PDFArray).push(popupRef);
}
