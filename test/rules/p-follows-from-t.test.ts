import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { findingsOf, levelsOf, ruleTable } from './table.js';

// Recomputed p values quoted in names were checked with scipy.stats.t.sf (Debian python3-scipy).
ruleTable('p-follows-from-t', [
  { name: 'exact p that follows (two-tailed p = .0449)', markdown: 'x, t(28) = 2.10, p = .045.', expect: [] },
  { name: 'p rounded to two decimals that follows', markdown: 'x, t(28) = 2.10, p = .04.', expect: [] },
  { name: 'p that misses without crossing alpha (two-tailed .0449, one-tailed .0225)', markdown: 'x, t(28) = 2.10, p = .03.', expect: ['1:4 mismatch'] },
  { name: 'inequality that holds', markdown: 'x, t(40) = 3.10, p < .01.', expect: [] },
  { name: 'inequality that holds at the boundary of rounding (t(21) = 3.87 gives .00088)', markdown: 'x (t(21) = 3.87; p < 0.001)', expect: [] },
  { name: 'inequality that fails without crossing alpha (t(21) = 2.87 gives .0091)', markdown: 'x (t(21) = 2.87; p < 0.001)', expect: ['1:4 mismatch'] },
  { name: 'negative t', markdown: 'x, t(38) = −2.08, p = .044.', expect: [] },
  { name: 'Welch df read within its rounding', markdown: "x, Welch's t(69.19) = 3.24, p = .002.", expect: [] },
  { name: 'scientific notation that follows (t(58) = 8.124 gives 3.79e-11)', markdown: 'x, t = 8.124, df = 58, p-value = 3.789e-11', expect: [] },
  { name: 'scientific notation off by a factor of ten', markdown: 'x, t = 8.124, df = 58, p-value = 3.789e-10', expect: ['1:4 mismatch'] },
  { name: 'one-tailed test the text declares', markdown: 'One-tailed: x, t(30) = 1.80, p = .041.', expect: [] },
  { name: 'one-tailed declared in the result', markdown: 'x, t(70.307) = 14.901, p < .0001, one-tailed.', expect: [] },
  { name: 'equivalence test reports the opposite tail (p near 1)', markdown: 'The equivalence test was not significant, t(29) = -8.22, p > .999.', expect: [] },
  { name: 'declared one-tailed but the p is the two-tailed one (t(23) = 8.02 gives 4.1e-8)', markdown: 'The test was one-tailed: t(23) = 8.02, p = 0.00000004.', expect: ['1:26 two-tailed-although-one-stated'] },
  { name: 'document says two-tailed, p is one-tailed', markdown: 'All tests were two-tailed.\n\nx, t(30) = 2.10, p = .022.', expect: ['3:4 one-tailed-although-two-stated'] },
  { name: 'integer t read as 3.5 to 4.5 reaches the printed p', markdown: 'x, t(999999) = 4, p = 0.0000317.', expect: [] },
  { name: 'n.s. with a small t', markdown: 'x, t(113) = 0.56, n.s.', expect: [] },
  { name: 'n.s. with a large t changes significance, so this rule is quiet', markdown: 'x, t(113) = 3.56, n.s.', expect: [] },
  { name: 'bounded t and p that agree', markdown: 'both ts(22) > 4.72, ps ≤ .0001.', expect: [] },
  { name: 'a mismatch that flips significance belongs to significance-follows-from-t', markdown: 'x, t(46) = 0.84, p = .04.', expect: [] },
  { name: 'quieted with a reason', markdown: '<!-- plumbline quiet p-follows-from-t: Holm-adjusted -->\nx, t(23) = 1.12, p = .42.', expect: [] },
  { name: 'a quiet comment without a reason silences nothing', markdown: '<!-- plumbline quiet p-follows-from-t -->\nx, t(23) = 1.12, p = .42.', expect: ['2:4 mismatch'] },
  { name: 'a quiet comment applies to the next block only', markdown: '<!-- plumbline quiet p-follows-from-t: Holm-adjusted -->\nx.\n\ny, t(23) = 1.12, p = .42.', expect: ['4:4 mismatch'] },
  { name: 'turned off in front matter', markdown: '---\nplumbline:\n  rules:\n    p-follows-from-t: "off"\n---\nx, t(23) = 1.12, p = .42.', expect: [] },
  { name: 'turned off in configuration', markdown: 'x, t(23) = 1.12, p = .42.', options: { config: { rules: { 'p-follows-from-t': 'off' } } }, expect: [] },
]);

