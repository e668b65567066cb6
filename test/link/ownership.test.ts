import { describe, expect, it } from 'vitest';
import { checkSource, type FileReport } from '../../src/engine/index.js';

/**
 * Which printed numbers belong to which test (the clause model) and which statements apply
 * to a result. The numbers are invented; each t, d and CI was computed for the case by hand
 * from the textbook formulas (common practice, no source): d = t·√(1/n1 + 1/n2), the CI of a
 * difference = estimate ± t_crit·SE with SE = estimate / t.
 */
const run = (markdown: string): FileReport => checkSource('x.md', `${markdown}\n`);
const warnings = (r: FileReport) => r.findings.filter((f) => f.level !== 'note').map((f) => `${f.ruleId}/${f.messageId}@${r.source.slice(f.span.start, f.span.end)}`);

describe('each number is tied to its own clause', () => {
  it('two tests in one sentence, each followed by its own d: each d is checked against its own t', () => {
    // t(40) = 2.50 with 21 + 21: d = 0.77; t(40) = 0.50: d = 0.15
    const r = run('A rose, t(40) = 2.50, p = .017, d = 0.77, and B fell, t(40) = 0.50, p = .62, d = 0.15.');
    expect(r.results.map((x) => x.context.effectSizes.map((e) => `${e.printed}/${e.basis}`))).toEqual([['d = 0.77/clause'], ['d = 0.15/clause']]);
    expect(warnings(r)).toEqual([]);
  });
  it('a d that its own t cannot give is found even when a neighbouring test could give it', () => {
    const r = run('A rose, t(40) = 2.50, p = .017, d = 0.77, and B fell, t(40) = 0.50, p = .62, d = 0.77.');
    expect(warnings(r)).toEqual(['effect-size-follows/mismatch@d = 0.77']);
    expect(r.findings.find((f) => f.ruleId === 'effect-size-follows')?.span.start).toBe(r.source.lastIndexOf('d = 0.77'));
  });
  it('the CI after d is the CI of d, not of the mean difference', () => {
    const r = run('Recall improved, t(58) = 2.10, p = .040, d = 0.54, 95% CI [0.02, 1.06].');
    expect(r.results[0]?.context.intervals?.map((i) => i.of)).toEqual(['effect-size']);
    expect(r.results[0]?.context.interval).toBeUndefined();
    expect(warnings(r)).toEqual([]);
  });
  it('a CI after d that cannot hold d is read as the CI of the difference, and only with doubt', () => {
    // difference 72.4 − 64.9 = 7.5, t(60) = 2.42: SE = 3.099, t_crit(60) = 2.0003, CI 1.30 to 13.70
    const ok = run('The poster group scored higher (M = 72.4, SD = 11.8, n = 32) than the prompt group (M = 64.9, SD = 12.6, n = 30), t(60) = 2.42, p = .019, d = 0.62, 95% CI [1.30, 13.70].');
    expect(ok.results[0]?.context.intervals?.map((i) => `${i.of}/${i.certain}`)).toEqual(['estimate/false']);
    // the JSON keeps the reason beside the uncertain tie
    expect(ok.results[0]?.context.intervals?.[0]?.doubt).toContain('it follows d = 0.62, which it cannot hold');
    expect(ok.findings.filter((f) => f.ruleId === 'ci-agrees-with-result')).toEqual([]);
    // the same interval moved off the difference: a note that says why it is not certain
    const off = run('The poster group scored higher (M = 72.4, SD = 11.8, n = 32) than the prompt group (M = 64.9, SD = 12.6, n = 30), t(60) = 2.42, p = .019, d = 0.62, 95% CI [3.30, 15.70].');
    const f = off.findings.filter((x) => x.ruleId === 'ci-agrees-with-result');
    expect(f.map((x) => `${x.messageId}/${x.level}`)).toEqual(['not-centred/note']);
    expect(f[0]?.message).toContain('it follows d = 0.62, which it cannot hold');
  });
  it('a CI after d that holds d (either sign) stays the CI of d', () => {
    const r = run('Recall fell, t(58) = -2.10, p = .040, d = 0.54, 95% CI [-1.06, -0.02].');
    expect(r.results[0]?.context.intervals?.map((i) => `${i.of}/${i.certain}`)).toEqual(['effect-size/true']);
    expect(r.results[0]?.context.intervals?.[0]).not.toHaveProperty('doubt');
  });
  it('in a table row, a t owns the d of its own cell, not the d of another statistic in the next cell', () => {
    const r = run('| Parameter | Model | Algorithm |\n|---|---|---|\n| C | G²(1) = 6.43, p = .011, d = 0.364 | t(195) = 2.39, p = .018, d = 0.153 |');
    expect(r.results.map((x) => x.context.effectSizes.map((e) => `${e.printed}/${e.basis}`))).toEqual([['d = 0.153/clause']]);
  });
  it('in a table row, a d in a cell of its own belongs to the row’s t', () => {
    const r = run('| Measure | Test | Effect |\n|---|---|---|\n| Recall | t(40) = 2.50, p = .017 | d = 0.77 |');
    expect(r.results.map((x) => x.context.effectSizes.map((e) => `${e.printed}/${e.basis}`))).toEqual([['d = 0.77/table-row']]);
  });
  it('two CIs in one result: the difference and then d', () => {
    // difference 3.1, t(58) = 2.10: SE = 1.476, t_crit(58) = 2.0017, CI 0.15 to 6.05
    const r = run('Recall improved by MD = 3.1, 95% CI [0.15, 6.05], t(58) = 2.10, p = .040, d = 0.54, 95% CI [0.02, 1.06].');
    expect(r.results[0]?.context.intervals?.map((i) => i.of)).toEqual(['estimate', 'effect-size']);
    expect(r.results[0]?.context.interval?.printed).toBe('95% CI [0.15, 6.05]');
    expect(warnings(r)).toEqual([]);
  });
  it('several regression results in one sentence: each CI goes with the b of its own clause', () => {
    // b = 0.24, t = 4.80 → SE 0.05, CI 0.14 to 0.34; b = 0.37, t = 7.40 → SE 0.05, CI 0.27 to 0.47
    const r = run('Contact predicted trust, b = 0.24, t(600) = 4.80, p < .001, 95% CI [0.14, 0.34], and need fulfilment did too, b = 0.37, t(600) = 7.40, p < .001, 95% CI [0.27, 0.47].');
    expect(r.results.map((x) => x.context.estimate?.printed)).toEqual(['b = 0.24', 'b = 0.37']);
    expect(r.results.map((x) => x.context.interval?.printed)).toEqual(['95% CI [0.14, 0.34]', '95% CI [0.27, 0.47]']);
    expect(warnings(r)).toEqual([]);
  });
  it('another test statistic ends the clause: an F test and its CI are not the t-test\'s', () => {
    const r = run('Recall improved, t(40) = 2.10, p = .042; the interaction was weak, F(1, 40) = 4.41, p = .042, η² = .10, 95% CI [.01, .25].');
    expect(r.results).toHaveLength(1);
    expect(r.results[0]?.context.intervals).toBeUndefined();
    expect(r.results[0]?.context.effectSizes).toEqual([]);
  });
  it('a p after another statistic is that statistic\'s, not the t-test\'s', () => {
    const r = run('The t-test gave t(40) = 2.10, and the correlation was r(40) = .30, p = .06.');
    expect(r.results[0]?.p).toBeUndefined();
  });
  it('a d in the next sentence of a paragraph with one test is tied by the paragraph only: a mismatch is a note', () => {
    const r = run('Recall improved, t(58) = 2.10, p = .040. The effect was large, d = 2.50.');
    expect(r.results[0]?.context.effectSizes.map((e) => [e.basis, e.certain])).toEqual([['paragraph', false]]);
    const f = r.findings.find((x) => x.ruleId === 'effect-size-follows');
    expect(f?.level).toBe('note');
    expect(f?.uncertain?.[0]).toMatch(/tied to the test only by its paragraph/);
  });
  it('a Welch df is never read as n1 + n2 − 2 when d is recomputed from t', () => {
    // Welch t(21.6) = 2.64 with groups of 8 and 20: d = 2.64·√(1/8 + 1/20) = 1.10
    const r = run("Minutes standing differed, Welch's t(21.6) = 2.64, p = .015, d = 1.10.");
    expect(warnings(r)).toEqual([]);
  });
});

