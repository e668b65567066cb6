import { fill, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  'ambiguous-link': 'Reported {reported} near descriptives plumbline could not match to it ({reason}), so t was not recomputed from them.',
};

/** Descriptives near a test can be matched to it without guessing. */
export const descriptivesLinkIsUnambiguous: Rule = {
  id: 'descriptives-link-is-unambiguous',
  summary: 'The descriptives near a t-test can be matched to it without guessing (otherwise it is not recomputed from them, and this says so).',
  kind: 'advice',
  defaultLevel: 'note',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const result of document.results) {
      const u = result.context.unlinked;
      if (!u) continue;
      out.push({
        messageId: 'ambiguous-link',
        span: u.span,
        message: fill(messages['ambiguous-link'], { reported: result.report.printed, reason: u.reason }),
        reported: result.report.printed,
        check: 'Give each test its own sentence with the descriptives it compares, or a table per comparison.',
        resultId: result.report.id,
        block: result.report.block,
      });
    }
    return out;
  },
};
