import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { blockStart, quietCommentAt } from '../../src/lsp/server.js';

/**
 * The code action "add a quiet comment" puts the comment where the quiet directive reads it: at
 * the start of the finding's block. Checked through the engine: with the comment's reason filled
 * in the finding is silenced; left empty (as inserted) it is not, and the comment is reported.
 */
const insertQuiet = (text: string, ruleId: string, reason: string) => {
  const f = checkSource('m.md', text).findings.find((x) => x.ruleId === ruleId);
  if (!f) throw new Error(`no ${ruleId} finding`);
  const at = blockStart(text, f.span.start);
  return `${text.slice(0, at)}<!-- plumbline quiet ${ruleId}:${reason ? ` ${reason}` : ''} -->\n${text.slice(at)}`;
};
const rulesOf = (text: string) => checkSource('m.md', text).findings.map((f) => f.ruleId);

describe('where a quiet comment goes', () => {
  const cases: Array<[string, string]> = [
    ['a one-line paragraph after a heading and a blank line', '# Results\n\nScores rose, t(23) = 5.90, p = .000.\n'],
    ['the third line of a wrapped paragraph', 'Intro text here.\n\nThe desks were used daily\nfor a month, and\nscores rose, t(23) = 5.90, p = .000.\n\nMore text.\n'],
    ['the first line of the document', 'Scores rose, t(23) = 5.90, p = .000.\n'],
    ['a block quote', '> Scores rose,\n> t(23) = 5.90, p = .000.\n'],
  ];
  it.each(cases)('%s: filled in, it silences the finding', (_name, text) => {
    expect(rulesOf(text)).toContain('zero-p-is-a-bound');
    expect(rulesOf(insertQuiet(text, 'zero-p-is-a-bound', 'the journal prints p = .000'))).not.toContain('zero-p-is-a-bound');
  });
  it.each(cases)('%s: as inserted, with no reason, it silences nothing and is reported', (_name, text) => {
    const after = rulesOf(insertQuiet(text, 'zero-p-is-a-bound', ''));
    expect(after).toContain('zero-p-is-a-bound');
    expect(after).toContain('quiet-directive-has-reason');
  });
});

describe('where no quiet comment is offered', () => {
  it('a list item: a comment above the list does not reach its second item', () => {
    const text = 'Intro.\n\n- First, t(23) = 2.0, p = .06.\n- Scores rose, t(23) = 5.90, p = .000.\n';
    // the engine confirms it: the comment above the list leaves the finding
    expect(rulesOf(insertQuiet(text, 'zero-p-is-a-bound', 'a reason'))).toContain('zero-p-is-a-bound');
    expect(quietCommentAt(text, text.indexOf('p = .000'))).toBeUndefined();
  });
  it('a paragraph is offered one, at its first line', () => {
    const text = 'Intro.\n\nThe desks\nscores rose, t(23) = 5.90, p = .000.\n';
    expect(quietCommentAt(text, text.indexOf('p = .000'))).toBe(text.indexOf('The desks'));
  });
});