describe('descriptives outside the test\'s own lead are certain only when the lead refers back to them', () => {
  // 24.0 (SD 5.0, n 30) against 23.6 (SD 5.2, n 30) gives Student's t = 0.30 (common practice,
  // no source: t = (M1 − M2)/(s_p·√(2/n))), far from the printed 2.60
  const baseline = 'Before the programme the two wards scored 24.0 (SD = 5.0, n = 30) and 23.6 (SD = 5.2, n = 30).';
  const levels = (r: FileReport) => r.findings.filter((f) => f.ruleId === 't-follows-from-descriptives').map((f) => f.level);
  it('a following sentence that names its own time and change: the means may be of another time, so only a note', () => {
    const r = run(`${baseline} By the third month the audited ward reported fewer falls, t(58) = 2.60, p = .012.`);
    expect(r.results[0]?.context.descriptives?.certain).toBe(false);
    expect(r.results[0]?.context.descriptives?.doubt).toContain('"third month audited falls"');
    expect(levels(r)).toEqual(['note']);
    expect(r.findings[0]?.message).toContain('"third month audited falls"');
  });
  it('a following sentence in the words of reporting alone refers back to them: a warning', () => {
    const r = run(`${baseline} The difference was significant, t(58) = 2.60, p = .012.`);
    expect(r.results[0]?.context.descriptives?.certain).toBe(true);
    expect(levels(r)).toEqual(['warning']);
  });
  it('descriptives before ", but" in the same sentence, and a lead about another outcome: only a note', () => {
    const r = run('Staffing levels were alike (M = 24.0, SD = 5.0, n = 30, and M = 23.6, SD = 5.2, n = 30), but falls were rarer on the audited ward, t(58) = 2.60, p = .012.');
    expect(levels(r)).toEqual(['note']);
  });
  it('descriptives before ", but the difference …" stay certain', () => {
    const r = run('The audited ward scored 24.0 (SD = 5.0, n = 30) and the other ward 23.6 (SD = 5.2, n = 30), but the difference was significant, t(58) = 2.60, p = .012.');
    expect(levels(r)).toEqual(['warning']);
  });
  it('a group described after ", and" inside the test\'s own lead keeps the tie certain', () => {
    const r = run('The audited ward scored 24.0 (SD = 5.0, n = 30), and the other ward scored 23.6 (SD = 5.2, n = 30), t(58) = 2.60, p = .012.');
    expect(levels(r)).toEqual(['warning']);
  });
  it('a group\'s words are read over at most 600 characters of its sentence: a lead word printed further back leaves only a note', () => {
    // the bounded window keeps a sentence of thousands of groups linear (bench figure 6)
    const tail = 'were 24.0 (SD = 5.0, n = 30) and 23.6 (SD = 5.2, n = 30). Falls differed, t(58) = 2.60, p = .012.';
    const near = run(`Falls on the two wards, counted by ${Array.from({ length: 40 }, (_, i) => `item ${i + 1}`).join(', ')}, ${tail}`);
    expect(levels(near)).toEqual(['warning']);
    const far = run(`Falls on the two wards, counted by ${Array.from({ length: 90 }, (_, i) => `item ${i + 1}`).join(', ')}, ${tail}`);
    expect(far.results[0]?.context.descriptives?.doubt).toContain('"falls" do not appear there');
    expect(levels(far)).toEqual(['note']);
  });
});

