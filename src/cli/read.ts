import { readRegularFile } from '../config/index.js';
import { decodeBytes } from '../engine/index.js';
import type { ReadNote } from '../engine/index.js';
import { DEFAULT_MAX_FILE_BYTES } from './defaults.js';
import { describeError } from './files.js';

export { DEFAULT_MAX_FILE_BYTES } from './defaults.js';

export type ReadOutcome = { ok: true; text: string; notes: ReadNote[] } | { ok: false; message: string };

/**
 * Read a manuscript from disk: refuse what is not a regular file or is over the size limit
 * before reading it, then decode (UTF-8, UTF-16 with BOM; binary files refused).
 */
export function readManuscript(path: string, maxBytes = DEFAULT_MAX_FILE_BYTES): ReadOutcome {
  const r = readRegularFile(path, maxBytes);
  if (r.ok) return decoded(r.bytes);
  if (r.problem === 'folder') return { ok: false, message: 'cannot read: is a folder' };
  if (r.problem === 'not-regular') return { ok: false, message: 'skipped: not a regular file' };
  if (r.problem === 'too-large') return overLimit(r.size, maxBytes);
  return { ok: false, message: `cannot read: ${describeError(r.error)}` };
}

/** Bytes already in memory (standard input) through the same decoding and limit. */
export function decodeManuscript(bytes: Uint8Array, maxBytes = DEFAULT_MAX_FILE_BYTES): ReadOutcome {
  if (bytes.length > maxBytes) return overLimit(bytes.length, maxBytes);
  return decoded(bytes);
}

function decoded(bytes: Uint8Array): ReadOutcome {
  const d = decodeBytes(bytes);
  return d.ok ? { ok: true, text: d.text, notes: d.notes } : { ok: false, message: `skipped: ${d.reason}` };
}

function overLimit(size: number, maxBytes: number): ReadOutcome {
  return { ok: false, message: `skipped: ${size} bytes is over the limit of ${maxBytes} (maxFileBytes in the configuration, or --max-file-bytes)` };
}
