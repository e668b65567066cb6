import { NO_OPTIONS, type ChecklistItem, type Rule, type RuleFinding } from './types.js';

export interface ChecklistRuleSpec extends ChecklistItem {
  id: string;
  summary: string;
  /** Message for a missing entry; `{detail}` is the entry's detail. */
  missingMessage: string;
  check: string;
  defaultLevel?: 'note' | 'warning' | 'error';
  /** The safe fixes its entries may carry (see Rule.fixes). */
  fixes?: Record<string, string>;
}

/**
 * A reporting-checklist rule: its findings are exactly the entries its assessment marks
 * missing, so the checklist and the findings can never disagree.
 */
export function checklistRule(spec: ChecklistRuleSpec): Rule {
  const messages = { missing: spec.missingMessage };
  return {
    id: spec.id,
    summary: spec.summary,
    kind: 'advice',
    defaultLevel: spec.defaultLevel ?? 'note',
    defaultOptions: {},
    optionsSchema: NO_OPTIONS,
    messages,
    checklist: { item: spec.item, guidelines: spec.guidelines, assess: spec.assess },
    checklistOnly: true,
    ...(spec.fixes ? { fixes: spec.fixes } : {}),
    check({ document }) {
      const out: RuleFinding[] = [];
      for (const e of spec.assess(document)) {
        if (e.status !== 'missing') continue;
        // a missing document item has no place: its finding is said of the whole document
        const span = e.span ?? (e.scope === 'document' ? { start: 0, end: 0 } : undefined);
        if (!span) continue;
        out.push({
          messageId: 'missing',
          span,
          message: spec.missingMessage.replace('{detail}', e.detail),
          reported: e.detail,
          check: spec.check,
          ...(e.resultId ? { resultId: e.resultId } : {}),
          ...(e.block !== undefined ? { block: e.block } : {}),
          ...(e.fix ? { fix: e.fix } : {}),
          ...(e.scope === 'document' && !e.span ? { scope: 'document' as const } : {}),
        });
      }
      return out;
    },
  };
}