describe('statements apply only where they are about the analysis', () => {
  it('"one-sided" in other prose is not a statement about the tests', () => {
    const r = run('A literature search may result in a one-sided report of the field.\n\nRecall improved, t(30) = 2.10, p = .022.');
    expect(r.results[0]?.sidedness).toMatchObject({ value: 'two', basis: 'default' });
  });
  it('a statement about every test applies to the document', () => {
    const r = run('All tests were one-tailed.\n\nRecall improved, t(30) = 2.10, p = .022.');
    expect(r.results[0]?.sidedness).toMatchObject({ value: 'one', basis: 'document-text' });
  });
  it('a statement about one test in another paragraph is not used', () => {
    const r = run('Hypothesis 2 was tested with a one-tailed t-test.\n\nRecall improved, t(30) = 2.10, p = .022.');
    expect(r.results[0]?.sidedness).toMatchObject({ value: 'two', basis: 'default' });
  });
  it('a statement in the paragraph that introduces the result applies to it', () => {
    const r = run('Only a rise was predicted, so the test was one-tailed. Recall improved, t(30) = 2.10, p = .022.');
    expect(r.results[0]?.sidedness).toMatchObject({ value: 'one', basis: 'paragraph' });
  });
  it('an equivalence test in the sentence before makes either reading acceptable, not a one-tailed claim', () => {
    const r = run('The equivalence test (TOST) was significant. A null hypothesis test of the same samples was significant too, t(50.52) = 2.958, p = 0.0047.');
    expect(r.results[0]?.sidedness.basis).toBe('equivalence-test');
    expect(warnings(r)).toEqual([]);
  });
  it('the alpha of a power calculation is not the significance level of the tests', () => {
    const r = run('A sample of 5 per group gives 90% power for d = 2.0 (two-sided α = .01).\n\nRecall rose, t(8) = 2.50, p = .037.');
    expect(r.results[0]?.alpha).toMatchObject({ value: 0.05, basis: 'default' });
  });
  it('the tails of a power calculation are not the tails of the tests, in the paragraph or the document', () => {
    // t(46) = 2.10: two-tailed p = .041, one-tailed .021 (scipy.stats.t.sf(2.10, 46) = 0.0206)
    for (const text of [
      'Twenty-four per arm gave 80% power to detect d = 0.7 with a one-tailed α of .05.\n\nRecall improved, t(46) = 2.10, p = .041.',
      'Twenty-four per arm gave 80% power to detect d = 0.7 with a one-tailed α of .05. Recall improved, t(46) = 2.10, p = .041.',
    ]) {
      const r = run(text);
      expect(r.results[0]?.sidedness).toMatchObject({ value: 'two', basis: 'default' });
      expect(warnings(r)).toEqual([]);
    }
  });
  it('a p that only a one-tailed test gives, beside a one-tailed power calculation, gets a note naming the calculation', () => {
    const r = run('Twenty-four per arm gave 80% power to detect d = 0.7 with a one-tailed α of .05. Recall improved, t(46) = 2.10, p = .021.');
    expect(warnings(r)).toEqual([]);
    expect(r.findings.map((f) => `${f.ruleId}/${f.messageId}`)).toContain('one-tailed-p-is-declared/one-tailed-power-calculation');
  });
  it('a statement limited to some tests applies to no result beyond its own sentence: a p it would explain gets a note, a two-tailed p stays right', () => {
    // t(28) = 2.10: two-tailed .0444 to .0453, one-tailed .0222 to .0227 (scipy.stats.t.sf, t from 2.095 to 2.105)
    for (const words of [
      'One-tailed tests were used for the secondary outcomes.',
      'For the exploratory analyses only, tests were one-tailed.',
      'One-tailed tests were used in Study 2.',
      'All tests were one-tailed, except for the manipulation check.',
      'One-tailed tests were used where a direction was predicted.',
      'Tests were one-tailed only for the planned comparisons.',
    ]) {
      for (const layout of ['\n\n', ' ']) {
        const r = run(`${words}${layout}The primary outcome fell, t(28) = 2.10, p = .045. The other outcome fell, t(28) = 2.10, p = .023.`);
        expect(r.results.map((x) => x.sidedness.basis)).toEqual(['default', 'default']);
        expect(warnings(r)).toEqual([]);
        expect(r.findings.map((f) => `${f.ruleId}/${f.level}`)).toEqual(['one-tailed-p-is-declared/note']);
      }
    }
    // the same words said of every test still apply to the document
    expect(run('All tests were one-tailed.\n\nThe primary outcome fell, t(28) = 2.10, p = .023.').results[0]?.sidedness).toMatchObject({ value: 'one', basis: 'document-text' });
  });
  it('a limited alpha is not the document\'s either', () => {
    const r = run('In Study 2, alpha was set at .01 for all tests.\n\nThe primary outcome fell, t(28) = 2.10, p = .045.');
    expect(r.results[0]?.alpha).toMatchObject({ value: 0.05, basis: 'default' });
  });
  it('a tails word in a result sentence does not make a statement about every test', () => {
    const r = run('Planned comparisons showed a rise (t(48) = 7.66, p < .0001, one-tailed).\n\nRecall improved, t(30) = 2.10, p = .045.');
    expect(r.results[1]?.sidedness.basis).toBe('default');
    expect(warnings(r)).toEqual([]);
  });
});

