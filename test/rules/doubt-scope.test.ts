import { describe, expect, it } from 'vitest';
import { checkSource, type FileReport } from '../../src/engine/index.js';
import { extract } from '../../src/extract/index.js';
import { parseDocument } from '../../src/parse/index.js';
import { expectLinearCheck } from '../helpers.js';

/**
 * Words that only make a finding less certain are read within their scope, so that they hide no
 * true finding: not in a list of references, not where they are denied, not for a test of another
 * paragraph; and the cues of this kind do not match look-alikes. Invented cases; numbers with
 * scipy 1.17.1: women (5.1, 1.2, 20) and men (4.3, 1.1, 20) give Student's t(38) = 2.20, p = .034
 * (scipy.stats.ttest_ind_from_stats), so t(48) is a wrong df; t(48) = 2.20: p = .033, t(58) =
 * 2.10: p = .040, t(78) = 2.43: p = .017 (scipy.stats.t.sf).
 */
const run = (markdown: string): FileReport => checkSource('x.md', `${markdown}\n`);
const levels = (r: FileReport, rule: string) => r.findings.filter((f) => f.ruleId === rule).map((f) => f.level);
const kinds = (text: string, kind: string) => extract(parseDocument('x.md', `${text}\n`)).mentions.filter((m) => m.kind === kind).map((m) => m.printed);
const anxiety = 'Women (M = 5.1, SD = 1.2, n = 20) and men (M = 4.3, SD = 1.1, n = 20) differed in anxiety, t(48) = 2.20, p = .033.';

describe('contrast words', () => {
  it('are not "Tukey" alone, a cited title, or words of another paragraph', () => {
    expect(kinds("Outliers were identified with Tukey's fences and removed.", 'contrast')).toEqual([]);
    expect(kinds("Post hoc comparisons used Tukey's HSD.", 'contrast')).toEqual(['Post hoc comparisons', "Tukey's HSD"]);
    expect(kinds('## References\n\nScheffé, H. (1959). The analysis of variance. Wiley.', 'contrast')).toEqual([]);
    // the words in another paragraph (another study, the Discussion) leave the df finding a warning
    expect(levels(run(`## Study 1\n\nPost hoc comparisons used Tukey's HSD.\n\n## Study 2\n\n${anxiety}`), 'df-follows-from-n')).toEqual(['warning']);
    expect(levels(run(`Post hoc comparisons used Tukey's HSD. ${anxiety}`), 'df-follows-from-n')).toEqual(['note']);
  });
  it("an F of two groups (Levene's test, or the same comparison) is no sign of a pooled error term", () => {
    // Levene's F(1, 58) beside t(58), and t(28) in a subgroup: the t(58) uses the whole 60
    const r = run("## Methods\n\nWe recruited 60 participants.\n\n## Results\n\nLevene's test indicated equal variances, F(1, 58) = 0.40, p = .53; women and men differed in anxiety, t(58) = 2.10, p = .040.\n\nAmong women only, older and younger women differed, t(28) = 2.25, p = .032.");
    expect(levels(r, 'sample-size-agrees-with-df')).toEqual([]);
  });
  it('a contrast said in words may come from up to six groups, not from any number', () => {
    // t(60) with N = 72 stated: N − k = 60 needs 12 groups
    const r = run("## Methods\n\nWe recruited 72 participants. Post hoc comparisons used Tukey's HSD.\n\n## Results\n\nPost hoc comparisons showed that cyclists were less stressed, t(60) = 2.10, p = .040.");
    expect(levels(r, 'sample-size-agrees-with-df')).toEqual(['warning']);
  });
});

describe('a total N, and the tests that may use part of it', () => {
  const trial = (methods: string) => run(`## Methods\n\n${methods}\n\n## Results\n\nPain was lower with strength training than with advice, t(78) = -2.43, p = .017.`);
  it('three or more arms, several studies, or an analysis of part of the sample make the finding a note', () => {
    expect(levels(trial('A total of 120 adults were randomised to strength training (n = 40), walking (n = 40) or advice (n = 40).'), 'sample-size-agrees-with-df')).toEqual(['note']);
    expect(levels(trial('N = 120 adults were randomised equally to strength training, walking or advice.'), 'sample-size-agrees-with-df')).toEqual(['note']);
    expect(levels(trial('Across two studies (total N = 146), we tested whether strength training eased pain.'), 'sample-size-agrees-with-df')).toEqual(['note']);
    expect(levels(trial('The cohort comprised N = 260 adults; this analysis concerns the women who trained.'), 'sample-size-agrees-with-df')).toEqual(['note']);
  });
  it('three group sizes beside another statistic (an F across sites) say nothing of the arms', () => {
    expect(levels(trial('We recruited N = 120 adults. The sites (n = 40, n = 50 and n = 30) did not differ in age, F(2, 117) = 0.40, p = .67.'), 'sample-size-agrees-with-df')).toEqual(['warning']);
  });
});

