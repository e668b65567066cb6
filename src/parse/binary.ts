import type { ParsedDocument, Span } from './types.js';

/** The binary document kinds read by a front end of their own. */
export type BinaryKind = 'docx' | 'pdf';

/** A binary document read into segments, or refused with one clear message (the file is then not checked). */
export type BinaryOutcome = { ok: true; document: ParsedDocument } | { ok: false; message: string };

const startsWith = (bytes: Uint8Array, magic: readonly number[]) => magic.every((b, i) => bytes[i] === b);
/** A zip archive's local file header, `PK\3\4` (APPNOTE.TXT 4.3.7), how every .docx starts. */
export const ZIP_MAGIC = [0x50, 0x4b, 0x03, 0x04] as const;
/** `%PDF-` (ISO 32000-1, 7.5.2). */
export const PDF_MAGIC = [0x25, 0x50, 0x44, 0x46, 0x2d] as const;
/** An OLE compound file (MS-CFB 2.2): old .doc files, and Office files encrypted with a password (MS-OFFCRYPTO 2.3.4). */
export const CFB_MAGIC = [0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1] as const;

/**
 * Which binary front end reads a file: by its extension (`.docx`, `.pdf`), else by its first
 * bytes (a zip archive is tried as Word, `%PDF-` as PDF). An OLE compound file named `.docx` is
 * Word's encrypted form and goes to the Word reader, which says so. Undefined: read as text.
 */
export function binaryKindOf(path: string, bytes: Uint8Array): BinaryKind | undefined {
  const lower = path.toLowerCase();
  if (lower.endsWith('.docx')) return 'docx';
  if (lower.endsWith('.pdf')) return 'pdf';
  if (startsWith(bytes, ZIP_MAGIC)) return 'docx';
  if (startsWith(bytes, PDF_MAGIC)) return 'pdf';
  return undefined;
}

/** Whether bytes start like an OLE compound file. */
export function isCompoundFile(bytes: Uint8Array): boolean {
  return startsWith(bytes, CFB_MAGIC);
}

/**
 * Read a binary document with its front end, loaded only when such a file is met (the
 * command's start-up and the text readers do not carry it).
 */
export async function readBinaryDocument(path: string, bytes: Uint8Array, kind: BinaryKind): Promise<BinaryOutcome> {
  if (kind === 'docx') {
    const { readDocxDocument } = await import('./docx/index.js');
    return readDocxDocument(path, bytes);
  }
  const { readPdf } = await import('./pdf/index.js');
  return readPdf(path, bytes);
}

/** A comment for annotateWordDocument: the span of the extracted text it is about, and its paragraphs. */
export interface WordComment {
  span: Span;
  paragraphs: string[];
}

/**
 * A copy of a Word file with each comment on the characters its span covers (see
 * src/parse/docx/annotate.ts), loaded only when asked for.
 */
export async function annotateWordDocument(bytes: Uint8Array, comments: readonly WordComment[]): Promise<{ ok: true; bytes: Uint8Array; added: number; notPlaced: number } | { ok: false; message: string }> {
  const { annotateDocx } = await import('./docx/annotate.js');
  return annotateDocx(bytes, comments);
}