describe('the message shows the rounding interval actually used, to one digit past the printed one', () => {
  // The interval of a number printed to k decimals is x ± 0.5·10^-k (common practice, no source).
  const message = (markdown: string) => checkSource('x.md', `${markdown}\n`).findings.find((f) => f.ruleId === 'p-follows-from-t')?.message ?? '';
  // scipy.stats.t.sf: t(5) = 5 gives two-tailed .0041; t(13) = 3.065 gives .0090
  it('t printed to four decimals: 5.0000 is read as 4.99995 to 5.00005, not "5 to 5"', () => {
    expect(message('x, t(5) = 5.0000, p = 0.0300.')).toContain('t = 5.0000 (read as 4.99995 to 5.00005)');
  });
  it('t printed to three decimals keeps its bounds distinct', () => {
    expect(message('x, t = 3.065, df = 13, p = .02')).toContain('t = 3.065 (read as 3.0645 to 3.0655)');
  });
  it('a Welch df printed with decimals is shown with its own bounds', () => {
    // scipy.stats.t.sf: two-tailed p 0.0327 to 0.0335 over the box, so .04 misses without crossing alpha
    expect(message("x, Welch's t(17.8) = 2.31, p = .04.")).toContain('df = 17.8 (read as 17.75 to 17.85)');
  });
});

describe("a whole df of a result named Welch's test is read as rounded (invented cases)", () => {
  // scipy.stats.t.sf (Debian python3-scipy), two-tailed: t = 2.60 (2.595 to 2.605) gives
  // .04796 to .04854 on df 5, and .04380 (t 2.605, df 5.5) to .05375 (t 2.595, df 4.5) over
  // df 4.5 to 5.5. A Welch df is a real number (common practice, no source), so "t(5)" printed
  // for a Welch test stands for 4.5 to 5.5.
  const found = (markdown: string) => findingsOf(markdown, 'p-follows-from-t');
  it('accepts a p that a df within the rounding of a Welch df gives', () => {
    expect(found("Because the variances differed, Welch's t-test was used: the groups differed, t(5) = 2.60, p = .045.")).toEqual([]);
    expect(found('A Welch test gave t(5) = 2.60, p = .045.')).toEqual([]);
  });
  it('keeps the whole df exact where the result is not named Welch, or named Student', () => {
    expect(found('The groups differed, t(5) = 2.60, p = .045.')).toHaveLength(1);
    expect(found("A Student's t-test gave t(5) = 2.60, p = .045.")).toHaveLength(1);
  });
  it('still reports a p no df within the rounding gives, and says how the df was read', () => {
    const [f] = found('A Welch test gave t(5) = 2.60, p = .07.');
    expect(f?.level).toBe('warning');
    // df 4.5 to 6 (rounded or cut), t 2.595 to 2.605: .0404 to .0537 (scipy.stats.t.sf)
    expect(f?.message).toContain("df = 5 (Welch's test, a df printed whole, rounded or cut: read as 4.5 to 6): 0.0404 to 0.0537");
  });
});

