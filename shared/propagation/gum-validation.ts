import type { CoverageInterval } from './coverage.js';
import type { GumResult } from './gum.js';
import { numericalTolerance } from './tolerance.js';

/** Outcome of comparing a GUM interval with a Monte Carlo one (JCGM 101:2008 §8). */
export interface GumValidation {
  dLow: number;
  dHigh: number;
  numericalTolerance: number;
  /** True when both d_low and d_high are ≤ δ: the GUM framework is validated here. */
  adequate: boolean;
}

/**
 * Validates the GUM uncertainty framework against the Monte Carlo method, JCGM 101:2008 8.2:
 * d_low = |y − U_p − y_low|, d_high = |y + U_p − y_high| against δ of u_c(y) at ndig digits
 * (7.9.2). Use the probabilistically symmetric MCM interval.
 * @param gum GUM result for the output
 * @param monteCarloInterval MCM coverage interval for the same p (output unit)
 * @param ndig significant digits of u_c(y) regarded as meaningful, default 2
 * @throws if ndig is not an integer ≥ 1
 * @example validateGum(gum, mc.outputs[0].symmetricInterval).adequate
 */
export function validateGum(gum: GumResult, monteCarloInterval: CoverageInterval, ndig = 2): GumValidation {
  const delta = numericalTolerance(gum.combinedStandardUncertainty, ndig);
  const dLow = Math.abs(gum.estimate - gum.expandedUncertainty - monteCarloInterval.low);
  const dHigh = Math.abs(gum.estimate + gum.expandedUncertainty - monteCarloInterval.high);
  return { dLow, dHigh, numericalTolerance: delta, adequate: dLow <= delta && dHigh <= delta };
}