describe('a comparison of the two groups units were randomised to is between independent groups', () => {
  const methods = '## Methods\n\nStaff were randomly assigned to the incentive group or the no-incentive group; within each group the same staff were also measured before and after.\n\n## Results\n\n';
  it('each group of descriptives carries one of the two names: independent, from the Methods statement', () => {
    // 19 + 19 staff: Student df = 36; df = 18 is the df of 19 pairs (common practice, no source)
    const r = run(`${methods}Sick days, the incentive group: M = 2.53, SD = 1.39, n = 19; the no-incentive group: M = 2.42, SD = 1.30, n = 19. The difference was small, t(18) = 0.24, p = .81.`);
    expect(r.results[0]?.context.design).toMatchObject({ value: 'independent', basis: 'methods', printed: 'assigned to the incentive group or the no-incentive group' });
    expect(warnings(r)).toContain('design-matches-analysis/independent-analysed-as-paired@t(18) = 0.24, p = .81');
  });
  it('names said after the numbers count ("7.34 (1.97) in the usual-routine group")', () => {
    const r = run('## Methods\n\nNurses were randomly assigned to the quiet-hour or the usual-routine group.\n\n## Results\n\nDaily steps: mean (SD) 7.34 (1.97) in the usual-routine group vs 6.98 (1.68) in the quiet-hour group; t = 0.65, df = 25, P = 0.52.');
    expect(r.results[0]?.context.design).toMatchObject({ value: 'independent', basis: 'methods' });
  });
  it('a change within one of the groups is not a comparison of the groups ("incentive" is not in "no-incentive")', () => {
    const r = run(`${methods}In the incentive group, alertness rose from before (M = 3.10, SD = 0.80) to after (M = 3.50, SD = 0.70), t(18) = 2.30, p = .034.`);
    expect(r.results[0]?.context.design.value).not.toBe('independent');
  });
  it('"at the first visit" is a time, not an order of conditions: the randomised groups stay independent', () => {
    const r = run('Job satisfaction at the first visit was lower in one group (M = 3.40, SD = 0.78, n = 27) than in the other (M = 3.44, SD = 0.65, n = 27) (between the randomly assigned groups); t = -0.19, df = 26, p = 0.85.');
    expect(r.results[0]?.context.design.value).toBe('independent');
    expect(warnings(r)).toContain('design-matches-analysis/independent-analysed-as-paired@t = -0.19, df = 26, p = 0.85');
  });
  it('an order of conditions (a crossover) names no independent groups', () => {
    const r = run('## Methods\n\nNurses were randomly assigned to the quiet condition or the usual condition first, then crossed over.\n\n## Results\n\nScores were higher in the quiet condition (M = 3.9, SD = 0.6, n = 51) than in the usual condition (M = 3.4, SD = 0.6), t(50) = 3.67, p < .001.');
    expect(r.results[0]?.context.design.value).not.toBe('independent');
  });
});

