import { describe, expect, it } from 'vitest';
import {
  fitPolynomial, lineUncertainty, readingUncertainty, referenceShare, referenceShareAt, withCommonReferenceError,
} from '../../../shared/fit/index.js';

const volts = Object.freeze([0, 125, 250, 375, 500]);
const meter = Object.freeze({ percentOfReading: 0.05, plusVolts: 0.1, coverageFactor: 0 });
const bound = (v: number) => (meter.percentOfReading / 100) * Math.abs(v) + meter.plusVolts;

describe('referenceShare', () => {
  it('keeps one bound at each voltage for a line with an offset over positive voltages', () => {
    const share = referenceShare(volts, meter, { degree: 1 });
    expect(share.coefficients[0]).toBeCloseTo(0.1 / Math.sqrt(3), 14); // offset share c/√3: rectangular limit (JCGM 100 4.3.7)
    expect(share.coefficients[1]).toBeCloseTo(0.0005 / Math.sqrt(3), 16); // gain share (p/100)/√3 (JCGM 100 4.3.7)
    for (const v of [0, 200, 500]) expect(referenceShareAt(share, v)).toBeCloseTo(bound(v) / Math.sqrt(3), 14); // a(V)/√3 at V, as the read-back states it
    const atK = referenceShare(volts, { ...meter, coverageFactor: 2 }, { degree: 1 });
    expect(referenceShareAt(atK, 500)).toBeCloseTo(bound(500) / 2, 14); // bound stated at k = 2: u = a/k (JCGM 100 4.3.3)
    expect(atK.distribution).toBe('normal');
  });

  it('is what a common reference error does to a least-squares line, to first order', () => {
    // Bench simulation: the meter reads V while the board sees V + ε·a(V); the line fitted on the meter's
    // readings then reads a later true voltage with error −ε·(Pa)(V) to first order (derived in reference-share.ts).
    const spanning = [-300, -150, 0, 150, 300, 450];
    const epsilon = 1e-4;
    const [b0, b1] = [512.5, 80.41];
    const line = fitPolynomial(spanning, spanning.map((v) => b0 + b1 * (v + epsilon * bound(v))), { degree: 1 });
    const share = referenceShare(spanning, meter, { degree: 1 });
    for (const v of [-300, 0, 200, 450]) {
      const readBack = (b0 + b1 * v - line.coefficients[0]) / line.coefficients[1];
      const carried = (v - readBack) / epsilon;
      expect(carried / (referenceShareAt(share, v) * Math.sqrt(3))).toBeCloseTo(1, 5); // first-order propagation through the fitted line (simulated in this test)
    }
    // Over a range that crosses zero the line cannot follow |V|, so the bound at −300 V is not what the line carries.
    expect(referenceShareAt(share, -300) * Math.sqrt(3)).not.toBeCloseTo(bound(-300), 3);
  });

  it('puts the whole bound into the gain of a line through the origin', () => {
    const share = referenceShare(volts, meter, { degree: 1, intercept: false });
    const slope = volts.reduce((s, v) => s + v * bound(v), 0) / volts.reduce((s, v) => s + v * v, 0); // least-squares slope through the origin Σxy/Σx² (common practice)
    expect(share.coefficients[0]).toBe(0);
    expect(share.coefficients[1]).toBeCloseTo(slope / Math.sqrt(3), 16);
  });

  it('lets the reading uncertainty carry the same reference share as the line\'s gain and offset', () => {
    const hertz = volts.map((v, i) => 512.5 + 80.41 * v + [0.2, -0.1, 0.3, -0.2, 0.1][i]);
    const fit = fitPolynomial(volts, hertz, { degree: 1 });
    const share = referenceShare(volts, meter, { degree: 1 });
    const line = lineUncertainty([0, 0], fit.coefficients[1], share);
    const [row] = readingUncertainty(fit, share, [400]);
    // gain and offset shares move together (one ε), so at V they add linearly: u = u_o + u_g·V (JCGM 100 5.2.2 with r = 1)
    expect(row.referenceV).toBeCloseTo(line.reference.offsetV + line.reference.gainFraction * 400, 14);
    expect(row.referenceV).toBeGreaterThan(Math.hypot(line.reference.offsetV, line.reference.gainFraction * 400));
  });

  it('refuses negative bounds and a bad coverage factor', () => {
    expect(() => referenceShare(volts, { ...meter, plusVolts: -0.1 }, { degree: 1 })).toThrow(/≥ 0/);
    expect(() => referenceShare(volts, { ...meter, coverageFactor: -1 }, { degree: 1 })).toThrow(/coverage factor/);
  });
});

describe('withCommonReferenceError', () => {
  it('moves every sample\'s gain and offset by one draw, so a reading at V spreads by the bound at V', () => {
    const trials = 20_000;
    const zeros = { gainErrorFraction: new Float64Array(trials), offsetErrorV: new Float64Array(trials) };
    const share = referenceShare(volts, meter, { degree: 1 });
    const out = withCommonReferenceError(zeros, share, 11);
    for (const v of [0, 250, 500]) {
      let sumSquares = 0;
      let largest = 0;
      for (let t = 0; t < trials; t++) {
        const error = out.offsetErrorV[t] + out.gainErrorFraction[t] * v;
        sumSquares += error * error;
        largest = Math.max(largest, Math.abs(error));
      }
      // rectangular variance a²/3 (JCGM 100 4.3.7); 4 % covers the sampling spread of s² at kurtosis 9/5 (√(0.8/20000) ≈ 0.6 %)
      expect(Math.abs(Math.sqrt(sumSquares / trials) / (bound(v) / Math.sqrt(3)) - 1)).toBeLessThan(0.04);
      expect(largest).toBeLessThanOrEqual(bound(v) * (1 + 1e-12)); // never beyond the limit itself (in this test)
    }
    expect(zeros.gainErrorFraction.every((g) => g === 0)).toBe(true); // inputs untouched
  });

  it('refuses samples of different lengths and a curved share', () => {
    const share = referenceShare(volts, meter, { degree: 1 });
    expect(() => withCommonReferenceError({ gainErrorFraction: [0, 0], offsetErrorV: [0] }, share, 1)).toThrow(/differ in length/);
    expect(() => withCommonReferenceError({ gainErrorFraction: [0], offsetErrorV: [0] }, { ...share, coefficients: [0, 0, 0] }, 1)).toThrow(/straight line/);
  });
});
