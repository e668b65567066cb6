import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { ruleTable } from './table.js';

// Numbers below were computed with scipy.stats (Debian python3-scipy) from the printed
// descriptives; each name says what the case proves.
const A = '(M = 45.0, SD = 10.1, n = 24)';
const B = '(M = 41.2, SD = 9.8, n = 24)';

ruleTable('t-follows-from-descriptives', [
  { name: 'Student t from the descriptives (1.32)', markdown: `Seated ${A} and standing ${B}, t(46) = 1.32, p = .19.`, expect: [] },
  { name: 'negative t with the groups the other way round', markdown: `Standing ${B} and seated ${A}, t(46) = -1.32, p = .19.`, expect: [] },
  { name: 'a t no variant gives', markdown: `Seated ${A} and standing ${B}, t(46) = 2.31, p = .025.`, expect: [{ at: 't(46) = 2.31', id: 'mismatch' }] },
  { name: 'per-group n stated once', markdown: 'Seated (M = 45.0, SD = 10.1) and standing (M = 41.2, SD = 9.8; n = 24 per group), t(46) = 1.32, p = .19.', expect: [] },
  { name: 'no n printed: every split of df + 2 is tried', markdown: 'Seated (M = 45.0, SD = 10.1) and standing (M = 41.2, SD = 9.8), t(46) = 1.32, p = .19.', expect: [] },
  { name: 'no n printed and no split fits (randomised groups)', markdown: 'Randomised to seated (M = 45.0, SD = 10.1) or standing (M = 41.2, SD = 9.8) desks, t(46) = 4.32, p < .001.', expect: [{ at: 't(46)', id: 'mismatch' }] },
  { name: 'no n printed, no split fits, but the design is unknown and a paired reading is possible', markdown: 'Seated (M = 45.0, SD = 10.1) and standing (M = 41.2, SD = 9.8), t(46) = 4.32, p < .001.', expect: [] },
  { name: 'table of groups beside the test', markdown: '| Group | Mean | SD | n |\n|---|---|---|---|\n| Seated | 45.0 | 10.1 | 24 |\n| Standing | 41.2 | 9.8 | 24 |\n\nThe groups differed little, t(46) = 1.32, p = .19.', expect: [] },
  { name: 'table of groups with a wrong t', markdown: '| Group | Mean | SD | n |\n|---|---|---|---|\n| Seated | 45.0 | 10.1 | 24 |\n| Standing | 41.2 | 9.8 | 24 |\n\nThe groups differed, t(46) = 3.32, p = .002.', expect: ['6:22 mismatch'] },
  { name: 'one "Mean (SD)" column', markdown: '| Group | Mean (SD) | n |\n|---|---|---|\n| Seated | 45.0 (10.1) | 24 |\n| Standing | 41.2 (9.8) | 24 |\n\nThe groups differed little, t(46) = 1.32, p = .19.', expect: [] },
  { name: 'mean ± SD stated for the document', markdown: 'Values are mean ± SD.\n\nSeated 45.0 ± 10.1 (n = 24) and standing 41.2 ± 9.8 (n = 24), t(46) = 1.32, p = .19.', expect: [] },
  { name: 'unstated ± tried both ways', markdown: 'Seated 45.0 ± 2.06 (n = 24) and standing 41.2 ± 2.00 (n = 24), t(46) = 1.32, p = .19.', expect: [] },
  // (127.2 − 150)/(53.2/√41) = −2.744 (common practice, no source)
  { name: '"a mean of 127.2 minutes a week (SD = 53.2)" is one group, tested against "the recommended 150 minutes"', markdown: 'Office staff reported a mean of 127.2 minutes a week (SD = 53.2), below the recommended 150 minutes, t(40) = -2.75, p = .009.', expect: [] },
  { name: 'the same group with a t its mean and SD cannot give against 150', markdown: 'Office staff reported a mean of 127.2 minutes a week (SD = 53.2), below the recommended 150 minutes, t(40) = -3.75, p < .001.', expect: [{ at: 't(40) = -3.75', id: 'mismatch' }] },
  { name: 'one sample against a stated test value', markdown: 'Above the test value of 5 (M = 5.6, SD = 1.9, n = 30), t(29) = 1.73, p = .094.', expect: [] },
  { name: 'one sample with a wrong t', markdown: 'Above the test value of 5 (M = 5.6, SD = 1.9, n = 30), t(29) = 2.73, p = .011.', expect: [{ at: 't(29)', id: 'mismatch' }] },
  { name: 'one sample with no stated reference value is not guessed', markdown: 'Scores were high (M = 5.6, SD = 1.9, n = 30), t(29) = 2.73, p = .011.', expect: [] },
  { name: 'two groups of unknown design that could be paired are not flagged', markdown: 'Before (M = 45.0, SD = 10.1) and after (M = 41.2, SD = 9.8), t(23) = 3.10, p = .005.', expect: [] },
  { name: "Welch's t named, only Student's fits", markdown: "Seated (M = 45.0, SD = 10.1, n = 10) and standing (M = 41.2, SD = 3.0, n = 40), Welch's t(48) = 2.05, p = .046.", expect: [{ at: 't(48)', id: 'named-variant-mismatch' }] },
  { name: 'a mean followed by its unit and a short phrase before its (n, SD) is read as the mean (1.32 fits)', markdown: 'Seated staff logged 45.0 minutes across their shifts (n = 24, SD = 10.1), standing staff 41.2 minutes (n = 24, SD = 9.8), t(46) = 1.32, p = .19.', expect: [] },
  { name: 'a mean followed by its unit and a short phrase, with a t no variant gives', markdown: 'Seated staff logged 45.0 minutes across their shifts (n = 24, SD = 10.1), standing staff 41.2 minutes (n = 24, SD = 9.8), t(46) = 2.31, p = .025.', expect: [{ at: 't(46) = 2.31', id: 'mismatch' }] },
  { name: 'a value after "=" is never taken as the mean of a spread printed after words', markdown: 'Seated staff, t(46) = 2.31 minutes across their shifts (n = 24, SD = 10.1), and standing staff 41.2 minutes (n = 24, SD = 9.8).', expect: [] },
  // Welch df 17.47 and t 1.65 from 7.34 (1.97) and 5.10 (4.68), n = 14 each (scipy.stats.ttest_ind_from_stats, equal_var=False)
  { name: 'no n printed, a fractional df: Welch over the sizes the df allows fits (1.65)', markdown: 'Daily steps: mean (SD) 7.34 (1.97) in the usual-routine arm vs 5.10 (4.68) in the quiet-hour arm; t = 1.65, df = 17.47, P = 0.117.', expect: [] },
  // the smallest Welch |t| any sizes with df 25.72 allow is at n = 26 and 2: 1.309 (scipy.stats.ttest_ind_from_stats, equal_var=False)
  { name: 'no n printed, a fractional df: a t below every size the Welch df allows', markdown: 'Daily steps: mean (SD) 7.34 (1.97) in the usual-routine arm vs 2.98 (4.68) in the quiet-hour arm; t = 0.33, df = 25.72, P = 0.748.', expect: [{ at: 't = 0.33', id: 'mismatch' }] },
  { name: 'three groups and one test: not guessed', markdown: 'A (M = 40.1, SD = 9.2, n = 20), B (M = 43.0, SD = 9.9, n = 20) and C (M = 46.2, SD = 10.4, n = 20), t(38) = 9.01, p < .001.', expect: [] },
]);

