import { describe, it, expect } from 'vitest';
import fixture from '../../fixtures/jcgm101-additive.json' with { type: 'json' };
import {
  functionalKernel, gumPropagation, runAdaptiveMonteCarlo, runMonteCarlo, uncertainInput, validateGum, type UncertainInput,
} from '../../../shared/propagation/index.js';
import { deepFreeze } from '../../fixtures/deep-freeze.js';

const sum4 = (x: Float64Array): number => x[0] + x[1] + x[2] + x[3];
const inputsOf = (distribution: 'normal' | 'rectangular'): UncertainInput[] =>
  deepFreeze(Array.from({ length: 4 }, (_, i) => uncertainInput({
    key: `x${i + 1}`, label: `X${i + 1}`, where: 'model', unit: '1', distribution,
    halfWidth: distribution === 'normal' ? 1 : Math.sqrt(3), centre: 0, coverageFactor: 1,
  })));

describe('JCGM 101 §9.2 additive model Y = X1 + X2 + X3 + X4', () => {
  for (const [name, distribution] of [['normal', 'normal'], ['rectangular', 'rectangular']] as const) {
    const published = fixture[name];

    it(`reproduces the published ${name}-input results within the adaptive run's own tolerance δ`, () => {
      const result = runAdaptiveMonteCarlo(functionalKernel(inputsOf(distribution), sum4), { seed: 2008, ndig: 2 });
      expect(result.stable).toBe(true);
      const out = result.outputs[0];
      const delta = result.stabilisation[0].numericalTolerance;
      expect(delta).toBeCloseTo(0.05, 12); // JCGM 101:2008 7.9.2: u ≈ 2.0 → c = 20, l = −1, δ = 0.05
      expect(Math.abs(out.standardDeviation - published.u)).toBeLessThanOrEqual(delta); // JCGM 101:2008 §9.2.2/9.2.3, Tables 2–3
      expect(Math.abs(out.symmetricInterval.low - published.interval[0])).toBeLessThanOrEqual(delta); // JCGM 101:2008 Tables 2–3
      expect(Math.abs(out.symmetricInterval.high - published.interval[1])).toBeLessThanOrEqual(delta); // JCGM 101:2008 Tables 2–3
      expect(Math.abs(out.mean)).toBeLessThanOrEqual(delta); // JCGM 101:2008 §9.2: y = 0
    });

    it(`places the ${name}-input 97.5 % point near its exact value with 2·10⁵ trials`, () => {
      const out = runMonteCarlo(functionalKernel(inputsOf(distribution), sum4), { seed: 7, trials: 200_000 }).outputs[0];
      // order-statistic sd at p = 0.975, M = 2·10⁵ is ≈ 0.012; tolerance 0.04 (> 3σ)
      expect(Math.abs(out.symmetricInterval.high - published.exactUpper975)).toBeLessThan(0.04); // derived from the model (refdata note)
      const shortestWidth = out.shortestInterval.high - out.shortestInterval.low;
      expect(shortestWidth).toBeLessThanOrEqual(out.symmetricInterval.high - out.symmetricInterval.low); // JCGM 101:2008 7.7.2: shortest by construction
      expect(Math.abs(shortestWidth - 2 * published.exactUpper975)).toBeLessThan(0.06); // symmetric output: shortest ≈ symmetric
    });
  }

  it('finds GUM adequate for normal inputs and not for a single rectangular input', () => {
    const normal = inputsOf('normal');
    const mc = runMonteCarlo(functionalKernel(normal, sum4), { seed: 3, trials: 200_000 }).outputs[0];
    const gum = gumPropagation(normal, sum4);
    expect(gum.combinedStandardUncertainty).toBeCloseTo(2, 12); // JCGM 101:2008 §9.2.2: u(y) = 2
    expect(gum.expandedUncertainty).toBeCloseTo(3.92, 2); // JCGM 101:2008 §9.2.2 GUF interval ±3.92
    expect(validateGum(gum, mc.symmetricInterval, 2).adequate).toBe(true); // JCGM 101:2008 §8, δ = 0.05

    const single = [inputsOf('rectangular')[0]];
    const one = (x: Float64Array): number => x[0];
    const mcOne = runMonteCarlo(functionalKernel(single, one), { seed: 3, trials: 100_000 }).outputs[0];
    const check = validateGum(gumPropagation(single, one), mcOne.symmetricInterval, 2);
    expect(check.dHigh).toBeGreaterThan(0.1); // from memory: R(−√3, √3) 95 % half-width 1.645 vs GUM 1.96
    expect(check.adequate).toBe(false); // JCGM 101:2008 §8.1
  });
});
