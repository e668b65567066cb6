import { ruleTable } from './table.js';

// F(1, df) = t(df)² for one comparison (common practice, no source). t = 2.05 is read as 2.045 to
// 2.055, whose squares are 4.1820 to 4.2230 (by hand in python3); scipy.stats.f.sf(4.20, 1, 38)
// = .0474 and 2·scipy.stats.t.sf(2.05, 38) = .0473 (Debian python3-scipy).
ruleTable('f-equals-t-squared', [
  { name: 'an F said to be the same comparison that equals t²', markdown: 'The groups differed, t(38) = 2.05, p = .047 (equivalently F(1, 38) = 4.20).', expect: [] },
  { name: 'an F said to be the same comparison that does not', markdown: 'The groups differed, t(38) = 2.05, p = .047 (equivalently F(1, 38) = 5.20).', expect: [{ at: 'F(1', id: 'mismatch' }] },
  { name: '"that is," after a semicolon', markdown: 'The groups differed, t(38) = 2.05, p = .047; that is, F(1, 38) = 5.20.', expect: [{ at: 'F(1', id: 'mismatch' }] },
  { name: 'the rounding of t reaches F = 4.22 (2.055² = 4.2230)', markdown: 'The groups differed, t(38) = 2.05, p = .047 (equivalently F(1, 38) = 4.22).', expect: [] },
  { name: 'just past it: F = 4.23', markdown: 'The groups differed, t(38) = 2.05, p = .047 (equivalently F(1, 38) = 4.23).', expect: [{ at: 'F(1', id: 'mismatch' }] },
  { name: 'a negative t squares to the same F', markdown: 'The groups differed, t(38) = −2.05, p = .047 (equivalently F(1, 38) = 4.20).', expect: [] },
  { name: 'an F with another df2', markdown: 'The groups differed, t(38) = 2.05, p = .047 (equivalently F(1, 36) = 4.20).', expect: [{ at: 'F(1', id: 'df' }] },
  { name: 'an F with df1 above 1 cannot be one comparison', markdown: 'The groups differed, t(38) = 2.05, p = .047 (equivalently F(2, 38) = 4.20).', expect: [{ at: 'F(2', id: 'df' }] },
  { name: 'an F merely near a t is another test', markdown: 'The groups differed, t(38) = 2.05, p = .047, and the interaction did too, F(1, 38) = 5.20, p = .028.', expect: [] },
  { name: 'an F in brackets without the words is not tied', markdown: 'The groups differed, t(38) = 2.05, p = .047 (F(1, 38) = 5.20 for the interaction).', expect: [] },
]);