describe('the design comes from beside the result, else from the Methods of a single study', () => {
  it('design words beside another result in the paragraph are that result\'s', () => {
    const r = run('Scores rose for the same staff measured twice (n = 20), t(19) = 2.40, p = .027. Typing was faster in the standing office (M = 50.1, SD = 5.0, n = 20) than in the seated office (M = 46.3, SD = 5.2, n = 20), t(38) = 2.36, p = .024.');
    expect(r.results.map((x) => x.context.design.value)).toEqual(['paired', 'unknown']);
  });
  it('a design the Methods state for the whole study applies to results that say nothing', () => {
    const r = run('## Design\n\nEach nurse completed both conditions in random order (a crossover design).\n\n## Results\n\nScores were higher in the quiet condition (M = 3.9, SD = 0.6, n = 51) than in the usual condition (M = 3.4, SD = 0.6), t(100) = 3.67, p < .001.');
    expect(r.results[0]?.context.design).toMatchObject({ value: 'paired', basis: 'methods' });
    expect(warnings(r)).toContain('design-matches-analysis/paired-analysed-as-independent@t(100) = 3.67, p < .001');
  });
  it('Methods that describe both designs give none', () => {
    const r = run('## Design\n\nStaff were randomly assigned to two groups; within each group the same staff were measured twice.\n\n## Results\n\nScores differed (M = 3.9, SD = 0.6, n = 51; M = 3.4, SD = 0.6), t(100) = 3.67, p < .001.');
    expect(r.results[0]?.context.design.basis).toBe('default');
  });
  it('Methods that name Welch\'s or Student\'s test for some comparisons and paired tests for others give none', () => {
    const methods = '## Statistical analysis\n\nNight and day workers were compared with Welch\'s t-test. Pain at baseline and at twelve weeks was compared with a paired t-test.\n\n## Results\n\n';
    const r = run(`${methods}Sleep was shorter on nights (M = 5.9, SD = 0.9, n = 38) than on days (M = 6.4, SD = 0.8, n = 45), t(81) = -2.68, p = .009.`);
    expect(r.results[0]?.context.design.basis).toBe('default');
    // "paired Student's t-test" names a paired test, so it does not contradict a paired Methods
    const paired = run('## Methods\n\nThe same workers were measured twice and compared with a paired Student\'s t-test.\n\n## Results\n\nPain fell (M = 3.9, SD = 0.6; M = 3.4, SD = 0.6), t(50) = 3.67, p < .001.');
    expect(paired.results[0]?.context.design).toMatchObject({ value: 'paired', basis: 'methods' });
  });
  it('a paired design read from words does not hold for two groups printed with different sizes', () => {
    const r = run('## Statistics\n\nProtocols were compared with paired t-tests.\n\n## Results\n\nThe gain was 1.61 cm (SD = 1.27, n = 14) in men and 0.21 cm (SD = 1.61, n = 10) in women, t(22) = 2.39, p = .026.');
    expect(r.results[0]?.context.design.value).toBe('unknown');
    // the test's own name is not overruled: units may have been lost between the measurements
    const named = run('The gain was 1.61 cm (SD = 1.27, n = 14) and 0.21 cm (SD = 1.61, n = 10), paired t(9) = 2.39, p = .041.');
    expect(named.results[0]?.context.design.value).toBe('paired');
  });
  it('a sentence about one study ("Experiment 2 used a within-participants design") gives no design to the other results of its paragraph', () => {
    const r = run('In Experiment 1, loud rooms slowed proofreading (M = 41.2, SD = 6.1 vs M = 36.0, SD = 5.9), t(58) = 3.35, p = .001. Experiment 2 used a within-participants design with the same people in both rooms.');
    expect(r.results[0]?.context.design.value).toBe('unknown');
    const plain = run('Loud rooms slowed proofreading (M = 41.2, SD = 6.1 vs M = 36.0, SD = 5.9), t(29) = 3.35, p = .002. The same people were tested in both rooms.');
    expect(plain.results[0]?.context.design).toMatchObject({ value: 'paired', basis: 'paragraph' });
  });
  it('a document of several studies takes no design from any one study\'s Methods', () => {
    const r = run('## Study 1 Methods\n\nParticipants were randomly assigned to two groups.\n\n## Study 1 Results\n\nA rose, t(40) = 2.10, p = .042.\n\n## Study 2 Methods\n\nEach participant completed both conditions.\n\n## Study 2 Results\n\nRatings differed (M = 6.13, SD = 0.51; M = 2.01, SD = 0.35), t(29) = 34.74, p < .001.');
    expect(r.results.map((x) => x.context.design.basis)).toEqual(['default', 'default']);
  });
});

