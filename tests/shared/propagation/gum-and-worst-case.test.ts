import { describe, it, expect } from 'vitest';
import {
  gumPropagation, inputStandardUncertainty, numericalTolerance, shortestInterval, summariseValues, symmetricInterval, uncertainInput, worstCase,
} from '../../../shared/propagation/index.js';
import { deepFreeze } from '../../fixtures/deep-freeze.js';

const input = (i: number, halfWidth: number, distribution: 'rectangular' | 'normal' = 'rectangular') =>
  uncertainInput({ key: `x${i}`, label: `X${i}`, where: 'model', unit: '1', distribution, halfWidth, centre: 0 });

describe('GUM law of propagation', () => {
  it('turns a rectangular bound a into u = a/√3', () => {
    expect(inputStandardUncertainty(input(1, 0.3))).toBeCloseTo(0.3 / Math.sqrt(3), 15); // GUM (JCGM 100) 4.3.7
  });

  it('sums contributions in quadrature and sorts the budget by contribution', () => {
    const inputs = deepFreeze([input(1, 1), input(2, 3), input(3, 2, 'normal')]);
    const gum = gumPropagation(inputs, (x) => 2 * x[0] - x[1] + 0.5 * x[2]);
    const expected = Math.sqrt((2 / Math.sqrt(3)) ** 2 + (3 / Math.sqrt(3)) ** 2 + (0.5 * 1) ** 2);
    expect(gum.combinedStandardUncertainty).toBeCloseTo(expected, 12); // GUM (JCGM 100) 5.1.2
    expect(gum.budget.map((r) => r.key)).toEqual(['x2', 'x1', 'x3']);
    expect(gum.budget[0].sensitivity).toBeCloseTo(-1, 12); // GUM (JCGM 100) 5.1.3
    expect(gum.coverageFactor).toBeCloseTo(1.959964, 5); // GUM (JCGM 100) Table G.1
  });

  it('refuses a coverage probability outside (0, 1) and an empty model', () => {
    expect(() => gumPropagation([input(1, 1)], (x) => x[0], 1)).toThrow('coverage probability must be in (0, 1)');
    expect(() => gumPropagation([], () => 0)).toThrow('inputs must not be empty');
  });
});

describe('numerical tolerance and coverage intervals', () => {
  it('derives δ from ndig significant digits of u', () => {
    expect(numericalTolerance(0.0236, 2)).toBeCloseTo(0.0005, 15); // JCGM 101:2008 7.9.2 example style
    expect(numericalTolerance(2.0, 2)).toBeCloseTo(0.05, 15); // JCGM 101:2008 7.9.2
    expect(numericalTolerance(9.97, 2)).toBeCloseTo(0.5, 15); // c rounds to 100 → one more digit of l
    expect(() => numericalTolerance(1, 0)).toThrow('significant digits must be an integer ≥ 1');
  });

  it('picks the order statistics of JCGM 101 7.7', () => {
    const sorted = Float64Array.from({ length: 10_000 }, (_, i) => i + 1);
    expect(symmetricInterval(sorted, 0.95)).toEqual({ low: 250, high: 9750 }); // JCGM 101:2008 7.7.1: r = 250, q = 9500
    const skewed = Float64Array.from({ length: 100 }, (_, i) => i * i);
    expect(shortestInterval(skewed, 0.9)).toEqual({ low: 0, high: 90 ** 2 }); // JCGM 101:2008 7.7.2: q = 90, shortest is [y₍₁₎, y₍₉₁₎]
    expect(() => symmetricInterval(Float64Array.of(1, 2), 0.95)).toThrow('trials are needed');
  });

  it('keeps the smallest and largest trial of a Monte Carlo summary', () => {
    const values = deepFreeze(Float64Array.of(0.5, -2, 3.25, 1));
    const summary = summariseValues(values, 0.5, 4);
    expect([summary.minimum, summary.maximum, summary.maxAbs]).toEqual([-2, 3.25, 3.25]); // by inspection of the four values
    expect(Array.from(values)).toEqual([0.5, -2, 3.25, 1]);
  });
});

describe('worst case', () => {
  it('searches all corners when few inputs are bounded', () => {
    const result = worstCase([input(1, 1), input(2, 2), input(3, 0)], (x) => x[0] - x[1] + x[0] * x[1]);
    expect(result.method).toBe('exhaustive');
    expect(result.boundedInputs).toBe(2);
    expect(result.maximum).toBeCloseTo(3, 12); // corners by hand: (−1, −2) → −1 + 2 + 2 = 3
    expect(result.minimum).toBeCloseTo(-5, 12); // corners by hand: (−1, 2) → −1 − 2 − 2 = −5
    expect(result.cornersEvaluated).toBe(4);
  });

  it('follows effect signs and flips when many inputs are bounded', () => {
    const inputs = Array.from({ length: 20 }, (_, i) => input(i, i + 1));
    const result = worstCase(inputs, (x) => x.reduce((a, v, i) => a + (i % 2 ? -v : v), 0));
    expect(result.method).toBe('signs-and-flips');
    expect(result.maximum).toBeCloseTo(210, 12); // Σ a_i for a linear model
    expect(result.minimum).toBeCloseTo(-210, 12);
  });

  it('reaches the far end of a scanned input that the coefficients multiply', () => {
    // y = Σ₂ α_i (t + 0.3) + Σ₁₀ β_j (t − 0.1) + Σ₁₂ δ_k, t ∈ [−1, 1] last: at the centre t has no effect and the
    // α favour t = +1, yet the extreme is at t = −1; flipping t alone from the hot corner only loses
    const inputs = deepFreeze([
      ...Array.from({ length: 24 }, (_, i) => input(i, 1)),
      uncertainInput({ key: 't', label: 'T', where: 'model', unit: '1', distribution: 'rectangular', halfWidth: 1, centre: 0 }),
    ]);
    const model = (x: Float64Array) => {
      let y = 0;
      for (let i = 0; i < 24; i++) y += x[i] * (i < 2 ? x[24] + 0.3 : i < 12 ? x[24] - 0.1 : 1);
      return y;
    };
    const result = worstCase(inputs, model, { scanned: 24 });
    expect(result.maximum).toBeCloseTo(2 * 0.7 + 10 * 1.1 + 12, 12); // by hand: t = −1, α = β = −1, δ = +1 (hot end gives 23.6)
    expect(result.minimum).toBeCloseTo(-(2 * 0.7 + 10 * 1.1 + 12), 12); // by hand: mirror corner
    expect(result.boundedInputs).toBe(25);
  });

  it('refines a scanned input whose extreme lies inside its range', () => {
    const inputs = [
      uncertainInput({ key: 't', label: 'T', where: 'model', unit: '1', distribution: 'rectangular', halfWidth: 0.5, centre: 0.5 }),
      ...Array.from({ length: 12 }, (_, i) => input(i + 1, 1)),
    ];
    const result = worstCase(inputs, (x) => -((x[0] - 0.3) ** 2) + x.subarray(1).reduce((a, v) => a + v, 0), { scanned: 0 });
    expect(result.maximum).toBeCloseTo(12, 4); // by hand: t = 0.3, every x_i = +1; golden section to 0.618^12 of the bracket
    expect(result.minimum).toBeCloseTo(-12 - 0.49, 12); // by hand: t = 1, every x_i = −1
  });

  it('refuses a scanned index that names no input', () => {
    expect(() => worstCase([input(1, 1)], (x) => x[0], { scanned: 3 })).toThrow('scanned input must be an input index');
  });
});
