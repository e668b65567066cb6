import { describe, expect, it } from 'vitest';
import { findingsOf, levelsOf } from './table.js';

// A Welch df is a real number, and papers often print it whole: rounded, or cut to its whole part
// (common practice, no source). The groups below (invented) give t = 1.566 and two-tailed p = .1399
// by scipy.stats.ttest_ind_from_stats(48.4, 8.7, 14, 44.7, 2.3, 30, equal_var=False) (Debian
// python3-scipy 1.17.1); the Welch–Satterthwaite df, (s1²/n1 + s2²/n2)² / ((s1²/n1)²/(n1 − 1) +
// (s2²/n2)²/(n2 − 1)), is 13.85 from the printed SDs (13.81 to 13.90 over their rounding: the same
// formula evaluated in Python at the SDs' ends). Student's t has n1 + n2 − 2 = 42 df; t(14) = 1.57
// gives p = .1387 (scipy.stats.t.sf), so the p agrees either way.
const groups = 'Fatigue differed between desks (M = 48.4, SD = 8.7, n = 14; M = 44.7, SD = 2.3, n = 30)';
const rule = 'df-follows-from-n';

describe('a whole df that Student\'s test does not give, where the SDs give it as a Welch df printed whole', () => {
  it('is a note when no words say which test it was, saying what the df may be', () => {
    const [f, ...rest] = findingsOf(`${groups}, t(14) = 1.57, p = .14.`, rule);
    expect(rest).toEqual([]);
    expect(f?.level).toBe('note');
    expect(f?.messageId).toBe('student');
    expect(f?.message).toBe(
      "Not checked with certainty (the text does not say which t-test gave this result, and its df of 14 may be a Welch df printed whole (rounded or cut: 13.5 to 15): the Welch–Satterthwaite df from the SDs and ns, 13.809 to 13.904, can be printed as 14). Reported df = 14 for two groups of n = 14 and 30; Student's t has n1 + n2 − 2 = 42 df.",
    );
  });
  it('reads a whole df cut to its whole part as well as a rounded one (13 for 13.85)', () => {
    expect(levelsOf(`${groups}, t(13) = 1.57, p = .14.`, rule)).toEqual(['note']);
  });
  it("is nothing when the result's own words name Welch's test, in any of the ways papers say it", () => {
    for (const name of ["Welch's t-test", 'a t-test not assuming equal variances', 'a t-test that did not assume equal variances', 'an unequal-variances t-test']) {
      expect(levelsOf(`${groups}; ${name} gave t(14) = 1.57, p = .14.`, rule)).toEqual([]);
    }
  });
  it("is a note naming the words where Welch's test is named elsewhere in the text, and points at them", () => {
    const [f] = findingsOf(`We compared the desks with t-tests that did not assume equal variances.\n\n${groups}, t(14) = 1.57, p = .14.`, rule);
    expect(f?.level).toBe('note');
    expect(f?.message).toContain("Welch's test is named elsewhere in the text, “t-tests that did not assume equal variances”, not with this result, and its df of 14 may be a Welch df printed whole");
    expect(f?.related).toEqual([expect.objectContaining({ message: "Welch's test named here", start: { line: 1, column: 28 } })]);
  });
  it("stays a warning where the text names Student's test, for the result or for every test", () => {
    expect(levelsOf(`${groups}, Student's t(14) = 1.57, p = .14.`, rule)).toEqual(['warning']);
    expect(levelsOf(`All comparisons used Student's t-tests.\n\n${groups}, t(14) = 1.57, p = .14.`, rule)).toEqual(['warning']);
  });
  it('stays a warning where the SDs give no Welch df the whole df could stand for', () => {
    // 24 is neither 42 nor 13.8 to 13.9 printed whole
    const [f] = findingsOf(`${groups}, t(24) = 1.57, p = .14.`, rule);
    expect(f?.level).toBe('warning');
    expect(f?.messageId).toBe('student');
    expect(levelsOf(`We used Welch's t-tests throughout.\n\n${groups}, t(24) = 1.57, p = .14.`, rule)).toEqual(['warning']);
  });
  it("holds a whole df of a result its own words name Welch's to the SDs' Welch df, saying how it was read", () => {
    const [f, ...rest] = findingsOf(`${groups}; Welch's t-test gave t(24) = 1.57, p = .14.`, rule);
    expect(rest).toEqual([]);
    expect(f?.level).toBe('warning');
    expect(f?.messageId).toBe('welch-sds');
    expect(f?.message).toBe('Reported df = 24; the Welch–Satterthwaite df from the SDs and ns (M = 48.4, SD = 8.7, n = 14; M = 44.7, SD = 2.3, n = 30) is 13.809 to 13.904.');
    expect(f?.recomputed?.assumptions).toEqual(['spreads are SDs, as labelled', "Welch's test, as its words say: the whole df read as rounded or cut (23.5 to 25)"]);
  });
});

