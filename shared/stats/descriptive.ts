/**
 * Descriptive statistics of a sample: mean and sample standard deviation
 * (Welford's one-pass update, stable for large offsets).
 */

function checkFinite(values: readonly number[], name: string): void {
  for (const value of values) if (!Number.isFinite(value)) throw new Error(`${name} must hold only finite numbers`);
}

/**
 * Arithmetic mean x̄ = Σxᵢ / n (GUM, JCGM 100 §4.2.1).
 * @param values the sample, any unit; n ≥ 1
 * @returns the mean, in the unit of the values
 * @throws Error when values is empty or holds a non-finite number
 * @example mean([1, 2, 3]) // 2
 */
export function mean(values: readonly number[]): number {
  if (values.length === 0) throw new Error('values must not be empty');
  checkFinite(values, 'values');
  let running = 0;
  for (let i = 0; i < values.length; i++) running += (values[i] - running) / (i + 1);
  return running;
}

/**
 * Sample variance s² = Σ(xᵢ − x̄)² / (n − 1) (GUM, JCGM 100 §4.2.2).
 * @param values the sample, any unit; n ≥ 2
 * @returns s², in the unit of the values squared
 * @throws Error when fewer than 2 values or a non-finite value
 * @example sampleVariance([1, 2, 3, 4]) // 1.6666666666666667
 */
export function sampleVariance(values: readonly number[]): number {
  if (values.length < 2) throw new Error('values must hold at least 2 numbers for a sample variance');
  checkFinite(values, 'values');
  let runningMean = 0;
  let sumSquares = 0;
  for (let i = 0; i < values.length; i++) {
    const delta = values[i] - runningMean;
    runningMean += delta / (i + 1);
    sumSquares += delta * (values[i] - runningMean);
  }
  return sumSquares / (values.length - 1);
}

/**
 * Sample standard deviation s = √s² (GUM, JCGM 100 §4.2.2).
 * @param values the sample, any unit; n ≥ 2
 * @returns s, in the unit of the values
 * @throws Error when fewer than 2 values or a non-finite value
 * @example sampleStandardDeviation([2, 4, 4, 4, 5, 5, 7, 9]) // 2.138089935299395
 */
export function sampleStandardDeviation(values: readonly number[]): number {
  return Math.sqrt(sampleVariance(values));
}
