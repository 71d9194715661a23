import { describe, it, expect } from 'vitest';
import { channelSchema } from '../../../shared/schemas/chain.js';
import { compileChannel } from '../../../shared/chain/index.js';
import { channelGum, channelKernel, crossTerms, gumPropagation, runMonteCarlo, uncertainInput } from '../../../shared/propagation/index.js';
import { deepFreeze } from '../../fixtures/deep-freeze.js';

const input = (i: number, halfWidth: number, centre = 0) =>
  uncertainInput({ key: `x${i}`, label: `X${i}`, where: 'model', unit: '1', distribution: 'rectangular', halfWidth, centre });

describe('second-order cross terms', () => {
  it('gives a product of two zero-mean inputs u(x₁)·u(x₂), which the first order misses', () => {
    const inputs = deepFreeze([input(1, 0.3), input(2, 2)]);
    const gum = gumPropagation(inputs, (x) => x[0] * x[1]);
    const u1 = 0.3 / Math.sqrt(3); // GUM (JCGM 100) 4.3.7
    const u2 = 2 / Math.sqrt(3); // GUM (JCGM 100) 4.3.7
    expect(gum.combinedStandardUncertainty).toBeCloseTo(u1 * u2, 12); // JCGM 100:2008 5.1.2 Note: ½·2·(∂²f/∂x₁∂x₂)²u₁²u₂², first order 0
    const row = gum.budget.find((r) => r.order === 2);
    expect(row?.label).toBe('X2 × X1');
    expect(row?.inputKeys).toEqual(['x2', 'x1']);
    expect(row?.sensitivity).toBeCloseTo(1, 12); // ∂²(x₁x₂)/∂x₁∂x₂ = 1 by hand
    expect(gum.budget.filter((r) => r.order === 1).every((r) => r.contribution === 0)).toBe(true);
  });

  it('reproduces the exact variance of a product of independent inputs', () => {
    const inputs = [input(1, 0.5, 2), input(2, 1, -3)];
    const [u1, u2] = [0.5 / Math.sqrt(3), 1 / Math.sqrt(3)]; // GUM (JCGM 100) 4.3.7
    const exact = Math.sqrt(3 ** 2 * u1 ** 2 + 2 ** 2 * u2 ** 2 + u1 ** 2 * u2 ** 2); // Var(XY) = μy²σx² + μx²σy² + σx²σy² (Goodman 1960)
    expect(gumPropagation(inputs, (x) => x[0] * x[1]).combinedStandardUncertainty).toBeCloseTo(exact, 12);
    expect(gumPropagation(inputs, (x) => x[0] * x[1], 0.95, false).combinedStandardUncertainty).toBeCloseTo(Math.sqrt(exact ** 2 - u1 ** 2 * u2 ** 2), 12); // GUM (JCGM 100) 5.1.2 first order
  });

  it('adds nothing to a linear model', () => {
    const gum = gumPropagation([input(1, 1), input(2, 3)], (x) => 2 * x[0] - x[1]);
    expect(gum.budget.map((r) => r.order)).toEqual([1, 1]);
    expect(crossTerms([input(1, 1), input(2, 3)], (x) => 2 * x[0] - x[1], [1, 1])).toEqual([]); // mixed difference of a linear model is 0
  });
});

// Temperature range centred on the 25 °C reference: every first-order temperature term is 0.
const centred = deepFreeze(channelSchema.parse({
  name: 'centred on the reference',
  rangeV: { minV: 100, maxV: 460 },
  divider: {
    top: Array.from({ length: 4 }, () => ({ nominalOhm: 1e6, tolerancePct: 0.1, tcrPpmPerK: 25 })),
    bottom: { nominalOhm: 10e3, tolerancePct: 0.1, tcrPpmPerK: 25 },
  },
  converter: { gainHzPerV: 10e3, offsetHz: 1e3, gainErrorPct: 0.1, gainTempcoPpmPerK: 15, offsetDriftHzPerK: 0.1, fullScaleHz: 60e3 },
  capture: { method: 'gated', gateS: 1, clockTolerancePpm: 20 },
  environment: { minC: -35, maxC: 85, referenceC: 25 },
}));

describe('GUM budget of a chain centred on its reference temperature', () => {
  const compiled = compileChannel(centred, 3);
  const gum = channelGum(compiled);
  const mc = runMonteCarlo(channelKernel(compiled), { seed: 17, trials: 100_000 });

  it('reproduces the Monte Carlo standard deviation within 1 % at every voltage', () => {
    gum.forEach((point, g) => {
      // sd of a standard deviation at M = 10⁵ is ≈ 0.2 %; tolerance 1 %
      expect(Math.abs(point.combinedStandardUncertainty / mc.outputs[g].standardDeviation - 1)).toBeLessThan(0.01); // JCGM 101:2008 7.6 against JCGM 100:2008 5.1.2 Note
      const firstOrder = Math.sqrt(point.budget.filter((r) => r.order === 1).reduce((a, r) => a + r.contribution ** 2, 0));
      expect(firstOrder / mc.outputs[g].standardDeviation).toBeLessThan(0.95); // the first-order budget alone misses temperature (JCGM 101:2008 7.6)
    });
  });

  it('attributes the spread to temperature in second-order rows', () => {
    const point = gum[2];
    const temperature = point.budget.filter((r) => r.inputKeys.includes('environment.temperature'));
    expect(temperature.find((r) => r.order === 1)?.contribution).toBe(0); // centred range: no first-order temperature effect (by hand)
    const second = temperature.filter((r) => r.order === 2);
    expect(second.map((r) => r.label)).toContain('operating temperature × R bottom TCR');
    expect(second.map((r) => r.label)).toContain('operating temperature × converter gain tempco');
    expect(second.find((r) => r.label === 'operating temperature × R bottom TCR')?.unit).toBe('1'); // K × 1/K is a pure number (by hand)
    expect(second.find((r) => r.label === 'operating temperature × converter offset drift')?.unit).toBe('Hz'); // K × Hz/K (by hand)
    for (const row of second) {
      expect(row.contribution).toBeGreaterThan(0);
      expect(row.contribution).toBeCloseTo(Math.abs(row.sensitivity) * row.standardUncertainty, 12); // JCGM 100:2008 5.1.2 Note
      expect(row.inputKeys[0]).toBe('environment.temperature');
    }
    const share = second.reduce((a, r) => a + r.contribution ** 2, 0) / point.combinedStandardUncertainty ** 2;
    expect(share).toBeGreaterThan(0.1); // TCR and tempco products carry a sizeable share here (by Monte Carlo above)
  });
});
