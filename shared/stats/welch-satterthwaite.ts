/**
 * Effective degrees of freedom of a combined standard uncertainty (JCGM 100:2008, G.4.1, eq. G.2b):
 * ν_eff = u_c⁴ / Σ (u_i⁴ / ν_i), with u_c² = Σ u_i². A Type B component whose bounds are taken as
 * exactly known has ν = ∞ and adds nothing to the sum (JCGM 100 G.4.3).
 */

/** One contribution to a combined standard uncertainty, already multiplied by its sensitivity coefficient. */
export interface UncertaintyContribution {
  /** |c_i|·u(x_i) ≥ 0, unit of the output */
  standardUncertainty: number;
  /** ν_i > 0; Infinity for a contribution known exactly */
  degreesOfFreedom: number;
}

/**
 * @param contributions at least one; standard uncertainties ≥ 0, degrees of freedom > 0
 * @returns ν_eff (Infinity when every finite-ν contribution is zero)
 * @throws Error when there are no contributions or one is out of range
 * @example effectiveDegreesOfFreedom([{ standardUncertainty: 1, degreesOfFreedom: 4 }]) // 4
 */
export function effectiveDegreesOfFreedom(contributions: readonly UncertaintyContribution[]): number {
  if (contributions.length === 0) throw new Error('at least one uncertainty contribution is needed');
  let variance = 0;
  let denominator = 0;
  for (const { standardUncertainty: u, degreesOfFreedom: nu } of contributions) {
    if (!(u >= 0 && Number.isFinite(u))) throw new Error('standard uncertainty must be a finite number ≥ 0');
    if (!(nu > 0)) throw new Error('degrees of freedom must be > 0');
    variance += u * u;
    if (Number.isFinite(nu)) denominator += u ** 4 / nu;
  }
  return denominator === 0 ? Infinity : (variance * variance) / denominator;
}
