import { ruleTable } from './table.js';

// Recomputed p values quoted in names: scipy.stats f.sf, chi2.sf, t.sf and norm.sf (Debian python3-scipy).
ruleTable('significance-follows-from-statistic', [
  { name: 'F that is not significant printed as significant (F(1, 38) = 2.10 gives .155)', markdown: 'x, F(1, 38) = 2.10, p = .03.', expect: ['1:4 mismatch'] },
  { name: 'χ² that is significant printed as not (χ²(2) = 6.1 gives .047)', markdown: 'x, χ²(2, N = 120) = 6.1, p = .47.', expect: ['1:4 mismatch'] },
  { name: 'r that is significant printed as n.s.', markdown: 'x, r(48) = .32, n.s.', expect: ['1:4 mismatch'] },
  { name: 'z that is significant printed as not', markdown: 'x, z = 2.31, p = .21.', expect: ['1:4 mismatch'] },
  { name: 'a mismatch on the same side is p-follows-from-f’s', markdown: 'x, F(1, 38) = 4.21, p = .03.', expect: [] },
  { name: 'a one-tailed r p below alpha where two-tailed is above is no flip (r(48) = .25 gives .080 two-tailed, .040 one-tailed)', markdown: 'x, r(48) = .25, p = .04.', expect: [] },
  { name: 'alpha stated in the sentence is used (F(1, 38) = 4.21 gives .047: above .01)', markdown: 'With alpha = .01, x, F(1, 38) = 4.21, p = .004.', expect: ['1:22 mismatch'] },
]);
