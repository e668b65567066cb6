import { ruleTable } from './table.js';

const on = { config: { rules: { 'minus-is-a-minus-sign': 'note' as const } } };

ruleTable('minus-is-a-minus-sign', [
  { name: 'a hyphen before a negative t in prose', markdown: 'Recall fell, t(28) = -2.10, p = .045.', options: on, expect: ['1:22 hyphen-as-minus'] },
  { name: 'off by default', markdown: 'Recall fell, t(28) = -2.10, p = .045.', expect: [] },
  { name: 'the minus sign', markdown: 'Recall fell, t(28) = \u22122.10, p = .045.', options: on, expect: [] },
  { name: 'a positive t', markdown: 'Recall rose, t(28) = 2.10, p = .045.', options: on, expect: [] },
  { name: 'software output in inline code', markdown: 'Output: `t(28) = -2.10, p = .045`.', options: on, expect: [] },
]);
