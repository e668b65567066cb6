import { describe, expect, it } from 'vitest';
import { findingsOf, levelsOf } from './table.js';

// A p corrected for multiple comparisons is never smaller than the p its statistic gives
// (Bonferroni, Holm, Šidák, Hochberg, Benjamini–Hochberg all multiply or step up; common practice,
// no source). Values (scipy.stats.t.sf and f.sf, Debian python3-scipy): t(28) = 2.10 gives
// two-tailed .0444 to .0453 (2.095 to 2.105); F(1, 38) = 4.21 gives .0470 to .0472.
// The manuscripts are invented.
const levels = levelsOf;

describe('a p larger than its statistic gives, where the text says p values were corrected and labels none as adjusted', () => {
  const general = 'All p values were Bonferroni-corrected for the three comparisons.';
  it('is a note, saying which correction the text names and pointing at it', () => {
    const [f, ...rest] = findingsOf(`${general}\n\nThe groups differed, t(28) = 2.10, p = .135.`, 'significance-follows-from-t');
    expect(rest).toEqual([]);
    expect(f?.level).toBe('note');
    // Bonferroni for three comparisons: 3 × (.0444 to .0453)
    expect(f?.message).toMatch(/^Not checked with certainty \(the text names a correction for multiple comparisons, “Bonferroni”, and labels no p as adjusted: this p, larger than t and df give, may be an adjusted one \(the correction for 3 comparisons could give 0\.1332 to 0\.136\)\)\. Reported p = \.135/);
    expect(f?.related).toEqual([expect.objectContaining({ message: 'the correction named here', start: { line: 1, column: 19 } })]);
  });
  it('is an error without such words', () => {
    expect(levels('The groups differed, t(28) = 2.10, p = .135.', 'significance-follows-from-t')).toEqual(['error']);
  });
  it('reads a correction named in the result\'s own sentence', () => {
    expect(levels('After Bonferroni correction the groups differed, t(28) = 2.10, p = .135.', 'significance-follows-from-t')).toEqual(['note']);
  });
  it('stays a warning where the p is smaller than t and df give: no correction makes a p smaller', () => {
    expect(levels(`${general}\n\nThe groups differed, t(28) = 2.10, p = .015.`, 'p-follows-from-t')).toEqual(['warning']);
  });
  it('stays an error where the text labels its adjusted p values: an unlabelled one is not adjusted', () => {
    const markdown = `${general}\n\nThe groups differed, t(28) = 2.10, p = .135. The second outcome did not, t(28) = 1.10, p = .28, Bonferroni-adjusted p = .84.`;
    expect(levels(markdown, 'significance-follows-from-t')).toEqual(['error']);
  });
  it("stays an error where the words are not said of every p, or name Tukey's HSD (an ANOVA's own procedure)", () => {
    expect(levels('We used the Bonferroni method.\n\nThe groups differed, t(28) = 2.10, p = .135.', 'significance-follows-from-t')).toEqual(['error']);
    expect(levels("All pairs of the ANOVA were compared with Tukey's HSD tests.\n\nThe groups differed, t(28) = 2.10, p = .135.", 'significance-follows-from-t')).toEqual(['error']);
    // said in a sentence that reports another result, the words are that result's
    expect(levels('The first outcome differed after Bonferroni correction of all p values, t(28) = 3.10, p = .013.\n\nThe groups differed, t(28) = 2.10, p = .135.', 'significance-follows-from-t')).toEqual(['error']);
  });
  it('stays an error where the words speak of other comparisons, deny a correction, or where the correction could not give the p', () => {
    expect(levels('Bonferroni correction was applied to the post hoc comparisons that followed the ANOVA.\n\nThe groups differed, t(28) = 2.10, p = .135.', 'significance-follows-from-t')).toEqual(['error']);
    expect(levels('We did not correct the p values for multiple comparisons (for example, with Bonferroni).\n\nThe groups differed, t(28) = 2.10, p = .135.', 'significance-follows-from-t')).toEqual(['error']);
    expect(levels('The groups differed, t(28) = 2.10, p = .135, which would not survive a Bonferroni correction.', 'significance-follows-from-t')).toEqual(['error']);
    expect(levels('No correction for multiple comparisons was applied, although Bonferroni would have been possible.\n\nThe groups differed, t(28) = 2.10, p = .135.', 'significance-follows-from-t')).toEqual(['error']);
    expect(levels('All p values are uncorrected; a Bonferroni threshold is given for reference.\n\nThe groups differed, t(28) = 2.10, p = .135.', 'significance-follows-from-t')).toEqual(['error']);
    // three comparisons allow at most 3 × .0453 = .136, and at least 3 × .0444 = .133
    expect(levels(`${general}\n\nThe groups differed, t(28) = 2.10, p = .90.`, 'significance-follows-from-t')).toEqual(['error']);
    expect(levels(`${general}\n\nThe groups differed, t(28) = 2.10, p = .047.`, 'p-follows-from-t')).toEqual(['warning']);
    // Holm for three comparisons: anything from the p to 3 × p
    expect(levels('All p values were Holm-adjusted for three comparisons.\n\nThe groups differed, t(28) = 2.10, p = .09.', 'significance-follows-from-t')).toEqual(['note']);
  });
  it('reads a negation elsewhere in the sentence as no denial of the correction', () => {
    expect(levels('Because the outcomes were not independent, all p values were Bonferroni-corrected for three comparisons.\n\nThe groups differed, t(28) = 2.10, p = .135.', 'significance-follows-from-t')).toEqual(['note']);
  });
  it('applies to F, χ², r and z alike (significance-follows-from-statistic, p-follows-from-f)', () => {
    expect(levels('All p values were Holm-adjusted.\n\nLoad mattered, F(1, 38) = 4.21, p = .094.', 'significance-follows-from-statistic')).toEqual(['note']);
    expect(levels('Load mattered, F(1, 38) = 4.21, p = .094.', 'significance-follows-from-statistic')).toEqual(['error']);
    expect(levels('All p values were Holm-adjusted.\n\nLoad mattered, F(1, 38) = 4.21, p = .03.', 'p-follows-from-f')).toEqual(['warning']);
  });
});

