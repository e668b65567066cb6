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

// z and r: p from scipy.stats norm.sf and t.sf with t = r√(df/(1 − r²)), over the printed rounding. z = 2.50: two-tailed
// .0122 to .0126, one-tailed .0061 to .0063. z = 1.80: two-tailed .0711 to .0727. r(48) = .31: two-tailed .0259 to .0375
// as df, .0292 to .0418 as n (df 46). F(1, 38) = 4.21: upper tail .0470 to .0472; χ²(2) = 6.1: .0462 to .0486.
ruleTable('one-tailed-p-is-declared', [
  { name: 'z: a silent one-tailed p', markdown: 'The ratings rose, z = 2.50, p = .006.', expect: [{ at: 'z =', id: 'undeclared-one-tailed' }] },
  { name: 'z: a silent one-tailed p that makes it significant', markdown: 'The ratings rose, z = 1.80, p = .036.', expect: [{ at: 'z =', id: 'undeclared-one-tailed-changes-significance' }] },
  { name: 'r: a silent one-tailed p, under both readings of its bracket', markdown: 'Sleep tracked mood, r(48) = .31, p = .015.', expect: [{ at: 'r(48)', id: 'undeclared-one-tailed' }] },
  { name: 'z: one-tailed in the p\'s own clause', markdown: 'The ratings rose, z = 2.50, p = .006, one-tailed.', expect: [] },
  { name: 'r: declared in the sentence', markdown: 'A one-tailed test showed that sleep tracked mood, r(48) = .31, p = .015.', expect: [] },
  { name: 'z: declared for the document', markdown: 'All tests were one-tailed.\n\nThe ratings rose, z = 2.50, p = .006.', expect: [] },
  { name: 'z: declared with --tails one', markdown: 'The ratings rose, z = 2.50, p = .006.', options: { sidedness: 'one' }, expect: [] },
  { name: 'z and r: the two-tailed p is not a one-tailed case', markdown: 'The ratings rose, z = 2.50, p = .012, and sleep tracked mood, r(48) = .31, p = .030.', expect: [] },
  { name: 'z: a p neither reading gives is p-follows-from-z\'s, not this rule\'s', markdown: 'The ratings rose, z = 2.50, p = .03.', expect: [] },
  {
    name: 'z: one-tailed words about one other test elsewhere are named',
    markdown: '## Methods\n\nHypothesis 2 was tested with a one-tailed test.\n\n## Results\n\nThe ratings rose, z = 2.50, p = .006.',
    expect: [{ at: 'z =', id: 'one-tailed-stated-elsewhere' }],
  },
  { name: 'F and χ² are never read one-tailed (half their p is not a reading)', markdown: 'Groups differed, F(1, 38) = 4.21, p = .0235, and choices differed, χ²(2, N = 120) = 6.1, p = .0237.', expect: [] },
]);