describe('design words count only where they say units were measured twice, or kept apart', () => {
  const design = (text: string) => run(`${text} Scores differed (M = 3.9, SD = 0.6; M = 3.4, SD = 0.6), t(50) = 3.67, p < .001.`).results[0]?.context.design.value;
  it('"paired with a peer tutor" pairs people for a treatment: no design', () => {
    expect(design('Pupils were paired with a Year 9 peer tutor for ten weeks.')).toBe('unknown');
    expect(design('Scores were compared with paired t-tests.')).toBe('paired');
  });
  it('"pre-test" alone names one time; the sentence must name both', () => {
    expect(design('At pre-test, the tutored pupils were tested in the hall.')).toBe('unknown');
    expect(design('Pupils were tested at pre-test and post-test.')).toBe('paired');
  });
  it('"staff hired before and after the change" are two cohorts, not one measured twice', () => {
    expect(design('Staff hired before and after the rota change were compared.')).toBe('unknown');
    expect(design('Pain was rated before and after the rota change.')).toBe('paired');
  });
  it('"each person took part in one role only" and "each participant received one of" are not paired', () => {
    expect(design('Each person took part in one role only.')).toBe('unknown');
    expect(design('Each patient received one of the two dressings.')).toBe('unknown');
    expect(design('Each patient received both dressings in turn.')).toBe('paired');
  });
  it('independent samples with a word between ("two independent school samples") are independent', () => {
    expect(design('We compared two independent school samples.')).toBe('independent');
  });
});

describe('a statement about every test keeps its reach beside words that limit something else (invented cases, second review)', () => {
  it('an exclusion of participants, a justification or an aside limits no test', () => {
    for (const words of [
      'All tests were one-tailed, and analyses were run after excluding two participants who withdrew.',
      'All tests were one-tailed, as is appropriate when the hypotheses are directional.',
      'Apart from age, which was log-transformed, all variables were analysed as recorded and all tests were one-tailed.',
    ]) {
      expect(run(`${words}\n\nThe primary outcome fell, t(28) = 2.10, p = .023.`).results[0]?.sidedness).toMatchObject({ value: 'one', basis: 'document-text' });
    }
    expect(run('All tests used alpha = .01; every participant completed the study except one.\n\nThe primary outcome fell, t(28) = 2.10, p = .045.').results[0]?.alpha).toMatchObject({ value: 0.01, basis: 'document-text' });
  });
});

describe('a paragraph statement about one test, or about a kind of test, where the paragraph reports several (invented cases, probing)', () => {
  // t(30) = 1.80: two-tailed .0818, one-tailed .0409; t(30) = 0.95: two-tailed .3497 (scipy.stats.t.sf)
  it('is tied to none of them: a p only it would explain gets a note, a two-tailed p stays right', () => {
    for (const words of ['The preregistered hypothesis was tested one-tailed.', 'Confirmatory tests were one-tailed.']) {
      const r = run(`${words} Fatigue was lower on the first ward, t(30) = 1.80, p = .041. In an exploratory analysis, sleep did not differ, t(30) = 0.95, p = .35.`);
      expect(r.results.map((x) => x.sidedness.basis)).toEqual(['default', 'default']);
      expect(warnings(r)).toEqual([]);
      expect(r.findings.map((f) => `${f.ruleId}/${f.level}`)).toEqual(['one-tailed-p-is-declared/note']);
    }
  });
  it('still applies to the one result of its paragraph', () => {
    const r = run('The preregistered hypothesis was tested one-tailed. Fatigue was lower on the first ward, t(30) = 1.80, p = .041.');
    expect(r.results[0]?.sidedness).toMatchObject({ value: 'one', basis: 'paragraph' });
  });
});

