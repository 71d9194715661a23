import { describe, expect, it } from 'vitest';
import {
  mean,
  sampleStandardDeviation,
  sampleVariance,
  shortestCoverageInterval,
  sortedQuantile,
  symmetricCoverageInterval,
} from '../../../shared/stats/index.js';

const sample = Object.freeze([2, 4, 4, 4, 5, 5, 7, 9]);

describe('mean and sample standard deviation', () => {
  it('computes the mean and the n − 1 standard deviation', () => {
    expect(mean(sample)).toBe(5); // arithmetic, by hand
    expect(sampleVariance(sample)).toBeCloseTo(32 / 7, 14); // Σ(x − x̄)² = 32, by hand
    expect(sampleStandardDeviation(sample)).toBeCloseTo(Math.sqrt(32 / 7), 14);
  });

  it('keeps full precision on a large offset', () => {
    const shifted = sample.map((x) => x + 1e9);
    expect(sampleVariance(shifted)).toBeCloseTo(32 / 7, 6); // common practice: Welford's update avoids cancellation
  });

  it('handles one value and rejects too few or non-finite values', () => {
    expect(mean([3.5])).toBe(3.5);
    expect(() => mean([])).toThrow('values must not be empty');
    expect(() => sampleStandardDeviation([1])).toThrow('at least 2');
    expect(() => sampleVariance([])).toThrow('at least 2');
    expect(() => mean([1, NaN])).toThrow('finite');
  });
});

describe('sorted-sample quantiles by the JCGM 101 convention', () => {
  const ascending = Object.freeze(Array.from({ length: 100 }, (_, i) => i + 1));

  it('interpolates between the points carrying probability (i − ½)/M', () => {
    expect(sortedQuantile([1, 2, 3, 4], 0.5)).toBe(2.5); // JCGM 101:2008 §7.5.1
    expect(sortedQuantile([1, 2, 3, 4], 0.125)).toBe(1); // (1 − ½)/4
    expect(sortedQuantile([1, 2, 3, 4], 0.25)).toBe(1.5);
    expect(sortedQuantile([1, 2, 3, 4], 0)).toBe(1);
    expect(sortedQuantile([1, 2, 3, 4], 1)).toBe(4);
    expect(sortedQuantile([7], 0.3)).toBe(7);
  });

  it('gives the probabilistically symmetric 95 % interval of 100 values', () => {
    expect(symmetricCoverageInterval(ascending, 0.95)).toEqual({ low: 3, high: 98 }); // JCGM 101:2008 §7.7.1: q = 95, r = 3
  });

  it('gives the shortest 95 % interval of a skewed sample', () => {
    const squares = ascending.map((x) => x * x);
    expect(shortestCoverageInterval(squares, 0.95)).toEqual({ low: 1, high: 96 * 96 }); // JCGM 101:2008 §7.7.2
  });

  it('rejects empty, unsorted or too small samples and bad probabilities', () => {
    expect(() => sortedQuantile([], 0.5)).toThrow('sortedValues must not be empty');
    expect(() => sortedQuantile([2, 1], 0.5)).toThrow('ascending');
    expect(() => sortedQuantile([1, 2], 1.2)).toThrow('p must be a probability');
    expect(() => symmetricCoverageInterval([1, 2, 3], 0.95)).toThrow('too few values');
    expect(() => shortestCoverageInterval(ascending, 1)).toThrow('coverageProbability');
  });
});