ruleTable('spread-kind-matches-t', [
  { name: 'SEs labelled SD', markdown: 'Seated (M = 45.0, SD = 2.06, n = 24) and standing (M = 41.2, SD = 2.00, n = 24), t(46) = 1.32, p = .19.', expect: [{ at: 't(46)', id: 'se-labelled-sd' }] },
  { name: 'SDs labelled SE', markdown: `Seated (M = 45.0, SE = 10.1, n = 24) and standing (M = 41.2, SE = 9.8, n = 24), t(46) = 1.32, p = .19.`, expect: [{ at: 't(46)', id: 'sd-labelled-se' }] },
  { name: 'SEs labelled SE', markdown: 'Seated (M = 45.0, SE = 2.06, n = 24) and standing (M = 41.2, SE = 2.00, n = 24), t(46) = 1.32, p = .19.', expect: [] },
  { name: '± SEM stated beside each value', markdown: 'Seated 45.0 ± 2.06 SEM (n = 24) and standing 41.2 ± 2.00 SEM (n = 24), t(46) = 1.32, p = .19.', expect: [] },
]);

ruleTable('df-follows-from-n', [
  { name: 'n1 + n2 − 2', markdown: `Seated ${A} and standing ${B}, t(46) = 1.32, p = .19.`, expect: [] },
  { name: 'df two short', markdown: `Seated ${A} and standing ${B}, t(44) = 1.32, p = .19.`, expect: [{ at: '44) =', id: 'student' }] },
  { name: 'one group: n − 1', markdown: 'Above the test value of 5 (M = 5.6, SD = 1.9, n = 30), t(30) = 1.73, p = .094.', expect: [{ at: '30) =', id: 'one-group' }] },
  { name: 'Welch df within its range and matching the SDs (71.3)', markdown: "(M = 23.2, SD = 7.0, n = 40) and (M = 18.8, SD = 5.1, n = 40), Welch's t(71.3) = 3.21, p = .002.", expect: [] },
  { name: 'Welch df above n1 + n2 − 2', markdown: "(M = 23.2, SD = 7.0, n = 40) and (M = 18.8, SD = 5.1, n = 40), Welch's t(80.5) = 3.21, p = .002.", expect: [{ at: '80.5', id: 'welch-range' }] },
  { name: 'paired design: n − 1', markdown: 'The same staff before (M = 45.0, SD = 10.1, n = 24) and after (M = 41.2, SD = 9.8, n = 24), paired t(20) = 3.10, p = .005.', expect: [{ at: '20) =', id: 'paired' }] },
]);

