import { describe, expect, it } from 'vitest';
import {
  functionalKernel, intervalEndUncertainty, minimumBatchTrials, minimumStudyTrials, recommendedTrials, runMonteCarlo, smallestIntervalTrials,
  symmetricInterval, uncertainInput,
} from '../../../shared/propagation/index.js';
import { uncertaintyStudyRequestSchema } from '../../../shared/schemas/runs.js';
import { deepFreeze } from '../../fixtures/deep-freeze.js';

const ramp = (count: number) => Float64Array.from({ length: count }, (_, i) => i);
const standardNormal = deepFreeze([uncertainInput({ key: 'x', label: 'X', where: 'model', unit: '1', distribution: 'normal', halfWidth: 1, centre: 0, coverageFactor: 1 })]);
const identity = (x: Float64Array): number => x[0];
const normalDensity = (z: number) => Math.exp(-(z ** 2) / 2) / Math.sqrt(2 * Math.PI);

describe('how many trials a coverage interval needs', () => {
  it('states the smallest count that forms an interval, and that count works', () => {
    for (const p of [0.95, 0.99, 0.999, 0.9999]) {
      const least = smallestIntervalTrials(p);
      expect(() => symmetricInterval(ramp(least), p)).not.toThrow();
      expect(() => symmetricInterval(ramp(least - 1), p)).toThrow(`at least ${least} trials are needed`);
      // counts below it, every 2 % of the way down (in this test): none forms an interval
      for (let m = least - 1; m >= 2; m -= Math.max(1, Math.floor(least / 50))) expect(() => symmetricInterval(ramp(m), p)).toThrow();
    }
    expect(() => symmetricInterval(ramp(10_000), 0.9999)).not.toThrow(); // the issue's case: 10⁴ works at 0.9999
    expect(smallestIntervalTrials(0.9999)).toBe(5001); // JCGM 101:2008 7.7.1 rounding: q = ⌊pM + ½⌋ leaves one value outside from M = 5001
  });

  it('gives an interval of the sample extremes at that smallest count', () => {
    const least = smallestIntervalTrials(0.999);
    expect(symmetricInterval(ramp(least), 0.999)).toEqual({ low: 0, high: least - 1 }); // JCGM 101:2008 7.7.1: r = 1, q = M − 1
  });

  it('recommends 10⁴/(1 − p) trials and never summarises fewer than 100/(1 − p) in a batch', () => {
    expect(recommendedTrials(0.95)).toBe(200_000); // JCGM 101:2008 7.2.2: M at least 10⁴ times 1/(1 − p)
    expect(recommendedTrials(0.9)).toBe(100_000); // same, with 1 − 0.9 rounding below 0.1 in binary
    expect(recommendedTrials(0.999)).toBe(10_000_000);
    expect(recommendedTrials(0.9999)).toBe(100_000_000);
    expect(minimumBatchTrials(0.95)).toBe(2_000); // JCGM 101:2008 7.9.4 b): J = ⌈100/(1 − p)⌉
    expect(minimumBatchTrials(0.999)).toBe(100_000);
    expect(minimumStudyTrials(0.95)).toBe(1_000); // 25 beyond each end: 0.025·1000 (by hand)
    expect(minimumStudyTrials(0.999)).toBe(50_000); // 0.0005·50 000 = 25 (by hand)
    expect(() => recommendedTrials(1)).toThrow('coverage probability must be in (0, 1)');
    expect(() => smallestIntervalTrials(0)).toThrow('coverage probability must be in (0, 1)');
  });
});

describe('uncertainty of the interval ends from the sample', () => {
  it('matches the order-statistic standard deviation √(α(1 − α)/M)/φ(z) for a normal output', () => {
    const trials = 100_000;
    const ends = runMonteCarlo(functionalKernel(standardNormal, identity), { seed: 99, trials }).outputs[0].symmetricInterval;
    const expected = Math.sqrt((0.025 * 0.975) / trials) / normalDensity(1.959964); // from memory: asymptotic variance of a sample quantile
    expect(Math.abs(ends.lowStandardUncertainty / expected - 1)).toBeLessThan(0.15);
    expect(Math.abs(ends.highStandardUncertainty / expected - 1)).toBeLessThan(0.15);
  });

  it('is close to the scatter of the ends over many seeds, and not below it', () => {
    const highs: number[] = [];
    const estimates: number[] = [];
    for (let seed = 1; seed <= 40; seed++) {
      const ends = runMonteCarlo(functionalKernel(standardNormal, identity), { seed, trials: 10_000 }).outputs[0].symmetricInterval;
      highs.push(ends.high);
      estimates.push(ends.highStandardUncertainty);
    }
    const mean = highs.reduce((a, b) => a + b, 0) / highs.length;
    const scatter = Math.sqrt(highs.reduce((a, b) => a + (b - mean) ** 2, 0) / (highs.length - 1));
    const estimated = estimates.reduce((a, b) => a + b, 0) / estimates.length;
    // 40 seeds estimate the scatter to about ±11 % (χ² with 39 degrees of freedom, from memory)
    expect(estimated / scatter).toBeGreaterThan(0.85);
    expect(estimated / scatter).toBeLessThan(1.6);
  });

  it('clamps ranks at the sample ends and refuses too few values', () => {
    const least = smallestIntervalTrials(0.99);
    const ends = intervalEndUncertainty(ramp(least), 0.99);
    expect(ends.lowStandardUncertainty).toBeGreaterThan(0); // the rank above still moves the end (in this test)
    expect(() => intervalEndUncertainty(ramp(least - 1), 0.99)).toThrow('trials are needed');
  });
});

describe('what a study request may ask for', () => {
  const fieldsOf = (body: object) => {
    const parsed = uncertaintyStudyRequestSchema.safeParse(body);
    return parsed.success ? {} : Object.fromEntries(parsed.error.issues.map((i) => [i.path.join('.'), i.message]));
  };

  it('refuses too few trials for the coverage probability, naming the field and the numbers', () => {
    // the issue's cases: 10³ trials at 99.9 % and 10⁴ at 99.99 % leave an interval of near-extreme values
    expect(fieldsOf({ trials: 1_000, coverageProbability: 0.999 })).toEqual({
      trials: 'trials must be ≥ 50000 for a 99.9 % coverage interval, 25 beyond each end; 10000000 are recommended', // JCGM 101:2008 7.2.2 for the second number
    });
    expect(fieldsOf({ trials: 10_000, coverageProbability: 0.9999 }).trials).toMatch(/^trials must be ≥ 500000 for a 99.99 % coverage interval/);
    expect(fieldsOf({ trials: 50_000, coverageProbability: 0.999 })).toEqual({});
    expect(fieldsOf({ trials: 1_000 })).toEqual({}); // 95 %: quick looks stay possible, with a warning on the page
    expect(fieldsOf({ significantDigits: 2, coverageProbability: 0.99999 }).coverageProbability).toMatch(/^coverageProbability must be ≤ 0.99995/);
  });
});
