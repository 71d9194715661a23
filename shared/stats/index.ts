export { normalQuantile, studentTQuantile } from './quantiles.js';
export { studentTCdf, studentTDensity, studentTUpperTail } from './student-t-distribution.js';
export { mean, sampleVariance, sampleStandardDeviation } from './descriptive.js';
export { sortedQuantile, symmetricCoverageInterval, shortestCoverageInterval } from './sorted-quantile.js';
export type { CoverageInterval } from './sorted-quantile.js';
export { effectiveDegreesOfFreedom } from './welch-satterthwaite.js';
export type { UncertaintyContribution } from './welch-satterthwaite.js';
export { clopperPearsonUpper, clopperPearsonLower, trialsToShow } from './clopper-pearson.js';
export { radixSortFloat64 } from './radix-sort.js';
