/**
 * Inverse use of a calibration fit for firmware: x from y (volts from frequency).
 * Degree 1 is inverted exactly; degrees 2–3 by safeguarded Newton iteration on
 * the fitted forward polynomial within the fitted x range.
 */
import { fitPolynomial } from './fit-polynomial.js';
import { predictValue } from './predict-interval.js';
import type { PolynomialFit } from './polynomial-fit-types.js';

/** x = offset + gain·y, the exact inverse of a straight-line fit. */
export interface InverseLine {
  /** −b0/b1, unit of x */
  offset: number;
  /** 1/b1, unit of x per unit of y */
  gain: number;
}

/**
 * Inverse of a degree-1 fit y = b0 + b1·x: x = (y − b0)/b1 = offset + gain·y.
 * @param fit a degree-1 result of fitPolynomial
 * @throws Error when the fit is not degree 1 or its slope is zero
 * @example inverseLine(fit) // { offset: −b0/b1, gain: 1/b1 }
 */
export function inverseLine(fit: PolynomialFit): InverseLine {
  if (fit.degree !== 1) throw new Error('inverseLine needs a degree 1 fit');
  const [b0, b1] = fit.coefficients;
  if (b1 === 0) throw new Error('the fitted slope is zero: x cannot be recovered from y');
  return { offset: -b0 / b1, gain: 1 / b1 };
}

/**
 * The x with ŷ(x) = y: exact for degree 1; for degrees 2–3 Newton's method started from the
 * secant of the end points, kept inside [xMin − margin, xMax + margin] by bisection, where the
 * fitted curve must be monotonic.
 * @param fit a result of fitPolynomial
 * @param y ordinate to invert, unit of y (e.g. Hz)
 * @param marginFraction allowed extrapolation as a fraction of the fitted x span (default 0.1)
 * @throws Error when y is not finite, the slope is zero, or y lies outside the range reached
 * @example invertFit(fit, 41000) // volts giving 41 kHz
 */
export function invertFit(fit: PolynomialFit, y: number, marginFraction = 0.1): number {
  if (!Number.isFinite(y)) throw new Error('y must be a finite number');
  if (fit.degree === 1) {
    const { offset, gain } = inverseLine(fit);
    return offset + gain * y;
  }
  const span = fit.xMax - fit.xMin;
  let low = fit.xMin - marginFraction * span;
  let high = fit.xMax + marginFraction * span;
  const excess = (x: number): number => predictValue(fit, x) - y;
  const rising = excess(high) > excess(low);
  if (rising ? excess(low) > 0 || excess(high) < 0 : excess(low) < 0 || excess(high) > 0) {
    throw new Error(`y = ${y} lies outside the range of the fit over x ∈ [${low}, ${high}]`);
  }
  const slope = (x: number): number => {
    let derivative = 0;
    for (let k = fit.degree; k >= 1; k--) derivative = derivative * x + k * fit.coefficients[k];
    return derivative;
  };
  let x = low + (high - low) * (excess(low) / (excess(low) - excess(high)));
  for (let iteration = 0; iteration < 100; iteration++) {
    const value = excess(x);
    if (value === 0) return x;
    if (value > 0 === rising) high = x;
    else low = x;
    let next = x - value / slope(x);
    if (!(next > low && next < high)) next = 0.5 * (low + high);
    if (Math.abs(next - x) <= 1e-15 * Math.max(Math.abs(x), span)) return next;
    x = next;
  }
  return x;
}

/**
 * A polynomial x ≈ Σ a_k y^k for firmware that evaluates a polynomial rather than iterating:
 * the least-squares fit of x on y (an approximation of the inverse, not its exact form).
 * @param x abscissae of the calibration, e.g. volts
 * @param y ordinates, e.g. hertz
 * @param degree 1, 2 or 3
 * @throws Error as fitPolynomial
 * @example fitInversePolynomial(volts, hertz, 2).coefficients
 */
export function fitInversePolynomial(x: readonly number[], y: readonly number[], degree: number): PolynomialFit {
  return fitPolynomial(y, x, { degree });
}
