/**
 * Figures of one divider at the maximum input voltage as the converter sees it, and whether it
 * keeps every limit: R_b' = R_b‖R_in, I = V/(ΣR_top + R_b'), V_i = I·R_i, V_b = I·R_b',
 * P_i = V_i²/R_i; ratio and source resistance from the editor's own dividerNominal.
 */
import { dividerNominal } from '../chain/divider.js';
import type { SearchPlan, SearchValue } from './finder-request.js';
import type { DividerCandidate } from './finder-types.js';

/**
 * The candidate for a top string and a bottom value, or null when it breaks a limit
 * (per-resistor volts or watts, a part's own rating, bleed current, total resistance).
 * @param plan the checked request (volts in V, limits in V, W, A, Ω; converter R_in in Ω, I_b in A)
 * @param top the top-string values, ascending
 * @param bottom the bottom value
 * @example evaluateDivider(plan, [v, v], bottom)
 */
export function evaluateDivider(plan: SearchPlan, top: readonly SearchValue[], bottom: SearchValue): DividerCandidate | null {
  const { limits, maxInputVolts, targetRatio } = plan;
  const inputResistance = plan.inputResistanceOhms === Infinity ? undefined : plan.inputResistanceOhms;
  // dividerNominal reads only nominalOhm; the finder's parts carry no other specs.
  const divider = { top: top.map((part) => ({ nominalOhm: part.ohms })), bottom: { nominalOhm: bottom.ohms } } as unknown as Parameters<typeof dividerNominal>[0];
  const nominal = dividerNominal(divider, inputResistance);
  const totalOhms = nominal.topOhm + nominal.loadedBottomOhm;
  if (totalOhms < limits.minTotalOhms || totalOhms > limits.maxTotalOhms) return null;
  const bleedAmps = maxInputVolts * nominal.bleedAPerV;
  if (bleedAmps > limits.maxBleedAmps || bleedAmps < limits.minBleedAmps) return null;
  let maxVoltsPerResistor = 0;
  let maxWattsPerResistor = 0;
  const parts: [SearchValue, number][] = [...top.map((part): [SearchValue, number] => [part, bleedAmps * part.ohms]), [bottom, bleedAmps * nominal.loadedBottomOhm]];
  for (const [part, volts] of parts) {
    const watts = (volts * volts) / part.ohms;
    if (volts > limits.maxVoltsPerResistor || volts > part.maxVolts) return null;
    if (watts > limits.maxWattsPerResistor || watts > part.maxWatts) return null;
    maxVoltsPerResistor = Math.max(maxVoltsPerResistor, volts);
    maxWattsPerResistor = Math.max(maxWattsPerResistor, watts);
  }
  const ratioErrorFraction = nominal.ratio / targetRatio - 1;
  const biasOffsetVolts = plan.inputBiasAmps * nominal.theveninOhm;
  return {
    topOhms: top.map((part) => part.ohms),
    bottomOhms: bottom.ohms,
    loadedBottomOhms: nominal.loadedBottomOhm,
    ratio: nominal.ratio,
    ratioErrorFraction,
    theveninOhms: nominal.theveninOhm,
    biasOffsetVolts,
    worstCaseErrorFraction: Math.abs(ratioErrorFraction) + biasOffsetVolts / (maxInputVolts * targetRatio),
    totalOhms,
    bleedAmps,
    totalWatts: maxInputVolts * bleedAmps,
    maxVoltsPerResistor,
    maxWattsPerResistor,
    outputVolts: maxInputVolts * nominal.ratio,
    partCount: top.length + 1,
  };
}
