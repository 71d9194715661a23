import { describe, expect, it } from 'vitest';
import { fitPolynomial } from '../../../shared/fit/index.js';
import { loadDataset, matchingDigits } from './nist-strd-fixture.js';

describe('fitPolynomial against NIST StRD certified values', () => {
  it('fits Norris to 12 significant digits', () => {
    const norris = loadDataset('Norris');
    const fit = fitPolynomial(norris.x, norris.y, { degree: 1 });
    fit.coefficients.forEach((b, k) => expect(matchingDigits(b, norris.estimates[k])).toBeGreaterThanOrEqual(12)); // NIST StRD Norris, certified values
    fit.standardErrors.forEach((se, k) => expect(matchingDigits(se, norris.standardDeviations[k])).toBeGreaterThanOrEqual(12)); // NIST StRD Norris, certified values
    expect(matchingDigits(fit.residualStandardDeviation, norris.residualSd)).toBeGreaterThanOrEqual(12); // NIST StRD Norris, certified values
    expect(matchingDigits(fit.rSquared, norris.rSquared)).toBeGreaterThanOrEqual(12); // NIST StRD Norris, certified values
    expect(fit.residualDegreesOfFreedom).toBe(34); // NIST StRD Norris, certified ANOVA residual df
  });

  it('fits NoInt1 through the origin with the uncentred R² to 12 significant digits', () => {
    const data = loadDataset('NoInt1');
    const fit = fitPolynomial(data.x, data.y, { degree: 1, intercept: false });
    expect(fit.coefficients[0]).toBe(0);
    expect(matchingDigits(fit.coefficients[1], data.estimates[0])).toBeGreaterThanOrEqual(12); // NIST StRD NoInt1, certified values
    expect(matchingDigits(fit.standardErrors[1], data.standardDeviations[0])).toBeGreaterThanOrEqual(12); // NIST StRD NoInt1, certified values
    expect(matchingDigits(fit.residualStandardDeviation, data.residualSd)).toBeGreaterThanOrEqual(12); // NIST StRD NoInt1, certified values
    expect(matchingDigits(fit.rSquared, data.rSquared)).toBeGreaterThanOrEqual(12); // NIST StRD NoInt1, certified values
  });

  it('fits NoInt2 (three points) through the origin to 12 significant digits', () => {
    const data = loadDataset('NoInt2');
    const fit = fitPolynomial(data.x, data.y, { degree: 1, intercept: false });
    expect(matchingDigits(fit.coefficients[1], data.estimates[0])).toBeGreaterThanOrEqual(12); // NIST StRD NoInt2, certified values
    expect(matchingDigits(fit.standardErrors[1], data.standardDeviations[0])).toBeGreaterThanOrEqual(12); // NIST StRD NoInt2, certified values
    expect(matchingDigits(fit.residualStandardDeviation, data.residualSd)).toBeGreaterThanOrEqual(12); // NIST StRD NoInt2, certified values
    expect(matchingDigits(fit.rSquared, data.rSquared)).toBeGreaterThanOrEqual(12); // NIST StRD NoInt2, certified values
  });

  it('fits the Pontius quadratic to at least 9 significant digits', () => {
    const data = loadDataset('Pontius');
    const fit = fitPolynomial(data.x, data.y, { degree: 2 });
    fit.coefficients.forEach((b, k) => expect(matchingDigits(b, data.estimates[k])).toBeGreaterThanOrEqual(9)); // NIST StRD Pontius, certified values
    fit.standardErrors.forEach((se, k) => expect(matchingDigits(se, data.standardDeviations[k])).toBeGreaterThanOrEqual(9)); // NIST StRD Pontius, certified values
    expect(matchingDigits(fit.residualStandardDeviation, data.residualSd)).toBeGreaterThanOrEqual(9); // NIST StRD Pontius, certified values
    expect(matchingDigits(fit.rSquared, data.rSquared)).toBeGreaterThanOrEqual(9); // NIST StRD Pontius, certified values
  });
});
