import { describe, expect, it } from 'vitest';
import { fitPolynomial, lineUncertainty, readingUncertainty, referenceShare, type ReferenceAccuracy } from '../../../shared/fit/index.js';
import { studentTQuantile } from '../../../shared/stats/index.js';
import { loadDataset } from './nist-strd-fixture.js';

describe('readingUncertainty', () => {
  // NIST StRD Norris, fitted as y on x; x plays the applied voltage and y the frequency.
  const norris = loadDataset('Norris');
  const fit = fitPolynomial(norris.x, norris.y, { degree: 1 });
  const n = norris.x.length;
  const xBar = norris.x.reduce((sum, v) => sum + v, 0) / n;
  const sxx = norris.x.reduce((sum, v) => sum + (v - xBar) ** 2, 0);
  const s = fit.residualStandardDeviation;
  const b1 = fit.coefficients[1];
  const none = { percentOfReading: 0, plusVolts: 0, coverageFactor: 0 };
  const shareOf = (reference: ReferenceAccuracy) => referenceShare(norris.x, reference, { degree: 1 });

  it('gives the inverse-regression uncertainty of a new reading when the reference is perfect', () => {
    for (const x0 of [0, xBar, 500, 900]) {
      // NIST/SEMATECH e-Handbook §2.3.6.7.1 (uncertainty of a linear calibration): u(x₀) = (s/|b₁|)·√(1 + 1/n + (x₀ − x̄)²/Sxx)
      const expected = (s / Math.abs(b1)) * Math.sqrt(1 + 1 / n + (x0 - xBar) ** 2 / sxx);
      const [point] = readingUncertainty(fit, shareOf(none), [x0]);
      expect(point.fitV).toBeCloseTo(expected, 10);
      expect(point.combinedV).toBeCloseTo(expected, 10);
      expect(point.degreesOfFreedom).toBeCloseTo(n - 2, 8); // one Type A contribution keeps its ν (JCGM 100 G.4.1)
      expect(point.coverageFactor).toBeCloseTo(studentTQuantile(0.975, n - 2), 10);
    }
  });

  it('reads a reference limit as rectangular and a stated bound at its k', () => {
    const limit = { percentOfReading: 0.01, plusVolts: 0.05, coverageFactor: 0 };
    const [p] = readingUncertainty(fit, shareOf(limit), [400]);
    // a = 0.01 % × 400 V + 0.05 V = 0.09 V; rectangular: u = a/√3 (JCGM 100 4.3.7)
    expect(p.referenceV).toBeCloseTo(0.09 / Math.sqrt(3), 12);
    const [q] = readingUncertainty(fit, shareOf({ ...limit, coverageFactor: 2 }), [400]);
    expect(q.referenceV).toBeCloseTo(0.045, 12); // bound stated at k = 2: u = a/k (JCGM 100 4.3.3)
    expect(q.combinedV).toBeCloseTo(Math.hypot(q.fitV, 0.045), 12);
  });

  it('raises ν_eff by Welch–Satterthwaite as the exactly known reference share grows, so k falls towards the normal value', () => {
    const [small] = readingUncertainty(fit, shareOf(none), [500]);
    const [large] = readingUncertainty(fit, shareOf({ percentOfReading: 1, plusVolts: 0, coverageFactor: 0 }), [500]);
    // ν_eff = u_c⁴ / (u_fit⁴/ν) (JCGM 100 eq. G.2b with the reference at ν = ∞)
    expect(large.degreesOfFreedom).toBeCloseTo(large.combinedV ** 4 / (large.fitV ** 4 / (n - 2)), 6);
    expect(large.degreesOfFreedom).toBeGreaterThan(small.degreesOfFreedom);
    expect(large.coverageFactor).toBeLessThan(small.coverageFactor);
    expect(large.coverageFactor).toBeGreaterThan(1.959); // never below the normal 97.5 % point (1.95996…)
    expect(large.expandedV).toBeCloseTo(large.coverageFactor * large.combinedV, 12);
  });

  it('divides by the local slope for a curved fit', () => {
    const pontius = loadDataset('Pontius');
    const quadratic = fitPolynomial(pontius.x, pontius.y, { degree: 2 });
    const x0 = 2e6;
    const slope = quadratic.coefficients[1] + 2 * quadratic.coefficients[2] * x0; // d/dx (b0 + b1 x + b2 x²)
    const noReference = { coefficients: [0, 0, 0], distribution: 'rectangular' as const };
    const [p] = readingUncertainty(quadratic, noReference, [x0]);
    const straight = readingUncertainty({ ...quadratic, coefficients: [quadratic.coefficients[0], slope, 0] }, noReference, [x0]);
    expect(p.fitV).toBeCloseTo(straight[0].fitV, 12);
  });

  it('refuses a fit without residual degrees of freedom and a negative reference bound', () => {
    expect(() => readingUncertainty({ ...fit, residualDegreesOfFreedom: 0 }, shareOf(none), [0.5])).toThrow(/residual degree of freedom/);
    expect(() => shareOf({ ...none, plusVolts: -1 })).toThrow(/≥ 0/);
    expect(() => readingUncertainty(fit, shareOf(none), [1], { inverseDepartureV: -1 })).toThrow(/inverse departure/);
    expect(() => readingUncertainty(fit, shareOf(none), [1, 2], { newReadingHz: [1] })).toThrow(/one value per voltage/);
  });

  it('splits the reference into a gain share and an offset share of a calibrated line', () => {
    const reference = { percentOfReading: 0.05, plusVolts: 0.1, coverageFactor: 0 };
    const volts = [0, 125, 250, 375, 500];
    const share = referenceShare(volts, reference, { degree: 1 });
    const onlyReference = lineUncertainty([0, 0], 80, share);
    expect(onlyReference.gainFraction).toBeCloseTo(0.0005 / Math.sqrt(3), 15); // rectangular limit, u = a/√3 (JCGM 100 4.3.7)
    expect(onlyReference.offsetV).toBeCloseTo(0.1 / Math.sqrt(3), 15);
    const noReference = referenceShare(volts, none, { degree: 1 });
    const onlyFit = lineUncertainty([0.4, 0.008], -80, noReference);
    expect(onlyFit.gainFraction).toBeCloseTo(1e-4, 15); // u(b₁)/|G|
    expect(onlyFit.offsetV).toBeCloseTo(0.005, 15); // u(b₀)/|G|: hertz back to volts
    const both = lineUncertainty([0.4, 0.008], 80, share);
    expect(both.gainFraction).toBeCloseTo(Math.hypot(1e-4, 0.0005 / Math.sqrt(3)), 15); // fit and reference are independent: quadrature (JCGM 100 5.1.2)
  });
});