describe('crossing over', () => {
  // paired t of 26 pairs has 25 df; t(50) = 2.34, p = .023 (scipy.stats.t.sf) is 2n − 2
  const result = 'Confidence was higher with mentoring (M = 14.8, SD = 3.9, n = 26) than without it (M = 12.2, SD = 4.1, n = 26), t(50) = 2.34, p = .023.';
  it('each group, both groups, or a crossing to the other condition is a crossover design', () => {
    for (const words of ['After a one-week washout, each group crossed over to the other condition.', 'After a washout, the mentoring group and the control group crossed over.', 'After a washout, the mentoring group crossed over to the other condition.']) {
      expect(levels(run(`${words} ${result}`), 'design-matches-analysis')).toEqual(['warning']);
    }
  });
});

describe('occasions and counts in words: look-alikes', () => {
  const occasions = (text: string) => extract(parseDocument('x.md', `${text}\n`)).summaries.map((g) => g.occasion);
  it('a duration, an age or a wave is no occasion; words right after a closing bracket are read', () => {
    expect(occasions('Function was better after 6 weeks (M = 24.0, SD = 4.0, n = 40) than after 2 weeks (M = 22.0, SD = 4.2, n = 40).')).toEqual([undefined, undefined]);
    expect(occasions('Children aged 8 years (M = 12.0, SD = 2.0) and aged 6 years (M = 10.0, SD = 2.0).')).toEqual([undefined, undefined]);
    expect(occasions('Trust in wave 2 (M = 3.1, SD = 0.8) and wave 1 (M = 3.3, SD = 0.7).')).toEqual([undefined, undefined]);
    expect(occasions('Pain (M = 18.2, SD = 5.1) at baseline fell to (M = 15.6, SD = 4.8) at week 8.')).toEqual(['baseline', 'week8']);
  });
  it('a number word that is part of a larger number is not read', () => {
    const counts = (text: string) => extract(parseDocument('x.md', `${text}\n`)).unitCounts.filter((c) => c.worded).map((c) => c.value);
    expect(counts('Three hundred sixty residents and one hundred participants replied.')).toEqual([]);
    expect(counts('Sixty residents replied.')).toEqual([60]);
  });
});

describe('derived-means words', () => {
  const falls = (words: string) => levels(run(`## Methods\n\nThe outcome was the number of falls over 12 months, a whole-number count. ${words}\n\n## Results\n\nThe mean number of falls was 1.37 (SD 1.42, n = 25) with exercise.\n\n## References\n\nA. Author (1987). Multiple imputation for surveys. Invented Press.`), 'mean-is-possible-for-integers');
  it('denied, or only in a cited title, leave the GRIM finding a warning', () => {
    // GRIM (common practice, no source): 1.37 × 25 = 34.25, no whole number
    expect(falls('Multiple imputation was not used: all participants completed follow-up.')).toEqual(['warning']);
    expect(falls('We report raw means rather than adjusted means.')).toEqual(['warning']);
    expect(falls('')).toEqual(['warning']);
  });
});

describe('an alpha or tails said of a side test', () => {
  // t(58) = 1.90: two-tailed p = .062, one-tailed .031 (scipy.stats.t.sf); "ns" is right at α = .05, wrong at .10
  const result = '## Results\n\nMood did not differ between exercise and stretching, t(58) = 1.90, ns.';
  const flip = (methods: string) => levels(run(`## Methods\n\n${methods}\n\n${result}`), 'significance-follows-from-t');
  it('is the side test\'s: an assumption check, heterogeneity, an interaction', () => {
    for (const words of ['Normality was checked with the Shapiro–Wilk test at α = .10.', 'Interaction terms were tested at alpha = .10, as is usual for effect modification.', "Heterogeneity between the sites was tested with Cochran's Q at a significance level of .10."]) {
      expect(flip(words)).toEqual([]);
    }
  });
  it('said of the t-tests or of every test beside it, it is theirs', () => {
    expect(flip('Normality was checked with the Shapiro–Wilk test, and all tests used α = .10.')).toEqual(['error']);
    expect(flip('Significance was set at α = .10.')).toEqual(['error']);
  });
});

