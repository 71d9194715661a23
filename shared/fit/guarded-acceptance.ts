/**
 * Conformity decision with guarded acceptance (JCGM 106:2012 §8.3.2): the acceptance interval is the
 * tolerance interval [T_L, T_U] shrunk at each side by a guard band w = U = k·u, the expanded uncertainty of
 * the measurement. A result inside it is accepted; one outside the tolerance interval is rejected; one in a
 * guard band is left undecided. The conformance probability (JCGM 106 §7.2, eq. 18 with a normal PDF for the
 * measurand given the measured value y and its standard uncertainty u) is
 * p_c = Φ((T_U − y)/u) − Φ((T_L − y)/u); 1 − p_c is the chance that an accepted item in fact does not conform
 * (the specific false-accept probability, JCGM 106 §9.5.2).
 */
import jStat from 'jstat';

export type AcceptanceDecision = 'accept' | 'undecided' | 'reject';

/** One quantity's decision against its tolerance interval. */
export interface GuardedDecision {
  decision: AcceptanceDecision;
  /** the acceptance interval; empty (low > high) when 2w exceeds the tolerance interval, so nothing can be accepted */
  acceptanceLow: number;
  acceptanceHigh: number;
  /** w = k·u, unit of the quantity */
  guardBand: number;
  /** p_c, 0–1 */
  conformanceProbability: number;
}

/** The rule as the tester and the lead read it; k is the guard band's coverage factor. */
export function guardedAcceptanceRule(k: number): string {
  return `Guarded acceptance (JCGM 106:2012 §8): a quantity is accepted when its measured value lies inside the design's interval `
    + `shrunk at each side by a guard band equal to its expanded uncertainty (k = ${k}), rejected when it lies outside the design's interval, `
    + 'and undecided when it lies in a guard band. The board is accepted only when every quantity is accepted and rejected when any is rejected. '
    + 'The probability of conformance assumes a normal distribution for the true value about the measured one.';
}

/**
 * @param estimate y, the measured value
 * @param standardUncertainty u(y) ≥ 0, same unit
 * @param coverageFactor k > 0 of the guard band w = k·u
 * @param toleranceLow T_L
 * @param toleranceHigh T_U ≥ T_L
 * @throws Error when an input is not finite, u < 0, k ≤ 0 or T_U < T_L
 * @example guardedDecision(0.2, 0.1, 2, -1, 1).decision // 'accept' (acceptance interval −0.8 to 0.8)
 */
export function guardedDecision(estimate: number, standardUncertainty: number, coverageFactor: number, toleranceLow: number, toleranceHigh: number): GuardedDecision {
  if (![estimate, toleranceLow, toleranceHigh].every(Number.isFinite)) throw new Error('estimate and tolerance limits must be finite numbers');
  if (!(standardUncertainty >= 0 && Number.isFinite(standardUncertainty))) throw new Error('standard uncertainty must be a finite number ≥ 0');
  if (!(coverageFactor > 0 && Number.isFinite(coverageFactor))) throw new Error('coverage factor must be > 0');
  if (!(toleranceHigh >= toleranceLow)) throw new Error('tolerance high limit must not be below the low limit');
  const guardBand = coverageFactor * standardUncertainty;
  const acceptanceLow = toleranceLow + guardBand;
  const acceptanceHigh = toleranceHigh - guardBand;
  const inside = estimate >= toleranceLow && estimate <= toleranceHigh;
  const decision: AcceptanceDecision = !inside ? 'reject' : estimate >= acceptanceLow && estimate <= acceptanceHigh ? 'accept' : 'undecided';
  const conformanceProbability = standardUncertainty === 0
    ? (inside ? 1 : 0)
    : (jStat.normal.cdf(toleranceHigh, estimate, standardUncertainty) as number) - (jStat.normal.cdf(toleranceLow, estimate, standardUncertainty) as number);
  return { decision, acceptanceLow, acceptanceHigh, guardBand, conformanceProbability: Math.min(1, Math.max(0, conformanceProbability)) };
}

/**
 * Several quantities of one item: rejected when any is rejected, accepted when all are accepted, else
 * undecided. The chance that the item does not conform is at most Σ(1 − p_c,i) (Bonferroni's inequality),
 * whatever the quantities' correlation.
 * @param decisions one per quantity, at least one
 * @throws Error when there are none
 * @example combinedDecision([gain, offset]).decision
 */
export function combinedDecision(decisions: readonly GuardedDecision[]): { decision: AcceptanceDecision; nonConformanceAtMost: number } {
  if (decisions.length === 0) throw new Error('at least one decision is needed');
  const decision: AcceptanceDecision = decisions.some((d) => d.decision === 'reject')
    ? 'reject'
    : decisions.every((d) => d.decision === 'accept') ? 'accept' : 'undecided';
  const nonConformanceAtMost = Math.min(1, decisions.reduce((sum, d) => sum + (1 - d.conformanceProbability), 0));
  return { decision, nonConformanceAtMost };
}
