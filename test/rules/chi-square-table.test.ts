import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { ruleTable } from './table.js';

// df = (r − 1)(c − 1) (common practice, no source). p values quoted were computed with
// scipy.stats.chi2.sf (Debian python3-scipy): χ²(2) = 9.40 gives .0091, χ²(3) = 9.40 gives .0244.
ruleTable('chi-square-df-follows-from-table', [
  { name: 'df that fits a stated 2 × 3 table', markdown: 'The outcome was cross-tabulated in a 2 × 3 contingency table, χ2(2, N = 150) = 9.40, p = .009.', expect: [] },
  { name: 'df that does not fit a stated 2 × 3 table', markdown: 'The outcome was cross-tabulated in a 2 × 3 contingency table, χ2(3, N = 150) = 9.40, p = .024.', expect: [{ at: '3, N', id: 'mismatch' }] },
  { name: 'x for ×, "2 x 2 table"', markdown: 'Counts formed a 2 x 2 table, χ2(2, N = 150) = 9.40, p = .009.', expect: [{ at: '2, N', id: 'mismatch' }] },
  { name: '"3-by-4 cross-tabulation"', markdown: 'A 3-by-4 cross-tabulation gave χ2(6, N = 200) = 12.60, p = .050.', expect: [] },
  { name: 'in words: across three groups and four categories', markdown: 'Answers were compared across three groups and four categories, χ2(4, N = 200) = 12.60, p = .013.', expect: [{ at: '4, N', id: 'mismatch' }] },
  { name: 'a size stated in the paragraph, a lone χ² later in it', markdown: 'Counts formed a 2 × 3 contingency table. Framing mattered, χ2(3, N = 150) = 9.40, p = .024.', expect: [{ at: '3, N', id: 'mismatch' }] },
  { name: 'a size in another paragraph is not the χ²’s', markdown: 'Counts formed a 2 × 3 contingency table.\n\nFraming mattered, χ2(3, N = 150) = 9.40, p = .024.', expect: [] },
  { name: 'two χ² in the sentence: whose table is it?', markdown: 'In the 2 × 3 contingency table framing mattered, χ2(3, N = 150) = 9.40, p = .024, and so did order, χ2(2, N = 150) = 9.40, p = .009.', expect: [] },
  { name: 'two sizes in the sentence: which is the χ²’s?', markdown: 'Of the 2 × 3 table and the 2 × 2 table, only the first differed, χ2(3, N = 150) = 9.40, p = .024.', expect: [] },
  { name: 'a 2 × 2 design is not a table’s size', markdown: 'In the 2 × 2 design the choices differed, χ2(3, N = 150) = 9.40, p = .024.', expect: [] },
  { name: 'a 2 × 2 × 3 table is not a 2 × 3 one', markdown: 'Counts formed a 2 × 2 × 3 table, χ2(3, N = 150) = 9.40, p = .024.', expect: [] },
  { name: 'a McNemar–Bowker test has another df', markdown: 'Ratings before and after formed a 3 × 3 table, McNemar–Bowker χ2(3, N = 90) = 9.40, p = .024.', expect: [] },
  { name: 'a goodness-of-fit χ² has another df', markdown: 'Counts formed a 2 × 3 table; a goodness-of-fit test gave χ2(5, N = 150) = 12.60, p = .027.', expect: [] },
]);

