export { TRIALS_PER_BLOCK, blockStreams, blockStream } from './streams.js';
export type { BlockGenerator } from './streams.js';
export { DISTRIBUTION_NAMES, distributionCode, standardUncertaintyOf } from './distributions.js';
export type { DistributionName } from './distributions.js';
export { VariateSource } from './variates.js';