describe("Welch's test named only for the whole text: a whole df that a rounded Welch df would fit is a note (invented cases)", () => {
  // The same values as above (scipy.stats.t.sf): t(5) = 2.60 gives .0480 to .0485 on df 5 and
  // .0404 to .0537 over df 4.5 to 6 (a whole df rounded or cut).
  const methods = "Groups were compared with Welch's t-tests.";
  const found = (markdown: string, rule = 'p-follows-from-t') => findingsOf(markdown, rule);
  it('is a note that says what could not be checked, and where Welch is named', () => {
    const [f, ...rest] = found(`${methods}\n\nThe groups differed, t(5) = 2.60, p = .045.`);
    expect(rest).toEqual([]);
    expect(f?.level).toBe('note');
    expect(f?.message).toMatch(/^Not checked with certainty \(Welch's test is named elsewhere in the text, “Welch's t-tests”, not with this result: if its df of 5 is a Welch df printed whole \(rounded or cut: 4\.5 to 6\), the two-tailed p would be 0\.0404 to 0\.0537, which holds the reported p\)\. Reported p = \.045\./);
    expect(f?.related).toEqual([expect.objectContaining({ message: "Welch's test named here", start: { line: 1, column: 27 } })]);
  });
  it("reads Welch's correction of a t-test, and the Welch–Satterthwaite approximation, as Welch's test", () => {
    expect(found("A t-test with Welch's correction showed that the groups differed, t(5) = 2.60, p = .045.")).toEqual([]);
    expect(found("Groups were compared with t-tests with Welch's correction.\n\nThe groups differed, t(5) = 2.60, p = .045.").map((f) => f.level)).toEqual(['note']);
    expect(found('Degrees of freedom were adjusted with the Welch–Satterthwaite approximation.\n\nThe groups differed, t(5) = 2.60, p = .045.').map((f) => f.level)).toEqual(['note']);
    expect(found("We used Welch's test, which does not assume equal variances.\n\nThe groups differed, t(5) = 2.60, p = .045.").map((f) => f.level)).toEqual(['note']);
    for (const words of ["Groups were compared with Welch's two-sample t-tests.", "Groups were compared with Welch's independent-samples t-tests.", 'Groups were compared with Welch-type t statistics.']) {
      expect(found(`${words}\n\nThe groups differed, t(5) = 2.60, p = .045.`).map((f) => f.level)).toEqual(['note']);
    }
  });
  it("takes Welch's test said to be rejected, contrasted, or set beside Student's tests for the whole text as no sign of a Welch df", () => {
    for (const words of ["Because the variances were equal, Student's t-tests are reported; Welch's t-tests gave the same conclusions.", "Unlike Welch's t-test, Student's t-test pools the variances.", "Welch's t-test was considered but rejected."]) {
      expect(found(`${words}\n\nThe groups differed, t(5) = 2.60, p = .045.`).map((f) => f.level)).toEqual(['warning']);
    }
  });
  it('reads a negation elsewhere in the sentence as no denial of the name', () => {
    expect(found("Because the variances were not equal, Welch's t-tests were used.\n\nThe groups differed, t(5) = 2.60, p = .045.").map((f) => f.level)).toEqual(['note']);
    expect(found("Welch's t-test was used instead of Student's.\n\nThe groups differed, t(5) = 2.60, p = .045.").map((f) => f.level)).toEqual(['note']);
    expect(found("Student's t-test was used instead of Welch's t-test.\n\nThe groups differed, t(5) = 2.60, p = .045.").map((f) => f.level)).toEqual(['warning']);
  });
  it('stays a warning where no rounded Welch df gives the p either', () => {
    // .035: neither two-tailed (.0438 to .0537) nor one-tailed (.0219 to .0269), on the same side of .05
    expect(found(`${methods}\n\nThe groups differed, t(5) = 2.60, p = .035.`).map((f) => f.level)).toEqual(['warning']);
  });
  it('stays a warning for a result named Student, and where Welch is named only beside another result', () => {
    expect(found(`${methods}\n\nA Student's t-test gave t(5) = 2.60, p = .045.`).map((f) => f.level)).toEqual(['warning']);
    expect(found("Welch's t(17.8) = 2.31, p = .033.\n\nThe groups differed, t(5) = 2.60, p = .045.").map((f) => f.level)).toEqual(['warning']);
  });
  it('makes a flipped significance call a note too (significance-follows-from-t)', () => {
    // t(5) = 2.55 gives two-tailed .0510 to .0516 on df 5 (not significant) and .0467 to .0569 over df 4.5 to 5.5
    expect(found(`${methods}\n\nThe groups differed, t(5) = 2.55, p = .049.`, 'significance-follows-from-t').map((f) => f.level)).toEqual(['note']);
    expect(found('The groups differed, t(5) = 2.55, p = .049.', 'significance-follows-from-t').map((f) => f.level)).toEqual(['error']);
  });
});

describe("Welch's name that does not name this test's df (invented cases; t(5) = 2.60 gives .0480 to .0485 on df 5)", () => {
  const levels = (markdown: string) => levelsOf(markdown, 'p-follows-from-t');
  it("stays a warning where Welch's name names a method or an ANOVA, or is negated", () => {
    expect(levels("Spectral power was estimated with Welch's method.\n\nThe groups differed, t(5) = 2.60, p = .045.")).toEqual(['warning']);
    expect(levels("Welch's ANOVA compared the three sites.\n\nThe groups differed, t(5) = 2.60, p = .045.")).toEqual(['warning']);
    expect(levels("Welch's test was not needed, as the variances were equal.\n\nThe groups differed, t(5) = 2.60, p = .045.")).toEqual(['warning']);
    expect(levels("Alpha power, estimated with Welch's method, was higher in the morning, t(5) = 2.60, p = .045.")).toEqual(['warning']);
  });
  it('stays a warning for a paired test, a one-sample test, or the t of a regression coefficient', () => {
    const methods = "Groups were compared with Welch's t-tests.";
    expect(levels(`${methods}\n\nScores rose from the first visit to the second, paired t(5) = 2.60, p = .045.`)).toEqual(['warning']);
    expect(levels(`${methods}\n\nScores were above the midpoint, one-sample t(5) = 2.60, p = .045.`)).toEqual(['warning']);
    expect(levels(`${methods}\n\nDose predicted recovery, b = 0.42, SE = 0.16, t(5) = 2.60, p = .045.`)).toEqual(['warning']);
  });
});