describe('design words apply only to the comparison they describe (invented cases, probing)', () => {
  // Student t for (412, 48, 20) and (400, 47, 20): 0.799, p = .43; for (14.8, 3.9, 26) and (12.2, 4.1, 26): 2.34, p = .023 (scipy.stats.ttest_ind_from_stats)
  const dma = (r: FileReport) => r.findings.filter((f) => f.ruleId === 'design-matches-analysis').map((f) => f.level);
  it("words naming another test in the sentence, or in another statistic's clause, are not this result's", () => {
    const r = run('Within the yoga group pain fell (paired t(29) = −4.24, p < .001), and the yoga group (n = 30) improved more than the usual-care group (n = 30), t(58) = −2.25, p = .028.');
    expect(r.results[1]?.context.design.value).not.toBe('paired');
    expect(dma(r)).toEqual([]);
  });
  it('words in the lead of a result are its own, though the clause of the statistic before reaches over them', () => {
    const r = run('The first pair differed (t(27) = 2.20, p = .037), but another paired t-test suggests that the third pair did not differ (t(27) = 0.23, p = .818).');
    expect(r.results[1]?.context.design).toMatchObject({ value: 'paired', basis: 'sentence' });
  });
  it('"before and after adjustment" is two steps of an analysis, not two measurements', () => {
    const r = run('Nurses who had worked abroad (M = 14.8, SD = 3.9, n = 26) reported more confidence than those who had not (M = 12.2, SD = 4.1, n = 26), t(50) = 2.34, p = .023, both before and after adjustment for age.');
    expect(r.results[0]?.context.design.value).not.toBe('paired');
    expect(dma(r)).toEqual([]);
  });
  it('two groups whose sizes add up to the units the design words count split those units: the comparison is between them', () => {
    const within = run('## Methods\n\nIn this within-subject study, 40 participants completed both the caffeine and the placebo session.\n\n## Results\n\nWomen (M = 412, SD = 48, n = 20) and men (M = 400, SD = 47, n = 20) did not differ at the placebo session, t(38) = 0.80, p = .43.');
    expect(within.results[0]?.context.design.value).toBe('unknown');
    expect(dma(within)).toEqual([]);
    const paragraph = run('All 52 residents were assessed before and after the installation. Residents on the lit corridor (n = 26) had fewer events than those on the unlit corridor (n = 26), t(50) = 2.34, p = .023.');
    expect(dma(paragraph)).toEqual([]);
    // the count spelled out, as a sentence must open: the same (invented probe)
    const worded = run('## Methods\n\nForty participants took part in this within-subject study; each completed both the caffeine and the placebo session.\n\n## Results\n\nWomen (n = 20) and men (n = 20) did not differ in placebo-session reaction time, t(38) = 0.80, p = .43.');
    expect(worded.results[0]?.context.design.value).toBe('unknown');
    expect(dma(worded)).toEqual([]);
    // the same units measured twice, counted once: still paired, and its 2n − 2 df still a warning
    const paired = run('All 26 residents were assessed before and after the installation. Events fell from before (M = 14.8, SD = 3.9, n = 26) to after (M = 12.2, SD = 4.1, n = 26), t(50) = 2.34, p = .023.');
    expect(dma(paired)).toEqual(['warning']);
  });
  it('one arm switching treatment is not units measured under both conditions', () => {
    const switched = run('Confidence at six months was higher in the mentoring arm (M = 14.8, SD = 3.9, n = 26) than in the control arm (M = 12.2, SD = 4.1, n = 26), t(50) = 2.34, p = .023, although the control arm later crossed over to mentoring.');
    expect(switched.results[0]?.context.design.value).not.toBe('paired');
    expect(dma(switched)).toEqual([]);
    const crossover = run('Each nurse crossed over to the other condition after a washout week. Confidence was higher with mentoring (M = 14.8, SD = 3.9, n = 26) than without it (M = 12.2, SD = 4.1, n = 26), t(50) = 2.34, p = .023.');
    expect(dma(crossover)).toEqual(['warning']);
  });
});

describe('numbers between two tests of a sentence (invented cases, probing)', () => {
  // t(58): −2.3 ± 2.0017 × (2.3 / 2.25) = −4.35 to −0.25, so the CI fits t(58), not t(29) (t critical from scipy.stats.t.ppf)
  it('a CI after a semicolon, in the words leading up to the next test, may be that test\'s: only a note against the test before', () => {
    const r = run('Pain in the usual-care group barely changed (paired t(29) = −1.12, p = .27); the between-group difference in change, −2.3 points (95% CI −4.34 to −0.26), was significant, t(58) = −2.25, p = .028.');
    expect(r.results[0]?.context.intervals?.[0]).toMatchObject({ certain: false });
    expect(warnings(r)).toEqual([]);
  });
  it('a d right after its own p, before the next test, stays certain', () => {
    const r = run('Scores differed in alertness, t(36) = 3.03, p = .005, d = 0.50, in anxiety at week 9, t(36) = -0.32, p = .75, d = -0.05, and in reaction time, t(33) = 1.27, p = .21, d = 0.22.');
    expect(r.results.map((x) => x.context.effectSizes.map((e) => e.certain))).toEqual([[true], [true], [true]]);
  });
  it('effect sizes listed together after the tests of a sentence are tied to none with certainty', () => {
    // d from t: 2·2.27/√76 = 0.52 and 2·0.43/√76 = 0.099 (common practice, no source); the list is in order
    const r = run('Self-efficacy, t(76) = 2.27, p = .026, and sleep, t(76) = 0.43, p = .67, differed by d = 0.51 and d = 0.10, respectively.');
    expect(warnings(r)).toEqual([]);
    expect(r.results[1]?.context.effectSizes.map((e) => e.certain)).toEqual([false, false]);
  });
});