ruleTable('design-matches-analysis', [
  { name: 'crossover analysed with 2n − 2', markdown: 'In this crossover, seated weeks (M = 45.0, SD = 10.1, n = 24) and standing weeks (M = 41.2, SD = 9.8, n = 24) gave t(46) = 1.32, p = .19.', expect: [{ at: 't(46)', id: 'paired-analysed-as-independent' }] },
  { name: 'crossover analysed as paired', markdown: 'In this crossover, seated weeks (M = 45.0, SD = 10.1, n = 24) and standing weeks (M = 41.2, SD = 9.8, n = 24) gave t(23) = 3.10, p = .005.', expect: [] },
  { name: 'randomised groups analysed with n − 1', markdown: `Staff randomised to seated ${A} or standing ${B} desks gave t(23) = 1.32, p = .20.`, expect: [{ at: 't(23)', id: 'independent-analysed-as-paired' }] },
  { name: 'no design words: nothing assumed', markdown: `Seated ${A} and standing ${B}, t(23) = 1.32, p = .20.`, expect: [] },
  { name: 'the same units "measured again", analysed with 2n − 2', markdown: 'The 24 nurses were measured again in the last week. Heart rate fell from 78.2 (SD = 6.1) to 74.0 (SD = 6.4), t(46) = 2.12, p = .039.', expect: [{ at: 't(46)', id: 'paired-analysed-as-independent' }] },
  { name: 'the same units by any name, "the same beds were assessed", analysed with 2n − 2', markdown: 'Plant height fell from spring (M = 85.9, SD = 14.4) to autumn (M = 81.9, SD = 12.2, n = 8), the same beds were assessed in spring and autumn, t(14) = -0.60, p = .561.', expect: [{ at: 't(14)', id: 'paired-analysed-as-independent' }] },
  { name: '"from the same ward" is a place, not the same units measured twice', markdown: 'Patients from the same ward were measured by two nurses (M = 85.9, SD = 14.4, n = 8; M = 81.9, SD = 12.2, n = 8), t(14) = -0.60, p = .561.', expect: [] },
  { name: '"measured again if …" is a procedure, not a design', markdown: 'Blood pressure was measured again if the first reading was high. The two wards (n = 24 each) differed, t(46) = 2.12, p = .039.', expect: [] },
]);

ruleTable('paired-correlation-is-possible', [
  { name: 'r above 1', markdown: 'Within-subjects: before (M = 45.0, SD = 6.0) and after (M = 41.2, SD = 12.0), t(23) = 4.50, p < .001.', expect: [{ at: 't(23)', id: 'correlation-above-one' }] },
  { name: 'r possible', markdown: 'Within-subjects: before (M = 45.0, SD = 6.0) and after (M = 41.2, SD = 12.0), t(23) = 2.50, p = .020.', expect: [] },
  { name: 'SEs converted to SDs before the check', markdown: 'Within-subjects: before (M = 45.0, SE = 1.22, n = 24) and after (M = 41.2, SE = 2.45, n = 24), t(23) = 2.50, p = .020.', expect: [] },
  { name: 'independent groups are not checked', markdown: 'Randomised to two desks: (M = 45.0, SD = 6.0, n = 24) and (M = 41.2, SD = 12.0, n = 24), t(46) = 4.50, p < .001.', expect: [] },
]);

