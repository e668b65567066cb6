/**
 * Bytes of a file into the text plumbline reads, or the reason it cannot be read as text.
 * UTF-8 (with or without a byte-order mark), UTF-16 and UTF-32 with a byte-order mark are
 * decoded; a NUL byte in a file without such a mark means a binary file, which is skipped.
 * UTF-32 LE begins FF FE 00 00, which starts like UTF-16 LE's mark, so it is tested first. A
 * file that begins with a UTF-16 mark but holds no NUL byte after it and is valid UTF-8 there
 * is UTF-8 with two stray bytes (UTF-16 text has a NUL in every space and line break): it is
 * read as UTF-8, with a note.
 * Invalid UTF-8 sequences become U+FFFD and the document carries a note saying where.
 */
import type { ReadNote } from './types.js';

export type Decoded =
  | { ok: true; text: string; encoding: 'utf-8' | 'utf-16le' | 'utf-16be' | 'utf-32le' | 'utf-32be'; notes: ReadNote[] }
  | { ok: false; reason: string };

const strictUtf8 = new TextDecoder('utf-8', { fatal: true, ignoreBOM: true });
const looseUtf8 = new TextDecoder('utf-8', { fatal: false, ignoreBOM: true });

export function decodeBytes(bytes: Uint8Array): Decoded {
  if (bytes.length >= 4 && bytes[0] === 0xff && bytes[1] === 0xfe && bytes[2] === 0 && bytes[3] === 0) return utf32(bytes, true);
  if (bytes.length >= 4 && bytes[0] === 0 && bytes[1] === 0 && bytes[2] === 0xfe && bytes[3] === 0xff) return utf32(bytes, false);
  const utf16Mark = bytes.length >= 2 && ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff));
  if (utf16Mark && bytes.indexOf(0, 2) < 0 && bytes.length > 2) {
    try {
      const text = strictUtf8.decode(bytes.subarray(2));
      // the two bytes stay as two U+FFFD so that offsets keep counting from the file's start
      return { ok: true, text: `\ufffd\ufffd${text}`, encoding: 'utf-8', notes: [strayMarkNote(bytes[0] as number, bytes[1] as number)] };
    } catch {
      // not UTF-8 either: UTF-16 as its mark says
    }
  }
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

/** UTF-32 with its byte-order mark (kept as U+FEFF, as for UTF-16); no platform decoder reads it. */
function utf32(bytes: Uint8Array, littleEndian: boolean): Decoded {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const whole = bytes.length - (bytes.length % 4);
  const parts: string[] = [];
  let chunk: number[] = [];
  let bad = 0;
  let firstBad = -1;
  for (let i = 0; i < whole; i += 4) {
    let cp = view.getUint32(i, littleEndian);
    if (cp > 0x10ffff || (cp >= 0xd800 && cp <= 0xdfff)) {
      if (firstBad < 0) firstBad = i;
      bad += 1;
      cp = 0xfffd;
    }
    chunk.push(cp);
    if (chunk.length === 4096) {
      parts.push(String.fromCodePoint(...chunk));
      chunk = [];
    }
  }
  if (whole < bytes.length) {
    if (firstBad < 0) firstBad = whole;
    bad += 1;
    chunk.push(0xfffd);
  }
  parts.push(String.fromCodePoint(...chunk));
  const text = parts.join('');
  const encoding = littleEndian ? 'utf-32le' : 'utf-32be';
  return { ok: true, text, encoding, notes: bad > 0 ? [replacementNote(text, `not valid ${encoding.toUpperCase()}`)] : [] };
}

function strayMarkNote(first: number, second: number): ReadNote {
  const hex = (b: number) => b.toString(16).toUpperCase().padStart(2, '0');
  return {
    kind: 'encoding-guessed',
    message: `the file begins with the bytes ${hex(first)} ${hex(second)} (a UTF-16 byte-order mark), but the rest is UTF-8 without a NUL byte, which UTF-16 text always has; it was read as UTF-8 and the two bytes as U+FFFD`,
    span: { start: 0, end: 2 },
  };
}
