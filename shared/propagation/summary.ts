import { intervalEndUncertainty, shortestInterval, symmetricInterval, type CoverageInterval, type SampledInterval } from './coverage.js';
import { histogramOf, type Histogram } from './histogram.js';
import { radixSortFloat64 } from '../stats/radix-sort.js';

/** What a Monte Carlo run says about one output (unit of the output). */
export interface OutputSummary {
  trials: number;
  mean: number;
  standardDeviation: number;
  /** With the standard uncertainty of each end from the sample (JCGM 101 §8 compares within it). */
  symmetricInterval: SampledInterval;
  shortestInterval: CoverageInterval;
  /** Smallest and largest trial value, so a bound can be checked against every trial. */
  minimum: number;
  maximum: number;
  maxAbs: number;
  histogram: Histogram;
}

/**
 * Summarises model values per JCGM 101:2008 7.6 (mean, standard deviation with M − 1) and 7.7
 * (symmetric and shortest coverage intervals), plus the smallest and largest value, max |value|
 * and a histogram. Quantiles come from the exactly sorted values (radix sort on the float bits).
 * @param values model values (unit of the output), at least 2
 * @param coverageProbability p in (0, 1)
 * @param binCount histogram bins, integer ≥ 1
 * @param sortInPlace sort `values` itself (the caller owns them and needs their order no more) instead
 *   of a copy, saving a copy of every value; the summary is the same either way
 * @throws if there are fewer than 2 values, any is not finite, or p is outside (0, 1)
 * @example summariseValues(errors, 0.95, 40).symmetricInterval
 */
export function summariseValues(values: Float64Array, coverageProbability: number, binCount = 40, sortInPlace = false): OutputSummary {
  const count = values.length;
  if (count < 2) throw new Error('at least 2 trials are needed to summarise');
  let sum = 0;
  let maxAbs = 0;
  for (let i = 0; i < count; i++) {
    const v = values[i];
    if (!Number.isFinite(v)) throw new Error(`trial ${i} gave a non-finite value`);
    sum += v;
    const a = Math.abs(v);
    if (a > maxAbs) maxAbs = a;
  }
  const mean = sum / count;
  let squares = 0;
  for (let i = 0; i < count; i++) squares += (values[i] - mean) ** 2;
  const histogram = histogramOf(values, binCount);
  const sorted = radixSortFloat64(sortInPlace ? values : Float64Array.from(values));
  return {
    trials: count,
    mean,
    standardDeviation: Math.sqrt(squares / (count - 1)),
    symmetricInterval: { ...symmetricInterval(sorted, coverageProbability), ...intervalEndUncertainty(sorted, coverageProbability) },
    shortestInterval: shortestInterval(sorted, coverageProbability),
    minimum: sorted[0],
    maximum: sorted[count - 1],
    maxAbs,
    histogram,
  };
}
