import { ruleTable } from './table.js';

ruleTable('quiet-directive-has-reason', [
  { name: 'no reason', markdown: '<!-- plumbline quiet p-follows-from-t -->\nx, t(23) = 1.12, p = .42.', expect: ['1:1 reason-missing'] },
  { name: 'no rule', markdown: '<!-- plumbline quiet : because -->\nx.', expect: ['1:1 rule-missing'] },
  { name: 'unknown verb', markdown: '<!-- plumbline hush p-follows-from-t: because -->\nx.', expect: ['1:1 unknown-verb'] },
  { name: 'nothing after it', markdown: 'x.\n\n<!-- plumbline quiet p-follows-from-t: because -->\n', expect: ['3:1 nothing-follows'] },
  { name: 'a good comment', markdown: '<!-- plumbline quiet p-follows-from-t: Holm-adjusted -->\nx.', expect: [] },
  { name: 'other comments are not directives', markdown: '<!-- a note to co-authors -->\nx.', expect: [] },
]);
