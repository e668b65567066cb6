import type { LevelSetting, OptionsSchema, RuleKind } from '../rule-api/types.js';

/** What `plumbline rules --format json` says of a rule. */
export interface RuleListing {
  id: string;
  summary: string;
  kind: RuleKind;
  defaultLevel: LevelSetting;
  /** JSON Schema of the rule's options (an object schema; no properties when it takes none). */
  optionsSchema: OptionsSchema;
  /** The safe fixes its findings may carry: fix id → what it changes. */
  fixes?: Record<string, string>;
}

/** The rule list as JSON: `{ "rules": [ … ] }`, in the order rules run. */
export function formatRulesJson(rules: readonly RuleListing[]): string {
  return `${JSON.stringify({ rules: rules.map((r) => ({ id: r.id, summary: r.summary, kind: r.kind, defaultLevel: r.defaultLevel, optionsSchema: r.optionsSchema, ...(r.fixes ? { fixes: r.fixes } : {}) })) }, null, 2)}\n`;
}