ruleTable('ci-agrees-with-result', [
  // One sample: M = 1.62, SD = 0.30, n = 30 against 1.5 gives SE = 0.0548, t = 2.19 and, with
  // t_crit(29) = 2.045 (scipy.stats.t.ppf), the mean's CI 1.51 to 1.73, the difference's 0.01 to 0.23
  { name: 'one sample: the CI of the mean beside a printed test value is read as the mean\'s', markdown: 'Water intake was above the test value of 1.5 L (M = 1.62, SD = 0.30, n = 30), t(29) = 2.19, p = .037, 95% CI [1.51, 1.73].', expect: [] },
  { name: 'one sample: the CI of the difference from the test value is accepted too', markdown: 'Water intake was above the test value of 1.5 L (M = 1.62, SD = 0.30, n = 30), t(29) = 2.19, p = .037, 95% CI [0.01, 0.23].', expect: [] },
  { name: 'one sample: a CI centred on the mean but twice as wide as t allows is reported as too wide', markdown: 'Water intake was above the test value of 1.5 L (M = 1.62, SD = 0.30, n = 30), t(29) = 2.19, p = .037, 95% CI [1.41, 1.83].', expect: [{ at: '95% CI', id: 'width-vs-t' }] },
  { name: 'possibly one sample, no test value printed: a CI far from zero is only a note', markdown: 'Water intake averaged 1.62 L, 95% CI [1.51, 1.73], t(29) = 2.19, p = .037.', expect: [{ at: '95% CI', id: 'width-vs-t' }] },
  { name: 'CI that fits t (SE from the CI gives 2.94)', markdown: 'difference = 3.8, 95% CI [1.2, 6.4], t(46) = 2.94, p = .005.', expect: [] },
  { name: 'CI with the normal critical value (Wald)', markdown: 'b = 0.62, t(3.187) = 2.89, p = .058, 95% CI [0.20, 1.03]', expect: [] },
  { name: 'a group CI right after its mean is not the test CI', markdown: 'Money (M = 251.73, SD = 148.89, 95% CI [198.05, 305.41]) versus buttons (M = 150.11, SD = 116.19), t(66) = 3.15, p = .002.', expect: [] },
  { name: 'CI from the group means (difference −2, CI centred on −4)', markdown: 'First (n = 4, M = 4.00, SD = 2.45) and second (n = 3, M = 6.00, SD = 2.45), t(5) = -1.07, p = .33, 95% CI [-8.24, 0.24].', expect: [{ at: '95% CI', id: 'not-centred' }] },
  { name: 'midpoint used when no estimate is printed', markdown: 'The difference was clear, t(23) = -8.02, p < .001, 95% CI [-18.03, 2.10].', expect: [{ at: '95% CI', id: 'width-vs-t' }] },
  { name: '90% CI is not compared with alpha .05', markdown: 'difference = 3.8, 90% CI [0.3, 7.3], t(46) = 1.82, p = .075.', expect: [] },
]);

ruleTable('effect-size-follows', [
  // d = (127.2 − 150)/53.2 = −0.43 and t/√n = −2.75/√41 = −0.43 (common practice, no source)
  { name: 'a one-sample d against "the recommended 150 minutes", its mean printed as "a mean of 127.2 minutes a week (SD = 53.2)"', markdown: 'Office staff reported a mean of 127.2 minutes a week (SD = 53.2), below the recommended 150 minutes, t(40) = -2.75, p = .009, d = -0.43.', expect: [] },
  // 18.4 (6.1), n = 34 vs 22.1 (6.3), n = 28: Student's t = -2.342, d = -0.598, g = -0.590
  // (scipy.stats.ttest_ind_from_stats; d from the pooled SD, g with the exact J); the sizes are not printed
  { name: 'group sizes not printed: the splits with which the means and SDs give t bound d, and g = 0.59 fits', markdown: 'Randomised to the moulded plug (M = 18.4, SD = 6.1) or the foam plug (M = 22.1, SD = 6.3), t(60) = -2.34, p = .023, g = -0.59.', expect: [] },
  { name: 'group sizes not printed: a g of 0.98 that no split giving t can give (any split alone would reach it)', markdown: 'Randomised to the moulded plug (M = 18.4, SD = 6.1) or the foam plug (M = 22.1, SD = 6.3), t(60) = -2.34, p = .023, g = -0.98.', expect: [{ at: 'g = -0.98', id: 'mismatch' }] },
  { name: 'pooled d from the means (0.38)', markdown: `Seated ${A} and standing ${B}, t(46) = 1.32, p = .19, d = 0.38.`, expect: [] },
  { name: "Hedges' g (0.38 × J)", markdown: `Seated ${A} and standing ${B}, t(46) = 1.32, p = .19, g = 0.37.`, expect: [] },
  { name: 'd_z for a paired test (3.49/√23)', markdown: 'Paired, t(22) = 3.49, p = .002, d = 0.73.', expect: [] },
  { name: 'd with unknown sizes: 2t/√df', markdown: 'x, t(38) = 2.03, p = .049, d = 0.65.', expect: [] },
  { name: 'd far from every definition', markdown: `Seated ${A} and standing ${B}, t(46) = 1.32, p = .19, d = 1.10.`, expect: [{ at: 'd = 1.10', id: 'mismatch' }] },
  // 2t/√df = 2·1.47/√184 = 0.217 and any split of 186 gives at least that; d_z = 1.47/√185 = 0.108,
  // and a paired d_av or d_rm is at most 2·d_z (common practice, no source)
  { name: 'design not stated, a d that only paired data give: a note asking which design', markdown: 'Women scored higher than men, t(184) = 1.47, p = .144, d = 0.013.', expect: [{ at: 'd = 0.013', id: 'fits-only-paired' }] },
  { name: 'the same d with the design stated as paired is accepted', markdown: 'The same staff were rated twice, t(184) = 1.47, p = .144, d = 0.013.', expect: [] },
  { name: 'design not stated, a d that independent groups give is accepted', markdown: 'Women scored higher than men, t(184) = 1.47, p = .144, d = 0.22.', expect: [] },
  { name: 'negative d matches in size', markdown: `Standing ${B} and seated ${A}, t(46) = -1.32, p = .19, d = -0.38.`, expect: [] },
]);

