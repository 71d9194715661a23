/**
 * Weighted polynomial least squares (degree 1–3, with or without intercept)
 * by Householder QR on a centred and scaled basis — not the normal equations.
 */
import { householderLeastSquares, solveUpper } from './householder-qr.js';
import { basisRow, powerMapping } from './polynomial-basis.js';
import type { PolynomialBasis } from './polynomial-basis.js';
import type { PolynomialFit, PolynomialFitOptions } from './polynomial-fit-types.js';
import { residualDiagnostics } from './residual-diagnostics.js';

function checkInputs(x: readonly number[], y: readonly number[], options: PolynomialFitOptions): number[] {
  const { degree, intercept = true, weights, weighting = 'relative' } = options;
  if (weighting !== 'relative' && weighting !== 'absolute') throw new Error("weighting must be 'relative' or 'absolute'");
  if (weighting === 'absolute' && weights === undefined) throw new Error('absolute weighting needs a weight per point');
  if (degree !== 1 && degree !== 2 && degree !== 3) throw new Error('degree must be 1, 2 or 3');
  if (x.length !== y.length) throw new Error('x and y differ in length');
  const parameterCount = intercept ? degree + 1 : degree;
  if (x.length < parameterCount + 1) {
    throw new Error(`need at least ${parameterCount + 1} points for degree ${degree} ${intercept ? 'with' : 'without'} intercept`);
  }
  if (!x.every(Number.isFinite)) throw new Error('x must hold only finite numbers');
  if (!y.every(Number.isFinite)) throw new Error('y must hold only finite numbers');
  if (weights !== undefined && weights.length !== x.length) throw new Error('weights and x differ in length');
  const checked = weights === undefined ? x.map(() => 1) : [...weights];
  if (!checked.every((w) => w > 0 && Number.isFinite(w))) throw new Error('weights must be finite numbers > 0');
  if (new Set(x).size < degree + (intercept ? 1 : 0)) {
    throw new Error(`x must hold at least ${parameterCount} distinct values for degree ${degree}`);
  }
  return checked;
}

function chooseBasis(x: readonly number[], weights: readonly number[], degree: number, intercept: boolean): PolynomialBasis {
  let centre = 0;
  if (intercept) {
    let weightSum = 0;
    for (let i = 0; i < x.length; i++) {
      weightSum += weights[i];
      centre += (weights[i] * (x[i] - centre)) / weightSum;
    }
  }
  const scale = Math.max(...x.map((value) => Math.abs(value - centre)));
  if (!(scale > 0)) throw new Error('x must not be all zero for a fit without intercept');
  const powers = Array.from({ length: degree + 1 }, (_, k) => k).filter((k) => intercept || k > 0);
  return { centre, scale, powers };
}

/**
 * Least-squares polynomial y ≈ Σ b_k x^k minimising Σ wᵢ(yᵢ − ŷᵢ)², with standard errors
 * s·√diag((AᵀWA)⁻¹) for relative weights (as certified by NIST StRD) or √diag((AᵀWA)⁻¹) for absolute ones
 * (weights 1/u² with u known; e.g. Bevington & Robinson, Data Reduction and Error Analysis, §6.4), R²,
 * leverages and studentised residuals.
 * @param x abscissae, e.g. applied volts (V)
 * @param y ordinates, e.g. measured frequency (Hz)
 * @param options degree 1–3, intercept (default true), weights > 0 (default 1), weighting (default 'relative')
 * @throws Error on a bad degree, length mismatch, too few or too few distinct points, bad weights or weighting
 * @example fitPolynomial([0, 1, 2, 3], [1, 3, 5, 7.1], { degree: 1 }).coefficients // ≈ [0.98, 2.03]
 */
export function fitPolynomial(x: readonly number[], y: readonly number[], options: PolynomialFitOptions): PolynomialFit {
  const weights = checkInputs(x, y, options);
  const { degree, intercept = true } = options;
  const basis = chooseBasis(x, weights, degree, intercept);
  const rootWeights = weights.map(Math.sqrt);
  const rows = x.map((value, i) => basisRow(basis, value).map((entry) => entry * rootWeights[i]));
  const columns = basis.powers.map((_, k) => rows.map((row) => row[k]));
  const { r, solution } = householderLeastSquares(columns, y.map((value, i) => value * rootWeights[i]));
  const fittedValues = x.map((value) => basisRow(basis, value).reduce((sum, entry, k) => sum + entry * solution[k], 0));
  const residuals = y.map((value, i) => value - fittedValues[i]);
  const residualSumOfSquares = residuals.reduce((sum, e, i) => sum + weights[i] * e * e, 0);
  const parameterCount = basis.powers.length;
  const residualDegreesOfFreedom = x.length - parameterCount;
  const variance = residualSumOfSquares / residualDegreesOfFreedom;
  const weighting = options.weighting ?? 'relative';
  // Absolute weights are 1/u² with u known, so (AᵀWA)⁻¹ is the covariance itself; relative ones learn the scale from the residuals.
  const covarianceScale = weighting === 'absolute' ? 1 : variance;
  // Cov(β) = scale·R⁻¹R⁻ᵀ; column k of R⁻¹ solves R z = e_k
  const rInverse = basis.powers.map((_, k) => solveUpper(r, basis.powers.map((__, j) => (j === k ? 1 : 0))));
  const scaledCovariance = basis.powers.map((_, i) =>
    basis.powers.map((__, j) => covarianceScale * rInverse.reduce((sum, column) => sum + column[i] * column[j], 0)),
  );
  const mapping = powerMapping(basis, degree);
  const coefficients = mapping.map((row) => row.reduce((sum, t, k) => sum + t * solution[k], 0));
  const covariance = mapping.map((rowA) =>
    mapping.map((rowB) =>
      rowA.reduce((sum, a, i) => sum + a * rowB.reduce((inner, b, j) => inner + scaledCovariance[i][j] * b, 0), 0),
    ),
  );
  let weightSum = 0;
  let weightedMean = 0;
  for (let i = 0; i < y.length; i++) {
    weightSum += weights[i];
    weightedMean += (weights[i] * (y[i] - weightedMean)) / weightSum;
  }
  const reference = intercept ? weightedMean : 0;
  const totalSumOfSquares = y.reduce((sum, value, i) => sum + weights[i] * (value - reference) ** 2, 0);
  const diagnostics = residualDiagnostics(rows, r, residuals, rootWeights, Math.sqrt(variance), residualDegreesOfFreedom);
  return {
    degree,
    intercept,
    pointCount: x.length,
    parameterCount,
    residualDegreesOfFreedom,
    coefficients,
    standardErrors: covariance.map((row, k) => Math.sqrt(Math.max(row[k], 0))),
    covariance,
    residualStandardDeviation: Math.sqrt(variance),
    weighting,
    uncertaintyScale: Math.sqrt(covarianceScale),
    covarianceDegreesOfFreedom: weighting === 'absolute' ? Infinity : residualDegreesOfFreedom,
    residualSumOfSquares,
    rSquared: totalSumOfSquares > 0 ? 1 - residualSumOfSquares / totalSumOfSquares : 1,
    fittedValues,
    residuals,
    ...diagnostics,
    xMin: Math.min(...x),
    xMax: Math.max(...x),
    basis,
    r,
  };
}
