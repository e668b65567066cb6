import { ruleTable } from './table.js';

ruleTable('one-tailed-p-is-declared', [
  { name: 'silent one-tailed p (t(30) = 3.25 gives two-tailed .0028)', markdown: 'x, t(30) = 3.25, p = 0.0014.', expect: ['1:4 undeclared-one-tailed'] },
  { name: 'silent one-tailed p that makes it significant', markdown: 'x, t(46) = 1.89, p = .03.', expect: ['1:4 undeclared-one-tailed-changes-significance'] },
  { name: 'declared in the sentence', markdown: 'A one-sided test gave t(30) = 3.25, p = 0.0014.', expect: [] },
  { name: 'declared for the document', markdown: 'All tests were one-tailed.\n\nx, t(30) = 3.25, p = 0.0014.', expect: [] },
  { name: 'declared in front matter', markdown: '---\nplumbline:\n  sidedness: one\n---\nx, t(30) = 3.25, p = 0.0014.', expect: [] },
  { name: 'declared with --tails one', markdown: 'x, t(30) = 3.25, p = 0.0014.', options: { sidedness: 'one' }, expect: [] },
  { name: 'equivalence test named in the sentence before', markdown: 'We ran an equivalence test (TOST). The upper test gave t(97.77) = -2.86, p = .003.', expect: [] },
  { name: 'exact p equal to the opposite tail (1 − half of .673)', markdown: 'x, t(22) = 0.427, p = 0.663.', expect: ['1:4 undeclared-one-tailed-opposite'] },
  { name: 'n.s. never reads as the opposite tail', markdown: 'x, t(113) = 3.56, n.s.', expect: [] },
  { name: 'p > bound never reads as the opposite tail', markdown: 'x, t(113) = 3.56, p > .25.', expect: [] },
  { name: 'two-tailed p is not a one-tailed case', markdown: 'x, t(30) = 3.25, p = 0.0028.', expect: [] },
  { name: 'a p neither reading gives is not this rule', markdown: 'x, t(30) = 3.25, p = 0.02.', expect: [] },
]);