describe('a tails word that labels a second p', () => {
  // t(29) = 1.85: two-tailed p = .075, one-tailed .037 (scipy.stats.t.sf)
  const of = (markdown: string) => run(markdown).findings.filter((f) => f.level !== 'note').map((f) => `${f.ruleId}/${f.level}`);
  it('is that p\'s, not the result\'s own p\'s', () => {
    for (const text of ['Wellbeing was higher, t(29) = 1.85, p = .075 (one-tailed p = .037).', 'Wellbeing was higher, t(29) = 1.85, p = .075, or p = .037 one-tailed.', 'Wellbeing was higher, t(29) = 1.85, p = .075; a one-tailed test, as preregistered, gives p = .037.']) {
      const r = run(text);
      expect(r.results[0]?.sidedness.value).toBe('two');
      expect(of(text)).toEqual([]);
    }
  });
  it("labelling the result's own p, the tails are its own", () => {
    for (const text of ['Wellbeing was higher, t(29) = 1.85, one-tailed p = .037.', 'Wellbeing was higher, t(29) = 1.85, p = .037, one-tailed.', 'Wellbeing was higher, t(29) = 1.85, p = .037 (one-tailed).']) {
      expect(run(text).results[0]?.sidedness.value).toBe('one');
      expect(of(text)).toEqual([]);
    }
    // the two-tailed p labelled one-tailed is still an error
    expect(of('Wellbeing was higher, t(29) = 1.85, p = .075, one-tailed.')).toEqual(['significance-follows-from-t/error']);
  });
});

describe('words saying values were transformed for the analysis', () => {
  // untransformed (1.48, 0.78, 40) and (1.79, 0.67, 42): Student's t = −1.93 (scipy.stats.ttest_ind_from_stats);
  // t(80) = −2.46 (p = .016, scipy.stats.t.sf) can only be of the log values, which are not printed
  const result = 'Triglycerides were lower with fish oil (M = 1.48, SD = 0.78, n = 40) than with placebo (M = 1.79, SD = 0.67, n = 42), t(80) = -2.46, p = .016.';
  const of = (markdown: string) => levels(run(markdown), 't-follows-from-descriptives');
  it('in the Methods, the result\'s sentence or a table\'s note make the t from the descriptives a note', () => {
    expect(of(`## Methods\n\nTriglycerides were log-transformed for the t-tests; untransformed means are shown.\n\n## Results\n\n${result}`)).toEqual(['note']);
    expect(of(result.replace('p = .016.', 'p = .016 (t-test on log-transformed values).'))).toEqual(['note']);
    expect(of(`## Methods\n\nGroups were compared on the log scale: geometric means are reported in Table 3.\n\n## Results\n\n${result}`)).toEqual(['note']);
  });
  it('denied, or absent, they leave it a warning', () => {
    expect(of(`## Methods\n\nValues were not log-transformed.\n\n## Results\n\n${result}`)).toEqual(['warning']);
    expect(of(`## Methods\n\nA logistic model was fitted to the adverse events.\n\n## Results\n\n${result}`)).toEqual(['warning']);
  });
});

describe('an exact test named beside a χ²', () => {
  // χ²(1) = 5.57: upper-tail p = .018 (scipy.stats.chi2.sf); p = .047 is another test's p
  const of = (markdown: string) => levels(run(markdown), 'p-follows-from-chi-square');
  it('in its sentence or in the Methods, makes a p that does not follow from the χ² a note', () => {
    expect(of('Escalation was more frequent after the training (9 of 12 vs 4 of 14; χ²(1) = 5.57, Fisher\'s exact p = .047).')).toEqual(['note']);
    expect(of("## Methods\n\nFisher's exact test was used where expected counts were below 5.\n\n## Results\n\nEscalation was more frequent after the training, χ²(1) = 5.57, p = .047.")).toEqual(['note']);
  });
  it('not named, or denied, it leaves the warning', () => {
    expect(of('Escalation was more frequent after the training, χ²(1) = 5.57, p = .047.')).toEqual(['warning']);
    // "exact p" is a p printed in full, not a test
    expect(of('Escalation was more frequent after the training, χ²(1) = 5.57, exact p = .047.')).toEqual(['warning']);
    expect(of("## Methods\n\nNo continuity correction was applied.\n\n## Results\n\nEscalation was more frequent after the training, χ²(1) = 5.57, p = .047.")).toEqual(['warning']);
  });
});

