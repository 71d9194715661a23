import { describe, expect, it } from 'vitest';
import { fitPolynomial } from '../../../shared/fit/index.js';
import { deepFreeze } from './nist-strd-fixture.js';

// An invented bench calibration: applied volts → converter frequency in Hz.
const volts = deepFreeze([0, 50, 100, 150, 200, 250, 300, 350, 400, 450, 500]);
const hertz = deepFreeze([12.1, 5009.8, 10010.4, 15007.9, 20011.2, 25009.1, 30008.7, 35012.3, 40009.6, 45010.8, 50011.5]);

describe('fitPolynomial residual diagnostics', () => {
  it('gives leverages that sum to the number of coefficients', () => {
    const fit = fitPolynomial(volts, hertz, { degree: 2 });
    const total = fit.leverages.reduce((sum, h) => sum + h, 0);
    expect(total).toBeCloseTo(3, 12); // common practice: trace of the hat matrix = p
  });

  it('flags a planted outlier with a studentised residual above 3', () => {
    const spoiled = [...hertz];
    spoiled[5] += 40;
    const fit = fitPolynomial(volts, spoiled, { degree: 1 });
    const internal = fit.studentisedResiduals.map((r) => Math.abs(r ?? 0));
    const external = fit.externallyStudentisedResiduals.map((r) => Math.abs(r ?? 0));
    expect(internal.indexOf(Math.max(...internal))).toBe(5);
    expect(internal[5]).toBeGreaterThan(2.9); // common practice: |r| near the bound √ν for a lone outlier
    expect(external[5]).toBeGreaterThan(3); // common practice: |t| > 3 flags an outlier
    expect(Math.max(...external.filter((_, i) => i !== 5))).toBeLessThan(3);
  });

  it('matches externally studentised residuals computed by deleting each point', () => {
    const fit = fitPolynomial(volts, hertz, { degree: 1 });
    volts.forEach((_, i) => {
      const keptX = volts.filter((__, j) => j !== i);
      const keptY = hertz.filter((__, j) => j !== i);
      const deleted = fitPolynomial(keptX, keptY, { degree: 1 });
      const expected = fit.residuals[i] / (deleted.residualStandardDeviation * Math.sqrt(1 - fit.leverages[i])); // Belsley, Kuh & Welsch (1980) eq. 2.8, from memory
      expect(fit.externallyStudentisedResiduals[i]).toBeCloseTo(expected, 10);
    });
  });

  it('treats weight 2 like a point entered twice', () => {
    const weights = volts.map((_, i) => (i === 3 ? 2 : 1));
    const weighted = fitPolynomial(volts, hertz, { degree: 2, weights });
    const doubled = fitPolynomial([...volts, volts[3]], [...hertz, hertz[3]], { degree: 2 });
    weighted.coefficients.forEach((b, k) => expect(b).toBeCloseTo(doubled.coefficients[k], 9)); // common practice: weights as replication
    expect(weighted.residualSumOfSquares).toBeCloseTo(doubled.residualSumOfSquares, 9);
  });

  it('recovers an exact cubic to rounding error', () => {
    const x = [-2, -1, 0, 0.5, 1, 2, 3, 4];
    const y = x.map((v) => 1.5 - 2 * v + 0.25 * v * v + 0.125 * v ** 3);
    const fit = fitPolynomial(x, y, { degree: 3 });
    [1.5, -2, 0.25, 0.125].forEach((b, k) => expect(fit.coefficients[k]).toBeCloseTo(b, 12)); // exact by construction
    expect(fit.rSquared).toBeCloseTo(1, 14);
  });

  it('leaves frozen inputs untouched', () => {
    const weights = deepFreeze(volts.map(() => 1));
    expect(() => fitPolynomial(volts, hertz, { degree: 3, weights })).not.toThrow();
    expect(hertz[0]).toBe(12.1);
  });
});

describe('fitPolynomial rejects bad input', () => {
  it('rejects degrees other than 1, 2 and 3', () => {
    expect(() => fitPolynomial(volts, hertz, { degree: 0 })).toThrow('degree must be 1, 2 or 3');
    expect(() => fitPolynomial(volts, hertz, { degree: 4 })).toThrow('degree must be 1, 2 or 3');
    expect(() => fitPolynomial(volts, hertz, { degree: 1.5 })).toThrow('degree must be 1, 2 or 3');
  });

  it('rejects x and y of different lengths', () => {
    expect(() => fitPolynomial([1, 2, 3], [1, 2], { degree: 1 })).toThrow('x and y differ in length');
  });

  it('rejects empty, one-point and too-short data', () => {
    expect(() => fitPolynomial([], [], { degree: 1 })).toThrow('need at least 3 points for degree 1 with intercept');
    expect(() => fitPolynomial([1], [2], { degree: 1, intercept: false })).toThrow('need at least 2 points for degree 1 without intercept');
    expect(() => fitPolynomial([1, 2, 3], [1, 2, 3], { degree: 2 })).toThrow('need at least 4 points for degree 2 with intercept');
  });

  it('rejects too few distinct x values', () => {
    expect(() => fitPolynomial([1, 1, 2, 2], [1, 2, 3, 4], { degree: 2 })).toThrow('distinct');
    expect(() => fitPolynomial([0, 0, 0], [1, 2, 3], { degree: 1, intercept: false })).toThrow();
  });

  it('rejects non-finite values and bad weights', () => {
    expect(() => fitPolynomial([1, 2, NaN], [1, 2, 3], { degree: 1 })).toThrow('x must hold only finite numbers');
    expect(() => fitPolynomial([1, 2, 3], [1, Infinity, 3], { degree: 1 })).toThrow('y must hold only finite numbers');
    expect(() => fitPolynomial([1, 2, 3], [1, 2, 3], { degree: 1, weights: [1, 0, 1] })).toThrow('weights must be finite numbers > 0');
    expect(() => fitPolynomial([1, 2, 3], [1, 2, 3], { degree: 1, weights: [1, 1] })).toThrow('weights and x differ in length');
  });
});
