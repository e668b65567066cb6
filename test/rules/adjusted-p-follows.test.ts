import { ruleTable } from './table.js';

// Two-tailed p of t(40) = 2.10 is .0421 (.0416 to .0425 over t's rounding) and of
// t(58) = 2.53 is .0141: scipy.stats.t.sf 1.17.1, computed for these cases. Bonferroni:
// min(1, m·p); Šidák: 1 − (1 − p)^m (common practice, no source).
ruleTable('adjusted-p-follows', [
  { name: 'printed unadjusted p times the stated 3 comparisons (.126) is accepted', markdown: 'Pairwise comparisons were Bonferroni-corrected for 3 comparisons. Recall rose, t(40) = 2.10, p = .042, Bonferroni-corrected p = .126.', expect: [] },
  { name: 'an adjusted p multiplied by 2 where 3 comparisons are stated is found', markdown: 'Pairwise comparisons were Bonferroni-corrected for 3 comparisons. Recall rose, t(40) = 2.10, p = .042, Bonferroni-corrected p = .084.', expect: [{ at: 'p = .084', id: 'mismatch' }] },
  { name: 'without the unadjusted p, it is recomputed from t and df (4 × .0141 = .057)', markdown: 'All p values were Bonferroni-adjusted for four comparisons. Step counts differed, t(58) = 2.53, p_adj = .057.', expect: [] },
  { name: 'an adjusted p equal to the unadjusted one is found', markdown: 'All p values were Bonferroni-adjusted for four comparisons. Step counts differed, t(58) = 2.53, p_adj = .014.', expect: [{ at: 'p_adj', id: 'mismatch' }] },
  { name: 'the number of comparisons as alpha divided by m', markdown: 'We used a Bonferroni correction (α = .05/3). Recall rose, t(40) = 2.10, p = .126 (Bonferroni-corrected).', expect: [] },
  { name: 'a correction capped at 1', markdown: 'Bonferroni correction for 10 comparisons was applied. Mood did not change, t(40) = 0.50, p = 1.00 (Bonferroni-corrected).', expect: [] },
  { name: 'Šidák for 3 comparisons: 1 − (1 − .0421)^3 = .121', markdown: 'P values were Šidák-corrected for three comparisons. Recall rose, t(40) = 2.10, p = .121 (Šidák-corrected).', expect: [] },
  { name: 'Holm is recognised but not recomputed', markdown: 'P values were Holm-corrected for three comparisons. Recall rose, t(40) = 2.10, p = .30 (Holm-corrected).', expect: [] },
  { name: 'no number of comparisons printed: nothing is guessed', markdown: 'Recall rose, t(40) = 2.10, p = .30 (Bonferroni-corrected).', expect: [] },
  { name: 'two different numbers of comparisons in the document: nothing is guessed', markdown: 'Bonferroni correction for 3 comparisons was applied to recall.\n\nBonferroni correction for 5 comparisons was applied to mood.\n\nRecall rose, t(40) = 2.10, p = .50 (Bonferroni-corrected).', expect: [] },
  { name: 'the number stated in the result\'s own sentence wins over the document', markdown: 'Bonferroni correction for 5 comparisons was applied throughout.\n\nWith a Bonferroni correction for 2 comparisons, recall rose, t(40) = 2.10, p = .084 (Bonferroni-corrected).', expect: [] },
  { name: 'the number of comparisons printed with the p itself wins over the document', markdown: 'Bonferroni correction for 2 comparisons was applied to mood.\n\nErrors fell, t(40) = 2.10, p_adj = .126 (3 tests).', expect: [] },
  { name: 'adjustment words in the bracket introduce the adjusted p, not the unadjusted one before them', markdown: 'Typing rose, t(36) = 0.70, p = .49 (Bonferroni-corrected for 4 comparisons: p = 1.000).', expect: [] },
  { name: 'a number of comparisons said of another result is not used for this one', markdown: 'Mood fell, t(40) = 0.97, p = .338 (Bonferroni-corrected for 2 comparisons: p = .676).\n\nErrors fell, t(40) = 2.10, p_adj = .126.', expect: [] },
]);
