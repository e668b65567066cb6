/**
 * Bytes of a file into the text plumbline reads, or the reason it cannot be read as text.
 * UTF-8 (with or without a byte-order mark) and UTF-16 with a byte-order mark are decoded;
 * a NUL byte in a file without a UTF-16 mark means a binary file, which is skipped.
 * Invalid UTF-8 sequences become U+FFFD and the document carries a note saying where.
 */
import type { ReadNote } from './types.js';

export type Decoded =
  | { ok: true; text: string; encoding: 'utf-8' | 'utf-16le' | 'utf-16be'; notes: ReadNote[] }
  | { ok: false; reason: string };

const strictUtf8 = new TextDecoder('utf-8', { fatal: true, ignoreBOM: true });
const looseUtf8 = new TextDecoder('utf-8', { fatal: false, ignoreBOM: true });

export function decodeBytes(bytes: Uint8Array): Decoded {
  if (bytes.length >= 2 && bytes[0] === 0xff && bytes[1] === 0xfe) return utf16(bytes, 'utf-16le');
  if (bytes.length >= 2 && bytes[0] === 0xfe && bytes[1] === 0xff) return utf16(bytes, 'utf-16be');
  const nul = bytes.indexOf(0);
  if (nul >= 0) return { ok: false, reason: `binary file (NUL byte at byte ${nul})` };
  try {
    return { ok: true, text: strictUtf8.decode(bytes), encoding: 'utf-8', notes: [] };
  } catch {
    const text = looseUtf8.decode(bytes);
    return { ok: true, text, encoding: 'utf-8', notes: [replacementNote(text, 'not valid UTF-8')] };
  }
}

function utf16(bytes: Uint8Array, encoding: 'utf-16le' | 'utf-16be'): Decoded {
  // the decoder keeps the BOM as U+FEFF, which the parsers already step over
  try {
    return { ok: true, text: new TextDecoder(encoding, { fatal: true, ignoreBOM: true }).decode(bytes), encoding, notes: [] };
  } catch {
    const text = new TextDecoder(encoding, { fatal: false, ignoreBOM: true }).decode(bytes);
    return { ok: true, text, encoding, notes: [replacementNote(text, `not valid ${encoding.toUpperCase()}`)] };
  }
}

function replacementNote(text: string, what: string): ReadNote {
  const first = text.indexOf('\ufffd');
  let count = 0;
  for (let i = first; i >= 0; i = text.indexOf('\ufffd', i + 1)) count += 1;
  return {
    kind: 'replaced-bytes',
    message: `the file is ${what}: ${count} undecodable sequence${count === 1 ? '' : 's'} replaced with U+FFFD, the first here`,
    span: { start: first, end: first + 1 },
  };
}
