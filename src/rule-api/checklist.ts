import type { LinkedDocument, LinkedResult, LinkedStatistic } from '../link/types.js';
import { NO_OPTIONS, type ChecklistEntry, type ChecklistItem, type Rule, type RuleFinding } from './types.js';

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

/**
 * A per-result item's entries over the t-tests and the F, χ², r and z results together, in
 * reading order (by where each result starts). `forStatistic` returns nothing for a kind the
 * item does not speak of.
 */
export function resultEntries(
  document: LinkedDocument,
  forResult: (result: LinkedResult) => ChecklistEntry,
  forStatistic: (statistic: LinkedStatistic) => ChecklistEntry | undefined,
): ChecklistEntry[] {
  const out: ChecklistEntry[] = [];
  const results = document.results;
  const statistics = document.statistics;
  let i = 0;
  let j = 0;
  while (i < results.length || j < statistics.length) {
    const r = results[i];
    const s = statistics[j];
    if (r && (!s || r.report.span.start <= s.report.span.start)) {
      out.push(forResult(r));
      i += 1;
    } else if (s) {
      const e = forStatistic(s);
      if (e) out.push(e);
      j += 1;
    }
  }
  return out;
}

/** The scope, id and block every per-result entry of an F, χ², r or z result carries. */
export function statisticBase(statistic: LinkedStatistic): { scope: 'result'; resultId: string; block: number } {
  return { scope: 'result', resultId: statistic.id, block: statistic.report.block };
}
