import { ruleTable } from './table.js';

// df + 2 for two independent groups, df + 1 for one group or pairs; a regression coefficient's
// t has N − k − 1 df for k predictors (common practice, no source).
ruleTable('sample-size-agrees-with-df', [
  { name: 'every t-test implies fewer than the N the Methods state, and nothing says why', markdown: '## Methods\n\nWe recruited 72 participants.\n\n## Results\n\nCyclists were less stressed, t(60) = 2.10, p = .040.', expect: [{ at: '72 participants', id: 'df-imply-other-n' }] },
  { name: 'the result\'s own sentence says how many attended: the text explains the difference', markdown: '## Abstract\n\nWe randomised N = 120 outpatients to a leaflet or no leaflet.\n\n## Results\n\nAt the one-year visit, which 60 patients attended, intentions were stronger with the leaflet, t(58) = 2.31, p = .024.', expect: [] },
  { name: "a regression coefficient's t (b, SE, t(69)) implies no number analysed: with 2 predictors 72 − 3 = 69", markdown: '## Methods\n\nWe recruited 72 participants.\n\n## Results\n\nCycling was associated with lower stress, b = -0.53, SE = 0.26, t(69) = -2.01, p = .049.', expect: [] },
  // t(10) = 2.50: two-sided p = .031 (scipy.stats.t.sf(2.5, 10) * 2)
  { name: 'a count of another kind of unit, spelled out, accounts for the df: ward means compared', markdown: '## Abstract\n\nTwelve wards (six per arm) with N = 240 patients took part.\n\n## Results\n\nBecause wards were the unit of randomisation, ward means were compared: satisfaction was higher on huddle wards than on control wards, t(10) = 2.50, p = .031.', expect: [] },
  { name: 'the same count in digits, beside the N of another kind, accounts for it too', markdown: '## Abstract\n\nIn all, 12 wards with N = 240 patients took part.\n\n## Results\n\nSatisfaction was higher on huddle wards, t(10) = 2.50, p = .031.', expect: [] },
  { name: 'a count elsewhere that no test implies explains nothing: still a warning', markdown: '## Abstract\n\nTwelve wards with N = 240 patients took part.\n\n## Results\n\nSatisfaction was higher on huddle wards, t(60) = 2.10, p = .040.', expect: [{ at: 'N = 240', id: 'df-imply-other-n' }] },
]);

// t(23) = 2.06: two-sided p = .051; t(59) = 3.17: p = .0024 (scipy.stats.t.sf). Pairs are the units of a within-pair t.
ruleTable('sample-size-agrees-with-df', [
  { name: 'the members of pairs in brackets ("24 monozygotic twin pairs (48 twins)") are no total against a within-pair df', markdown: '## Methods\n\nWe recruited 24 monozygotic twin pairs (48 twins) discordant for regular exercise. Within-pair differences were analysed with paired t-tests.\n\n## Results\n\nThe within-pair difference was −2.1 mmHg (SD 5.0), t(23) = −2.06, p = .051.', expect: [] },
  { name: 'the pairs are then the total: 24 twin pairs tested as 20 pairs (t(19)) is still reported (second review)', markdown: '## Methods\n\nWe recruited 24 monozygotic twin pairs (48 twins). Within-pair differences were analysed with paired t-tests.\n\n## Results\n\nThe within-pair difference was −2.1 mmHg (SD 5.0), t(19) = −1.88, p = .076.', expect: [{ at: '24 monozygotic twin pairs', id: 'df-imply-other-n' }] },
  { name: 'nor "60 couples (120 individuals)"', markdown: '## Methods\n\nWe enrolled 60 couples (120 individuals) and compared partners within couples.\n\n## Results\n\nWomen reported more household tasks than their partners, t(59) = 3.17, p = .002.', expect: [] },
]);
