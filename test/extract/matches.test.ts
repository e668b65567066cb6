import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { FirstMatches, matchesOf } from '../../src/extract/matches.js';
import { NOT_ONE_WAY } from '../../src/extract/statistics.js';

/**
 * matchesOf (src/extract/matches.ts) must give exactly what ECMAScript's String.prototype.matchAll
 * gives (the reference: Node 20's own implementation of ECMA-262 §22.1.3.14), match for match:
 * the text, the index, every group and named group, and the `d` flag's indices. Seeded.
 */
const RUNS = Number(process.env.PLUMBLINE_PROPERTY_RUNS ?? 1_000);
const SEED = Number(process.env.PLUMBLINE_PROPERTY_SEED ?? 20261204);

// patterns that may match empty, span surrogate pairs, look behind, stick, fold case or index groups
const PATTERNS: RegExp[] = [
  /\d+/g, /\d*/g, /(?<![\p{L}])(a+|b)(?![\p{L}])/giu, /(?:)/g, /(?:)/gu, /x?/gu, /./gu, /./g, /(?<w>\p{L}+)|(\d)/gdu, /a|(?=b)/gy, /\b/g,
  /(?<=\d) ?(%)?/gdu, /[\u{1F600}-\u{1F64F}]|é/giu, /^a|b$/gm, /t\((\d+)\) = (\d?\.\d+)/gd,
];
const piece = fc.constantFrom('a', 'b', 'A', 'é', 'É', '1', '23', ' ', '\n', '😀', '\ud83d', '\ude00', 'x', '%', 't(12) = 2.10', 'ß', 'ſ');

/** Everything a match carries, as plain data. */
const plain = (m: RegExpExecArray) => ({ all: [...m], index: m.index, groups: m.groups ? { ...m.groups } : undefined, indices: m.indices ? m.indices.map((p) => (p ? [...p] : p)) : undefined });

describe('the matches of a global regular expression, without a copy of it', () => {
  it('are the ones matchAll gives, for generated texts and patterns', () => {
    fc.assert(
      fc.property(fc.array(piece, { maxLength: 30 }), fc.integer({ min: 0, max: PATTERNS.length - 1 }), (parts, k) => {
        const text = parts.join('');
        const re = PATTERNS[k] as RegExp;
        expect([...matchesOf(re, text)].map(plain)).toEqual([...text.matchAll(re)].map(plain));
        expect(re.lastIndex).toBe(0);
      }),
      { numRuns: RUNS, seed: SEED },
    );
  });

  it('keeps nested and interleaved loops over one expression apart, and leaves lastIndex at 0 after a loop left early', () => {
    const re = /\d+/g;
    const text = 'a 1 b 22 c 333';
    const pairs: string[] = [];
    for (const m of matchesOf(re, text)) for (const n of matchesOf(re, text)) pairs.push(`${m[0]}-${n[0]}`);
    expect(pairs).toEqual(['1-1', '1-22', '1-333', '22-1', '22-22', '22-333', '333-1', '333-22', '333-333']);
    const a = matchesOf(re, text);
    const b = matchesOf(re, 'x 9 y 8');
    expect([a.next().value?.[0], b.next().value?.[0], a.next().value?.[0], b.next().value?.[0], a.next().value?.[0]]).toEqual(['1', '9', '22', '8', '333']);
    for (const m of matchesOf(re, text)) if (m[0] === '22') break;
    expect(re.lastIndex).toBe(0);
  });

  it('refuses an expression without the g flag, as matchAll does', () => {
    expect(() => [...'a1'.matchAll(/\d/ as RegExp)]).toThrow(TypeError);
    expect(() => [...matchesOf(/\d/, 'a1')]).toThrow(TypeError);
  });
});

/**
 * FirstMatches must give what `exec` on the slice itself gives (the reference: Node 20's
 * RegExp.prototype.exec), index counted in the whole text, for any slices, in any order, of one
 * text, with any region end given for a slice's start: here the analysis words an F reads (NOT_ONE_WAY, whose `\w{0,4}` and `points?` can be cut
 * short at a slice's end), case-folded alternatives, a pattern that may match empty, and one
 * whose later alternative only fits a shorter slice.
 */
describe('the first match inside slices of one text', () => {
  const WORDS: RegExp[] = [NOT_ONE_WAY, /covariat\w{0,4}|cov/iu, /a*/u, /(ab|a)(c?)/, /sessions|session|ses/i, /time points?/iu];
  const fragment = fc.constantFrom('repeated', 'covariate', 'covariates', 'adjusted', 'adjust', 'time point', 'time points', 'sessions', 'Welch', 'WITHIN-SUBJECTS', 'ab', 'abc', 'a', 'c', ' ', '; F(2, 12) = 9.1', 'x', 'é', '😀', 'ſessions');

  it('is the slice’s own first match, for generated texts and slices asked in any order', () => {
    fc.assert(
      fc.property(fc.array(fragment, { maxLength: 25 }), fc.integer({ min: 0, max: WORDS.length - 1 }), fc.array(fc.tuple(fc.nat(300), fc.nat(300), fc.nat(300)), { minLength: 1, maxLength: 12 }), (parts, k, cuts) => {
        const text = parts.join('');
        const re = WORDS[k] as RegExp;
        const first = new FirstMatches(re, text);
        for (const [a, b, c] of cuts) {
          const from = Math.min(a, text.length);
          const to = Math.min(Math.max(from, b), text.length);
          // the end no slice from `from` passes, as a sentence's end; some slices here pass it, and must still be right
          const limit = Math.min(Math.max(from, c), text.length);
          const got = first.within(from, to, limit);
          const want = re.exec(text.slice(from, to));
          expect(got === null ? null : { all: [...got], index: got.index }).toEqual(want === null ? null : { all: [...want], index: want.index + from });
        }
      }),
      { numRuns: RUNS, seed: SEED },
    );
  });

  it('refuses a pattern with an anchor, a word boundary, a look-around, or the g, y or d flag', () => {
    for (const re of [/^a/, /a$/, /\ba/, /(?=a)b/, /(?<!a)b/, /a/d, /a/g, /a/y]) {
      // every time it is given: a pattern refused once is not remembered as checked
      expect(() => new FirstMatches(re, 'ab')).toThrow(TypeError);
      expect(() => new FirstMatches(re, 'ba')).toThrow(TypeError);
    }
  });

  it('checks a pattern once, and each text of a pattern that matches the empty string is read slice by slice', () => {
    // the same pattern object over two texts: what it is found to be on the first holds for the second
    const empty = /a*/;
    for (const text of ['aab', 'baa']) {
      const first = new FirstMatches(empty, text);
      for (let from = 0; from <= text.length; from += 1)
        for (let to = from; to <= text.length; to += 1) {
          const want = empty.exec(text.slice(from, to));
          const got = first.within(from, to);
          expect([got?.[0], got?.index], `${text} [${from}, ${to})`).toEqual([want?.[0], want === null ? undefined : (want.index as number) + from]);
        }
    }
  });
});
