import { describe, expect, it } from 'vitest';
import { findingsOf, levelsOf } from './table.js';

// A mixed model's Satterthwaite or Kenward–Roger df is a real number, often printed whole (common
// practice, no source). Values from scipy.stats.t.sf (Debian python3-scipy 1.17.1), two-tailed, t
// from 2.565 to 2.575: df 5 gives .0497 to .0503; df 4.5 to 5.5 gives .0455 to .0556. A printed
// p = .055 (.0545 to .0555) is then a whole df read exact that misses, read rounded that fits.
// The manuscripts are invented.
const result = 'Fatigue fell over the weeks, t(5) = 2.57, p = .055.';

describe('a whole df where the text says dfs were approximated', () => {
  it('is a note that says the df may be an approximated one printed whole, with what that gives, and points at the words', () => {
    const [f, ...rest] = findingsOf(`Degrees of freedom were estimated with the Satterthwaite approximation.\n\n${result}`, 'p-follows-from-t');
    expect(rest).toEqual([]);
    expect(f?.level).toBe('note');
    expect(f?.message).toMatch(/^Not checked with certainty \(the text says dfs were approximated, “Satterthwaite”: if its df of 5 is such a df printed whole \(4\.5 to 5\.5\), the two-tailed p would be 0\.0455 to 0\.0556, which holds the reported p\)\. Reported p = \.055\./);
    expect(f?.related).toEqual([expect.objectContaining({ message: 'approximated dfs named here', start: { line: 1, column: 44 } })]);
  });
  it("reads Kenward and Roger's dfs, and words in the result's own sentence", () => {
    expect(levelsOf(`Linear mixed models with Kenward–Roger degrees of freedom were fitted to every outcome.\n\n${result}`, 'p-follows-from-t')).toEqual(['note']);
    expect(levelsOf("Fatigue fell over the weeks in the mixed model (Satterthwaite's df), t(5) = 2.57, p = .055.", 'p-follows-from-t')).toEqual(['note']);
  });
  it('stays a warning without such words, where they are denied, or where they sit in the sentence of another result', () => {
    expect(levelsOf(result, 'p-follows-from-t')).toEqual(['warning']);
    expect(levelsOf(`We did not use the Kenward–Roger correction.\n\n${result}`, 'p-follows-from-t')).toEqual(['warning']);
    expect(levelsOf(`Sleep rose in the model with Satterthwaite dfs, t(30.2) = 2.10, p = .044.\n\n${result}`, 'p-follows-from-t').slice(-1)).toEqual(['warning']);
  });
  it('stays a warning where no df the whole one can stand for gives the p, or where its own words name a t-test', () => {
    expect(levelsOf('Degrees of freedom were estimated with the Satterthwaite approximation.\n\nFatigue fell over the weeks, t(5) = 2.57, p = .070.', 'p-follows-from-t')).toEqual(['warning']);
    expect(levelsOf('Degrees of freedom were estimated with the Satterthwaite approximation.\n\nA paired t-test showed that fatigue fell, t(5) = 2.57, p = .055.', 'p-follows-from-t')).toEqual(['warning']);
  });
});
