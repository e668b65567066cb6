import { repairOf, repairText, type FontRecord, type FontRepair } from './glyphs.js';
import { layoutPages } from './layout.js';
import { importPdfJs } from './pdfjs.js';
import type { PageRuns, PdfBlock, PdfLimits, PdfLine, TextRun } from './types.js';

/** Pages read at most: a longer file is refused rather than read for minutes. */
export const PDF_MAX_PAGES = 2000;
/** Text runs read at most over the file (a dense page holds some 3,000). */
export const PDF_MAX_RUNS = 2_000_000;
/** Indirect objects (`N G obj` headers in the file's bytes) at most. */
export const PDF_MAX_OBJECTS = 1_000_000;

export const DEFAULT_PDF_LIMITS: PdfLimits = { maxPages: PDF_MAX_PAGES, maxRuns: PDF_MAX_RUNS };

/** A PDF that is not read, with the reason in words a person can act on. */
export class PdfRefusal extends Error {
  constructor(
    message: string,
    readonly reason: 'damaged' | 'encrypted' | 'too-large' | 'no-text',
  ) {
    super(message);
    this.name = 'PdfRefusal';
  }
}

/** The text read from a PDF: blocks in reading order and every kept line with its character boxes. */
export interface PdfText {
  pages: number;
  blocks: PdfBlock[];
  lines: PdfLine[];
  /** Each page's visible box (points): its lower left corner, which box coordinates are relative to, and its size. */
  sizes: Array<{ x0: number; y0: number; width: number; height: number }>;
  /** Pages with characters that could not be read (their font gives them no Unicode; see glyphs.ts), with those fonts. */
  unreadable: Array<{ page: number; fonts: string[] }>;
}

type PdfJs = typeof import('pdfjs-dist/legacy/build/pdf.mjs');
let loading: Promise<PdfJs> | undefined;

/**
 * pdf.js, loaded once. Its parser runs in this thread: the worker module is imported here and
 * handed to pdf.js as `globalThis.pdfjsWorker`, which pdf.js uses in place of a worker script it
 * would otherwise load by URL. That keeps it working inside the bundled command line and the
 * browser page (no file to find, nothing fetched), and a CLI worker thread already gives the
 * parallelism a separate pdf.js worker would.
 */
export function loadPdfJs(): Promise<PdfJs> {
  loading ??= importPdfJs().then(({ worker, pdfjs }) => {
    (globalThis as { pdfjsWorker?: unknown }).pdfjsWorker = worker;
    return pdfjs;
  });
  return loading;
}

/** Counts `obj` keywords after a generation number: a cheap upper bound of the file's indirect objects. */
export function countObjects(bytes: Uint8Array, stopAt: number): number {
  let count = 0;
  // " obj" preceded by a digit: `12 0 obj`
  for (let i = bytes.indexOf(0x6f); i >= 0; i = bytes.indexOf(0x6f, i + 1)) {
    if (bytes[i + 1] === 0x62 && bytes[i + 2] === 0x6a && bytes[i - 1] === 0x20 && (bytes[i - 2] ?? 0) >= 0x30 && (bytes[i - 2] ?? 0) <= 0x39) {
      count += 1;
      if (count > stopAt) return count;
    }
  }
  return count;
}

/**
 * Reads the text of a PDF, page by page, into blocks in reading order. Refuses (PdfRefusal)
 * a damaged or encrypted file, one past the limits, and one with no text to read.
 */
