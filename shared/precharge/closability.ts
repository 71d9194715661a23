import { timeToFractionS } from './rc.js';
import type { PrechargeDesign } from './types.js';
import { assertPrechargeDesign } from './validate.js';

/** Whether the healthy, nominal pre-charge can close at all. */
export interface Closability {
  closes: boolean;
  /** Why not: the link settles below the threshold, or reaches it only after the timeout. */
  reason: 'settles-below-threshold' | 'after-timeout' | null;
  /** R_l/(R_p + R_l) of the nominal network (1 without leakage). */
  steadyFraction: number;
  /** Closure time with exact readings, s: max(1, ⌈t_x/Δ⌉) + N − 1 readings; Infinity when it never closes. */
  closeS: number;
}

/**
 * Checks the nominal healthy curve against the closing rule with exact readings: the link
 * settles at R_l/(R_p + R_l) of the pack (handbook RC charging), so a threshold at or above
 * that is never reached ("unable to close"); otherwise closure is at the first reading after
 * t = −τ·ln(1 − p·(R_p + R_l)/R_l) plus N − 1 further readings, which must not pass the timeout.
 * @param design pre-charge design (tolerances and reading errors are ignored)
 * @throws Error naming a bad design input
 * @example nominalClosability({ ...design, leakageOhm: 20e3 }).reason // 'settles-below-threshold' at 95 %
 */
export function nominalClosability(design: PrechargeDesign): Closability {
  assertPrechargeDesign(design);
  const network = { prechargeOhm: design.prechargeOhm, leakageOhm: design.leakageOhm ?? Infinity, capacitanceF: design.linkCapacitanceF };
  const steadyFraction = network.leakageOhm === Infinity ? 1 : network.leakageOhm / (network.prechargeOhm + network.leakageOhm);
  const crossS = timeToFractionS(design.closingFraction, network);
  if (crossS === Infinity) return { closes: false, reason: 'settles-below-threshold', steadyFraction, closeS: Infinity };
  const readings = Math.max(1, Math.ceil(crossS / design.updateIntervalS)) + design.consecutiveReadings - 1;
  const closeS = readings * design.updateIntervalS;
  if (closeS > design.timeoutS) return { closes: false, reason: 'after-timeout', steadyFraction, closeS: Infinity };
  return { closes: true, reason: null, steadyFraction, closeS };
}
