/**
 * How the reference instrument's error reaches a calibration, one treatment for every figure built on it.
 * A meter specified ±(p % of reading + c) gives one bound a(V) = (p/100)·|V| + c at each voltage. The bench
 * points share one instrument, range and day, so its error is read as δ(V) = ε·a(V) with a single ε common
 * to every point: rectangular on [−1, 1] for a limit (u = a/√3, JCGM 100 4.3.7), or normal for a bound
 * stated at k (u = a/k, JCGM 100 4.3.3). A fit of f on V treats the applied voltages as exact, so δ moves
 * its coefficients by b₁·(AᵀWA)⁻¹AᵀW·δ: the fit carries the weighted least-squares projection Pa of the
 * bound onto its own polynomial basis. A reading read back at V then errs by ε·(Pa)(V), and a line's offset
 * and gain by ε·(Pa)₀ volts and ε·(Pa)₁ (a fraction): fully correlated, through the one ε. For a fit with
 * an offset term over V ≥ 0 the projection is exact, Pa = a, so the read-back keeps the bound a(V) at V,
 * the offset takes c and the gain p %.
 */
import { fitPolynomial } from './fit-polynomial.js';
import type { PolynomialFitOptions } from './polynomial-fit-types.js';

/** A reference instrument's accuracy as datasheets state it: ±(percentOfReading % · |V| + plusVolts). */
export interface ReferenceAccuracy {
  percentOfReading: number;
  plusVolts: number;
  /** 0: the bounds are a limit (rectangular); otherwise the k they are stated at */
  coverageFactor: number;
}

/** The reference's standard uncertainty as a fit carries it: u_ref(V) = |Σ coefficients[k]·V^k|, all from one ε. */
export interface ReferenceShare {
  /** signed, volts per V^k; [0] is the offset share (V) and [1] the gain share (fraction) of a line */
  coefficients: number[];
  /** the law of the common ε: rectangular for a limit, normal for a bound stated at k */
  distribution: 'rectangular' | 'normal';
}

/** What a reference bound is divided by to give a standard uncertainty: √3 for a limit (JCGM 100 4.3.7), else its k. */
export function referenceDivisor(reference: ReferenceAccuracy): number {
  return reference.coverageFactor === 0 ? Math.sqrt(3) : reference.coverageFactor;
}

/**
 * The projection Pa/d of the reference's bound onto a fit's basis, with the fit's own points and weights.
 * @param appliedV the applied voltages of the points fitted, V
 * @param reference the reference instrument's accuracy
 * @param options the fit's degree, intercept and weights (as given to fitPolynomial)
 * @throws Error when a bound is negative, the coverage factor is neither 0 nor > 0, or as fitPolynomial
 * @example referenceShare([0, 250, 500], { percentOfReading: 0.05, plusVolts: 0.1, coverageFactor: 0 }, { degree: 1 }).coefficients // [0.1/√3, 0.0005/√3]
 */
export function referenceShare(appliedV: readonly number[], reference: ReferenceAccuracy, options: PolynomialFitOptions): ReferenceShare {
  if (!(reference.percentOfReading >= 0 && reference.plusVolts >= 0)) throw new Error('reference accuracy must be ≥ 0');
  if (!(reference.coverageFactor === 0 || reference.coverageFactor > 0)) throw new Error('reference coverage factor must be 0 or > 0');
  const divisor = referenceDivisor(reference);
  const bound = appliedV.map((v) => ((reference.percentOfReading / 100) * Math.abs(v) + reference.plusVolts) / divisor);
  const projected = fitPolynomial(appliedV, bound, { degree: options.degree, intercept: options.intercept, weights: options.weights });
  return { coefficients: projected.coefficients, distribution: reference.coverageFactor === 0 ? 'rectangular' : 'normal' };
}

/**
 * u_ref(V) = |(Pa)(V)|/d: the reference's standard uncertainty in a reading read back at V.
 * @param share from referenceShare
 * @param appliedV voltage, V
 * @example referenceShareAt(share, 500) // (0.05 % · 500 V + 0.1 V)/√3 for an offset fit over V ≥ 0
 */
export function referenceShareAt(share: ReferenceShare, appliedV: number): number {
  let value = 0;
  for (let k = share.coefficients.length - 1; k >= 0; k--) value = value * appliedV + share.coefficients[k];
  return Math.abs(value);
}