ruleTable('mean-is-possible-for-integers', [
  { name: 'impossible mean of 19 single items (hand-checked: 2.39 × 19 = 45.41, no integer rounds there)', markdown: 'The number of reminders averaged M = 2.39 (SD = 1.10, n = 19).', expect: [{ at: '2.39', id: 'grim-mean' }] },
  { name: 'possible mean (45/19 = 2.368 → 2.37, hand-checked)', markdown: 'The number of reminders averaged M = 2.37 (SD = 1.07, n = 19).', expect: [] },
  // 2.39 is impossible as a mean of whole numbers over 19 (above); as a rate or a mean over occasions it has no whole-number grain
  { name: 'a count per hour is a rate: no whole-number grain', markdown: 'The number of reminders per hour was M = 2.39 (SD = 1.10, n = 19).', expect: [] },
  { name: 'a count per 100 discharges is a rate', markdown: 'The number of calls per 100 discharges was M = 2.39 (SD = 1.10, n = 19).', expect: [] },
  { name: 'a count averaged over rounds is a mean', markdown: 'The number of errors was counted on each of four rounds and averaged over the rounds for each nurse. Errors: M = 2.39 (SD = 1.10, n = 19).', expect: [] },
  { name: 'a single-item rating averaged across visits is a mean', markdown: 'Satisfaction was rated on a single 7-point item, averaged across the three visits. Satisfaction: M = 2.39 (SD = 1.10, n = 19).', expect: [] },
  { name: 'counts said whole per shift stay whole', markdown: 'Errors per shift were recorded as whole-number counts. Errors: M = 2.39 (SD = 1.10, n = 19).', expect: [{ at: '2.39', id: 'grim-mean' }] },
  { name: 'k items: 3.48 × 19 × 3 = 198.36; 198/57 = 3.474 and 199/57 = 3.491, so 3.48 is impossible (hand-checked)', markdown: 'A 3-item scale (M = 3.48, SD = 1.20, n = 19).', expect: [{ at: '3.48', id: 'grim-mean' }] },
  { name: 'on a 4-item scale 3.48 is impossible too (264/76 = 3.474, 265/76 = 3.487; hand-checked)', markdown: 'A 4-item scale (M = 3.48, SD = 1.20, n = 19).', expect: [{ at: '3.48', id: 'grim-mean' }] },
  { name: 'on a 5-item scale 3.48 is possible (331/95 = 3.484; hand-checked)', markdown: 'A 5-item scale (M = 3.48, SD = 1.20, n = 19).', expect: [] },
  { name: 'configuration declares whole-number data', markdown: 'Comfort (M = 3.48, SD = 1.47, n = 19).', options: { config: { integerItems: 1 } }, expect: [{ at: '3.48', id: 'grim-mean' }] },
  { name: 'not applied to continuous measures', markdown: 'Speed in m/s (M = 3.48, SD = 1.47, n = 19).', expect: [] },
  { name: 'not applied to percentages', markdown: 'The number of correct trials was M = 33.88% (SD = 31%, n = 19).', expect: [] },
  { name: 'a single five-point item declared in the Methods binds by name in the Results (3.47 × 20 = 69.4; 69/20 = 3.45, 70/20 = 3.50; hand-checked)', markdown: '## Methods\n\nComfort was rated on a single five-point item.\n\n## Results\n\nComfort averaged M = 3.47 (SD = 1.10, n = 20).', expect: [{ at: '3.47', id: 'grim-mean' }] },
  { name: 'a possessive before the measure ("each worker\'s breaks") does not hide its name', markdown: '## Methods\n\nEach worker\'s breaks were counted over one shift, so the score is a whole number.\n\n## Results\n\nBreaks per shift averaged M = 3.47 (SD = 1.10, n = 20).', expect: [{ at: '3.47', id: 'grim-mean' }] },
  { name: 'a possessive before a generic head ("each child\'s score") names no measure, so another score is not tied to it', markdown: '## Methods\n\nEach child\'s score on the pain item is a whole number.\n\n## Results\n\nThe anxiety score averaged M = 3.47 (SD = 1.10, n = 20).', expect: [] },
  { name: 'GRIMMER: SD 1.28 impossible with mean 3.47, n = 19 (possible SDs 1.26, 1.31; enumerated with Python)', markdown: 'A single item scored 1–7 (M = 3.47, SD = 1.28, n = 19).', expect: [{ at: '1.28', id: 'grimmer-sd' }] },
]);

