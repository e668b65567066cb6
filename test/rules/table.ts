import { describe, expect, it } from 'vitest';
import { checkSource, type CheckOptions } from '../../src/engine/index.js';

export interface RuleCase {
  /** What the case proves. */
  name: string;
  markdown: string;
  options?: CheckOptions;
  /**
   * Each finding of the rule, in order: `line:column messageId`, or `{ at, id }` where the
   * finding must start at the first occurrence of the text `at`; [] for accepted cases.
   */
  expect: Array<string | { at: string; id: string }>;
}

/** 1-based line and column of the first occurrence of `anchor` in `text`. */
function placeOf(text: string, anchor: string): string {
  const i = text.indexOf(anchor);
  if (i < 0) throw new Error(`anchor ${JSON.stringify(anchor)} not in the case`);
  const before = text.slice(0, i);
  const line = before.split('\n').length;
  return `${line}:${i - before.lastIndexOf('\n')}`;
}

/** Runs a per-rule table: exactly the expected findings of `ruleId`, by place and message id. */
export function ruleTable(ruleId: string, cases: RuleCase[]): void {
  describe(ruleId, () => {
    it.each(cases)('$name', (c) => {
      const got = checkSource('case.md', c.markdown, { checklist: true, ...c.options })
        .findings.filter((f) => f.ruleId === ruleId)
        .map((f) => `${f.start.line}:${f.start.column} ${f.messageId}`);
      expect(got).toEqual(c.expect.map((e) => (typeof e === 'string' ? e : `${placeOf(c.markdown, e.at)} ${e.id}`)));
    });
  });
}

/** The findings of one rule on a text, in order (for cases that look at more than place and message id). */
export function findingsOf(markdown: string, ruleId: string, options?: CheckOptions) {
  return checkSource('case.md', markdown, options).findings.filter((f) => f.ruleId === ruleId);
}

/** The levels of one rule's findings on a text, in order: [] when it finds nothing. */
export function levelsOf(markdown: string, ruleId: string, options?: CheckOptions): string[] {
  return findingsOf(markdown, ruleId, options).map((f) => f.level);
}
