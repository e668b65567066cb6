export { formatHuman, type HumanOptions } from './human.js';
export { formatJson, formatJsonChunks, JSON_REPORT_VERSION } from './json.js';
export { formatSarif, formatSarifChunks, artifactUri } from './sarif.js';
export { CAUTIONS, countRun, type Counts, type RuleInfo, type RunReport } from './types.js';
export { formatChecklist } from './checklist.js';
export { formatHtml, escapeHtml } from './html.js';
export { formatLines } from './lines.js';
export { formatRulesJson, type RuleListing } from './rules.js';
export { say, showBidi, terminalLine, terminalSafe } from './text.js';
