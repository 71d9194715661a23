/**
 * The fitted value at a new x and its confidence or prediction interval
 * through Student's t with ν = n − p degrees of freedom.
 */
import { studentTQuantile } from '../stats/quantiles.js';
import { basisRow } from './polynomial-basis.js';
import { solveUpperTransposed } from './householder-qr.js';
import type { PolynomialFit } from './polynomial-fit-types.js';

/** A fitted value with its interval at one x. */
export interface FitInterval {
  x: number;
  fitted: number;
  /** standard uncertainty of the mean response (confidence) or of a new observation (prediction) */
  standardError: number;
  /** t_{(1+level)/2, ν} */
  coverageFactor: number;
  low: number;
  high: number;
}

/**
 * ŷ(x) = Σ b_k x^k.
 * @param fit a result of fitPolynomial
 * @param x abscissa, unit of the fitted x
 * @throws Error when x is not finite
 * @example predictValue(fit, 400) // ŷ at 400
 */
export function predictValue(fit: PolynomialFit, x: number): number {
  if (!Number.isFinite(x)) throw new Error('x must be a finite number');
  let value = 0;
  for (let k = fit.degree; k >= 0; k--) value = value * x + fit.coefficients[k];
  return value;
}

/**
 * Interval ŷ ± t·s·√(g) at x, with g = aᵀ(AᵀWA)⁻¹a for the mean response ('confidence') and
 * g + 1/w₀ for a new observation of weight w₀ ('prediction'); for a straight line with intercept
 * this is ŷ ± t·s·√(1/n + (x − x̄)²/Sxx) and ŷ ± t·s·√(1 + 1/n + (x − x̄)²/Sxx). With absolute
 * weights s is 1 (the weights are 1/u² with u known) and t becomes the normal quantile (ν = ∞).
 * @param fit a result of fitPolynomial
 * @param x abscissa, unit of the fitted x
 * @param level coverage probability, 0 < level < 1 (e.g. 0.95)
 * @param kind 'confidence' or 'prediction'
 * @param observationWeight w₀ of the new observation for 'prediction' (default 1)
 * @throws Error on a bad level, kind, weight or non-finite x
 * @example predictInterval(fit, 400, 0.95, 'prediction')
 */
export function predictInterval(
  fit: PolynomialFit,
  x: number,
  level: number,
  kind: 'confidence' | 'prediction',
  observationWeight = 1,
): FitInterval {
  if (!(level > 0 && level < 1)) throw new Error('level must be strictly between 0 and 1');
  if (kind !== 'confidence' && kind !== 'prediction') throw new Error("kind must be 'confidence' or 'prediction'");
  if (!(observationWeight > 0 && Number.isFinite(observationWeight))) throw new Error('observationWeight must be > 0');
  const fitted = predictValue(fit, x);
  const z = solveUpperTransposed(fit.r, basisRow(fit.basis, x));
  const meanFactor = z.reduce((sum, entry) => sum + entry * entry, 0);
  const factor = kind === 'prediction' ? meanFactor + 1 / observationWeight : meanFactor;
  const standardError = fit.uncertaintyScale * Math.sqrt(factor);
  const coverageFactor = studentTQuantile((1 + level) / 2, fit.covarianceDegreesOfFreedom);
  const halfWidth = coverageFactor * standardError;
  return { x, fitted, standardError, coverageFactor, low: fitted - halfWidth, high: fitted + halfWidth };
}
