/**
 * The divider as the converter sees it. Thevenin equivalent of the divider with the converter's
 * input resistance R_in across the bottom resistor and its bias current I_b drawn from the node:
 * V_in = V·R_b'/(R_t + R_b') − I_b·(R_t‖R_b'), R_b' = R_b‖R_in (handbook voltage divider and
 * Thevenin's theorem). I_b is a bound of either sign, so its effect is a ± offset beside the ratio.
 */
import type { SearchPlan } from './finder-request.js';

/**
 * The bottom resistor in parallel with the converter input, R_b·R_in/(R_b + R_in) (same
 * expression as the editor's dividerNominal, so the two agree to the last bit).
 * @param bottomOhms R_b (Ω)
 * @param inputResistanceOhms R_in (Ω), Infinity when unloaded
 * @example loadedBottomOhms(1e6, 10e6) // 909090.9…
 */
export function loadedBottomOhms(bottomOhms: number, inputResistanceOhms: number): number {
  return inputResistanceOhms === Infinity ? bottomOhms : (bottomOhms * inputResistanceOhms) / (bottomOhms + inputResistanceOhms);
}

/**
 * The ranking figure: worst case over the bias current's sign of the relative error of V_in at
 * the highest input, |r/r₀ − 1| + I_b·(R_t‖R_b')/(V·r₀), with r = R_b'/(R_t + R_b').
 * @param plan target ratio r₀, highest input V (V), bias bound I_b (A)
 * @param topOhms R_t (Ω)
 * @param loadedOhms R_b' (Ω)
 * @example worstCaseError(plan, 4e6, 16.2e3)
 */
export function worstCaseError(plan: SearchPlan, topOhms: number, loadedOhms: number): number {
  const total = topOhms + loadedOhms;
  const ratioError = Math.abs(loadedOhms / total / plan.targetRatio - 1);
  return ratioError + (plan.inputBiasAmps * topOhms * loadedOhms) / (total * plan.maxInputVolts * plan.targetRatio);
}

/**
 * Whether the worst-case error grows on both sides of its minimum as R_t moves away, so a search
 * may stop walking at the first R_t beyond a bound. With u = R_b'/(R_t + R_b') the error is
 * linear in u on each side of r₀ and grows below the target when I_b·R_b' < V, i.e. when the bias
 * current through the bottom alone drops less than the whole input (always, for a usable divider).
 * @example isMonotoneAbout(plan, 10e3) // true
 */
export function isMonotoneAbout(plan: SearchPlan, loadedOhms: number): boolean {
  return plan.inputBiasAmps * loadedOhms < plan.maxInputVolts;
}

/**
 * The range of R_t whose worst-case error is at most `bound`, from the linear form in
 * u = R_b'/(R_t + R_b'): below target e = u(1/r₀ − β) − 1 + β, above e = 1 + β − u(1/r₀ + β),
 * β = I_b·R_b'/(V·r₀); R_t = R_b'(1 − u)/u.
 * @param plan target ratio, highest input, bias bound
 * @param loadedOhms R_b' (Ω)
 * @param bound worst-case error fraction ≥ 0 (Infinity for no bound)
 * @returns [lowest, highest] R_t in Ω (lowest 0, highest Infinity when unbounded); lowest > highest when empty
 * @example topOhmsWithin(plan, 16.2e3, 1e-3)
 */
export function topOhmsWithin(plan: SearchPlan, loadedOhms: number, bound: number): [number, number] {
  if (bound === Infinity) return [0, Infinity];
  const beta = (plan.inputBiasAmps * loadedOhms) / (plan.maxInputVolts * plan.targetRatio);
  const invTarget = 1 / plan.targetRatio;
  const uHigh = (bound + 1 - beta) / (invTarget - beta);
  const uLow = (1 + beta - bound) / (invTarget + beta);
  const lowest = uHigh >= 1 ? 0 : (loadedOhms * (1 - uHigh)) / uHigh;
  const highest = uLow <= 0 ? Infinity : (loadedOhms * (1 - uLow)) / uLow;
  return [lowest, highest];
}

/**
 * The R_t at which the ratio the converter sees equals the target, R_b'(1 − r₀)/r₀.
 * @example idealTopOhms(plan, 16.2e3)
 */
export function idealTopOhms(plan: SearchPlan, loadedOhms: number): number {
  return (loadedOhms * (1 - plan.targetRatio)) / plan.targetRatio;
}
