import { type Rule, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  'bytes-replaced': 'Part of this file could not be decoded: {detail}. Results in the damaged text may be missed or misread.',
  'read-as-plain-text': 'This file could not be read as Markdown: {detail}.',
  'markup-set-aside': 'Part of this file was read without its Markdown markup: {detail}.',
  'encoding-guessed': 'The encoding of this file had to be guessed: {detail}. If the guess is wrong, results may be missed or misread.',
  'invisible-removed': 'Invisible characters were removed from this file\'s text: {detail}.',
  'include-not-read': 'A file this LaTeX manuscript includes was not read: {detail}. Results in it were not checked.',
  'tracked-changes-accepted': 'This Word file holds tracked changes: {detail}.',
  'macro-not-expanded': 'A command this LaTeX manuscript defines was not expanded: {detail}. A result printed through it was not checked.',
  'glyphs-not-read': 'Some characters of this PDF could not be read: {detail}. Results printed with them may be missed or misread.',
};

/** The file could be read as written: every byte decoded, the Markdown structure within the parser's limits. */
export const inputIsReadable: Rule = {
  id: 'input-is-readable',
  summary: 'The file decodes cleanly and its Markdown nests within the parser\'s limits (otherwise results there may be missed); a Word file\'s tracked changes are said.',
  kind: 'advice',
  defaultLevel: 'note',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    return (document.readNotes ?? []).map((n) => {
      if (n.kind === 'include-not-read') {
        return {
          messageId: 'include-not-read',
          span: n.span,
          message: messages['include-not-read'].replace('{detail}', n.message),
          reported: 'an included file',
          check: 'Check the included file on its own (name it on the command line), or move it into the manuscript\'s folder if it belongs to the manuscript.',
        };
      }
      if (n.kind === 'tracked-changes') {
        return {
          messageId: 'tracked-changes-accepted',
          span: n.span,
          message: messages['tracked-changes-accepted'].replace('{detail}', n.message),
          reported: 'tracked changes',
          check: 'Accept or reject the changes in Word (Review › Accept or Reject) and check the file again if the text meant is not the text with every change accepted.',
        };
      }
      if (n.kind === 'macro-not-expanded') {
        return {
          messageId: 'macro-not-expanded',
          span: n.span,
          message: messages['macro-not-expanded'].replace('{detail}', n.message),
          reported: 'a defined command',
          check: 'Look at what the command prints where it is used; a result printed through it may need checking by hand.',
        };
      }
      if (n.kind === 'glyphs-not-read') {
        return {
          messageId: 'glyphs-not-read',
          span: n.span,
          message: messages['glyphs-not-read'].replace('{detail}', n.message),
          reported: 'characters without Unicode',
          check: 'Look at the pages named in the PDF itself: signs such as =, < or − set in a symbol font may have been read as other characters. Check the results there by hand, or check the manuscript in its Word or LaTeX form.',
        };
      }
      if (n.kind === 'encoding-guessed') {
        return { messageId: 'encoding-guessed', span: n.span, message: messages['encoding-guessed'].replace('{detail}', n.message), reported: 'byte-order mark', check: 'Save the file as UTF-8 without stray bytes at its start and check it again.' };
      }
      const messageId = n.kind === 'replaced-bytes' ? 'bytes-replaced' : n.kind === 'dense-markup' || n.kind === 'slow-shape' ? 'markup-set-aside' : n.kind === 'invisible-characters' ? 'invisible-removed' : 'read-as-plain-text';
      return {
        messageId,
        span: n.span,
        message: messages[messageId].replace('{detail}', n.message),
        reported: n.kind === 'replaced-bytes' ? 'undecodable bytes' : n.kind === 'dense-markup' ? 'dense markup' : n.kind === 'slow-shape' ? 'slow block shapes' : n.kind === 'invisible-characters' ? 'invisible characters' : 'nesting',
        check:
          n.kind === 'replaced-bytes'
            ? 'Save the file as UTF-8 (or UTF-16 with a byte-order mark) and check it again; text pulled from a PDF may need to be extracted again.'
            : n.kind === 'invisible-characters'
              ? 'Look at the place named: direction marks, byte-order marks, variation selectors or combining marks inside a statistic are usually debris from copying or conversion, and can also hide a number; remove them and check the file again.'
              : n.kind === 'dense-markup'
              ? 'Look at the blocks named: markup this dense is usually debris from a conversion; remove it and check the file again.'
              : n.kind === 'slow-shape'
                ? 'Look at the blocks named: so many of them are usually debris from a conversion; results there were still read, as paragraph text.'
              : 'Flatten the nesting (it is usually debris from a conversion) and check the file again.',
      };
    });
  },
};
