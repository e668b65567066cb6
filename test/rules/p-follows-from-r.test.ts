import { ruleTable } from './table.js';

// Recomputed p values quoted in names: scipy.stats.t.sf of t = r·√(df/(1 − r²)) (Debian python3-scipy).
ruleTable('p-follows-from-r', [
  { name: 'p that follows (r(48) = .32 gives .0213 to .0259)', markdown: 'x, r(48) = .32, p = .02.', expect: [] },
  { name: 'p that misses without crossing alpha', markdown: 'x, r(48) = .32, p = .002.', expect: ['1:4 mismatch'] },
  { name: 'n printed instead of df (r = −.41, n = 30 gives .0244)', markdown: 'x, r = −.41, n = 30, p = .024.', expect: [] },
  { name: 'n printed, p that misses', markdown: 'x, r = −.41, n = 30, p = .004.', expect: ['1:4 mismatch'] },
  { name: 'a one-tailed p is not taken for an error', markdown: 'x, r(48) = .32, p = .012.', expect: [] },
  { name: 'a bracket holding n is a reading too (r(50) = .32: as df .0187 to .0229, as n .0213 to .0259)', markdown: 'x, r(50) = .32, p = .025.', expect: [] },
  { name: 'neither reading of the bracket fits', markdown: 'x, r(50) = .32, p = .028.', expect: ['1:4 mismatch'] },
  { name: 'a rank correlation speaks only as a note', markdown: 'x, rs(30) = .40, p = .002.', expect: ['1:4 mismatch'] },
  { name: 'r without df or n is not checked', markdown: 'x, r = .32, p = .002.', expect: [] },
]);
