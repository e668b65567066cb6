export type * from './types.js';
export { fill, showInterval, showNumber } from './format.js';
export { NO_OPTIONS } from './types.js';
export { describeDf, describeT, dfInterval, numberInterval, pInterval, pLastDigit, tInterval } from './intervals.js';
export { describeTails, evaluateP, showRange, type PEvaluation, type PStanding } from './evaluate.js';
export { pMessageId, pPlaceholders } from './pMessages.js';
export { describeAttempt, evaluateDescriptives, inferDesign, type Attempt, type DescriptiveEvaluation, type Reading, type Variant } from './descriptives.js';
export { checklistRule, type ChecklistRuleSpec } from './checklist.js';
export { documentAnchor } from './docs.js';
