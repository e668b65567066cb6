import { ruleTable } from './table.js';

ruleTable('zero-p-is-a-bound', [
  { name: 'p = .000', markdown: 'x, t(23) = 5.90, p = .000.', expect: ['1:18 p-printed-as-zero'] },
  { name: 'p = 0', markdown: 'x, t(23) = 5.90, p = 0.', expect: ['1:18 p-printed-as-zero'] },
  { name: 'p < .001', markdown: 'x, t(23) = 5.90, p < .001.', expect: [] },
  { name: 'a small exact p', markdown: 'x, t(23) = 5.90, p = .000005.', expect: [] },
]);