ruleTable('percentage-matches-count', [
  { name: '10 of 24 is 41.7%, not 40%', markdown: 'Of the 24 staff, 10 (40%) reported pain.', expect: ['1:18 percent-mismatch'] },
  { name: '10 of 24 printed as 42%', markdown: 'Of the 24 staff, 10 (42%) reported pain.', expect: [] },
  { name: 'group n in the sentence', markdown: 'In the poster ward (n = 32), 21 (65.6%) complied.', expect: [] },
  // 18 of 30 is 60%, 18 of 60 is 30%: the percentage is of the arm, whose size is not tied to the count
  { name: 'a count said of one arm is a percentage of that arm, not of the sentence\'s total', markdown: 'Of the 60 patients randomised, 18 (60%) in the sock arm and 12 (40%) in the control arm were women.', expect: [] },
  { name: 'a count of the whole sentence\'s total is still checked', markdown: 'Of the 60 patients randomised, 18 (60%) were women.', expect: ['1:32 percent-mismatch'] },
  { name: 'two possible denominators: no guess', markdown: 'Of 24 staff and 30 patients, 10 (40%) reported pain.', expect: [] },
  { name: 'no denominator: no guess', markdown: 'Ten reported pain, 10 (40%).', expect: [] },
  // 55/202 = 27.23% (common practice, no source)
  { name: '"55 of 202 (27.2%)": the count is 55 and its denominator 202, not the N of a neighbouring test', markdown: 'Omissions: 31 of 210 (14.8%) on Ward A against 55 of 202 (27.2%) on Ward B, χ²(1, N = 412) = 9.69, p = .002.', expect: [] },
  { name: '"55 out of 202 (37.2%)" does not round from 55/202', markdown: 'Omissions: 55 out of 202 (37.2%) on Ward B.', expect: ['1:12 percent-mismatch'] },
]);

ruleTable('power-statement-follows', [
  { name: "Cohen's example: 64 per group for d = 0.5", markdown: '80% power to detect d = 0.5 at α = .05 (two-sided) needed 64 per group.', expect: [] },
  // power at d = 0.5, two-sided α = .05 (scipy.stats.nct, two groups): 40 per group .598, 64 .802, 80 .882, 100 .940
  { name: 'a bound: more than 80% power from 80 per group (.882)', markdown: 'With 80 participants per group, the trial had more than 80% power to detect d = 0.5 at a two-sided alpha of .05.', expect: [] },
  { name: 'a bound: at least 80% power that 40 per group cannot give (.598)', markdown: 'With 40 participants per group, the trial had at least 80% power to detect d = 0.5 at a two-sided alpha of .05.', expect: [{ at: '80% power', id: 'n-does-not-give-power' }] },
  { name: 'an n that allows for 20% attrition: 80 × 0.8 = 64', markdown: 'To have 80% power to detect d = 0.5 at a two-sided alpha of .05 after allowing for 20% attrition, we recruited 80 participants per group.', expect: [] },
  { name: 'an n that allows for 20% attrition but does not give the power: 100 × 0.8 = 80 (.882)', markdown: 'To have 80% power to detect d = 0.5 at a two-sided alpha of .05 after allowing for 20% attrition, we recruited 100 participants per group.', expect: [{ at: '80% power', id: 'n-does-not-give-power' }] },
  { name: 'attrition allowed for at no stated rate, or unequal groups: not modelled, not flagged', markdown: 'To have 80% power to detect d = 0.5 at a two-sided alpha of .05 after allowing for attrition, we recruited 100 participants per group. With a 2:1 allocation, 96 intervention and 48 control participants give 80% power to detect d = 0.5 (two-sided alpha = .05).', expect: [] },
  { name: 'within one of the exact answer (393 vs 394)', markdown: '80% power to detect d = 0.2 at α = .05 needed 393 per group.', expect: [] },
  { name: 'a total N is halved', markdown: 'A total of 128 participants gives 80% power to detect d = 0.5.', expect: [] },
  { name: 'paired design', markdown: 'A paired design with 34 pairs gives 80% power to detect d = 0.5 at α = .05.', expect: [] },
  { name: 'power stated for an n (power .70 with 50 per group)', markdown: 'With 50 per group we had 70% power to detect d = 0.5.', expect: [] },
  { name: 'an n too small for the stated power', markdown: '80% power to detect d = 0.5 at α = .05 (two-sided) needed 40 per group.', expect: ['1:1 n-does-not-give-power'] },
  { name: 'one-sided alpha makes 51 per group enough', markdown: '80% power to detect d = 0.5 at α = .05 (one-sided) needed 51 per group.', expect: [] },
]);

