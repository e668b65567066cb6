import type { FileFailure, FileReport } from '../engine/types.js';
import type { LevelSetting, RuleKind } from '../rule-api/types.js';

/** What a formatter knows of a rule: its metadata and its documentation page. */
export interface RuleInfo {
  id: string;
  summary: string;
  kind: RuleKind;
  defaultLevel: LevelSetting;
  /** The rule's page (rules/<id>.md) as Markdown. */
  doc: string;
  /** Where people can read the page (SARIF `helpUri`). */
  helpUri?: string;
}

export interface RunReport {
  tool: { name: string; version: string };
  files: FileReport[];
  failures: FileFailure[];
  rules: RuleInfo[];
  /**
   * Symbolic links a folder walk met and did not follow, because they lead outside the folder
   * named (paths as the walk found them). Absent or empty when there were none.
   */
  skippedLinks?: string[];
}

/** Why a symbolic link in a folder walk was not followed: said on standard error and in the reports. */
export const SKIPPED_LINK_REASON = 'not followed: this symbolic link leads outside the folder walked (--follow-links-outside follows it)';

export interface Counts {
  files: number;
  results: number;
  checked: number;
  /** F, χ², r and z results read, and those whose p was recomputed. */
  statistics: number;
  statisticsChecked: number;
  error: number;
  warning: number;
  note: number;
  /** Files not checked: unreadable, missing, skipped, or under a bad configuration. */
  failures: number;
  /** Findings silenced by quiet comments in the files. */
  hiddenByQuiet: number;
  /** Findings recorded in the baseline (--baseline), so not reported. */
  hiddenByBaseline: number;
}

/** Said in every report (README "Cautions"). */
export const CAUTIONS: readonly string[] = [
  'An inconsistency is a question to ask the authors, not proof of error or misconduct: the printed numbers may come from an analysis plumbline cannot see (adjusted p values, mixed models, permutation tests).',
  'A clean run does not validate a study: plumbline checks only that the reported numbers agree with each other, not the design, the data or the choice of analysis.',
  "Follow the journal's policy and ask for qualified statistical review before acting on a finding.",
];

export function countRun(run: RunReport): Counts {
  // a bad configuration counts the manuscripts it kept from being checked
  const failures = run.failures.reduce((n, f) => n + (f.notChecked ? f.notChecked.length : 1), 0);
  const c: Counts = { files: run.files.length, results: 0, checked: 0, statistics: 0, statisticsChecked: 0, error: 0, warning: 0, note: 0, failures, hiddenByQuiet: 0, hiddenByBaseline: 0 };
  for (const f of run.files) {
    c.hiddenByQuiet += f.hidden.quiet;
    c.hiddenByBaseline += f.hidden.baseline;
    c.results += f.results.length;
    c.checked += f.results.filter((r) => r.recomputed !== undefined).length;
    c.statistics += f.statistics?.length ?? 0;
    c.statisticsChecked += f.statistics?.filter((s) => s.recomputed !== undefined).length ?? 0;
    for (const x of f.findings) c[x.level] += 1;
  }
  return c;
}
