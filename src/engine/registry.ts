import { frontMatterIsReadable } from '../../rules/front-matter-is-readable.js';
import { oneTailedPIsDeclared } from '../../rules/one-tailed-p-is-declared.js';
import { pFollowsFromT } from '../../rules/p-follows-from-t.js';
import { powerStatementFollows } from '../../rules/power-statement-follows.js';
import { quietDirectiveHasReason } from '../../rules/quiet-directive-has-reason.js';
import { resultIsComplete } from '../../rules/result-is-complete.js';
import { significanceFollowsFromT } from '../../rules/significance-follows-from-t.js';
import { valuesArePossible } from '../../rules/values-are-possible.js';
import { zeroPIsABound } from '../../rules/zero-p-is-a-bound.js';
import { ciAgreesWithResult } from '../../rules/ci-agrees-with-result.js';
import { descriptivesLinkIsUnambiguous } from '../../rules/descriptives-link-is-unambiguous.js';
import { designMatchesAnalysis } from '../../rules/design-matches-analysis.js';
import { dfFollowsFromN } from '../../rules/df-follows-from-n.js';
import { effectSizeFollows } from '../../rules/effect-size-follows.js';
import { meanIsPossibleForIntegers } from '../../rules/mean-is-possible-for-integers.js';
import { pairedCorrelationIsPossible } from '../../rules/paired-correlation-is-possible.js';
import { percentageMatchesCount } from '../../rules/percentage-matches-count.js';
import { spreadKindIsStated } from '../../rules/spread-kind-is-stated.js';
import { spreadKindMatchesT } from '../../rules/spread-kind-matches-t.js';
import { tFollowsFromDescriptives } from '../../rules/t-follows-from-descriptives.js';
import type { AnyRule } from '../rule-api/types.js';

/** Every rule, in the order their findings are listed for one place. */
export const RULES: readonly AnyRule[] = [
  significanceFollowsFromT,
  pFollowsFromT,
  oneTailedPIsDeclared,
  valuesArePossible,
  zeroPIsABound,
  tFollowsFromDescriptives,
  spreadKindMatchesT,
  dfFollowsFromN,
  designMatchesAnalysis,
  pairedCorrelationIsPossible,
  ciAgreesWithResult,
  effectSizeFollows,
  meanIsPossibleForIntegers,
  percentageMatchesCount,
  powerStatementFollows,
  spreadKindIsStated,
  descriptivesLinkIsUnambiguous,
  resultIsComplete,
  quietDirectiveHasReason,
  frontMatterIsReadable,
];

export const RULE_IDS: readonly string[] = RULES.map((r) => r.id);

export function ruleById(id: string): AnyRule | undefined {
  return RULES.find((r) => r.id === id);
}