describe('an effect size of a power or sensitivity statement, or an expected one', () => {
  // t(58) = 0.42 gives d = 2t/√df = 0.11 (common practice, no source): 0.74 and 0.50 are no result's d
  const of = (markdown: string) => levels(run(markdown), 'effect-size-follows');
  it('is a reference, not the result\'s d', () => {
    for (const text of [
      'Sleep quality did not differ, t(58) = 0.42, p = .676; with 30 per group the study had 80% power only for effects of d = 0.74 or larger.',
      'Sleep quality did not differ, t(58) = 0.42, p = .676, although a sample of this size could detect only d = 0.74 or larger.',
      'Mood did not differ between groups (t(58) = 0.42, p = .676; minimum detectable effect d = 0.74 at 80% power).',
      'Mood did not differ between groups, t(58) = 0.42, p = .676, well short of the expected d = 0.50.',
    ]) expect(of(text)).toEqual([]);
  });
  it("the result's own d after such words in another sentence or clause is still checked", () => {
    expect(of('The study was powered for d = 0.5. Mood did not differ, t(58) = 0.42, p = .676, d = 0.74.')).toEqual(['warning']);
    expect(of('As expected, mood did not differ, t(58) = 0.42, p = .676, d = 0.74.')).toEqual(['warning']);
  });
});

describe('a number with a percentage that is no count of the sentence\'s n', () => {
  // 9 of 36 is 25%, 60 of 120 50%, 18 of 80 22.5% (arithmetic): none is the percentage printed,
  // each of which is of another base (9 of 90 kg, 60 of 80 responders, 18 of 24 with pain)
  const of = (markdown: string) => levels(run(markdown), 'percentage-matches-count');
  it('an amount of a measure, or a part of a part, is not checked against the n', () => {
    expect(of('Among the 36 participants, weight fell by 9 (10%) kilograms from a baseline of 90 kg.')).toEqual([]);
    expect(of('In the 64 patients, the median stay was 2 (25%) days shorter.')).toEqual([]);
    expect(of('Of 120 patients invited, 80 responded; 60 (75%) rated communication as good.')).toEqual([]);
    expect(of('Among the 80 respondents, 24 reported pain at discharge, and 18 (75%) of them had had no written advice.')).toEqual([]);
  });
  it('a count of the n itself is still checked', () => {
    expect(of('Among the 36 participants, 9 (10%) reported a fall.')).toEqual(['warning']);
    expect(of('Of 120 patients invited, 60 (75%) rated communication as good.')).toEqual(['warning']);
  });
});

describe('a power statement for another model than two groups compared by a t-test', () => {
  // power at d = 0.5, two-sided α = .05 (scipy.stats.nct): 48 per group .679, 64 .801
  const of = (markdown: string) => levels(run(markdown), 'power-statement-follows');
  it('clustering, adjustment for baseline, or non-inferiority: the plain calculation does not give its n', () => {
    expect(of('With ANCOVA and an assumed baseline–outcome correlation of r = 0.5, 48 participants per group give 80% power to detect d = 0.5 (two-sided alpha .05).')).toEqual([]);
    expect(of('Allowing for clustering (ICC 0.05, design effect 1.9), 122 pupils per arm give 80% power to detect d = 0.5 at alpha .05.')).toEqual([]);
  });
  it('without such words, the same n is still a warning', () => {
    expect(of('48 participants per group give 80% power to detect d = 0.5 (two-sided alpha .05).')).toEqual(['warning']);
  });
});

describe('group sizes said to be those randomised', () => {
  // analysed 29 and 28 of 32 and 30 randomised: Student's t(55) = 2.06, p = .044 (scipy.stats.ttest_ind_from_stats)
  const text = 'Symptom scores at 12 weeks were better with the app (M = 24.6, SD = 5.1; randomised n = 32) than with the leaflet (M = 21.9, SD = 4.8; randomised n = 30), t(55) = 2.06, p = .044, among the 57 women with 12-week data.';
  it('need not be those analysed: the df and the sum are notes', () => {
    const r = run(text);
    expect(levels(r, 'df-follows-from-n')).toEqual(['note']);
    expect(levels(r, 'group-sizes-sum-to-total')).toEqual(['note']);
  });
  it('sizes not so called are held to the df and the total', () => {
    const r = run(text.replaceAll('randomised n', 'n'));
    expect(levels(r, 'df-follows-from-n')).toEqual(['warning']);
    expect(levels(r, 'group-sizes-sum-to-total')).toEqual(['warning']);
  });
});

