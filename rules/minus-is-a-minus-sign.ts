import { fill, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  'hyphen-as-minus': 'Reported t = {t}: its sign is a hyphen (-), which typesetting may set as a dash or break from the number; the minus sign is −.',
};

/** A negative t in prose is printed with the minus sign. Off by default: a matter of typesetting. */
export const minusIsAMinusSign: Rule = {
  id: 'minus-is-a-minus-sign',
  summary: 'A negative t in prose is printed with a minus sign (−), not a hyphen (-). Off unless turned on.',
  kind: 'advice',
  defaultLevel: 'off',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  fixes: { 'minus-sign': '- → − (U+2212) as the sign of a t in prose' },
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const result of document.results) {
      const t = result.report.t;
      if (!t.hyphenMinus) continue;
      out.push({
        messageId: 'hyphen-as-minus',
        span: t.span,
        message: fill(messages['hyphen-as-minus'], { t: t.printed }),
        reported: result.report.printed,
        check: 'Write the minus sign (U+2212; &minus; in HTML).',
        resultId: result.report.id,
        block: result.report.block,
        // Fix minus-sign: only the sign's character changes; plumbline reads − and - alike, so every check stays as it was
        fix: { id: 'minus-sign', title: 'Write the minus sign (−)', edits: [{ span: { start: t.span.start, end: t.span.start + 1 }, find: '-', text: '\u2212' }] },
      });
    }
    return out;
  },
};
