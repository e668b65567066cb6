import { fill, type Rule, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  'front-matter-unreadable': 'The YAML front matter could not be read ({reason}); plumbline used the configuration and defaults instead.',
};

/** Front matter, when present, is YAML plumbline can read. */
export const frontMatterIsReadable: Rule = {
  id: 'front-matter-is-readable',
  summary: 'YAML front matter, when present, can be read (otherwise its settings are ignored).',
  kind: 'advice',
  defaultLevel: 'note',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const e = document.frontMatterError;
    if (!e) return [];
    return [{
      messageId: 'front-matter-unreadable',
      span: e.span,
      message: fill(messages['front-matter-unreadable'], { reason: e.message }),
      reported: 'front matter',
      check: 'Fix the YAML syntax at the place the message names.',
    }];
  },
};
