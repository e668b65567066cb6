import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { hash64 } from '../../src/engine/fingerprint.js';

/** FNV-1a, 64 bits, over UTF-16 code units, written with BigInt as the algorithm states it. */
function byBigInt(s: string): string {
  let h = 0xcbf29ce484222325n;
  for (let i = 0; i < s.length; i++) {
    h ^= BigInt(s.charCodeAt(i));
    h = (h * 0x100000001b3n) & 0xffffffffffffffffn;
  }
  return h.toString(16).padStart(16, '0');
}

describe('hash64: 64-bit FNV-1a of fingerprints', () => {
  it('gives the published FNV-1a 64-bit test vectors', () => {
    // FNV-1a 64-bit test vectors from the FNV reference page (Landon Curt Noll,
    // http://www.isthe.com/chongo/tech/comp/fnv/); quoted from memory, confirmed with an
    // independent Python big-integer FNV-1a. ASCII: a code unit per byte, as there.
    expect(hash64('')).toBe('cbf29ce484222325');
    expect(hash64('a')).toBe('af63dc4c8601ec8c');
    expect(hash64('foobar')).toBe('85944171f73967e8');
  });

  it('equals the BigInt form on any text (every code unit, surrogates and NUL included)', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary', maxLength: 200 }), (s) => {
        expect(hash64(s)).toBe(byBigInt(s));
      }),
      { numRuns: 2_000, seed: 17 },
    );
    const edge = ['\u0000', '\uffff'.repeat(1000), 'p-follows-from-t\u0000t(23) = 2.47, p = .021', '\ud800x\udc00'];
    for (const s of edge) expect(hash64(s)).toBe(byBigInt(s));
  });
});
