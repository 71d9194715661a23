import { describe, expect, it } from 'vitest';
import fixture from '../../fixtures/jcgm101-additive.json' with { type: 'json' };
import {
  functionalKernel, gumPropagation, numericalTolerance, overallGumAgreement, runMonteCarlo, uncertainInput, validateGum,
  type GumResult, type UncertainInput,
} from '../../../shared/propagation/index.js';
import { deepFreeze } from '../../fixtures/deep-freeze.js';

const sum4 = (x: Float64Array): number => x[0] + x[1] + x[2] + x[3];
/** The JCGM 101 §9.2 additive model's four inputs, each with standard uncertainty `u`. */
const inputsOf = (distribution: 'normal' | 'rectangular', u = 1): UncertainInput[] =>
  deepFreeze(Array.from({ length: 4 }, (_, i) => uncertainInput({
    key: `x${i + 1}`, label: `X${i + 1}`, where: 'model', unit: '1', distribution,
    halfWidth: distribution === 'normal' ? u : Math.sqrt(3) * u, centre: 0, coverageFactor: 1,
  })));
const SEEDS = [1, 2, 3, 4, 5, 6];

describe('GUM against Monte Carlo within the Monte Carlo\'s own tolerance (JCGM 101 §8)', () => {
  it('agrees for normal inputs at every seed once the interval ends are known to within δ', () => {
    const inputs = inputsOf('normal');
    const gum = gumPropagation(inputs, sum4);
    expect(gum.expandedUncertainty).toBeCloseTo(fixture.gumInterval[1], 2); // JCGM 101:2008 §9.2.2: GUF interval ±3.92
    for (const seed of SEEDS) {
      const check = validateGum(gum, runMonteCarlo(functionalKernel(inputs, sum4), { seed, trials: 100_000 }).outputs[0].symmetricInterval, 2);
      expect(check.numericalTolerance).toBeCloseTo(0.05, 12); // JCGM 101:2008 7.9.2: u = 2.0 → δ = 0.05
      expect(check.monteCarloToleranceHigh).toBeLessThan(check.numericalTolerance); // 2s ≈ 2·2·0.0085 = 0.034 at 10⁵ (order-statistic sd, from memory)
      expect(check.verdict).toBe('agrees');
    }
  });

  it('never says disagree when GUM is exact and only the Monte Carlo scatters (the issue\'s case)', () => {
    // Same model with u(y) = 9.9: δ = 0.05 is 0.5 % of u, finer than 10⁵ trials place a 97.5 % point.
    const inputs = inputsOf('normal', 4.95);
    const gum = gumPropagation(inputs, sum4);
    expect(gum.combinedStandardUncertainty).toBeCloseTo(9.9, 12); // √(4·4.95²), JCGM 100 law of propagation for a sum
    const checks = SEEDS.map((seed) => validateGum(gum, runMonteCarlo(functionalKernel(inputs, sum4), { seed, trials: 100_000 }).outputs[0].symmetricInterval, 2));
    expect(checks.some((c) => c.dLow > c.numericalTolerance || c.dHigh > c.numericalTolerance)).toBe(true); // the bare §8.2 test would have rejected GUM (found in this test)
    for (const c of checks) {
      expect(c.verdict).toBe('cannot-tell'); // normal inputs, linear model: GUM is exact (JCGM 101:2008 §9.2.2)
      expect(c.adequate).toBe(false);
    }
    expect(overallGumAgreement(checks)).toBe('cannot-tell');
  });

  it('agrees for the four rectangular inputs at 10⁶ trials, as the published intervals differ by 0.04 < δ', () => {
    const inputs = inputsOf('rectangular');
    const check = validateGum(gumPropagation(inputs, sum4), runMonteCarlo(functionalKernel(inputs, sum4), { seed: 3, trials: 1_000_000 }).outputs[0].symmetricInterval, 2);
    expect(Math.abs(fixture.gumInterval[1] - fixture.rectangular.interval[1])).toBeCloseTo(0.04, 12); // JCGM 101:2008 Table 3: 3.92 vs 3.88
    expect(check.verdict).toBe('agrees');
  });

  it('disagrees for a single rectangular input at every seed', () => {
    const single = [inputsOf('rectangular')[0]];
    const one = (x: Float64Array): number => x[0];
    const gum = gumPropagation(single, one);
    for (const seed of SEEDS) {
      const check = validateGum(gum, runMonteCarlo(functionalKernel(single, one), { seed, trials: 20_000 }).outputs[0].symmetricInterval, 2);
      expect(check.dHigh).toBeGreaterThan(0.3); // from memory: R(−√3, √3) 95 % half-width 0.95·√3 = 1.645 vs GUM 1.96
      expect(check.verdict).toBe('disagrees'); // JCGM 101:2008 §8.1
    }
  });

  it('decides by δ and each end\'s own tolerance', () => {
    const gum = { estimate: 0, combinedStandardUncertainty: 2, expandedUncertainty: 3.92 } as GumResult;
    const delta = numericalTolerance(2, 2); // 0.05, JCGM 101:2008 7.9.2
    const at = (low: number, high: number, s: number) => ({ low, high, lowStandardUncertainty: s, highStandardUncertainty: s });
    expect(validateGum(gum, at(-3.9, 3.9, 0.01)).verdict).toBe('agrees'); // d = 0.02 ≤ δ, 2s = 0.02 ≤ δ (by hand)
    expect(validateGum(gum, at(-3.9, 3.9, 0.04)).verdict).toBe('cannot-tell'); // 2s = 0.08 > δ (by hand)
    expect(validateGum(gum, at(-3.92, 3.85, 0.02)).verdict).toBe('cannot-tell'); // d = 0.07 within δ + 2s = 0.09 (by hand)
    expect(validateGum(gum, at(-3.92, 3.8, 0.02)).verdict).toBe('disagrees'); // d = 0.12 > δ + 2s = 0.09 (by hand)
    expect(validateGum(gum, { low: -3.92, high: 3.86 }).verdict).toBe('disagrees'); // exact interval: d = 0.06 > δ (JCGM 101:2008 8.2)
    expect(validateGum(gum, at(-3.92, 3.92, 0)).numericalTolerance).toBe(delta);
    expect(() => overallGumAgreement([])).toThrow('validations must not be empty');
    expect(overallGumAgreement([{ verdict: 'agrees' }, { verdict: 'cannot-tell' }, { verdict: 'disagrees' }])).toBe('disagrees');
  });
});