describe('second review of the scope fixes (invented cases)', () => {
  // t(30) = 1.80: two-tailed .0818, one-tailed .0409 (scipy.stats.t.sf)
  it('a kind of test named in another clause does not limit a statement about every test', () => {
    const r = run('All tests were one-tailed; primary outcomes are listed in Table 1.\n\nFatigue fell, t(30) = 1.80, p = .082.');
    expect(r.results[0]?.sidedness).toMatchObject({ value: 'one', basis: 'document-text' });
  });
  it('a paragraph statement that names no single test applies to all its results', () => {
    const r = run('We tested one-tailed. Fatigue fell, t(30) = 1.80, p = .082. Sleep did not change, t(30) = 0.95, p = .35.');
    expect(r.results.map((x) => x.sidedness.basis)).toEqual(['paragraph', 'paragraph']);
    const a = run('Differences with p < .01 were deemed significant. Fatigue fell, t(30) = 2.30, p < .01. Sleep did not change, t(30) = 0.95, p = .35.');
    expect(a.results.map((x) => x.alpha.value)).toEqual([0.01, 0.01]);
  });
});

describe('a comparison of two occasions is not the Methods\' comparison of arms (invented cases, probing)', () => {
  // Methods: a two-arm trial. Results: one arm against itself, baseline to week 8.
  const trial = '## Methods\n\nSixty inpatients were randomised to yoga (n = 30) or usual care (n = 30).\n\n## Results\n\n';
  // t(29) = 2.93: two-sided p = .0065 (scipy.stats.t.sf(2.93, 29) * 2); a paired t of 2.93 from these
  // means and SDs needs an SD of the differences of 4.86 (2.6 · √30 / 2.93), a correlation of some .52 between the occasions: possible
  it('groups labelled by two occasions, before their numbers or right after them, leave the design unknown', () => {
    for (const text of [
      'In the yoga arm, pain fell from baseline (M = 18.2, SD = 5.1) to week 8 (M = 15.6, SD = 4.8), t(29) = 2.93, p = .007.',
      'In the yoga arm, pain fell from M = 18.2 (SD = 5.1) at baseline to M = 15.6 (SD = 4.8) at week 8, t(29) = 2.93, p = .007.',
      'Among the 30 yoga patients, pain scores went from admission (M = 18.2, SD = 5.1) to discharge (M = 15.6, SD = 4.8), t(29) = 2.93, p = .007.',
    ]) {
      const r = run(`${trial}${text}`);
      expect(r.results[0]?.context.descriptives?.groups.length).toBe(2);
      expect(r.results[0]?.context.design.value).toBe('unknown');
      expect(warnings(r)).toEqual([]);
    }
    // words of repeated measurement in its own sentence make it paired, as before
    const words = run(`${trial}Among the 30 yoga patients, pain scores went from pre-test (M = 18.2, SD = 5.1) to post-test (M = 15.6, SD = 4.8), t(29) = 2.93, p = .007.`);
    expect(words.results[0]?.context.design).toMatchObject({ value: 'paired', basis: 'sentence' });
    expect(warnings(words)).toEqual([]);
  });
  it('a t that no correlation between the occasions gives is still a warning', () => {
    const r = run(`${trial}In the yoga arm, pain fell from baseline (M = 18.2, SD = 5.1) to week 8 (M = 15.6, SD = 4.8), t(29) = 100.00, p < .001.`);
    expect(warnings(r)).toEqual(['t-follows-from-descriptives/mismatch@t(29) = 100.00, p < .001']);
  });
  it('the same occasion on both sides is a comparison of the arms: the Methods\' design holds', () => {
    // Student t for (15.6, 4.8, 30) against (18.2, 5.1, 30): −2.03, p = .047 (scipy.stats.ttest_ind_from_stats)
    const r = run(`${trial}Pain was lower in the yoga arm at week 8 (M = 15.6, SD = 4.8) than in usual care at week 8 (M = 18.2, SD = 5.1), t(58) = 2.93, p = .005.`);
    expect(r.results[0]?.context.design).toMatchObject({ value: 'independent', basis: 'methods' });
    expect(warnings(r)).toEqual(['t-follows-from-descriptives/mismatch@t(58) = 2.93, p = .005']);
  });
});