ruleTable('descriptives-link-is-unambiguous', [
  { name: 'three groups and one test', markdown: 'A (M = 40.1, SD = 9.2, n = 20), B (M = 43.0, SD = 9.9, n = 20) and C (M = 46.2, SD = 10.4, n = 20), t(38) = 2.01, p = .052.', expect: [{ at: 't(38)', id: 'ambiguous-link' }] },
  { name: 'two tests sharing a paragraph of descriptives', markdown: 'Groups: A (M = 40.1, SD = 9.2, n = 20) and B (M = 43.0, SD = 9.9, n = 20). Fatigue differed, t(38) = 0.96, p = .34. Alertness did not, t(38) = 0.51, p = .61.', expect: [{ at: 't(38) = 0.96', id: 'ambiguous-link' }, { at: 't(38) = 0.51', id: 'ambiguous-link' }] },
  { name: 'one test with its two groups', markdown: 'A (M = 40.1, SD = 9.2, n = 20) and B (M = 43.0, SD = 9.9, n = 20), t(38) = 0.96, p = .34.', expect: [] },
]);

describe('a d that fits only an unstated paired design is a note, never a warning', () => {
  it('is a note whose message says what was tried and what the text does not say', () => {
    const f = checkSource('x.md', 'Women scored higher than men, t(184) = 1.47, p = .144, d = 0.013.\n').findings.filter((x) => x.ruleId === 'effect-size-follows');
    expect(f.map((x) => x.level)).toEqual(['note']);
    expect(f[0]?.message).toContain('the text does not state the design');
    expect(f[0]?.message).toContain('d = 2t/√df: 0.216 to 0.2175');
  });
});

describe('an interval that may be a one-sample mean\'s, with no test value printed, is never more than a note', () => {
  it('says why it could not be read with certainty', () => {
    const f = checkSource('x.md', 'Water intake averaged 1.62 L, 95% CI [1.51, 1.73], t(29) = 2.19, p = .037.\n').findings.filter((x) => x.ruleId === 'ci-agrees-with-result');
    expect(f.map((x) => x.level)).toEqual(['note']);
    expect(f[0]?.message).toContain('no test value is printed');
  });
  it('with the design stated as two independent groups the same interval is a warning', () => {
    const f = checkSource('x.md', 'The two randomised groups differed in water intake, 95% CI [1.51, 1.73], t(29) = 2.19, p = .037.\n').findings.filter((x) => x.ruleId === 'ci-agrees-with-result');
    expect(f.map((x) => x.level)).toEqual(['warning']);
  });
});

describe('power-statement-follows quotes the statement it recomputes', () => {
  it('as a quotation without its closing full stop', () => {
    const r = checkSource('x.md', 'For the paired comparison, 12 pickers give 90% power to detect d = 0.7 (α = .05).\n');
    const f = r.findings.filter((x) => x.ruleId === 'power-statement-follows');
    expect(f.map((x) => x.messageId)).toEqual(['n-does-not-give-power']);
    expect(f[0]?.message).toMatch(/^Reported "For the paired comparison, 12 pickers give 90% power to detect d = 0\.7 \(α = \.05\)"\. Recomputed/);
  });
});

describe('"±" said to stand for neither an SD nor an SE (invented cases, probing)', () => {
  // 17.3 ± 1.86 (n = 22) and 14.1 ± 2.09 (n = 21) as CI half-widths give SDs 4.19 and 4.59 (half-width / t.ppf(.975, n − 1) × √n,
  // scipy), and Student t(41) = 2.39; read as SDs or SEs they give t = 5.3 or 1.1: no certain reading
  const levels = (markdown: string) => checkSource('x.md', `${markdown}\n`).findings.filter((f) => f.ruleId === 't-follows-from-descriptives').map((f) => f.level);
  it('makes a recomputation from them a note, whatever the multiple or interval named', () => {
    expect(levels('Recovery was higher after immersion (17.3 ± 1.86, n = 22) than after rest (14.1 ± 2.09, n = 21), t(41) = 2.38, p = .022; values are means ± half-width of the 95% CI.')).toEqual(['note']);
    expect(levels('Recovery was higher after immersion (17.3 ± 1.79, n = 22) than after rest (14.1 ± 2.01, n = 21), t(41) = 2.38, p = .022 (mean ± 2 SE).')).toEqual(['note']);
  });
  it('leaves "mean ± SD" as SDs', () => {
    expect(levels('Recovery was higher after immersion (17.3 ± 1.86, n = 22) than after rest (14.1 ± 2.09, n = 21), t(41) = 2.38, p = .022 (mean ± SD).')).toEqual(['warning']);
  });
});

