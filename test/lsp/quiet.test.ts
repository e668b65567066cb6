import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { blockStart, quietEdit, quietPlaces } from '../../src/lsp/server.js';

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

describe('the quiet comment the code action offers, confirmed by the engine', () => {
  const offer = async (path: string, text: string, ruleId = 'zero-p-is-a-bound') => {
    const report = checkSource(path, text);
    const f = report.findings.find((x) => x.ruleId === ruleId);
    if (!f) throw new Error(`no ${ruleId} finding`);
    const place = await quietEdit(text, report.findings, f, report.format, async (t) => checkSource(path, t));
    return place && `${text.slice(0, place.at)}${place.text}${text.slice(place.at)}`;
  };
  const filled = (text: string) => text.replace(/(plumbline quiet [a-z-]+):/, '$1: the journal prints p = .000');
  const cases: Array<[string, string, string, string]> = [
    ['a paragraph', 'm.md', 'Intro.\n\nThe desks\nscores rose, t(23) = 5.90, p = .000.\n', 'Intro.\n\n<!-- plumbline quiet zero-p-is-a-bound: -->\nThe desks\n'],
    ['the second item of a list', 'm.md', 'Intro.\n\n- First, t(23) = 2.0, p = .06.\n- Scores rose, t(23) = 5.90, p = .000.\n', '- <!-- plumbline quiet zero-p-is-a-bound: -->\n  Scores rose'],
    ['a wrapped item of an ordered list', 'm.md', '1. First, t(23) = 2.0, p = .06.\n2. Scores rose,\n   t(23) = 5.90, p = .000.\n', '2. <!-- plumbline quiet zero-p-is-a-bound: -->\n   Scores rose'],
    ['a list in a block quote', 'm.md', '> - First, t(23) = 2.0, p = .06.\n> - Scores rose, t(23) = 5.90, p = .000.\n', '> - <!-- plumbline quiet zero-p-is-a-bound: -->\n>   Scores rose'],
    ['a table row, the cell before the one whose block the result has (its t)', 'm.md', '| Outcome | t | df | p |\n|---|---|---|---|\n| Recall | 2.0 | 23 | .06 |\n| Scores | 5.90 | 23 | .000 |\n', '| Scores <!-- plumbline quiet zero-p-is-a-bound: --> | 5.90 | 23 | .000 |'],
    ['LaTeX: a % line above the paragraph', 'm.tex', '\\begin{document}\nIntro.\n\nScores rose, $t(23) = 5.90$, $p = .000$.\n\\end{document}\n', '\n% plumbline quiet zero-p-is-a-bound:\nScores rose'],
  ];
  it.each(cases)('%s: placed where it applies; filled in, it silences that finding alone', async (_name, path, text, expected) => {
    const offered = await offer(path, text);
    expect(offered).toContain(expected);
    const before = checkSource(path, text).findings.map((f) => f.ruleId);
    const after = checkSource(path, filled(offered as string)).findings.map((f) => f.ruleId);
    expect(after).toEqual(before.filter((r) => r !== 'zero-p-is-a-bound'));
    // as inserted, with no reason, it silences nothing and is reported
    expect(checkSource(path, offered as string).findings.map((f) => f.ruleId)).toContain('quiet-directive-has-reason');
  });
  it('plain text has no comments: none is offered', async () => {
    expect(await offer('m.txt', 'Scores rose, t(23) = 5.90, p = .000.\n')).toBeUndefined();
    expect(quietPlaces('Scores rose.', 3, 'text')).toEqual([]);
  });
  it('a paragraph is offered one at its first line', () => {
    const text = 'Intro.\n\nThe desks\nscores rose, t(23) = 5.90, p = .000.\n';
    expect(quietPlaces(text, text.indexOf('p = .000'), 'markdown')[0]?.at).toBe(text.indexOf('The desks'));
  });
});