describe('tails and alpha said of a non-inferiority or equivalence test', () => {
  // t(216) = −2.03: two-tailed p = .044, one-tailed .022 (scipy.stats.t.sf)
  const result = '## Results\n\nAnxiety was lower with telephone follow-up (M = 14.2, SD = 5.0, n = 110) than with clinic follow-up (M = 15.6, SD = 5.2, n = 108), t(216) = -2.03, p = .044, a significant difference.';
  const of = (methods: string) => run(`## Methods\n\n${methods}\n\n${result}`).findings.filter((f) => f.level !== 'note').map((f) => `${f.ruleId}/${f.level}`);
  it('are that test\'s, even where the sentence calls it primary', () => {
    expect(of('The primary hypothesis, non-inferiority of telephone follow-up for satisfaction, was tested one-sided at α = 0.025 against a margin of −3 points.')).toEqual([]);
    expect(of('Equivalence was tested with two one-sided tests against bounds of ±4 points.')).toEqual([]);
  });
  it('said of every test, they apply', () => {
    expect(of('All tests were one-sided at α = 0.025.')).toEqual(['significance-follows-from-t/error']);
  });
});

describe('second review: look-alikes of the doubt words leave true findings as they were (invented cases)', () => {
  // each text holds a real inconsistency: χ²(1) = 5.57 gives p = .018, not .18 (scipy.stats.chi2.sf);
  // t(58) = 0.42 gives d = 0.11 (2t/√df), not 0.74; 20 per group give power .34 at d = 0.5, not .80
  // (scipy.stats.nct); 30 of 120 is 25%, not 40%; t(58) = 1.90 is p = .062, not significant at .10
  // (scipy.stats.t.sf); t(29) = 1.85 one-tailed is p = .037, not .075
  const flagged = (markdown: string) => run(markdown).findings.filter((f) => f.level !== 'note').map((f) => f.ruleId);
  const chi = '## Results\n\nEscalation was more frequent after the training, χ²(1) = 5.57, p = .18.';
  const mood = '## Results\n\nMood did not differ between exercise and stretching, t(58) = 1.90, ns.';
  const cases: Array<[string, string]> = [
    [`## Methods\n\nExact p values are reported unless p < .001.\n\n${chi}`, 'significance-follows-from-statistic'],
    [`## Methods\n\nBaseline characteristics were compared with Fisher's exact test.\n\n${chi}`, 'significance-follows-from-statistic'],
    [`## Methods\n\nAdherence was compared with an exact binomial test against 50%.\n\n${chi}`, 'significance-follows-from-statistic'],
    ['## Introduction\n\nEarlier trials log-transformed cortisol values before analysis.\n\n## Results\n\nAnxiety was lower with fish oil (M = 1.48, SD = 0.78, n = 40) than with placebo (M = 1.79, SD = 0.67, n = 42), t(80) = -2.46, p = .016.', 't-follows-from-descriptives'],
    ['## Methods\n\nScores were log-transformed; means and SDs of the log values are reported.\n\n## Results\n\nAnxiety was lower with fish oil (M = 1.48, SD = 0.78, n = 40) than with placebo (M = 1.79, SD = 0.67, n = 42), t(80) = -2.46, p = .016.', 't-follows-from-descriptives'],
    [`## Methods\n\nStatistical significance was set at α = .10 (two-tailed); interaction effects were also examined.\n\n${mood}`, 'significance-follows-from-t'],
    [`## Methods\n\nAll statistical tests used α = .10, and outliers were retained.\n\n${mood}`, 'significance-follows-from-t'],
    [`## Methods\n\nGroup differences were tested at α = .10; homogeneity of variance was assumed.\n\n${mood}`, 'significance-follows-from-t'],
    ['Peak power did not differ with d = 0.74, t(58) = 0.42, p = .676.', 'effect-size-follows'],
    ['Mood differed less than expected: d = 0.74, t(58) = 0.42, p = .676.', 'effect-size-follows'],
    ['Mood did not differ, t(58) = 0.42, p = .676; the effect we detected was d = 0.74.', 'effect-size-follows'],
    ['20 participants per group give 80% power to detect d = 0.5 (two-sided alpha .05), without adjustment for covariates.', 'power-statement-follows'],
    ['In this trial of cluster headache, 20 patients per group give 80% power to detect d = 0.5 at alpha .05.', 'power-statement-follows'],
    ['We recruited 120 adults, 30 (40%) of whom were women.', 'percentage-matches-count'],
    ['A total of 120 patients completed the study; 30 (40%) were women.', 'percentage-matches-count'],
    ['Of the 40 wards, 12 (45%) units adopted the checklist.', 'percentage-matches-count'],
    ['Wellbeing was higher, t(29) = 1.85, p = .075 one-tailed (p = .15 two-tailed).', 'significance-follows-from-t'],
    ['## Methods\n\nA total of 120 adults were randomised to strength training or advice, stratified by site and sex.\n\n## Results\n\nPain was lower with strength training than with advice, t(78) = -2.43, p = .017.', 'sample-size-agrees-with-df'],
    ['## Methods\n\nA total of 120 adults took part. As in Study 2 of an earlier report, pain was rated daily.\n\n## Results\n\nPain was lower with strength training than with advice, t(78) = -2.43, p = .017.', 'sample-size-agrees-with-df'],
  ];
  for (const [markdown, rule] of cases) {
    it(`still ${rule}: ${markdown.replace(/^## \w+\n\n/, '').slice(0, 70)}`, () => {
      expect(flagged(markdown)).toContain(rule);
    });
  }
  it('a tails word labelling the result\'s own p in brackets, or a bare second p, is read as such', () => {
    expect(flagged('Wellbeing was higher, t(29) = 1.85, p = .075 (one-tailed: p = .037).')).toEqual([]);
    expect(flagged('Wellbeing was higher, t(29) = 1.85, p = .075 (.037 one-tailed).')).toEqual([]);
    expect(flagged('Wellbeing was higher, t(29) = 1.85, p = .037 one-tailed (p = .075 two-tailed).')).toEqual([]);
  });
  it('an ITT n is the n analysed', () => {
    // Student's t from (24.6, 5.1, 32) and (21.9, 4.8, 30): 2.14 on 60 df (scipy.stats.ttest_ind_from_stats); t(55) is a wrong df
    const r = run('Symptom scores were better with the app (M = 24.6, SD = 5.1; ITT n = 32) than with the leaflet (M = 21.9, SD = 4.8; ITT n = 30), t(55) = 2.14, p = .037.');
    expect(levels(r, 'df-follows-from-n')).toEqual(['warning']);
  });
});