describe('second review of the probing fixes (invented cases): words that only look like the new cues', () => {
  const of = (markdown: string, rule: string) => checkSource('x.md', `${markdown}\n`).findings.filter((f) => f.ruleId === rule).map((f) => f.level);
  // power at d = 0.5, two-sided α = .05 (scipy.stats.nct): 40 per group .598, 64 .802, 71 .841
  it('a weight loss is no attrition, and a withdrawal outcome no allowance: the power statement is still checked', () => {
    expect(of('Participants lost weight; a 10% weight loss was the outcome. With 64 participants per group the trial had 80% power to detect d = 0.5 at a two-sided alpha of .05.', 'power-statement-follows')).toEqual([]);
    expect(of('The outcome was withdrawal symptoms. With 40 participants per group the trial had 80% power to detect d = 0.5 at a two-sided alpha of .05.', 'power-statement-follows')).toEqual(['warning']);
  });
  it('the printed n may be the one needed before the loss', () => {
    expect(of('64 participants per group give 80% power to detect d = 0.5 at a two-sided alpha of .05; allowing for 20% attrition, we will recruit 80 per group.', 'power-statement-follows')).toEqual([]);
  });
  it('a mean across people is no mean over occasions, and a response rate no rate of the measure', () => {
    // 2.39 × 19 = 45.41: no whole number of errors gives it (above)
    expect(of('Each nurse reported the number of errors as a whole-number count; averaged across nurses, errors were M = 2.39 (SD = 1.10, n = 19).', 'mean-is-possible-for-integers')).toEqual(['warning']);
    expect(of('The number of reminders was recorded, with a response rate of 95%: M = 2.39 (SD = 1.10, n = 19).', 'mean-is-possible-for-integers')).toEqual(['warning']);
  });
  it('"before and after corrective surgery" is two measurements', () => {
    expect(of('All 30 patients were assessed before and after corrective surgery. Pain fell after surgery (n = 30), t(58) = 2.34, p = .023.', 'design-matches-analysis')).toEqual(['warning']);
  });
});

describe('a mean the text says is adjusted, modelled or pooled over imputations (invented cases, probing)', () => {
  const of = (markdown: string) => checkSource('x.md', `${markdown}\n`).findings.filter((f) => f.ruleId === 'mean-is-possible-for-integers').map((f) => f.level);
  // GRIM (common practice, no source): means of 25 whole numbers are multiples of 0.04, so 1.37
  // is none (1.36, 1.40); of 24, multiples of 1/24 (2.083, 2.125), so 2.11 is none
  const declared = '## Methods\n\nThe outcome was the number of falls over 12 months, a whole-number count.';
  it('in its own sentence: the finding is a note that says so', () => {
    expect(of(`${declared}\n\n## Results\n\nThe adjusted mean number of falls was 1.37 (SD 1.42, n = 25) with exercise and 2.11 (SD 1.63, n = 24) with usual care.`)).toEqual(['note', 'note']);
  });
  it('in a sentence that reports no statistic: the same', () => {
    expect(of(`${declared} Missing outcomes were handled by multiple imputation.\n\n## Results\n\nThe mean number of falls was 1.37 (SD 1.42, n = 25) with exercise.`)).toEqual(['note']);
    expect(of(`${declared} Model-estimated means are shown.\n\n## Results\n\nThe number of falls was M = 1.37 (SD 1.42, n = 25) with exercise.`)).toEqual(['note']);
  });
  it('without such words, or with them beside another statistic only, a plain mean is still a warning', () => {
    expect(of(`${declared}\n\n## Results\n\nThe mean number of falls was 1.37 (SD 1.42, n = 25) with exercise.`)).toEqual(['warning']);
    expect(of(`${declared}\n\n## Results\n\nThe mean number of falls was 1.37 (SD 1.42, n = 25) with exercise. Adjusted means gave the same picture, t(47) = 2.10, p = .041.`)).toEqual(['warning']);
  });
});
