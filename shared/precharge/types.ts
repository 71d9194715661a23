/**
 * How a channel's readings err: V̂ = V·(1 + g) + o. Either normal with given standard
 * deviations, or paired samples (g, o) drawn from the channel model (see readingErrorSamples),
 * resampled uniformly.
 */
export type ReadingErrorModel =
  | { kind: 'sigma'; gainSigmaFraction: number; offsetSigmaV: number }
  | { kind: 'samples'; gainErrorFraction: ArrayLike<number>; offsetErrorV: ArrayLike<number> };

/** The pre-charge circuit and closing rule under study (SI units). */
export interface PrechargeDesign {
  packMinV: number;
  packMaxV: number;
  prechargeOhm: number;
  prechargeTolerancePct: number;
  linkCapacitanceF: number;
  capacitanceTolerancePct: number;
  /** Parallel leakage on the link side (its divider, bleed resistors), Ω; omit for none. */
  leakageOhm?: number;
  /** Close when link reading ≥ this fraction of the pack reading (e.g. 0.95). */
  closingFraction: number;
  /** True link/pack ratio the contactor must not close below (e.g. 0.90). */
  requiredFraction: number;
  /** Readings are taken at t = k·updateIntervalS, k = 1, 2, … */
  updateIntervalS: number;
  /** Consecutive readings at or above the threshold needed to close. */
  consecutiveReadings: number;
  /** Give up (never reached) after this time, s. */
  timeoutS: number;
  packReading: ReadingErrorModel;
  linkReading: ReadingErrorModel;
}

/** A fault injected into the healthy design. */
export type PrechargeFault =
  | { kind: 'open-precharge' }
  | { kind: 'bypassed-precharge'; residualOhm?: number }
  | { kind: 'leakage'; resistanceOhm: number }
  | { kind: 'missing-capacitance'; fraction: number };

/** How a fault shows up against the plausibility window. */
export type FaultVerdict = 'too-fast' | 'too-slow' | 'not-detected';
