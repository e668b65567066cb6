export { twoSidedPFromT, oneSidedPFromT, upperTailT, twoSidedCriticalT, tDensity } from './tDistribution.js';
export { roundingInterval, scientificRoundingInterval, lastDigitUnit } from './rounding.js';
export { twoSidedPRange, oneSidedPRange, intervalsMeet, type Interval } from './pRange.js';
export { checkPAgainstT, meets, sideOfAlpha, distanceBetween, type PInterval, type PConsistency, type PConsistencyInput } from './pConsistency.js';
export { oneSampleAbsT, pairedImpliedCorrelation, studentAbsT, welchAbsT, welchDfRange, type Box } from './summaryT.js';
export { dAverage, dFromMeansPooled, dFromTIndependent, dRepeatedMeasures, dzFromT, hedgesCorrection } from './effectSize.js';
export { ciHalfWidthFromT, pFromConfidenceInterval } from './confidenceInterval.js';
export { grimmerPossible, grimPossible, percentPossible } from './granularity.js';
export { requiredN, tTestPower, type PowerDesign } from './power.js';
