export { findDividers } from './find-dividers.js';
export type { DividerCandidate, FinderLimits, FinderRequest, StockItem } from './finder-types.js';
export { planSearch } from './finder-request.js';
export type { SearchPlan, SearchValue } from './finder-request.js';
export { compareCandidates } from './candidate-ranking.js';
export { MIXED_STRING_BUDGET, multisetCount } from './top-strings.js';
