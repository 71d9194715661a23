/**
 * The scatter of one new reading at a frequency, from the bench points' own standard uncertainties, so a
 * weighted fit's read-back is given the u(f) found where the reading falls rather than a typical bench point's.
 */

/**
 * u(f) interpolated linearly over the bench points' frequencies and held at the end values outside them;
 * points at the same frequency count once, with their mean u.
 * @param frequenciesHz the bench points' frequencies, Hz
 * @param uncertaintiesHz their standard uncertainties, Hz, > 0
 * @param frequencyHz where a new reading falls, Hz
 * @throws Error when the lists are empty or differ in length, or a value is not finite (u must be > 0)
 * @example interpolatedUncertainty([1000, 3000], [0.1, 0.3], 2000) // 0.2
 */
export function interpolatedUncertainty(frequenciesHz: readonly number[], uncertaintiesHz: readonly number[], frequencyHz: number): number {
  if (frequenciesHz.length === 0) throw new Error('frequencies must hold at least one point');
  if (frequenciesHz.length !== uncertaintiesHz.length) throw new Error('frequencies and uncertainties differ in length');
  if (!frequenciesHz.every(Number.isFinite) || !Number.isFinite(frequencyHz)) throw new Error('frequencies must be finite numbers');
  if (!uncertaintiesHz.every((u) => u > 0 && Number.isFinite(u))) throw new Error('uncertainties must be finite numbers > 0');
  const byFrequency = new Map<number, number[]>();
  frequenciesHz.forEach((f, i) => byFrequency.set(f, [...(byFrequency.get(f) ?? []), uncertaintiesHz[i]]));
  const knots = [...byFrequency.entries()]
    .map(([f, us]) => ({ f, u: us.reduce((a, b) => a + b, 0) / us.length }))
    .sort((a, b) => a.f - b.f);
  if (frequencyHz <= knots[0].f) return knots[0].u;
  const last = knots[knots.length - 1];
  if (frequencyHz >= last.f) return last.u;
  const upper = knots.findIndex((k) => k.f >= frequencyHz);
  const a = knots[upper - 1];
  const b = knots[upper];
  return a.u + ((b.u - a.u) * (frequencyHz - a.f)) / (b.f - a.f);
}