describe('what counts as a correction of every p (invented cases, second review)', () => {
  const t = 'The groups differed, t(28) = 2.10, p = .135.';
  it('reads corrections a negation elsewhere in the sentence does not deny', () => {
    expect(levels('The groups did not differ after Bonferroni correction for three comparisons, t(28) = 2.10, p = .135.', 'significance-follows-from-t')).toEqual(['note']);
    expect(levels(`All p values were Bonferroni-corrected; the manipulation showed no effect on accuracy.\n\n${t}`, 'significance-follows-from-t')).toEqual(['note']);
  });
  it('reads counted tests as every p, and "p values" only near the correction', () => {
    expect(levels(`The three t-tests were Bonferroni-corrected.\n\n${t}`, 'significance-follows-from-t')).toEqual(['note']);
    expect(levels(`Bonferroni correction was applied to the post hoc comparisons that followed the ANOVA; exact p values are given in Table 2.\n\n${t}`, 'significance-follows-from-t')).toEqual(['error']);
  });
  it('takes a corrected alpha as no correction of the p values', () => {
    // t(28) = 1.50 gives two-tailed .1448 (scipy.stats.t.sf); .43 would be 3 × p
    expect(levels('A Bonferroni-corrected alpha of .05/3 = .017 was applied to all three tests.\n\nThe groups differed, t(28) = 1.50, p = .43.', 'p-follows-from-t')).toEqual(['warning']);
  });
  it('reads Bonferroni–Holm as Holm, and Benjamini–Yekutieli as a correction of unknown bound', () => {
    expect(levels('All p values were Bonferroni–Holm corrected for three comparisons.\n\nThe groups differed, t(28) = 2.10, p = .09.', 'significance-follows-from-t')).toEqual(['note']);
    // Benjamini–Yekutieli can exceed m × p (up to m(1 + 1/2 + 1/3) p = .249 here)
    expect(levels('All p values were Benjamini–Yekutieli adjusted for three comparisons.\n\nThe groups differed, t(28) = 2.10, p = .24.', 'significance-follows-from-t')).toEqual(['note']);
  });
});

describe('third review (invented cases): denials, alpha thresholds and the reading the note names', () => {
  // t(30) = 2.50 gives two-tailed .0179 to .0183; four Bonferroni comparisons would give .0716 to .0733
  const t = 'The groups differed, t(30) = 2.50, p = .072.';
  it('takes "no p values were", "none of", "did not apply" and raw p values as no correction', () => {
    for (const words of ['No p values were Bonferroni-corrected.', 'None of the p values were Bonferroni-corrected.', 'We considered a Bonferroni correction for the four outcomes but did not apply one.', 'All p values in the text are raw; Bonferroni thresholds are given in Table 2.']) {
      expect(levels(`${words}\n\n${t}`, 'significance-follows-from-t')).toEqual(['error']);
    }
  });
  it('takes a threshold below .05 in the correction\'s sentence as a corrected alpha', () => {
    for (const words of ['Each of the four tests was evaluated at an alpha of .0125 (Bonferroni).', 'All p values below .0125 were considered significant (Bonferroni correction for four tests).', 'The threshold was Bonferroni-adjusted to .0125 for all four tests.', 'All results were significant at p < .0125 (Bonferroni correction for four tests).']) {
      expect(levels(`${words}\n\n${t}`, 'significance-follows-from-t')).toEqual(['error']);
    }
  });
  it('names the range of the reading the correction could have made the p from (r, bracket as df)', () => {
    // r(30) = .40: two-tailed .0215 to .0253 with df 30 (×3: .0644 to .0758), .0264 to .0308 with df 28
    const [f] = findingsOf('All p values were Bonferroni-corrected for three comparisons.\n\nSleep and mood were related, r(30) = .40, p = .070.', 'significance-follows-from-statistic');
    expect(f?.level).toBe('note');
    expect(f?.message).toContain('(the correction for 3 comparisons could give 0.0644 to 0.0758)');
  });
});

