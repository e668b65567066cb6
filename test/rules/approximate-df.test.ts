import { describe, expect, it } from 'vitest';
import { findingsOf, levelsOf } from './table.js';

// A mixed model's Satterthwaite or Kenward–Roger df is a real number, often printed whole (common
// practice, no source). Values from scipy.stats.t.sf (Debian python3-scipy 1.17.1), two-tailed, t
// from 2.565 to 2.575: df 5 gives .0497 to .0503; df 4.5 to 6 (a whole df rounded or cut) gives
// .0421 to .0556. A printed p = .055 (.0545 to .0555) is then a whole df read exact that misses,
// read as rounded or cut that fits.
// The manuscripts are invented.
const result = 'Fatigue fell over the weeks, t(5) = 2.57, p = .055.';

describe('a whole df where the text says dfs were approximated', () => {
  it('is a note that says the df may be an approximated one printed whole, with what that gives, and points at the words', () => {
    const [f, ...rest] = findingsOf(`Degrees of freedom were estimated with the Satterthwaite approximation.\n\n${result}`, 'p-follows-from-t');
    expect(rest).toEqual([]);
    expect(f?.level).toBe('note');
    expect(f?.message).toMatch(/^Not checked with certainty \(the text says dfs were approximated, “Satterthwaite”: if its df of 5 is such a df printed whole \(rounded or cut: 4\.5 to 6\), the two-tailed p would be 0\.0421 to 0\.0556, which holds the reported p\)\. Reported p = \.055\./);
    expect(f?.related).toEqual([expect.objectContaining({ message: 'approximated dfs named here', start: { line: 1, column: 44 } })]);
  });
  it("reads Kenward and Roger's dfs, and words in the result's own sentence", () => {
    expect(levelsOf(`Linear mixed models with Kenward–Roger degrees of freedom were fitted to every outcome.\n\n${result}`, 'p-follows-from-t')).toEqual(['note']);
    expect(levelsOf("Fatigue fell over the weeks in the mixed model (Satterthwaite's df), t(5) = 2.57, p = .055.", 'p-follows-from-t')).toEqual(['note']);
  });
  it('stays a warning without such words, where they are denied, or where they sit in the sentence of another result', () => {
    expect(levelsOf(result, 'p-follows-from-t')).toEqual(['warning']);
    expect(levelsOf(`We did not use the Kenward–Roger correction.\n\n${result}`, 'p-follows-from-t')).toEqual(['warning']);
    expect(levelsOf(`Sleep rose in the model with Satterthwaite dfs, t(30.2) = 2.10, p = .044.\n\n${result}`, 'p-follows-from-t')).toEqual(['warning']);
  });
  it('stays a warning without method words (a cited author), or where a df is said counted rather than approximated', () => {
    expect(levelsOf(`Satterthwaite, F. E. (1946). An approximate distribution of estimates of variance components.\n\n${result}`, 'p-follows-from-t')).toEqual(['warning']);
    expect(levelsOf(`The df were counted as n − 1 rather than estimated with the Satterthwaite approximation.\n\n${result}`, 'p-follows-from-t')).toEqual(['warning']);
  });
  it("reads Welch–Satterthwaite with any dash or a slash as Welch's test named elsewhere, not as a mixed model's df", () => {
    for (const dash of ['–', '—', '\u2011', '/']) {
      const [f] = findingsOf(`Degrees of freedom were adjusted with the Welch${dash}Satterthwaite approximation.\n\n${result}`, 'p-follows-from-t');
      expect(f?.level).toBe('note');
      expect(f?.message).toContain("Welch's test is named elsewhere in the text");
    }
  });
  it('stays a warning where the df is the count its own group size gives (n − 1)', () => {
    // one group of n = 6: df 5 is n − 1, a count, whatever the text says of mixed models
    expect(levelsOf('Degrees of freedom were estimated with the Satterthwaite approximation.\n\nFatigue was above the norm (M = 55.1, SD = 4.9, n = 6), t(5) = 2.57, p = .055.', 'p-follows-from-t')).toEqual(['warning']);
  });
  it('stays a warning where no df the whole one can stand for gives the p, or where its own words name a t-test', () => {
    expect(levelsOf('Degrees of freedom were estimated with the Satterthwaite approximation.\n\nFatigue fell over the weeks, t(5) = 2.57, p = .070.', 'p-follows-from-t')).toEqual(['warning']);
    expect(levelsOf('Degrees of freedom were estimated with the Satterthwaite approximation.\n\nA paired t-test showed that fatigue fell, t(5) = 2.57, p = .055.', 'p-follows-from-t')).toEqual(['warning']);
  });
});