describe('words of a model in the result\'s sentence, or in a sentence about the comparisons', () => {
  // (138.2, 15.1, 88) and (133.9, 14.6, 212): Student's t on 298 df; adjusted for k covariates the df is 298 − k
  const result = 'Systolic pressure was higher in lonely participants (M = 138.2, SD = 15.1, n = 88) than in others (M = 133.9, SD = 14.6, n = 212), t(295) = 2.78, p = .006.';
  const of = (markdown: string) => levels(run(markdown), 'df-follows-from-n');
  it('make the df a note: the model has covariates', () => {
    expect(of(result.replace('t(295)', 'adjusted for age, t(297)'))).toEqual(['note']);
    expect(of(`## Methods\n\nAll group comparisons were estimated by linear regression adjusted for age, sex and body-mass index.\n\n## Results\n\n${result}`)).toEqual(['note']);
  });
  it('not said of the comparisons, or in another paragraph of results, they leave the warning', () => {
    expect(of(`## Methods\n\nBlood pressure was measured twice and the mean used.\n\n## Results\n\nIn a regression adjusting for age, loneliness predicted sleep, b = 0.31, SE = 0.12.\n\n${result}`)).toEqual(['warning']);
    expect(of(`## Introduction\n\nEarlier studies estimated group comparisons by linear regression adjusted for age.\n\n## Results\n\n${result}`)).toEqual(['warning']);
  });
});

