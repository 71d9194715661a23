/**
 * Numerical tolerance δ of a standard uncertainty, JCGM 101:2008 7.9.2: write u = c·10^l with
 * c an integer of `ndig` significant digits; δ = ½·10^l. Zero u gives δ = 0.
 * @param standardUncertainty u ≥ 0, any unit (δ has the same unit)
 * @param ndig significant decimal digits regarded as meaningful in u, integer ≥ 1
 * @throws if u is negative or not finite, or ndig is not an integer ≥ 1
 * @example numericalTolerance(0.0236, 2) // 0.0005
 */
export function numericalTolerance(standardUncertainty: number, ndig: number): number {
  if (!Number.isFinite(standardUncertainty) || standardUncertainty < 0) throw new Error('standard uncertainty must be ≥ 0');
  if (!Number.isInteger(ndig) || ndig < 1) throw new Error('significant digits must be an integer ≥ 1');
  if (standardUncertainty === 0) return 0;
  let exponent = Math.floor(Math.log10(standardUncertainty)) - ndig + 1;
  const digits = Math.round(standardUncertainty / 10 ** exponent);
  if (digits >= 10 ** ndig) exponent += 1;
  return 0.5 * 10 ** exponent;
}
