import { ruleTable } from './table.js';

// Recomputed p values quoted in names were computed with scipy.stats.chi2.sf (Debian python3-scipy).
ruleTable('p-follows-from-chi-square', [
  { name: 'p that follows (χ²(2) = 6.1 gives .0462 to .0486)', markdown: 'x, χ²(2, N = 120) = 6.1, p = .047.', expect: [] },
  { name: 'p that misses without crossing alpha', markdown: 'x, χ²(2, N = 120) = 6.1, p = .02.', expect: ['1:4 mismatch'] },
  { name: 'chi-square spelt out (χ²(1) = 4.3 gives .0381)', markdown: 'x, chi-square(1) = 4.3, p = .04.', expect: [] },
  { name: 'X2 as converters print it (χ²(3) = 9.2 gives .0261 to .0274)', markdown: 'x, X2(3) = 9.2, p = .01.', expect: ['1:4 mismatch'] },
  { name: 'χ2 with the digit flattened', markdown: 'x, χ2(3) = 9.2, p = .027.', expect: [] },
  { name: 'never a one-tailed reading', markdown: 'x, χ²(1) = 4.3, p = .019.', expect: ['1:4 mismatch'] },
  { name: 'without df nothing is checked', markdown: 'x, χ² = 6.1, p = .02.', expect: [] },
]);
