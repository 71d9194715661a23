/** Shapes a bounded input can take; a normal one is bounded by ±k·σ. */
export type DistributionName = 'rectangular' | 'normal' | 'triangular' | 'u-shaped';

/** Numeric codes for hot loops (index into {@link DISTRIBUTION_NAMES}). */
export const DISTRIBUTION_NAMES: readonly DistributionName[] = ['rectangular', 'normal', 'triangular', 'u-shaped'];

/**
 * Numeric code of a distribution name for typed-array loops.
 * @param name distribution name
 * @throws if the name is unknown
 * @example distributionCode('triangular') // 2
 */
export function distributionCode(name: DistributionName): number {
  const code = DISTRIBUTION_NAMES.indexOf(name);
  if (code < 0) throw new Error(`distribution must be one of ${DISTRIBUTION_NAMES.join(', ')}`);
  return code;
}

/**
 * Standard uncertainty of an input known only by its half-width a and shape:
 * rectangular a/√3 (GUM 4.3.7), triangular a/√6 (GUM 4.3.9), U-shaped (arcsine) a/√2
 * (JCGM 101 6.4.6), normal with a = k·σ: a/k (GUM 4.3.4).
 * @param halfWidth a, in the input's own unit (≥ 0)
 * @param distribution shape of the input
 * @param coverageFactor k for a normal input (a = k·σ), > 0; ignored otherwise
 * @throws if the half-width is negative or k is not > 0
 * @example standardUncertaintyOf(1, 'rectangular') // 0.5774
 */
export function standardUncertaintyOf(halfWidth: number, distribution: DistributionName, coverageFactor = 2): number {
  if (!(halfWidth >= 0) || !Number.isFinite(halfWidth)) throw new Error('half-width must be a finite number ≥ 0');
  switch (distribution) {
    case 'rectangular':
      return halfWidth / Math.sqrt(3);
    case 'triangular':
      return halfWidth / Math.sqrt(6);
    case 'u-shaped':
      return halfWidth / Math.SQRT2;
    case 'normal':
      if (!(coverageFactor > 0)) throw new Error('coverage factor must be > 0');
      return halfWidth / coverageFactor;
    default:
      throw new Error(`distribution must be one of ${DISTRIBUTION_NAMES.join(', ')}`);
  }
}
