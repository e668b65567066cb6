/**
 * plumbline as a library: check manuscript text, or files and folders as the command line
 * does, get results and findings as data, and format them in any of the report formats. The
 * command line (src/cli) is a thin layer over these.
 */
export { checkSource, checkWithIncludes, RULES, RULE_IDS, ruleById, type CheckOptions, type IncludeCheckOptions, type IncludeReader } from './engine/index.js';
export { folderIncludeReader } from './cli/includes.js';
export type { ChecklistRecord, FileFailure, FileReport, Finding, LinkedRecord, NumberRecord, Place, ResultRecord } from './engine/types.js';
export { ConfigError, ConfigFinder, parseConfigText, readConfigFile, type Config, type FoundConfig } from './config/index.js';
export {
  formatHuman,
  formatLines,
  formatJson,
  formatJsonChunks,
  readJsonReport,
  formatSarif,
  formatSarifChunks,
  formatChecklist,
  formatHtml,
  formatRulesJson,
  countRun,
  CAUTIONS,
  JSON_REPORT_VERSION,
  type Counts,
  type HumanOptions,
  type RuleInfo,
  type RuleListing,
  type RunReport,
} from './report/index.js';
export { checkFiles, type FileRun, type RunnerOptions } from './cli/runner.js';
export { expandArguments, MANUSCRIPT_EXTENSIONS, SKIPPED_FOLDERS, type ExpandOptions, type Expansion, type IgnoreSource } from './cli/files.js';
export { applyBaseline, baselineText, readBaseline, recordBaseline, BaselineError, BASELINE_FORMAT, BASELINE_VERSION, type Baseline, type BaselineEntry } from './cli/baseline.js';
export type { CorrelationFigure, DfFigure, Figure, Gap, IntervalFigure, LatticeFigure, Level, LevelSetting, PFigure, Recomputed, Rule, RuleKind } from './rule-api/types.js';
export { twoSidedPFromT, oneSidedPFromT, twoSidedCriticalT, roundingInterval } from './stats/index.js';
