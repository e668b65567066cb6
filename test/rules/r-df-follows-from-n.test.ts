import { ruleTable } from './table.js';

// df = n − 2 for a Pearson r (common practice, no source).
ruleTable('r-df-follows-from-n', [
  { name: 'df that is n − 2', markdown: 'x, r(48) = .32, n = 50, p = .02.', expect: [] },
  { name: 'df that is not n − 2', markdown: 'x, r(48) = .32, n = 60, p = .02.', expect: ['1:6 df-not-n-minus-2'] },
  { name: 'no n printed', markdown: 'x, r(48) = .32, p = .02.', expect: [] },
]);