describe('a correction said without a name, and corrections named by their authors (invented cases)', () => {
  // t(28) = 2.10 gives two-tailed .0444 to .0453 (scipy.stats.t.sf, as above)
  const t = 'The groups differed, t(28) = 2.10, p = .135.';
  it('reads "adjusted for multiple comparisons" and its kin as a correction of unknown kind: a note, from the p up to 1', () => {
    for (const words of ['All p values were adjusted for multiple comparisons.', 'P values are multiplicity-adjusted.', 'The p values were corrected for multiple testing.', 'A multiple-comparison correction was applied to all p values.', 'All p values are adjusted for multiplicity.']) {
      const [f, ...rest] = findingsOf(`${words}\n\n${t}`, 'significance-follows-from-t');
      expect(rest).toEqual([]);
      expect(f?.level).toBe('note');
      expect(f?.message).toContain('without naming it, and labels no p as adjusted: this p, larger than t and df give, may be an adjusted one (the correction could give 0.0444 to 1)');
    }
    // in the result's own sentence, before its p
    expect(levels('After adjustment for multiple comparisons the groups differed, t(28) = 2.10, p = .135.', 'significance-follows-from-t')).toEqual(['note']);
    // right after its p the words label that p as adjusted: it is not held to t and df at all
    expect(levels('The groups differed, t(28) = 2.10, p = .135 (adjusted for multiple comparisons).', 'significance-follows-from-t')).toEqual([]);
  });
  it('stays an error where the words deny a correction, correct alpha, or speak of something else', () => {
    for (const words of ['We did not correct for multiple comparisons.', 'No adjustment for multiple comparisons was made.', 'P values were not adjusted for multiple testing.', 'The alpha level was adjusted for multiple comparisons.', 'All estimates were adjusted for age and sex.', 'We adjusted for multiple comparisons in the secondary analyses.']) {
      expect(levels(`${words}\n\n${t}`, 'significance-follows-from-t')).toEqual(['error']);
    }
  });
  it('stays a warning where the p is smaller than t and df give', () => {
    expect(levels('All p values were adjusted for multiple comparisons.\n\nThe groups differed, t(28) = 2.10, p = .015.', 'p-follows-from-t')).toEqual(['warning']);
  });
  it("reads Hommel's procedure and Westfall and Young's as corrections of unknown bound", () => {
    // a bound of 3 × p would make .24 impossible for three comparisons; these are read up to 1
    expect(levels('All p values were adjusted with the Hommel procedure for three comparisons.\n\nThe groups differed, t(28) = 2.10, p = .24.', 'significance-follows-from-t')).toEqual(['note']);
    expect(levels('All p values were adjusted with the Westfall–Young step-down procedure.\n\nThe groups differed, t(28) = 2.10, p = .24.', 'significance-follows-from-t')).toEqual(['note']);
  });
  it('does not let unnamed words stand beside a named correction in adjusted-p-follows (the named one is the method)', () => {
    // Bonferroni for three comparisons from p = .021 (.0205 to .0215): .0615 to .0645; .090 is outside
    const markdown = 'We corrected for multiple comparisons. The Bonferroni method was used for the three comparisons.\n\nThe groups differed, t(28) = 2.45, p = .021, adjusted p = .090.';
    expect(levels(markdown, 'adjusted-p-follows')).toEqual(['warning']);
  });
});

describe('words about corrections that say none was made, or cite an author (invented cases, second review)', () => {
  const t = 'The groups differed, t(28) = 2.10, p = .135.';
  it('stays an error where a correction is not needed, still to come, hypothetical, or an author is cited', () => {
    for (const words of [
      'Power for all tests was computed following Westfall, Kenny and Judd (2014).',
      'All p values follow the scoring of Hommel et al. (2001).',
      'Because all p values are exploratory, adjustment for multiple comparisons was deemed unnecessary.',
      'All p values are reported before adjustment for multiple comparisons.',
    ]) {
      expect(levels(`${words}\n\n${t}`, 'significance-follows-from-t')).toEqual(['error']);
    }
    expect(levels('The groups differed, t(28) = 2.10, p = .135, although this would not remain significant after correcting for multiple comparisons.', 'significance-follows-from-t')).toEqual(['error']);
  });
  it('reads "we corrected all p values for multiple testing" as a correction made', () => {
    expect(levels(`We corrected all p values for multiple testing.\n\n${t}`, 'significance-follows-from-t')).toEqual(['note']);
  });
  it('counts a Hommel correction as multiplicity addressed (the checklist item)', () => {
    const five = Array.from({ length: 5 }, (_, i) => `Outcome ${i + 1} differed, t(28) = 2.10, p = .045.`).join(' ');
    const entries = (words: string) => findingsOf(`${words}\n\n${five}`, 'multiple-comparisons-addressed', { checklist: true });
    expect(entries('All p values were Hommel-adjusted.')).toEqual([]);
    expect(entries('The data were collected in spring.')).toHaveLength(1);
  });
});
