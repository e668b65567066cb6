/**
 * 64-bit FNV-1a of a string's UTF-16 code units, as 16 hex digits (no Node API: the browser page
 * runs this too). The 64-bit state is two unsigned 32-bit halves: the prime is 2^40 + 0x1b3, so
 * h × prime = (h << 40) + h × 0x1b3 (mod 2^64), every partial product exact in a double. (A
 * BigInt per code unit made fingerprints a tenth of the check of a document of many findings.)
 * test/engine/fingerprint.test.ts holds FNV-1a's published test vectors and the BigInt form.
 */
export function hash64(s: string): string {
  let hi = 0xcbf29ce4;
  let lo = 0x84222325;
  for (let i = 0; i < s.length; i++) {
    lo = (lo ^ s.charCodeAt(i)) >>> 0;
    const low = lo * 0x1b3;
    const high = hi * 0x1b3 + Math.floor(low / 0x100000000) + ((lo << 8) >>> 0);
    lo = low >>> 0;
    hi = high >>> 0;
  }
  return hi.toString(16).padStart(8, '0') + lo.toString(16).padStart(8, '0');
}
