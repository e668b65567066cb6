import { frontMatterIsReadable } from '../../rules/front-matter-is-readable.js';
import { inputIsReadable } from '../../rules/input-is-readable.js';
import { oneTailedPIsDeclared } from '../../rules/one-tailed-p-is-declared.js';
import { pFollowsFromT } from '../../rules/p-follows-from-t.js';
import { pFollowsFromF } from '../../rules/p-follows-from-f.js';
import { pFollowsFromChiSquare } from '../../rules/p-follows-from-chi-square.js';
import { pFollowsFromR } from '../../rules/p-follows-from-r.js';
import { pFollowsFromZ } from '../../rules/p-follows-from-z.js';
import { significanceFollowsFromStatistic } from '../../rules/significance-follows-from-statistic.js';
import { rDfFollowsFromN } from '../../rules/r-df-follows-from-n.js';
import { etaSquaredFollowsFromF } from '../../rules/eta-squared-follows-from-f.js';
import { chiSquareDfFollowsFromTable } from '../../rules/chi-square-df-follows-from-table.js';
import { associationFollowsFromChiSquare } from '../../rules/association-follows-from-chi-square.js';
import { fEqualsTSquared } from '../../rules/f-equals-t-squared.js';
import { fFollowsFromGroupSummaries } from '../../rules/f-follows-from-group-summaries.js';
import { zFollowsFromCoefficient } from '../../rules/z-follows-from-coefficient.js';
import { powerStatementFollows } from '../../rules/power-statement-follows.js';
import { quietDirectiveHasReason } from '../../rules/quiet-directive-has-reason.js';
import { resultIsComplete } from '../../rules/result-is-complete.js';
import { significanceFollowsFromT } from '../../rules/significance-follows-from-t.js';
import { valuesArePossible } from '../../rules/values-are-possible.js';
import { zeroPIsABound } from '../../rules/zero-p-is-a-bound.js';
import { minusIsAMinusSign } from '../../rules/minus-is-a-minus-sign.js';
import { adjustedPFollows } from '../../rules/adjusted-p-follows.js';
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
import { tFollowsFromCoefficient } from '../../rules/t-follows-from-coefficient.js';
import { alphaIsStated } from '../../rules/alpha-is-stated.js';
import { assumptionsAreChecked } from '../../rules/assumptions-are-checked.js';
import { descriptivesWithN } from '../../rules/descriptives-with-n.js';
import { effectSizeWithCi } from '../../rules/effect-size-with-ci.js';
import { groupSizesSumToTotal } from '../../rules/group-sizes-sum-to-total.js';
import { multipleComparisonsAddressed } from '../../rules/multiple-comparisons-addressed.js';
import { noTrendWording } from '../../rules/no-trend-wording.js';
import { pIsExact } from '../../rules/p-is-exact.js';
import { pPrecisionIsSensible } from '../../rules/p-precision-is-sensible.js';
import { repeatedResultAgrees } from '../../rules/repeated-result-agrees.js';
import { sampleSizeAgreesWithDf } from '../../rules/sample-size-agrees-with-df.js';
import { softwareIsNamed } from '../../rules/software-is-named.js';
import { statisticHasDf } from '../../rules/statistic-has-df.js';
import { tailsAreStated } from '../../rules/tails-are-stated.js';
import { testIsNamed } from '../../rules/test-is-named.js';
import type { AnyRule } from '../rule-api/types.js';

/** Every rule, in the order their findings are listed for one place. */
export const RULES: readonly AnyRule[] = [
  significanceFollowsFromT,
  pFollowsFromT,
  significanceFollowsFromStatistic,
  pFollowsFromF,
  pFollowsFromChiSquare,
  pFollowsFromR,
  pFollowsFromZ,
  rDfFollowsFromN,
  etaSquaredFollowsFromF,
  chiSquareDfFollowsFromTable,
  associationFollowsFromChiSquare,
  fEqualsTSquared,
  fFollowsFromGroupSummaries,
  oneTailedPIsDeclared,
  valuesArePossible,
  zeroPIsABound,
  minusIsAMinusSign,
  adjustedPFollows,
  tFollowsFromDescriptives,
  tFollowsFromCoefficient,
  zFollowsFromCoefficient,
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
  sampleSizeAgreesWithDf,
  groupSizesSumToTotal,
  repeatedResultAgrees,
  resultIsComplete,
  testIsNamed,
  tailsAreStated,
  alphaIsStated,
  pIsExact,
  pPrecisionIsSensible,
  statisticHasDf,
  effectSizeWithCi,
  descriptivesWithN,
  softwareIsNamed,
  assumptionsAreChecked,
  multipleComparisonsAddressed,
  noTrendWording,
  quietDirectiveHasReason,
  frontMatterIsReadable,
  inputIsReadable,
];

export const RULE_IDS: readonly string[] = RULES.map((r) => r.id);

export function ruleById(id: string): AnyRule | undefined {
  return RULES.find((r) => r.id === id);
}