describe('a model or a transformation said of a measure, for a result that opens with it', () => {
  // (4.2, 1.9, 48) against (5.0, 2.1, 47): Student's t(93) = −1.95, so t(91.4) = −2.26 (p = .026) is a
  // model's; (3.1, 1.2, 40) against (2.4, 1.1, 40): Welch's t(77.4) = 2.72, so t(77.4) = 3.60 (p < .001), beyond the rounding of the printed values, is of
  // the log values (scipy.stats.ttest_ind_from_stats, scipy.stats.t.sf)
  const of = (markdown: string) => levels(run(markdown), 't-follows-from-descriptives');
  const fatigue = 'Fatigue was lower with the exercise programme (M = 4.2, SD = 1.9, n = 48) than with usual care (M = 5.0, SD = 2.1, n = 47), t(91.4) = -2.26, p = .026.';
  const crp = 'CRP was higher in smokers (M = 3.1, SD = 1.2, n = 40) than in non-smokers (M = 2.4, SD = 1.1, n = 40), t(77.4) = 3.60, p < .001.';
  it('makes the t from the descriptives a note', () => {
    expect(of(`## Methods\n\nFatigue was rated weekly for 8 weeks and analysed with a linear mixed model.\n\n## Results\n\n${fatigue}`)).toEqual(['note']);
    expect(of(`## Methods\n\nCRP values were log-transformed before analysis.\n\n## Results\n\n${crp}`)).toEqual(['note']);
  });
  it('said of another measure, or in a discussion, leaves the warning', () => {
    expect(of(`## Methods\n\nAdherence was recorded weekly and analysed with a linear mixed model.\n\n## Results\n\n${fatigue}`)).toEqual(['warning']);
    expect(of(`## Methods\n\nIL-6 values were log-transformed before analysis.\n\n## Results\n\n${crp}`)).toEqual(['warning']);
    expect(of(`## Results\n\n${crp}\n\n## Discussion\n\nCRP was log-transformed in earlier cohorts.`)).toEqual(['warning']);
  });
  it('the whole measure must be named, not its first word; covariates and other studies do not count (review)', () => {
    // (128.4, 11.0, 48) against (134.1, 12.2, 47): t(93) = −2.39; (4.2, 1.9, 48) against (5.0, 2.1, 47): t(93) = −1.95 (scipy.stats.ttest_ind_from_stats)
    expect(of('## Methods\n\nBlood glucose values were log-transformed before analysis.\n\n## Results\n\nBlood pressure was lower with the diet (M = 128.4, SD = 11.0, n = 48) than with usual care (M = 134.1, SD = 12.2, n = 47), t(93) = -3.41, p < .001.')).toEqual(['warning']);
    expect(of('## Methods\n\nBaseline scores were entered as covariates in a linear regression model for each follow-up outcome.\n\n## Results\n\nBaseline anxiety did not differ between the groups (M = 4.2, SD = 1.9, n = 48 vs M = 5.0, SD = 2.1, n = 47), t(93) = -2.95, p = .004.')).toEqual(['warning']);
    expect(of(`## Methods\n\nFatigue was analysed with a linear mixed model in the pilot study that preceded this trial; here, the two arms were compared with Student's t-test.\n\n## Results\n\n${fatigue.replace('t(91.4) = -2.26, p = .026', 't(93) = -2.95, p = .004')}`)).toEqual(['warning']);
  });
  it('each sentence is read once for its measure: thousands of matches in one sentence stay linear', () => {
    const make = (n: number) => `## Methods\n\nFatigue item 0 was log-transformed${Array.from({ length: n }, (_, i) => `, item ${i + 1} was log-transformed`).join('')}.\n\n## Results\n\n${fatigue}\n`;
    expectLinearCheck('log-transformed items in one sentence', make, 2000);
  }, 120_000);
});

describe('a CI named as another kind than estimate ± t × SE', () => {
  // (1240, 410, 45) against (1480, 520, 44): t(87) = −2.42, p = .018 (scipy.stats.ttest_ind_from_stats);
  // a bootstrap interval −452 to −61 is not centred on −240, and need not be
  const of = (markdown: string) => levels(run(markdown), 'ci-agrees-with-result');
  it('"bootstrap 95% CI" makes the finding a note', () => {
    expect(of('Mean cost was 1240 (SD 410, n = 45) for day surgery and 1480 (SD 520, n = 44) for inpatient surgery, t(87) = -2.42, p = .018; difference -240 (bootstrap 95% CI -452 to -61).')).toEqual(['note']);
  });
  it('"after adjustment for baseline" in its sentence: the interval may be of an adjusted difference (a note)', () => {
    // (27.4, 6.2, 55) against (26.1, 6.5, 54): Student's t(107) = 1.07, p = .288 (scipy.stats.ttest_ind_from_stats)
    expect(of('Grip strength was 27.4 kg (SD 6.2, n = 55) with vitamin D and 26.1 kg (SD 6.5, n = 54) with placebo, t(107) = 1.07, p = .288; after adjustment for baseline, the difference was 1.9 kg (95% CI 0.4 to 3.4).')).toEqual(['note']);
  });
  it('a plain 95% CI is still checked', () => {
    expect(of('Mean cost was 1240 (SD 410, n = 45) for day surgery and 1480 (SD 520, n = 44) for inpatient surgery, t(87) = -2.42, p = .018; difference -240 (95% CI -452 to -61).')).toEqual(['warning']);
  });
});

