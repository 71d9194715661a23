import type { CoverageInterval, SampledInterval } from './coverage.js';
import type { GumResult } from './gum.js';
import { numericalTolerance } from './tolerance.js';

/** What comparing the GUM interval with the Monte Carlo one can say. */
export type GumAgreement = 'agrees' | 'disagrees' | 'cannot-tell';

/** Outcome of comparing a GUM interval with a Monte Carlo one (JCGM 101:2008 §8). */
export interface GumValidation {
  dLow: number;
  dHigh: number;
  numericalTolerance: number;
  /** Twice the standard uncertainty of each Monte Carlo end: how far the sample alone may move it (about 95 %). */
  monteCarloToleranceLow: number;
  monteCarloToleranceHigh: number;
  /**
   * agrees: both d ≤ δ with the Monte Carlo ends known to within δ; disagrees: some d exceeds δ plus
   * that end's own tolerance; cannot-tell otherwise (more trials would decide).
   */
  verdict: GumAgreement;
  /** True only when the verdict is 'agrees': the GUM framework is validated here. */
  adequate: boolean;
}

/**
 * Validates the GUM uncertainty framework against the Monte Carlo method, JCGM 101:2008 8.2:
 * d_low = |y − U_p − y_low| and d_high = |y + U_p − y_high| against δ of u_c(y) at ndig digits
 * (7.9.2), allowing for the Monte Carlo's own numerical tolerance, twice the standard uncertainty
 * of each sampled end (the 2s of the stabilisation test, 7.9.4): a difference is only real when it
 * exceeds δ + 2s, and agreement only means something when 2s ≤ δ. An interval without endpoint
 * uncertainties is taken as exact. Use the probabilistically symmetric MCM interval.
 * @param gum GUM result for the output
 * @param monteCarloInterval MCM coverage interval for the same p (output unit), ideally with its ends' uncertainties
 * @param ndig significant digits of u_c(y) regarded as meaningful, default 2
 * @throws if ndig is not an integer ≥ 1 or an endpoint uncertainty is negative
 * @example validateGum(gum, mc.outputs[0].symmetricInterval).verdict
 */
export function validateGum(gum: GumResult, monteCarloInterval: CoverageInterval | SampledInterval, ndig = 2): GumValidation {
  const delta = numericalTolerance(gum.combinedStandardUncertainty, ndig);
  const dLow = Math.abs(gum.estimate - gum.expandedUncertainty - monteCarloInterval.low);
  const dHigh = Math.abs(gum.estimate + gum.expandedUncertainty - monteCarloInterval.high);
  const sampled = 'lowStandardUncertainty' in monteCarloInterval;
  const toleranceLow = sampled ? 2 * monteCarloInterval.lowStandardUncertainty : 0;
  const toleranceHigh = sampled ? 2 * monteCarloInterval.highStandardUncertainty : 0;
  if (!(toleranceLow >= 0 && toleranceHigh >= 0)) throw new Error('interval end uncertainties must be ≥ 0');
  const verdict: GumAgreement = dLow > delta + toleranceLow || dHigh > delta + toleranceHigh
    ? 'disagrees'
    : dLow <= delta && dHigh <= delta && toleranceLow <= delta && toleranceHigh <= delta ? 'agrees' : 'cannot-tell';
  return {
    dLow, dHigh, numericalTolerance: delta,
    monteCarloToleranceLow: toleranceLow, monteCarloToleranceHigh: toleranceHigh,
    verdict, adequate: verdict === 'agrees',
  };
}

/**
 * One verdict over several points: disagrees if any point disagrees, agrees if all agree,
 * otherwise cannot tell.
 * @param validations per-point results (at least one)
 * @throws if there are none
 * @example overallGumAgreement(study.points.map((p) => p.gumValidation))
 */
export function overallGumAgreement(validations: readonly Pick<GumValidation, 'verdict'>[]): GumAgreement {
  if (validations.length === 0) throw new Error('validations must not be empty');
  if (validations.some((v) => v.verdict === 'disagrees')) return 'disagrees';
  return validations.every((v) => v.verdict === 'agrees') ? 'agrees' : 'cannot-tell';
}

/** How the product words each outcome of the check, on the page and in the report. */
export const GUM_AGREEMENT_WORDS: Record<GumAgreement, string> = { agrees: 'agrees', disagrees: 'differs', 'cannot-tell': 'cannot tell yet' };