export async function readPdfText(bytes: Uint8Array, limits: PdfLimits = DEFAULT_PDF_LIMITS): Promise<PdfText> {
  if (countObjects(bytes, PDF_MAX_OBJECTS) > PDF_MAX_OBJECTS) {
    throw new PdfRefusal(`the PDF holds more than ${PDF_MAX_OBJECTS.toLocaleString('en')} objects; it was not read`, 'too-large');
  }
  const pdfjs = await loadPdfJs();
  // pdf.js takes over the buffer it is given: hand it a copy so the caller's bytes stay usable
  const task = pdfjs.getDocument({
    data: new Uint8Array(bytes),
    isEvalSupported: false,
    disableFontFace: true,
    useSystemFonts: false,
    stopAtErrors: false,
    verbosity: 0,
    // the fonts' encodings and glyph names, for characters pdf.js cannot read (glyphs.ts)
    fontExtraProperties: true,
    // fonts are looked at through an operator list, which would otherwise decode every image
    maxImageSize: 1,
  });
  let doc: Awaited<typeof task.promise>;
  try {
    doc = await task.promise;
  } catch (e) {
    await task.destroy();
    throw refusalOf(e);
  }
  try {
    if (doc.numPages > limits.maxPages) {
      throw new PdfRefusal(`the PDF has ${doc.numPages} pages, more than the ${limits.maxPages} read at most; it was not read`, 'too-large');
    }
    const pages: PageRuns[] = [];
    const sizes: PdfText['sizes'] = [];
    let runs = 0;
    let printed = 0;
    // each font's repair (undefined: pdf.js reads it whole), by pdf.js's name for it, which is the same on every page
    const repairs = new Map<string, FontRepair | undefined>();
    const unreadable: PdfText['unreadable'] = [];
    for (let n = 1; n <= doc.numPages; n += 1) {
      const page = await doc.getPage(n);
      const view = page.view;
      const [x0, y0, x1, y1] = [view[0] ?? 0, view[1] ?? 0, view[2] ?? 0, view[3] ?? 0];
      const content = await page.getTextContent();
      // pdf.js hands a font's record (encoding, glyph names, Unicode map) to this side only with an
      // operator list: asked for on the pages where a font is first met, so once per font
      const fresh = new Set<string>();
      for (const item of content.items) if ('str' in item && item.fontName !== '' && !repairs.has(item.fontName)) fresh.add(item.fontName);
      if (fresh.size > 0) {
        try {
          await page.getOperatorList({ annotationMode: pdfjs.AnnotationMode.DISABLE });
        } catch {
          // a page pdf.js cannot draw: its text is read as pdf.js gives it
        }
        for (const name of fresh) repairs.set(name, page.commonObjs.has(name) ? repairOf(page.commonObjs.get(name) as FontRecord) : undefined);
      }
      const unreadFonts = new Set<string>();
      const out: TextRun[] = [];
      for (const item of content.items) {
        if (!('str' in item)) continue;
        runs += 1;
        if (runs > limits.maxRuns) {
          throw new PdfRefusal(`the PDF has more than ${limits.maxRuns.toLocaleString('en')} pieces of text; it was not read`, 'too-large');
        }
        const [a, b, c, d, e, f] = item.transform as number[];
        const size = Math.hypot(c ?? 0, d ?? 0);
        const upright = Math.abs(b ?? 0) < 1e-3 * Math.abs(a ?? 1) && Math.abs(c ?? 0) < 1e-3 * Math.abs(d ?? 1) && (a ?? 0) > 0 && (d ?? 0) > 0;
        if (item.str.trim().length > 0) printed += 1;
        let str = item.str;
        const repair = repairs.get(item.fontName);
        if (repair) {
          const read = repairText(str, repair);
          str = read.text;
          if (read.unreadable > 0) unreadFonts.add(repair.name);
        }
        out.push({ str, x: (e ?? 0) - x0, y: (f ?? 0) - y0, width: item.width, size, upright });
      }
      if (unreadFonts.size > 0) unreadable.push({ page: n, fonts: [...unreadFonts] });
      pages.push({ page: n, width: x1 - x0, height: y1 - y0, runs: out });
      sizes.push({ x0, y0, width: x1 - x0, height: y1 - y0 });
      page.cleanup();
    }
    if (printed === 0) {
      throw new PdfRefusal(
        `none of the PDF's ${doc.numPages === 1 ? 'page' : `${doc.numPages} pages`} carries text, only images (a scan?); make a text layer with OCR software first, then check that copy`,
        'no-text',
      );
    }
    const { blocks, lines } = layoutPages(pages);
    return { pages: doc.numPages, blocks, lines, sizes, unreadable };
  } finally {
    await doc.destroy();
  }
}

function refusalOf(e: unknown): Error {
  const name = e instanceof Error ? e.name : '';
  if (name === 'PasswordException') return new PdfRefusal('the PDF is encrypted with a password; it was not read (save an unprotected copy to check it)', 'encrypted');
  if (name === 'InvalidPDFException' || name === 'FormatError' || name === 'UnknownErrorException') {
    return new PdfRefusal(`the PDF is damaged and could not be read (${e instanceof Error ? e.message : String(e)})`, 'damaged');
  }
  return e instanceof Error ? e : new Error(String(e));
}