describe('the tests against the bounds of an equivalence margin', () => {
  // t(118) = 3.56: one-tailed p = .0003; t(118) = −1.92: one-tailed .029; t(118) = 0.82: two-tailed .41 (scipy.stats.t)
  it('are one-sided where they are named, though the text says all tests were two-tailed', () => {
    const r = run('## Statistical analysis\n\nAll tests were two-tailed with alpha = .05. Equivalence was assessed with two one-sided tests (TOST) against bounds of ±1.0 points.\n\n## Results\n\nPain scores did not differ between dressings, t(118) = 0.82, p = .41. The dressings were equivalent: the test against the lower bound gave t(118) = 3.56, p < .001, and the test against the upper bound gave t(118) = −1.92, p = .029.');
    expect(r.results.map((x) => x.sidedness.value)).toEqual(['two', 'one', 'one']);
    expect(r.findings.filter((f) => f.level !== 'note')).toEqual([]);
  });
  // t(118) = 0.40: two-tailed p = .690, one-tailed .345; t(118) = 1.99: one-tailed p = .024 (scipy.stats.t.sf)
  it('"both one-sided tests" after a conventional t are the equivalence pair, not its tails', () => {
    const r = run('Healing did not differ, t(118) = 0.40, p = .689, and both one-sided tests rejected non-equivalence (p < .001).');
    expect(r.results[0]?.sidedness.value).toBe('two');
    expect(r.findings.filter((f) => f.level !== 'note')).toEqual([]);
    // a p that neither tail gives still speaks
    expect(run('Healing did not differ, t(118) = 0.40, p = .012, and both one-sided tests rejected non-equivalence (p < .001).').findings.map((f) => f.level)).toContain('error');
  });
  it('"both one-tailed" without words of equivalence ("marginally", a CI\'s "lower bound") still says the tails (review)', () => {
    // t(30) = 2.30: two-tailed p = .029, one-tailed .014; t(30) = 1.80: two-tailed .082, one-tailed .041 (scipy.stats.t.sf)
    const levelsOf = (text: string) => run(text).findings.filter((f) => f.level !== 'note').map((f) => f.level);
    expect(levelsOf('Recall was higher after sleep, t(30) = 1.80, p = .082, and recognition was higher, t(30) = 2.30, p = .029 (both one-tailed; the lower bound of each 95% CI was above zero).')).not.toEqual([]);
    expect(levelsOf('Recognition was higher after sleep, t(30) = 2.30, p = .029, and recall marginally so, t(30) = 1.80, p = .082, both one-tailed.')).toContain('error');
    expect(levelsOf('## Results\n\nBoth one-sided tests favoured sleep. Recognition was higher after sleep, t(30) = 2.30, p = .029.')).not.toEqual([]);
  });
  it('"two one-tailed t-tests" without words of equivalence still say the tails', () => {
    const r = run('We ran two one-tailed t-tests. Healing differed, t(118) = 1.99, p = .024.');
    expect(r.results[0]?.sidedness.value).toBe('one');
    expect(r.findings.filter((f) => f.level !== 'note')).toEqual([]);
  });
});

describe('a test of cluster means', () => {
  // 12 school means, six per arm: t on 10 df; t(10) = 2.41, p = .037 (scipy.stats.t.sf)
  const of = (markdown: string) => levels(run(markdown), 'df-follows-from-n');
  it('counts the clusters: its df beside pupil-level sizes is a note', () => {
    expect(of('Pupils in intervention schools drank fewer sugary drinks (M = 4.1, SD = 2.6, n = 612) than pupils in control schools (M = 5.0, SD = 2.8, n = 598); comparing the 12 school means, t(10) = -2.41, p = .037.')).toEqual(['note']);
  });
  it('said without their number in the result\'s sentence ("on school means"), a note too; in another sentence, not', () => {
    const pupils = 'Pupils in intervention schools drank fewer sugary drinks (M = 4.1, SD = 2.6, n = 612) than pupils in control schools (M = 5.0, SD = 2.8, n = 598)';
    expect(of(`${pupils}; on school means, t(10) = -2.41, p = .037.`)).toEqual(['note']);
    expect(of(`${pupils}; analysed at the school level, t(10) = -2.41, p = .037.`)).toEqual(['note']);
    // words that do not govern the test, or a df no test of a few clusters has (review)
    expect(of(`${pupils}, t(10) = -2.41, p = .037, although school means varied widely.`)).toEqual(['warning']);
    expect(of('Pupils in intervention schools, which were randomised at the school level, drank fewer sugary drinks (M = 4.1, SD = 2.6, n = 612) than pupils in control schools (M = 5.0, SD = 2.8, n = 598), t(1028) = -5.80, p < .001.')).toEqual(['warning']);
    expect(of(`${pupils}, t(1028) = -5.80, p < .001, on school means.`)).toEqual(['warning']);
    expect(of(`School-level means are given in Table 3. ${pupils}, t(10) = -2.41, p = .037.`)).toEqual(['warning']);
  });
  it('a number of cluster means that is not df + 2 leaves the warning', () => {
    expect(of('Pupils in intervention schools drank fewer sugary drinks (M = 4.1, SD = 2.6, n = 612) than pupils in control schools (M = 5.0, SD = 2.8, n = 598); comparing the 20 school means, t(10) = -2.41, p = .037.')).toEqual(['warning']);
  });
});
