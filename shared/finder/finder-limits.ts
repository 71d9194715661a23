/**
 * What the limits allow, as bounds a search can use before building a candidate: the range of the
 * top resistance for a bottom, the largest top value, and the cheap part of the full check.
 */
import type { SearchPlan, SearchValue } from './finder-request.js';

/**
 * The range of R_t the limits allow with one bottom: total resistance and bleed current, and, when
 * the bottom part is given, its own voltage V_b = V·R_b'/(R_t + R_b') and power V_b²/R_b.
 * @param plan limits (V, W, A, Ω) and the highest input V
 * @param bottom the bottom part, or null for the totals alone
 * @param loadedOhms R_b' (Ω)
 * @returns [lowest, highest] R_t in Ω
 */
export function limitWindow(plan: SearchPlan, bottom: SearchValue | null, loadedOhms: number): [number, number] {
  const { limits, maxInputVolts } = plan;
  const lowestTotal = Math.max(limits.minTotalOhms, maxInputVolts / limits.maxBleedAmps);
  const highestTotal = Math.min(limits.maxTotalOhms, maxInputVolts / limits.minBleedAmps);
  let lowest = lowestTotal - loadedOhms;
  if (bottom !== null) {
    const maxVolts = Math.min(limits.maxVoltsPerResistor, bottom.maxVolts);
    const maxWatts = Math.min(limits.maxWattsPerResistor, bottom.maxWatts);
    lowest = Math.max(lowest, loadedOhms * (maxInputVolts / maxVolts - 1), (maxInputVolts * loadedOhms) / Math.sqrt(maxWatts * bottom.ohms) - loadedOhms);
  }
  return [lowest, highestTotal - loadedOhms];
}

/**
 * The largest value a top string may hold when the total is at most `highestTotal`: its voltage
 * V·R/R_total and power (V/R_total)²·R within the per-resistor limits.
 */
export function largestTopOhms(plan: SearchPlan, highestTotal: number): number {
  const { limits, maxInputVolts } = plan;
  const perVolt = highestTotal / maxInputVolts;
  return Math.min(limits.maxVoltsPerResistor * perVolt, limits.maxWattsPerResistor * perVolt * perVolt);
}

/**
 * The highest R_t a string of `length` resistors can have under the per-resistor voltage limit:
 * each holds at most maxV·(R_t + R_b')/V, so R_t ≤ n·maxV·R_b'/(V − n·maxV) when n·maxV < V.
 */
export function stringCapOhms(plan: SearchPlan, length: number, loadedOhms: number): number {
  const share = length * plan.limits.maxVoltsPerResistor;
  return share < plan.maxInputVolts ? ((share * loadedOhms) / (plan.maxInputVolts - share)) * (1 + 1e-9) : Infinity;
}

/**
 * Whether a value can sit in a top string at all: even at the lowest current the limits allow
 * (V over the highest total) its voltage and power stay within the limits and its own ratings.
 */
export function usableInTop(plan: SearchPlan, part: SearchValue): boolean {
  const { limits, maxInputVolts } = plan;
  const amps = maxInputVolts / Math.min(limits.maxTotalOhms, maxInputVolts / limits.minBleedAmps);
  const volts = amps * part.ohms;
  return volts <= Math.min(limits.maxVoltsPerResistor, part.maxVolts) && volts * amps <= Math.min(limits.maxWattsPerResistor, part.maxWatts);
}

/** The cheap part of the limit check (totals, bleed, largest top resistor, bottom), before any allocation. */
export function breaksLimits(plan: SearchPlan, topOhms: number, largestTopOhms: number, bottomIndex: number, loadedOhms: number): boolean {
  const { limits, maxInputVolts } = plan;
  const total = topOhms + loadedOhms;
  const amps = maxInputVolts / total;
  if (total < limits.minTotalOhms || total > limits.maxTotalOhms || amps > limits.maxBleedAmps || amps < limits.minBleedAmps) return true;
  const topVolts = amps * largestTopOhms;
  if (topVolts > limits.maxVoltsPerResistor || topVolts * amps > limits.maxWattsPerResistor) return true;
  const bottom = plan.values[bottomIndex];
  const bottomVolts = amps * loadedOhms;
  return bottomVolts > Math.min(limits.maxVoltsPerResistor, bottom.maxVolts) ||
    (bottomVolts * bottomVolts) / bottom.ohms > Math.min(limits.maxWattsPerResistor, bottom.maxWatts);
}
