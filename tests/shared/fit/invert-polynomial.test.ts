import { describe, expect, it } from 'vitest';
import { fitInversePolynomial, fitPolynomial, inverseLine, invertFit, predictValue } from '../../../shared/fit/index.js';

// Invented calibration of a 10 kHz/V converter behind a 1 : 100 divider (f in Hz against V in volts).
const volts = [0, 60, 120, 180, 240, 300, 360, 420, 480];
const hertz = volts.map((v, i) => 15 + 100.2 * v + 1.5e-3 * v * v + (i % 2 === 0 ? 0.4 : -0.4));

describe('inverting a calibration fit', () => {
  it('inverts a straight line exactly as V = (f − b0)/b1', () => {
    const fit = fitPolynomial(volts, hertz, { degree: 1 });
    const [b0, b1] = fit.coefficients;
    const { offset, gain } = inverseLine(fit);
    expect(offset + gain * 30000).toBeCloseTo((30000 - b0) / b1, 9); // algebra
    expect(invertFit(fit, 30000)).toBeCloseTo((30000 - b0) / b1, 9); // algebra
  });

  it('inverts a quadratic by Newton iteration to rounding error', () => {
    const fit = fitPolynomial(volts, hertz, { degree: 2 });
    for (const v of [0, 12.5, 250, 479.9]) {
      expect(invertFit(fit, predictValue(fit, v))).toBeCloseTo(v, 9); // round trip
    }
  });

  it('refuses a frequency the fitted range cannot reach', () => {
    const fit = fitPolynomial(volts, hertz, { degree: 2 });
    expect(() => invertFit(fit, 1e7)).toThrow('outside the range');
    expect(() => invertFit(fit, NaN)).toThrow('y must be a finite number');
    expect(() => inverseLine(fit)).toThrow('inverseLine needs a degree 1 fit');
  });

  it('fits an approximate inverse polynomial of volts on hertz', () => {
    const inverse = fitInversePolynomial(volts, hertz, 2);
    const forward = fitPolynomial(volts, hertz, { degree: 2 });
    expect(predictValue(inverse, predictValue(forward, 300))).toBeCloseTo(300, 1); // approximate by design
  });
});
