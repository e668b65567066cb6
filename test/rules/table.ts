import { describe, expect, it } from 'vitest';
import { checkSource, type CheckOptions } from '../../src/engine/index.js';

export interface RuleCase {
  /** What the case proves. */
  name: string;
  markdown: string;
  options?: CheckOptions;
  /** `line:column messageId` for each finding of the rule, in order; [] for accepted cases. */
  expect: string[];
}

/** Runs a per-rule table: exactly the expected findings of `ruleId`, by place and message id. */
export function ruleTable(ruleId: string, cases: RuleCase[]): void {
  describe(ruleId, () => {
    it.each(cases)('$name', (c) => {
      const got = checkSource('case.md', c.markdown, c.options)
        .findings.filter((f) => f.ruleId === ruleId)
        .map((f) => `${f.start.line}:${f.start.column} ${f.messageId}`);
      expect(got).toEqual(c.expect);
    });
  });
}
