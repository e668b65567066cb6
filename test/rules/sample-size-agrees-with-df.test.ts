import { ruleTable } from './table.js';

// df + 2 for two independent groups, df + 1 for one group or pairs; a regression coefficient's
// t has N − k − 1 df for k predictors (common practice, no source).
ruleTable('sample-size-agrees-with-df', [
  { name: 'every t-test implies fewer than the N the Methods state, and nothing says why', markdown: '## Methods\n\nWe recruited 72 participants.\n\n## Results\n\nCyclists were less stressed, t(60) = 2.10, p = .040.', expect: [{ at: '72 participants', id: 'df-imply-other-n' }] },
  { name: 'the result\'s own sentence says how many attended: the text explains the difference', markdown: '## Abstract\n\nWe randomised N = 120 outpatients to a leaflet or no leaflet.\n\n## Results\n\nAt the one-year visit, which 60 patients attended, intentions were stronger with the leaflet, t(58) = 2.31, p = .024.', expect: [] },
  { name: "a regression coefficient's t (b, SE, t(69)) implies no number analysed: with 2 predictors 72 − 3 = 69", markdown: '## Methods\n\nWe recruited 72 participants.\n\n## Results\n\nCycling was associated with lower stress, b = -0.53, SE = 0.26, t(69) = -2.01, p = .049.', expect: [] },
]);
