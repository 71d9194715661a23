export { findDividers, CLOSEST_SHOWN, MAX_HALF_STRINGS, MIXED_WORK_BUDGET } from './find-dividers.js';
export type { DividerCandidate, FinderLimits, FinderRequest, FinderResult, SeriesValues, StockItem } from './finder-types.js';
export { planSearch } from './finder-request.js';
export type { SearchPlan, SearchValue } from './finder-request.js';
export { compareCandidates } from './candidate-ranking.js';
export { multisetCount } from './top-strings.js';
export { loadedBottomOhms, worstCaseError } from './loaded-divider.js';
