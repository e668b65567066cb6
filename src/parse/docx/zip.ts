import { unzipSync } from 'fflate';

/**
 * What a Word file may cost before it is refused. A .docx is a zip archive, and a small
 * archive can inflate to gigabytes (a zip bomb): only the XML parts plumbline reads are
 * inflated, each into a buffer of its declared size (fflate never writes past it), and those
 * sizes are checked first.
 */
export interface DocxLimits {
  /** The archive itself (compressed). */
  maxCompressedBytes: number;
  /** All the parts read, inflated. */
  maxUncompressedBytes: number;
  /** Inflated over compressed size of one part read, for parts past `ratioFloorBytes`. */
  maxRatio: number;
  ratioFloorBytes: number;
  /** Entries in the archive's central directory. */
  maxEntries: number;
  /** Nesting of XML elements in a part. */
  maxDepth: number;
}

/**
 * The defaults (README, "Word and PDF files"). A long manuscript's document.xml is some
 * 1–5 MB inflated, at ratios of 5–20 to 1 (deflate on XML markup; common practice, no source);
 * a zip bomb packs 1,000 to 1 and more. Word's own files nest some 20 elements deep.
 */
export const DOCX_LIMITS: DocxLimits = {
  maxCompressedBytes: 64 * 1024 * 1024,
  maxUncompressedBytes: 256 * 1024 * 1024,
  maxRatio: 200,
  ratioFloorBytes: 1024 * 1024,
  maxEntries: 10_000,
  maxDepth: 256,
};

export type Unzipped = { ok: true; parts: Map<string, Uint8Array> } | { ok: false; message: string };

/** The end of central directory record's signature (APPNOTE.TXT 4.3.16). */
const EOCD = 0x06054b50;
/** A central directory header's signature (APPNOTE.TXT 4.3.12). */
const CENTRAL = 0x02014b50;

const u16 = (b: Uint8Array, at: number) => (b[at] as number) | ((b[at + 1] as number) << 8);
const u32 = (b: Uint8Array, at: number) => (u16(b, at) | (u16(b, at + 2) << 16)) >>> 0;

/**
 * The parts `wanted` says yes to, inflated within `limits`; or why the archive is refused:
 * damaged (no central directory, a header out of place), encrypted entries (general purpose
 * bit 0, APPNOTE.TXT 4.4.4), too many entries, or a part past the size and ratio limits.
 */
export function unzipParts(bytes: Uint8Array, wanted: (name: string) => boolean, limits: DocxLimits): Unzipped {
  if (bytes.length > limits.maxCompressedBytes) return { ok: false, message: `${bytes.length} bytes is over the limit of ${limits.maxCompressedBytes} for a Word file` };
  // the end record sits in the last 22 + 65,535 bytes (its comment is at most 65,535 bytes)
  let eocd = -1;
  for (let at = bytes.length - 22; at >= 0 && at >= bytes.length - 22 - 65_535; at -= 1) {
    if (u32(bytes, at) === EOCD) {
      eocd = at;
      break;
    }
  }
  if (eocd < 0) return { ok: false, message: 'damaged: the zip archive has no central directory (the file is cut short or is not a zip archive)' };
  const entries = u16(bytes, eocd + 10);
  if (entries > limits.maxEntries) return { ok: false, message: `the archive lists ${entries} entries, over the limit of ${limits.maxEntries}` };
  let at = u32(bytes, eocd + 16);
  const names: string[] = [];
  for (let i = 0; i < entries; i += 1) {
    if (at + 46 > bytes.length || u32(bytes, at) !== CENTRAL) return { ok: false, message: 'damaged: the zip archive\'s central directory is broken' };
    const flags = u16(bytes, at + 8);
    const nameLength = u16(bytes, at + 28);
    const name = new TextDecoder().decode(bytes.subarray(at + 46, at + 46 + nameLength));
    if ((flags & 1) !== 0) return { ok: false, message: `encrypted: the archive's entry ${name} is encrypted; save the document without a password and check it again` };
    names.push(name);
    at += 46 + nameLength + u16(bytes, at + 30) + u16(bytes, at + 32);
  }
  let total = 0;
  let refused: string | undefined;
  let parts: Record<string, Uint8Array>;
  try {
    parts = unzipSync(bytes, {
      filter: (file) => {
        if (refused !== undefined || !wanted(file.name)) return false;
        total += file.originalSize;
        if (total > limits.maxUncompressedBytes) refused = `its parts inflate to more than the limit of ${limits.maxUncompressedBytes} bytes`;
        else if (file.originalSize > limits.ratioFloorBytes && file.originalSize > limits.maxRatio * Math.max(1, file.size))
          refused = `its part ${file.name} inflates ${Math.round(file.originalSize / Math.max(1, file.size))} times (${file.size} to ${file.originalSize} bytes), over the limit of ${limits.maxRatio} times: a zip bomb or a damaged file`;
        return refused === undefined;
      },
    });
  } catch (e) {
    return { ok: false, message: `damaged: the zip archive could not be read (${e instanceof Error ? e.message : String(e)})` };
  }
  if (refused !== undefined) return { ok: false, message: `refused: ${refused}` };
  return { ok: true, parts: new Map(Object.entries(parts)) };
}
