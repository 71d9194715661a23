/**
 * Quantiles and coverage intervals of a sorted Monte Carlo sample by the
 * JCGM 101:2008 conventions: the i-th of M sorted values carries cumulative
 * probability (i − ½)/M, linear in between (§5.1.1 c, §7.5.1).
 */

function checkSorted(sortedValues: readonly number[]): void {
  if (sortedValues.length === 0) throw new Error('sortedValues must not be empty');
  for (let i = 0; i < sortedValues.length; i++) {
    if (!Number.isFinite(sortedValues[i])) throw new Error('sortedValues must hold only finite numbers');
    if (i > 0 && sortedValues[i] < sortedValues[i - 1]) throw new Error('sortedValues must be in ascending order');
  }
}

/**
 * The p-quantile of an ascending sample, G⁻¹(p) with G((i − ½)/M) = y₍ᵢ₎
 * interpolated linearly and clamped to [y₍₁₎, y₍M₎] (JCGM 101:2008 §7.5.1).
 * @param sortedValues ascending sample, any unit, M ≥ 1 (not copied, not mutated)
 * @param p probability, 0 ≤ p ≤ 1
 * @throws Error when empty, unsorted, non-finite or p outside [0, 1]
 * @example sortedQuantile([1, 2, 3, 4], 0.5) // 2.5
 */
export function sortedQuantile(sortedValues: readonly number[], p: number): number {
  checkSorted(sortedValues);
  if (!(p >= 0 && p <= 1)) throw new Error('p must be a probability between 0 and 1');
  const count = sortedValues.length;
  const position = count * p + 0.5; // 1-based index carrying probability p
  if (position <= 1) return sortedValues[0];
  if (position >= count) return sortedValues[count - 1];
  const below = Math.floor(position);
  const fraction = position - below;
  return sortedValues[below - 1] + fraction * (sortedValues[below] - sortedValues[below - 1]);
}

/** A coverage interval [low, high] in the unit of the sample. */
export interface CoverageInterval {
  low: number;
  high: number;
}

function coverageCount(count: number, coverageProbability: number): number {
  if (!(coverageProbability > 0 && coverageProbability < 1)) {
    throw new Error('coverageProbability must be strictly between 0 and 1');
  }
  const exact = coverageProbability * count;
  const q = Number.isInteger(exact) ? exact : Math.floor(exact + 0.5);
  if (q < 1 || q >= count) throw new Error(`too few values (${count}) for coverage probability ${coverageProbability}`);
  return q;
}

/**
 * Probabilistically symmetric coverage interval [y₍ᵣ₎, y₍ᵣ₊q₎], q = pM (or ⌊pM + ½⌋),
 * r = (M − q)/2 rounded up to an integer (JCGM 101:2008 §7.7.1).
 * @param sortedValues ascending sample, any unit
 * @param coverageProbability p, 0 < p < 1 (e.g. 0.95)
 * @throws Error when empty, unsorted or too small for p
 * @example symmetricCoverageInterval(sorted, 0.95)
 */
export function symmetricCoverageInterval(sortedValues: readonly number[], coverageProbability: number): CoverageInterval {
  checkSorted(sortedValues);
  const count = sortedValues.length;
  const q = coverageCount(count, coverageProbability);
  const r = (count - q) % 2 === 0 ? (count - q) / 2 : (count - q + 1) / 2;
  return { low: sortedValues[Math.max(r, 1) - 1], high: sortedValues[Math.max(r, 1) - 1 + q] };
}

/**
 * Shortest coverage interval: the r minimising y₍ᵣ₊q₎ − y₍ᵣ₎ (JCGM 101:2008 §7.7.2).
 * @param sortedValues ascending sample, any unit
 * @param coverageProbability p, 0 < p < 1
 * @throws Error when empty, unsorted or too small for p
 * @example shortestCoverageInterval(sorted, 0.95)
 */
export function shortestCoverageInterval(sortedValues: readonly number[], coverageProbability: number): CoverageInterval {
  checkSorted(sortedValues);
  const q = coverageCount(sortedValues.length, coverageProbability);
  let best = 0;
  for (let r = 1; r + q < sortedValues.length; r++) {
    if (sortedValues[r + q] - sortedValues[r] < sortedValues[best + q] - sortedValues[best]) best = r;
  }
  return { low: sortedValues[best], high: sortedValues[best + q] };
}
