import { ruleTable } from './table.js';

ruleTable('front-matter-is-readable', [
  { name: 'broken YAML', markdown: '---\nplumbline: {alpha: 0.01\n---\nx.', expect: ['1:1 front-matter-unreadable'] },
  { name: 'unknown plumbline key', markdown: '---\nplumbline:\n  alfa: 0.01\n---\nx.', expect: ['1:1 front-matter-unreadable'] },
  { name: 'alpha out of range', markdown: '---\nplumbline:\n  alpha: 5\n---\nx.', expect: ['1:1 front-matter-unreadable'] },
  { name: 'valid settings', markdown: '---\nplumbline:\n  alpha: 0.01\n  sidedness: two\n---\nx.', expect: [] },
  { name: 'front matter without plumbline settings', markdown: '---\ntitle: A study\n---\nx.', expect: [] },
  // an opening fence never closed: said when the next line reads as YAML; a lone rule is not front matter
  { name: 'opening --- never closed', markdown: '---\ntitle: A study\n\nx.', expect: ['1:1 front-matter-unreadable'] },
  { name: 'a thematic break on line 1', markdown: '---\n\nx.', expect: [] },
  // issue 18: the YAML library is quadratic in a mapping's keys, so front matter over 2,000 lines and commas is not read
  { name: 'front matter with 2,500 keys: not read, said', markdown: `---\n${Array.from({ length: 2500 }, (_, i) => `k${i}: ${i}`).join('\n')}\n---\nx.`, expect: ['1:1 front-matter-unreadable'] },
  { name: 'front matter with a long abstract of ordinary size is read', markdown: `---\ntitle: A study\nabstract: ${'Words, words, and more words. '.repeat(200)}\n---\nx.`, expect: [] },
]);
