import { fill, type Rule, type RuleFinding, NO_OPTIONS } from '../src/rule-api/index.js';

const messages = {
  'reason-missing': 'This `plumbline quiet` comment gives no reason, so it silences nothing. Write it as <!-- plumbline quiet {rules}: why the finding does not apply -->.',
  'rule-missing': 'This `plumbline quiet` comment names no rule. Write it as <!-- plumbline quiet RULE-ID: reason -->.',
  'unknown-verb': 'plumbline does not know the comment verb "{verb}"; the only verb is "quiet".',
  'nothing-follows': 'This `plumbline quiet` comment has no block after it to apply to.',
};

/** Silencing comments say which rule they silence and why. */
export const quietDirectiveHasReason: Rule = {
  id: 'quiet-directive-has-reason',
  summary: 'A `plumbline quiet` comment names the rules it silences and gives a reason.',
  kind: 'advice',
  defaultLevel: 'warning',
  defaultOptions: {},
  optionsSchema: NO_OPTIONS,
  messages,
  check({ document }) {
    const out: RuleFinding[] = [];
    for (const d of document.directives) {
      const base = { span: d.span, reported: `plumbline ${d.verb} ${d.ruleIds.join(', ')}`.trim() };
      if (d.verb !== 'quiet') {
        out.push({ ...base, messageId: 'unknown-verb', message: fill(messages['unknown-verb'], { verb: d.verb }), check: 'Use "quiet".' });
      } else if (d.ruleIds.length === 0) {
        out.push({ ...base, messageId: 'rule-missing', message: messages['rule-missing'], check: 'Name the rule id shown with the finding.' });
      } else if (d.reason === '') {
        out.push({ ...base, messageId: 'reason-missing', message: fill(messages['reason-missing'], { rules: d.ruleIds.join(', ') }), check: 'Add the reason after a colon.' });
      } else if (d.appliesToBlock < 0) {
        out.push({ ...base, messageId: 'nothing-follows', message: messages['nothing-follows'], check: 'Move the comment right above the paragraph it is about.' });
      }
    }
    return out;
  },
};
