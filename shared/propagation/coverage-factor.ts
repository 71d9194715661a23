import jStat from 'jstat';

/**
 * Coverage factor k_p of a normal output for coverage probability p (GUM (JCGM 100) G.1.3,
 * Table G.1): k_p = Φ⁻¹((1 + p)/2), e.g. 1.960 for p = 0.95.
 * @param coverageProbability p in (0, 1)
 * @throws if p is outside (0, 1)
 * @example normalCoverageFactor(0.95) // 1.95996
 */
export function normalCoverageFactor(coverageProbability: number): number {
  if (!(coverageProbability > 0 && coverageProbability < 1)) throw new Error('coverage probability must be in (0, 1)');
  return jStat.normal.inv((1 + coverageProbability) / 2, 0, 1) as number;
}
