import { orderQuantile } from './quantiles.js';

/** Closure-time limits outside which the controller should flag a fault. */
export interface PlausibilityWindow {
  /** Closing before this is implausibly fast, s. */
  tooFastBelowS: number;
  /** Not closed by this is implausibly slow, s (never beyond the timeout). */
  tooSlowAboveS: number;
  marginFraction: number;
  fromProbabilities: [number, number];
  /** Healthy trials the window would flag (false alarms), fraction. */
  falseAlarmFraction: number;
}

/**
 * Plausibility window from healthy closure times: [q_low·(1 − m), min(q_high·(1 + m), timeout)]
 * with q the order-statistic quantiles at the given probabilities and m the margin (common
 * practice: a fault must move the closure time clearly outside the healthy spread).
 * @param sortedCloseS ascending closure times of healthy trials that closed, s
 * @param neverCount healthy trials that never closed (counted as false alarms)
 * @param timeoutS the controller's timeout, s
 * @param marginFraction m in [0, 1)
 * @param probabilities [low, high] in [0, 1], low < high
 * @throws if no trial closed, or m or the probabilities are out of range
 * @example plausibilityWindow(sortedTimes, 0, 10, 0.2, [0.001, 0.999])
 */
export function plausibilityWindow(
  sortedCloseS: Float64Array, neverCount: number, timeoutS: number, marginFraction: number, probabilities: [number, number],
): PlausibilityWindow {
  if (sortedCloseS.length === 0) throw new Error('no healthy trial closed before the timeout');
  if (!(marginFraction >= 0 && marginFraction < 1)) throw new Error('plausibility margin must be in [0, 1)');
  if (!(probabilities[0] < probabilities[1])) throw new Error('plausibility probabilities reversed');
  const tooFastBelowS = orderQuantile(sortedCloseS, probabilities[0]) * (1 - marginFraction);
  const tooSlowAboveS = Math.min(orderQuantile(sortedCloseS, probabilities[1]) * (1 + marginFraction), timeoutS);
  let flagged = neverCount;
  for (let i = 0; i < sortedCloseS.length; i++) if (sortedCloseS[i] < tooFastBelowS || sortedCloseS[i] > tooSlowAboveS) flagged++;
  return {
    tooFastBelowS,
    tooSlowAboveS,
    marginFraction,
    fromProbabilities: probabilities,
    falseAlarmFraction: flagged / (sortedCloseS.length + neverCount),
  };
}
