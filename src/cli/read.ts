import { readRegularFile } from '../config/index.js';
import { binaryKindOf, decodeBytes, readBinaryDocument } from '../engine/index.js';
import type { ParsedDocument, ReadNote } from '../engine/index.js';
import { DEFAULT_MAX_FILE_BYTES } from './defaults.js';
import { describeError } from './files.js';

export { DEFAULT_MAX_FILE_BYTES } from './defaults.js';

/**
 * A manuscript read: its text and decoding notes, and for a Word or PDF file the document its
 * front end read (whose `source` is `text`); or why it was not read.
 */
export type ReadOutcome = { ok: true; text: string; notes: ReadNote[]; document?: ParsedDocument } | { ok: false; message: string };

/**
 * Read a manuscript from disk: refuse what is not a regular file or is over the size limit
 * before reading it, then decode (UTF-8, UTF-16 with BOM; binary files refused), or read a Word
 * or PDF file (by extension or first bytes) with its front end.
 */
export function readManuscript(path: string, maxBytes = DEFAULT_MAX_FILE_BYTES): ReadOutcome | Promise<ReadOutcome> {
  const r = readRegularFile(path, maxBytes);
  if (r.ok) return decoded(path, r.bytes);
  if (r.problem === 'folder') return { ok: false, message: 'cannot read: is a folder' };
  if (r.problem === 'not-regular') return { ok: false, message: 'skipped: not a regular file' };
  if (r.problem === 'too-large') return overLimit(r.size, maxBytes);
  return { ok: false, message: `cannot read: ${describeError(r.error)}` };
}

/** Bytes already in memory (standard input, named `path`) through the same decoding and limit. */
export function decodeManuscript(bytes: Uint8Array, maxBytes = DEFAULT_MAX_FILE_BYTES, path = ''): ReadOutcome | Promise<ReadOutcome> {
  if (bytes.length > maxBytes) return overLimit(bytes.length, maxBytes);
  return decoded(path, bytes);
}

function decoded(path: string, bytes: Uint8Array): ReadOutcome | Promise<ReadOutcome> {
  const kind = binaryKindOf(path, bytes);
  if (kind) {
    return readBinaryDocument(path, bytes, kind).then(
      (o): ReadOutcome => (o.ok ? { ok: true, text: o.document.source, notes: [], document: o.document } : { ok: false, message: o.message }),
      (e: unknown): ReadOutcome => ({ ok: false, message: `cannot read: ${e instanceof Error ? e.message : String(e)}` }),
    );
  }
  const d = decodeBytes(bytes);
  return d.ok ? { ok: true, text: d.text, notes: d.notes } : { ok: false, message: `skipped: ${d.reason}` };
}

function overLimit(size: number, maxBytes: number): ReadOutcome {
  return { ok: false, message: `skipped: ${size} bytes is over the limit of ${maxBytes} (maxFileBytes in the configuration, or --max-file-bytes)` };
}
