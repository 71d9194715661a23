import { all, create, type BigNumber } from 'mathjs';
import { describe, expect, it } from 'vitest';
import {
  fitPolynomial, interpolatedUncertainty, predictInterval, predictValue, readingUncertainty, referenceShare,
} from '../../../shared/fit/index.js';
import { studentTQuantile } from '../../../shared/stats/index.js';

const big = create(all, { number: 'BigNumber', precision: 60 });
type Big = BigNumber;
const B = (v: number): Big => big.bignumber(v) as Big;
const sum = (values: Big[]): Big => values.reduce((a, b) => big.add(a, b) as Big, B(0));

/** An invented bench calibration whose frequency scatter grows with frequency (u ≈ 2·10⁻⁵·f). */
const volts = Object.freeze([0, 50, 100, 150, 200, 250, 300, 350, 400, 450, 500]);
const hertz = Object.freeze([512.31, 4532.86, 8553.02, 12572.35, 16593.6, 20613.1, 24631.9, 28654.4, 32671.2, 36695.8, 40712.1]);
const uHz = Object.freeze(hertz.map((f) => 0.02 + 2e-5 * f));
const weights = uHz.map((u) => 1 / u ** 2);
const none = { percentOfReading: 0, plusVolts: 0, coverageFactor: 0 };

/**
 * The weighted straight line by its closed-form sums (Bevington & Robinson, Data Reduction and Error Analysis,
 * §6.4; NIST/SEMATECH e-Handbook §4.4.3.2), in 60-digit decimal arithmetic: coefficients, χ², and the variance
 * of the fitted mean at V for weights taken as known, (S_xx − 2V·S_x + V²·S)/Δ.
 */
function referenceLine() {
  const w = weights.map(B);
  const x = volts.map(B);
  const y = hertz.map(B);
  const S = sum(w);
  const Sx = sum(w.map((wi, i) => big.multiply(wi, x[i]) as Big));
  const Sy = sum(w.map((wi, i) => big.multiply(wi, y[i]) as Big));
  const Sxx = sum(w.map((wi, i) => big.multiply(wi, big.multiply(x[i], x[i])) as Big));
  const Sxy = sum(w.map((wi, i) => big.multiply(wi, big.multiply(x[i], y[i])) as Big));
  const delta = big.subtract(big.multiply(S, Sxx), big.multiply(Sx, Sx)) as Big;
  const b0 = big.divide(big.subtract(big.multiply(Sxx, Sy), big.multiply(Sx, Sxy)), delta) as Big;
  const b1 = big.divide(big.subtract(big.multiply(S, Sxy), big.multiply(Sx, Sy)), delta) as Big;
  const chiSquared = sum(w.map((wi, i) => {
    const e = big.subtract(y[i], big.add(b0, big.multiply(b1, x[i])));
    return big.multiply(wi, big.multiply(e, e)) as Big;
  }));
  const meanVariance = (v: number) => big.divide(big.add(big.subtract(Sxx, big.multiply(2 * v, Sx)), big.multiply(v * v, S)), delta) as Big;
  return { b0, b1, chiSquared, meanVariance, varB0: big.divide(Sxx, delta) as Big, varB1: big.divide(S, delta) as Big };
}

const relativeError = (value: number, expected: Big) => Math.abs(value / (big.number(expected) as number) - 1);

