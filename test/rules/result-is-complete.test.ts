import { ruleTable } from './table.js';

ruleTable('result-is-complete', [
  { name: 't and df without p', markdown: 'x, t(23) = 0.52.', expect: ['1:4 p-missing'] },
  { name: 't with a bound needs no p', markdown: 'x, t(30) < 1.', expect: [] },
  { name: 't and p without df is the checklist item statistic-has-df', markdown: 'x, t = 3.10, p = .004.', expect: [] },
  { name: 'p in a sentence naming a t-test', markdown: 'A paired t-test showed an effect (p = .04).', expect: ['1:35 t-missing'] },
  { name: "p in a sentence naming Welch's t", markdown: "Welch's t was significant, p = .01.", expect: ['1:28 t-missing'] },
  { name: 'p of another test is not a t-test p', markdown: 'A chi-square test showed an effect (p = .04).', expect: [] },
  { name: 'a legend saying what the stars mean ("* p < .05 (paired t-tests)") reports no p', markdown: '| Side | Before | After | t |\n| --- | --- | --- | --- |\n| Varnish | 1.57 (0.07) | 1.23 (0.08) | 8.11*** |\n\n\\* p < .05; \\*\\* p < .01; \\*\\*\\* p < .001 (paired t-tests).', expect: [] },
  { name: 'a complete result', markdown: 'A paired t-test showed an effect, t(23) = 2.20, p = .038.', expect: [] },
]);