describe('a whole df beside two group sizes only (no SDs)', () => {
  // Welch's df lies between min(n1, n2) − 1 = 13 and n1 + n2 − 2 = 42 (common practice, no source)
  const sizes = 'The desks differed (n = 14 and 30)';
  it("is a warning where nothing names Welch's test: the sizes alone cannot show a Welch df", () => {
    expect(levelsOf(`${sizes}, t(20) = 1.57, p = .13.`, rule)).toEqual(['warning']);
  });
  it("is a note where Welch's test is named elsewhere and the df lies in its range", () => {
    expect(levelsOf(`We used Welch's t-tests throughout.\n\n${sizes}, t(20) = 1.57, p = .13.`, rule)).toEqual(['note']);
  });
  it("is nothing where the result's own words name Welch's test and the df lies in its range, and a range finding where it does not", () => {
    expect(levelsOf(`${sizes}; Welch's t-test gave t(20) = 1.57, p = .13.`, rule)).toEqual([]);
    const [f] = findingsOf(`${sizes}; Welch's t-test gave t(8) = 1.57, p = .16.`, rule);
    expect(f?.messageId).toBe('welch-range');
    expect(f?.message).toBe("Reported df = 8 for two groups of n = 14 and 30; Welch's df lies between min(n1, n2) − 1 = 13 and n1 + n2 − 2 = 42.");
  });
});

describe('second review (invented cases): what names which test, and one reading of a whole Welch df across rules', () => {
  // (M = 54.2, SD = 8.7, n = 14) and (M = 44.7, SD = 2.3, n = 30): Welch t = 4.021, df = 13.86,
  // p = .00129 (scipy.stats.ttest_ind_from_stats, equal_var=False; the df by the formula above)
  const wide = 'Fatigue differed between desks (M = 54.2, SD = 8.7, n = 14; M = 44.7, SD = 2.3, n = 30)';
  it("takes what a test assumes as its name: equal variances assumed or pooled is Student's, so the df finding stays a warning", () => {
    for (const words of ['All t-tests assumed equal variances.', 'Pooled-variance t-tests were used throughout.', 'Equal variances assumed.']) {
      expect(levelsOf(`${words}\n\n${wide}, t(14) = 4.02, p = .001.`, rule)).toEqual(['warning']);
    }
  });
  it("does not take Student's t distribution for Student's test", () => {
    expect(levelsOf(`All p values were taken from Student's t distribution.\n\n${wide}, t(14) = 4.02, p = .001.`, rule)).toEqual(['note']);
  });
  it("reads a whole Welch df cut to its whole part the same way in the p rule as in the df rule (13 for 13.86)", () => {
    const markdown = `${wide}; Welch's t-test gave t(13) = 4.02, p = .00129.`;
    expect(findingsOf(markdown, rule)).toEqual([]);
    // read as rounded only (12.5 to 13.5) the p would be .00134 to .00158, and this p outside it
    expect(findingsOf(markdown, 'p-follows-from-t')).toEqual([]);
  });
  it("holds a df of n1 + n2 − 2 to the SDs where the result's own words name Welch's test", () => {
    const [f] = findingsOf(`${wide}; Welch's t-test gave t(42) = 4.02, p < .001.`, rule);
    expect(f?.messageId).toBe('welch-sds');
    expect(f?.level).toBe('warning');
  });
  it('says the spreads were read both ways where their kind is not stated', () => {
    const [f] = findingsOf('Fatigue differed between desks (48.4 ± 8.7, n = 14; 44.7 ± 2.3, n = 30), t(14) = 1.57, p = .14.', rule);
    expect(f?.level).toBe('note');
    expect(f?.message).toContain('the Welch–Satterthwaite df from the spreads (read as SDs, and as SEs) and ns');
  });
});
