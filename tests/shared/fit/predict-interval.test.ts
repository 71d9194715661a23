import { describe, expect, it } from 'vitest';
import { fitPolynomial, predictInterval, predictValue } from '../../../shared/fit/index.js';
import { studentTQuantile } from '../../../shared/stats/index.js';
import { loadDataset } from './nist-strd-fixture.js';

describe('predictInterval', () => {
  const norris = loadDataset('Norris');
  const fit = fitPolynomial(norris.x, norris.y, { degree: 1 });
  const n = norris.x.length;
  const xBar = norris.x.reduce((sum, v) => sum + v, 0) / n;
  const sxx = norris.x.reduce((sum, v) => sum + (v - xBar) ** 2, 0);
  const s = fit.residualStandardDeviation;

  it('matches the textbook simple-regression prediction interval', () => {
    for (const x0 of [0, 250, xBar, 999, 1500]) {
      const t = studentTQuantile(0.975, n - 2);
      const halfWidth = t * s * Math.sqrt(1 + 1 / n + (x0 - xBar) ** 2 / sxx); // NIST/SEMATECH e-Handbook §4.5.2, prediction interval for a new y
      const interval = predictInterval(fit, x0, 0.95, 'prediction');
      expect(interval.high - interval.fitted).toBeCloseTo(halfWidth, 10);
      expect(interval.fitted - interval.low).toBeCloseTo(halfWidth, 10);
    }
  });

  it('matches the textbook confidence interval of the mean response', () => {
    for (const x0 of [0, 500, 1000]) {
      const t = studentTQuantile(0.995, n - 2);
      const halfWidth = t * s * Math.sqrt(1 / n + (x0 - xBar) ** 2 / sxx); // NIST/SEMATECH e-Handbook §4.5.2, confidence interval for the mean
      const interval = predictInterval(fit, x0, 0.99, 'confidence');
      expect(interval.high - interval.fitted).toBeCloseTo(halfWidth, 10);
      expect(interval.coverageFactor).toBeCloseTo(t, 14);
    }
  });

  it('centres the interval on the fitted value', () => {
    const interval = predictInterval(fit, 420, 0.95, 'prediction');
    expect(interval.fitted).toBeCloseTo(fit.coefficients[0] + fit.coefficients[1] * 420, 10); // ŷ = b0 + b1·x
    expect(predictValue(fit, 420)).toBe(interval.fitted);
  });

  it('widens a prediction interval for a new point of smaller weight', () => {
    const unit = predictInterval(fit, 420, 0.95, 'prediction', 1);
    const light = predictInterval(fit, 420, 0.95, 'prediction', 0.25);
    expect(light.high - light.low).toBeGreaterThan(unit.high - unit.low);
  });

  it('rejects a bad level, kind or x', () => {
    expect(() => predictInterval(fit, 1, 0, 'prediction')).toThrow('level must be strictly between 0 and 1');
    expect(() => predictInterval(fit, 1, 1, 'confidence')).toThrow('level');
    expect(() => predictInterval(fit, 1, 0.95, 'band' as 'confidence')).toThrow("kind must be 'confidence' or 'prediction'");
    expect(() => predictInterval(fit, NaN, 0.95, 'confidence')).toThrow('x must be a finite number');
  });
});
