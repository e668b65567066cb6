/**
 * plumbline as a library: check manuscript text, get results and findings as data, format
 * them. The command line (src/cli) is a thin layer over these.
 */
export { checkSource, RULES, RULE_IDS, ruleById, type CheckOptions } from './engine/index.js';
export type { FileFailure, FileReport, Finding, NumberRecord, Place, ResultRecord } from './engine/types.js';
export { ConfigError, ConfigFinder, parseConfigText, readConfigFile, type Config } from './config/index.js';
export { formatHuman, formatJson, formatSarif, CAUTIONS, JSON_REPORT_VERSION, type RunReport, type RuleInfo } from './report/index.js';
export type { Gap, Level, LevelSetting, Recomputed, Rule, RuleKind } from './rule-api/types.js';
export { twoSidedPFromT, oneSidedPFromT, twoSidedCriticalT, roundingInterval } from './stats/index.js';
