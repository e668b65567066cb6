import { describe, expect, it } from 'vitest';
import { findingsOf, levelsOf } from './table.js';

// A p from a permutation, randomization or bootstrap procedure is an estimate from resampled
// data, not the tail of the t (or F, χ², r, z) distribution, so it need not follow from the
// printed statistic (common practice, no source). t(28) = 2.10 gives two-tailed .0444 to .0454
// and F(1, 38) = 4.21 gives .0470 to .0472 (scipy.stats.t.sf, f.sf; Debian python3-scipy).
// The manuscripts are invented.
const found = findingsOf;
const levels = levelsOf;

describe('a p the text says came from resampling is a note where it does not follow', () => {
  it('words about every p value, in a sentence that reports none', () => {
    const [f, ...rest] = found('The p values were obtained from 10,000 permutations of the group labels.\n\nThe groups differed, t(28) = 2.10, p = .037.', 'p-follows-from-t');
    expect(rest).toEqual([]);
    expect(f?.level).toBe('note');
    expect(f?.message).toMatch(/^Not checked with certainty \(the text says its p came from resampling, “p values were obtained from 10,000 permutations”: such a p need not follow from t and df\)\. Reported p = \.037/);
    expect(f?.related?.map((r) => r.message)).toEqual(['resampling named here']);
    for (const words of ['Permutation-based p values are reported throughout.', 'P-values were computed using permutation tests.', 'Bootstrapped p-values are given.', 'p values were estimated by Monte Carlo simulation.']) {
      expect(levels(`${words}\n\nThe groups differed, t(28) = 2.10, p = .037.`, 'p-follows-from-t')).toEqual(['note']);
    }
  });
  it('a permutation test named in the result\'s own sentence', () => {
    expect(levels('A permutation test showed that the groups differed, t(28) = 2.10, p = .037.', 'p-follows-from-t')).toEqual(['note']);
    expect(levels('A randomization test gave F(1, 38) = 4.21, p = .06.', 'significance-follows-from-statistic')).toEqual(['note']);
  });
  it('stays a warning or error where the words are elsewhere and about another analysis, or absent', () => {
    expect(levels('The groups differed, t(28) = 2.10, p = .037.', 'p-follows-from-t')).toEqual(['warning']);
    // a permutation test named for another analysis, in a sentence of its own
    expect(levels('Cluster-based permutation tests were run on the EEG data.\n\nThe groups differed, t(28) = 2.10, p = .037.', 'p-follows-from-t')).toEqual(['warning']);
    // bootstrapped intervals are not p values
    expect(levels('Confidence intervals were bootstrapped with 5,000 resamples.\n\nThe groups differed, t(28) = 2.10, p = .037.', 'p-follows-from-t')).toEqual(['warning']);
    // words in another result's sentence are that result's
    expect(levels('A permutation test gave t(28) = 3.10, p = .004.\n\nThe groups differed, t(28) = 2.10, p = .037.', 'p-follows-from-t')).toEqual(['warning']);
  });
  it('leaves a p that follows alone', () => {
    expect(found('The p values were obtained from 10,000 permutations.\n\nThe groups differed, t(28) = 2.10, p = .045.', 'p-follows-from-t')).toEqual([]);
  });
});

describe('resampling words, second review (invented cases)', () => {
  const t = 'The groups differed, t(28) = 2.10, p = .037.';
  it('reads more ways of saying it', () => {
    expect(levels(`Significance was assessed with permutation tests.\n\n${t}`, 'p-follows-from-t')).toEqual(['note']);
    expect(levels(`The p values were computed from 10000 random permutations.\n\n${t}`, 'p-follows-from-t')).toEqual(['note']);
    // shuffled labels, a p that "comes from" a randomisation test, an adverb before "by"
    for (const words of ['P values were obtained by randomly reshuffling the group labels 20,000 times.', 'P values come from a randomisation test with 20,000 random assignments.', 'Significance was assessed non-parametrically, by shuffling condition labels 10,000 times.']) {
      expect(levels(`${words}\n\n${t}`, 'p-follows-from-t')).toEqual(['note']);
    }
    // thousands grouped with a space, a no-break space or a thin space, as many journals print them
    for (const count of ['10 000', '10\u00A0000', '10\u2009000', '1 000 000']) {
      expect(levels(`P values were obtained from ${count} permutations.\n\n${t}`, 'p-follows-from-t')).toEqual(['note']);
    }
    expect(levels('The groups differed, t(28) = 2.10, permutation p = .037.', 'p-follows-from-t')).toEqual(['note']);
  });
  it('takes resampling denied at its words as none', () => {
    expect(levels(`Permutation-based p values were not computed.\n\n${t}`, 'p-follows-from-t')).toEqual(['warning']);
  });
});

describe('resampling named after a result\'s p is another p\'s (third review, invented)', () => {
  it('leaves the parametric result certain', () => {
    // t(30) = 2.50 gives two-tailed .0179 to .0183
    expect(levels('The parametric t-test gave t(30) = 2.50, p = .072, whereas the permutation test gave p = .02.', 'significance-follows-from-t')).toEqual(['error']);
    expect(levels('The groups differed, t(28) = 2.10, p = .037, and a permutation test confirmed this (p = .041).', 'p-follows-from-t')).toEqual(['warning']);
  });
});
