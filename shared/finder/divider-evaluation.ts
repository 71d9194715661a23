/**
 * Figures of one divider at the maximum input voltage, and whether it keeps
 * every limit: I = V/(ΣR_top + R_bottom), V_i = I·R_i, P_i = I²·R_i.
 */
import type { SearchPlan, SearchValue } from './finder-request.js';
import type { DividerCandidate } from './finder-types.js';

/**
 * The candidate for a top string and a bottom value, or null when it breaks a limit
 * (per-resistor volts or watts, a part's own rating, bleed current, total resistance).
 * @param plan the checked request (volts in V, limits in V, W, A, Ω)
 * @param top the top-string values
 * @param topOhms their sum (Ω)
 * @param bottom the bottom value
 * @example evaluateDivider(plan, [v, v], 2 * v.ohms, bottom)
 */
export function evaluateDivider(
  plan: SearchPlan,
  top: readonly SearchValue[],
  topOhms: number,
  bottom: SearchValue,
): DividerCandidate | null {
  const { limits, maxInputVolts } = plan;
  const totalOhms = topOhms + bottom.ohms;
  if (totalOhms < limits.minTotalOhms || totalOhms > limits.maxTotalOhms) return null;
  const bleedAmps = maxInputVolts / totalOhms;
  if (bleedAmps > limits.maxBleedAmps || bleedAmps < limits.minBleedAmps) return null;
  let maxVoltsPerResistor = 0;
  let maxWattsPerResistor = 0;
  for (const part of [...top, bottom]) {
    const volts = bleedAmps * part.ohms;
    const watts = volts * bleedAmps;
    if (volts > limits.maxVoltsPerResistor || volts > part.maxVolts) return null;
    if (watts > limits.maxWattsPerResistor || watts > part.maxWatts) return null;
    maxVoltsPerResistor = Math.max(maxVoltsPerResistor, volts);
    maxWattsPerResistor = Math.max(maxWattsPerResistor, watts);
  }
  const ratio = bottom.ohms / totalOhms;
  return {
    topOhms: top.map((part) => part.ohms),
    bottomOhms: bottom.ohms,
    ratio,
    ratioErrorFraction: ratio / plan.targetRatio - 1,
    totalOhms,
    bleedAmps,
    totalWatts: maxInputVolts * bleedAmps,
    maxVoltsPerResistor,
    maxWattsPerResistor,
    outputVolts: maxInputVolts * ratio,
    partCount: top.length + 1,
  };
}
