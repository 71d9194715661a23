/**
 * The numbers a study uses when the person does not say, and the bounds it accepts, held once: the request
 * schemas, the engine's defaults, the server and the client's forms all read them from here.
 */

/** Evaluation voltages across a channel's range: 0, 10 %, …, 100 % of the maximum. */
export const DEFAULT_GRID_POINTS = 11;
export const MIN_GRID_POINTS = 2;
export const MAX_GRID_POINTS = 41;

/** Coverage probability of the intervals shown when none is asked for (JCGM 101:2008 uses 0.95 throughout). */
export const DEFAULT_COVERAGE_PROBABILITY = 0.95;

/** Fewest trials any study accepts. */
export const MIN_TRIALS = 1000;
/** Most trials one uncertainty study may ask for. */
export const MAX_TRIALS = 2_000_000;
/** Trials a fixed-count uncertainty study offers first: JCGM 101 7.2.2's 10⁴/(1 − p) for p = 0.95. */
export const DEFAULT_UNCERTAINTY_TRIALS = 200_000;

/** Most trials, fault trials or simulated boards one margin study may ask for. */
export const MAX_MARGIN_TRIALS = 1_000_000;
/** Fewest fault trials or simulated boards a margin study accepts. */
export const MIN_MARGIN_FAULT_TRIALS = 500;
/** What a margin study runs when the request leaves the counts out. */
export const MARGIN_TRIAL_DEFAULTS = { trials: 100_000, faultTrials: 10_000, readingErrorTrials: 20_000 } as const;
