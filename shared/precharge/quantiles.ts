/**
 * Empirical quantile of ascending finite values: the ⌈p·n⌉-th order statistic (1-based,
 * at least the first), common practice for Monte Carlo output.
 * @param sorted ascending values, at least one
 * @param probability p in [0, 1]
 * @throws if there are no values or p is outside [0, 1]
 * @example orderQuantile(Float64Array.of(1, 2, 3, 4), 0.5) // 2
 */
export function orderQuantile(sorted: Float64Array, probability: number): number {
  if (sorted.length === 0) throw new Error('values must not be empty');
  if (!(probability >= 0 && probability <= 1)) throw new Error('probability must be in [0, 1]');
  return sorted[Math.max(0, Math.ceil(probability * sorted.length) - 1)];
}

/**
 * The finite entries of a sample, sorted ascending (a new array).
 * @param values any samples; Infinity and NaN are dropped
 * @throws never
 * @example finiteSorted(Float64Array.of(3, Infinity, 1)) // [1, 3]
 */
export function finiteSorted(values: Float64Array): Float64Array {
  let count = 0;
  for (let i = 0; i < values.length; i++) if (Number.isFinite(values[i])) count++;
  const out = new Float64Array(count);
  for (let i = 0, j = 0; i < values.length; i++) if (Number.isFinite(values[i])) out[j++] = values[i];
  return out.sort();
}

/** Probabilities at which distributions are reported. */
export const REPORTED_PROBABILITIES = [0.001, 0.01, 0.05, 0.5, 0.95, 0.99, 0.999] as const;

/**
 * Quantiles at REPORTED_PROBABILITIES (or the given ones) of ascending values.
 * @param sorted ascending values (may be empty: then no quantiles)
 * @param probabilities probabilities in [0, 1]
 * @throws if a probability is outside [0, 1]
 * @example quantileTable(sortedTimes).find((q) => q.probability === 0.5)
 */
export function quantileTable(sorted: Float64Array, probabilities: readonly number[] = REPORTED_PROBABILITIES): { probability: number; value: number }[] {
  if (sorted.length === 0) return [];
  return probabilities.map((probability) => ({ probability, value: orderQuantile(sorted, probability) }));
}
