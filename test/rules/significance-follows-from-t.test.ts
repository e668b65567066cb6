import { ruleTable } from './table.js';

// Recomputed p values quoted in names were checked with scipy.stats.t.sf (Debian python3-scipy).
ruleTable('significance-follows-from-t', [
  { name: 'reported significant, recomputed .405', markdown: 'x, t(46) = 0.84, p = .04.', expect: ['1:4 mismatch'] },
  { name: 'reported not significant, recomputed .038', markdown: 'x, t(23) = 2.20, p = .38.', expect: ['1:4 mismatch'] },
  { name: 'n.s. with t(113) = 3.56 (p = .0005)', markdown: 'x, t(113) = 3.56, n.s.', expect: ['1:4 mismatch'] },
  { name: 'recomputed range straddling alpha is not a change (t(46) = 2.01 gives .0497–.0509)', markdown: 'x, t(46) = 2.01, p = .03.', expect: [] },
  { name: 'alpha stated in the text moves the line (.021 is not significant at .01)', markdown: 'Significance was set at α = .01.\n\nx, t(23) = 2.47, p = .005.', expect: ['3:4 mismatch'] },
  { name: 'alpha from the command line or configuration', markdown: 'x, t(23) = 2.47, p = .005.', options: { alpha: 0.01 }, expect: ['1:4 mismatch'] },
  { name: 'alpha .05 by default: same numbers are not a change', markdown: 'x, t(23) = 2.47, p = .005.', expect: [] },
  { name: 'text says one-tailed, p is two-tailed and crosses alpha', markdown: 'One-tailed test: t(20) = 1.80, p = .087.', expect: ['1:18 two-tailed-although-one-stated'] },
  { name: 'consistent result', markdown: 'x, t(23) = 2.47, p = .021.', expect: [] },
  { name: 'impossible p is left to values-are-possible', markdown: 'x, t(9) = 2.89, p = 043.', expect: [] },
]);