describe('a weighted calibration read back', () => {
  const exact = referenceLine();
  const nu = volts.length - 2;
  const birgeSquared = big.divide(exact.chiSquared, nu) as Big;
  const absolute = fitPolynomial(volts, hertz, { degree: 1, weights, weighting: 'absolute' });
  const relative = fitPolynomial(volts, hertz, { degree: 1, weights, weighting: 'relative' });
  const noReference = referenceShare(volts, none, { degree: 1, weights });
  const newReadingAt = (v: number) => interpolatedUncertainty(hertz, uHz, predictValue(absolute, v));

  it('fits the coefficients and their absolute standard errors of the closed-form weighted line', () => {
    expect(relativeError(absolute.coefficients[0], exact.b0)).toBeLessThan(1e-12); // closed-form weighted LS, 60-digit reference (in this test)
    expect(relativeError(absolute.coefficients[1], exact.b1)).toBeLessThan(1e-12); // closed-form weighted LS, 60-digit reference (in this test)
    expect(relativeError(absolute.standardErrors[0] ** 2, exact.varB0)).toBeLessThan(1e-10); // Bevington & Robinson §6.4: σ²(b₀) = S_xx/Δ
    expect(relativeError(absolute.standardErrors[1] ** 2, exact.varB1)).toBeLessThan(1e-10); // Bevington & Robinson §6.4: σ²(b₁) = S/Δ
    expect(absolute.covarianceDegreesOfFreedom).toBe(Infinity); // known u: no degrees of freedom are spent on the scale (JCGM 100 G.4.3)
  });

  it('scales relative weights by χ²/ν and reports the Birge ratio', () => {
    expect(relativeError(relative.residualStandardDeviation ** 2, big.divide(exact.chiSquared, nu) as Big)).toBeLessThan(1e-9); // Birge ratio² = χ²/ν, 60-digit reference (in this test)
    expect(relativeError(relative.standardErrors[1] ** 2, big.multiply(exact.varB1, birgeSquared) as Big)).toBeLessThan(1e-9); // NIST/SEMATECH e-Handbook §4.4.3.2: Cov = s²(XᵀWX)⁻¹
    expect(relative.covarianceDegreesOfFreedom).toBe(nu);
  });

  it('gives a new reading its own interpolated u(f) and matches the closed-form read-back uncertainty', () => {
    const at = [0, 125, 250, 375, 500];
    for (const weighting of ['absolute', 'relative'] as const) {
      const fit = weighting === 'absolute' ? absolute : relative;
      const scale = weighting === 'absolute' ? B(1) : birgeSquared;
      const rows = readingUncertainty(fit, noReference, at, { newReadingHz: at.map(newReadingAt) });
      rows.forEach((row, i) => {
        const u0 = newReadingAt(at[i]);
        // u(V) = √((mean variance + u(f)²)·scale)/|b₁|: first-order inverse regression (NIST/SEMATECH e-Handbook §2.3.6.7.1), 60-digit sums
        const expected = big.divide(big.sqrt(big.multiply(big.add(exact.meanVariance(at[i]), B(u0 * u0)), scale) as Big), big.abs(exact.b1)) as Big;
        expect(relativeError(row.fitV, expected)).toBeLessThan(1e-9);
        expect(row.newReadingHz).toBe(u0);
      });
      // ν = ∞ for known u gives the normal k; relative weights keep t at ν = n − 2 (JCGM 100 G.3, G.4)
      expect(rows[4].coverageFactor).toBeCloseTo(weighting === 'absolute' ? 1.959963984540054 : studentTQuantile(0.975, nu), 12);
    }
  });

  it('states a larger uncertainty at the top of the range than a typical bench point would, and a smaller one at the bottom', () => {
    const meanWeight = weights.reduce((a, b) => a + b, 0) / weights.length;
    const [bottom, , , , top] = readingUncertainty(absolute, noReference, [0, 125, 250, 375, 500], { newReadingHz: [0, 125, 250, 375, 500].map(newReadingAt) });
    const typical = (v: number) => predictInterval(absolute, v, 0.95, 'prediction', meanWeight).standardError / absolute.coefficients[1];
    expect(top.fitV / typical(500)).toBeGreaterThan(2); // u(f) at 40.7 kHz is 0.83 Hz against the mean weight's 0.094 Hz (in this test)
    expect(bottom.fitV / typical(0)).toBeLessThan(0.5); // u(f) at 0.5 kHz is 0.03 Hz; the line's own uncertainty remains (in this test)
  });

  it('adds the inverse polynomial\'s largest departure as a rectangular bound with infinite degrees of freedom', () => {
    const departureV = 0.82;
    const [plain] = readingUncertainty(relative, noReference, [400], { newReadingHz: [newReadingAt(400)] });
    const [withInverse] = readingUncertainty(relative, noReference, [400], { newReadingHz: [newReadingAt(400)], inverseDepartureV: departureV });
    expect(withInverse.inverseV).toBeCloseTo(departureV / Math.sqrt(3), 15); // rectangular bound d: u = d/√3 (JCGM 100 4.3.7)
    expect(withInverse.combinedV).toBeCloseTo(Math.hypot(plain.fitV, departureV / Math.sqrt(3)), 14); // independent parts in quadrature (JCGM 100 5.1.2)
    expect(withInverse.degreesOfFreedom).toBeCloseTo(withInverse.combinedV ** 4 / (plain.fitV ** 4 / nu), 6); // JCGM 100 eq. G.2b, the bound at ν = ∞
  });

  it('refuses absolute weighting without weights and an unknown convention', () => {
    expect(() => fitPolynomial(volts, hertz, { degree: 1, weighting: 'absolute' })).toThrow(/absolute weighting needs/);
    expect(() => fitPolynomial(volts, hertz, { degree: 1, weights, weighting: 'known' as never })).toThrow(/weighting must be/);
  });
});

describe('interpolatedUncertainty', () => {
  const frequencies = Object.freeze([3000, 1000, 2000, 2000]);
  const uncertainties = Object.freeze([0.3, 0.1, 0.15, 0.25]);

  it('interpolates linearly between bench frequencies and holds the end values beyond them', () => {
    expect(interpolatedUncertainty(frequencies, uncertainties, 1500)).toBeCloseTo(0.15, 15); // halfway from 0.1 to the mean 0.2 at 2 kHz (in this test)
    expect(interpolatedUncertainty(frequencies, uncertainties, 2000)).toBeCloseTo(0.2, 15); // two points at one frequency count once, with their mean (in this test)
    expect(interpolatedUncertainty(frequencies, uncertainties, 2750)).toBeCloseTo(0.275, 15); // linear interpolation (common practice)
    expect(interpolatedUncertainty(frequencies, uncertainties, 10)).toBe(0.1); // clamped below (in this test)
    expect(interpolatedUncertainty(frequencies, uncertainties, 9000)).toBe(0.3); // clamped above (in this test)
    expect(interpolatedUncertainty([5000], [0.4], 1)).toBe(0.4); // one point: its u everywhere (in this test)
  });

  it('refuses empty, mismatched and non-positive inputs', () => {
    expect(() => interpolatedUncertainty([], [], 1)).toThrow(/at least one/);
    expect(() => interpolatedUncertainty([1, 2], [0.1], 1)).toThrow(/differ in length/);
    expect(() => interpolatedUncertainty([1], [0], 1)).toThrow(/> 0/);
    expect(() => interpolatedUncertainty([1], [0.1], Number.NaN)).toThrow(/finite/);
  });
});
