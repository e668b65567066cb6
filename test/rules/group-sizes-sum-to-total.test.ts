import { ruleTable } from './table.js';

// Sums are simple arithmetic on the printed sizes (common practice, no source).
ruleTable('group-sizes-sum-to-total', [
  { name: 'two groups that add up to the total', markdown: 'We enrolled N = 60 residents, n = 31 in the garden group and n = 29 in the reading group.', expect: [] },
  { name: 'two groups that do not add up, and nothing says who was left out', markdown: 'We enrolled N = 60 residents, n = 31 in the garden group and n = 25 in the reading group.', expect: [{ at: 'N = 60', id: 'sum-differs' }] },
  { name: 'the screened total and the eligible ones randomised: the text says who was left out', markdown: 'We screened N = 212 patients; 80 were eligible and were randomised to socks (n = 40) or usual care (n = 40).', expect: [] },
  { name: 'a size stated for each arm says how the total splits; the counts of men inside the arms are not groups', markdown: 'We randomised N = 64 adults, n = 32 to each arm; n = 12 of the choir arm and n = 10 of the waiting list were men.', expect: [] },
  { name: 'sizes followed by "of the" are parts of a group, never groups of the total', markdown: 'We enrolled N = 60 residents, n = 30 in the garden group and n = 30 in the reading group; n = 14 of the gardeners and n = 9 of the readers lived alone.', expect: [] },
]);

ruleTable('group-sizes-sum-to-total', [
  { name: '"of whom" counts a part of a group', markdown: 'We enrolled N = 40 workers, n = 20 on the early shift and n = 20 on the late shift, n = 7 of whom were new.', expect: [] },
  { name: 'a group written "from the" group is still a group', markdown: 'At follow-up, N = 65 employees returned the questionnaire: n = 21 from the early group and n = 41 from the late group.', expect: [{ at: 'N = 65', id: 'sum-differs' }] },
  { name: 'three sizes, none of whose pairs add up to the total', markdown: 'We enrolled N = 60 residents, n = 31 in the garden group, n = 25 in the reading group and n = 3 in the third.', expect: [{ at: 'N = 60', id: 'sum-differs' }] },
]);

ruleTable('group-sizes-sum-to-total', [
  { name: '"each holding 30 plants" counts within every plot: not the total the groups of plots add up to', markdown: 'Forty plots, each holding 30 plants, were randomly assigned to straw mulch (n = 20) or bare soil (n = 20).', expect: [] },
  { name: 'a sentence counting two kinds of unit (plots and plants) does not say which the groups are of', markdown: 'Forty plots (a total of 1,200 plants) were randomly assigned to straw mulch (n = 20) or bare soil (n = 20).', expect: [] },
  { name: 'a total of the one kind of unit the sentence names is still checked', markdown: 'In all, 30 plants were randomly assigned to straw mulch (n = 20) or bare soil (n = 20).', expect: [{ at: '30 plants', id: 'sum-differs' }] },
]);

ruleTable('group-sizes-sum-to-total', [
  { name: 'a count in a group\'s bracket after its n says how the group is made up, not a total', markdown: 'Sixty adults were randomised to coaching (n = 30; 18 women) or usual care (n = 30; 16 women).', expect: [] },
  { name: 'the same after a comma, or in a bracket of its own', markdown: 'Sixty adults were randomised to coaching (n = 30, 18 women) or usual care (n = 30 (16 women)).', expect: [] },
  { name: 'a total stated beside such groups is still checked', markdown: 'A total of 64 adults were randomised to coaching (n = 30; 18 women) or usual care (n = 30; 16 women).', expect: [{ at: '64 adults', id: 'sum-differs' }] },
]);