// φ = √(χ²/N), V = √(χ²/(N·(min(r, c) − 1))) (common practice, no source; the formula is checked
// against scipy.stats.contingency.association in test/stats/association.test.ts). Values quoted
// were computed in python3: √(5.30/120) = .2102, √(9.40/150) = .2503, √(12.60/200) = .2510,
// √(12.60/400) = .1775.
ruleTable('association-follows-from-chi-square', [
  { name: 'φ that follows', markdown: 'Choice depended on framing, χ2(1, N = 120) = 5.30, p = .021, φ = .21.', expect: [] },
  { name: 'φ that does not follow', markdown: 'Choice depended on framing, χ2(1, N = 120) = 5.30, p = .021, φ = .30.', expect: [{ at: 'φ =', id: 'mismatch' }] },
  { name: 'a negative φ is compared by its magnitude', markdown: 'Choice depended on framing, χ2(1, N = 120) = 5.30, p = .021, φ = −.21.', expect: [] },
  { name: 'φ before the p is still the χ²’s', markdown: 'Choice depended on framing, χ2(1, N = 120) = 5.30, φ = .30, p = .021.', expect: [{ at: 'φ =', id: 'mismatch' }] },
  { name: 'N printed in the clause', markdown: 'Choice depended on framing, χ2(1) = 5.30, N = 120, p = .021, phi = .30.', expect: [{ at: 'phi', id: 'mismatch' }] },
  { name: "Cramér's V of a stated 2 × 3 table", markdown: "The outcome differed in the 2 × 3 contingency table, χ2(2, N = 150) = 9.40, p = .009, Cramér's V = .25.", expect: [] },
  { name: "Cramér's V that does not follow", markdown: "The outcome differed in the 2 × 3 contingency table, χ2(2, N = 150) = 9.40, p = .009, Cramér's V = .35.", expect: [{ at: 'Cramér', id: 'mismatch' }] },
  { name: 'V without a stated size: df 4 allows k = 1 (.2510) and k = 2 (.1775)', markdown: 'Answers differed, χ2(4, N = 200) = 12.60, p = .013, V = .18.', expect: [] },
  { name: 'V without a stated size that no k gives', markdown: 'Answers differed, χ2(4, N = 200) = 12.60, p = .013, V = .40.', expect: [{ at: 'V =', id: 'mismatch' }] },
  { name: 'the stated size decides k: a 3 × 3 table gives .1775, not .2510', markdown: 'A 3 × 3 table of answers differed, χ2(4, N = 200) = 12.60, p = .013, V = .25.', expect: [{ at: 'V =', id: 'mismatch' }] },
  { name: 'the rounding of χ² reaches the printed V (√(9.395/150) = .25027)', markdown: 'Answers differed, χ2(2, N = 150) = 9.4, p = .009, V = .25.', expect: [] },
  { name: 'a continuity-corrected χ² is not compared', markdown: 'With Yates’ correction, χ2(1, N = 120) = 4.10, p = .043, φ = .21.', expect: [] },
  { name: 'without N nothing is compared', markdown: 'Choice depended on framing, χ2(1) = 5.30, p = .021, φ = .30.', expect: [] },
  { name: 'a V of another statistic is not the χ²’s', markdown: 'Choice depended on framing, χ2(1, N = 120) = 5.30, p = .021, whereas the later survey found a weak tie in its own sample, V = .30.', expect: [] },
]);

describe('a V or φ is the χ²’s own and does not end its clause', () => {
  it('keeps the p after a φ for the χ²', () => {
    // scipy.stats.chi2.sf(5.30, 1) = .0213, so p = .50 is a flip of significance
    const r = checkSource('case.md', 'Choice depended on framing, χ2(1, N = 120) = 5.30, φ = .21, p = .50.');
    expect(r.findings.map((f) => f.ruleId)).toContain('significance-follows-from-statistic');
  });
});

describe('the findings say what was recomputed from which inputs', () => {
  const md = "In the 2 × 3 contingency table, χ2(3, N = 150) = 9.40, p = .024, Cramér's V = .35.";
  const findings = checkSource('case.md', md).findings;
  it('names the table and the df it gives', () => {
    expect(findings.find((f) => f.ruleId === 'chi-square-df-follows-from-table')?.message).toBe(
      'Reported df = 3 for "2 × 3 contingency table" (2 rows, 3 columns). Recomputed df = (rows − 1)(columns − 1) = 2. The printed df differs by 1.',
    );
  });
  it('names χ², N and k for V', () => {
    // √(9.395/150) = 0.25027, √(9.405/150) = 0.25040 (by hand in python3)
    expect(findings.find((f) => f.ruleId === 'association-follows-from-chi-square')?.message).toContain(
      'Recomputed V = √(χ²/(N·1)) from χ² = 9.40 (read as 9.395 to 9.405), N = 150, min(r, c) − 1 = 1 (2 × 3 contingency table): 0.2503 to 0.2504.',
    );
  });
});
