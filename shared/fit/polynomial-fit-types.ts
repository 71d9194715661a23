/**
 * Shapes of a polynomial least-squares request and result.
 */
import type { PolynomialBasis } from './polynomial-basis.js';

/** Options of fitPolynomial. */
export interface PolynomialFitOptions {
  /** 1, 2 or 3 */
  degree: number;
  /** fit a constant term b0 (default true); without it the line passes through the origin */
  intercept?: boolean;
  /** weight per point, > 0, proportional to 1/variance (default all 1) */
  weights?: readonly number[];
  /**
   * How the weights are read (default 'relative'): 'relative' weights fix only the points' proportions, so the
   * covariance is scaled by s² = χ²/ν; 'absolute' weights are 1/u² with u known standard uncertainties, so the
   * covariance is (AᵀWA)⁻¹ as it stands and its degrees of freedom are infinite.
   */
  weighting?: 'relative' | 'absolute';
}

/** A fitted polynomial y = Σ b_k x^k with its statistics. */
export interface PolynomialFit {
  degree: number;
  intercept: boolean;
  /** number of points n */
  pointCount: number;
  /** number of fitted coefficients p */
  parameterCount: number;
  /** ν = n − p */
  residualDegreesOfFreedom: number;
  /** b_k by power k = 0…degree, unit of y per unit of x^k; b0 is exactly 0 without intercept */
  coefficients: number[];
  /** standard error of each b_k (0 for an absent intercept) */
  standardErrors: number[];
  /** covariance of b_0…b_degree, (degree+1)×(degree+1) */
  covariance: number[][];
  /** s = √(Σ wᵢeᵢ² / ν), unit of y (at unit weight); with wᵢ = 1/uᵢ² this is the Birge ratio √(χ²/ν) */
  residualStandardDeviation: number;
  /** how the weights were read */
  weighting: 'relative' | 'absolute';
  /** the factor on √((AᵀWA)⁻¹) in every standard error: s for relative weights, 1 for absolute */
  uncertaintyScale: number;
  /** degrees of freedom of the covariance: ν = n − p for relative weights, Infinity for absolute */
  covarianceDegreesOfFreedom: number;
  /** Σ wᵢeᵢ² */
  residualSumOfSquares: number;
  /** centred 1 − SSE/Σw(y − ȳ)² with intercept; uncentred 1 − SSE/Σwy² without */
  rSquared: number;
  /** ŷᵢ, unit of y */
  fittedValues: number[];
  /** eᵢ = yᵢ − ŷᵢ, unit of y */
  residuals: number[];
  /** hat-matrix diagonal hᵢᵢ */
  leverages: number[];
  /** internally studentised eᵢ√wᵢ / (s√(1 − hᵢᵢ)); null where hᵢᵢ = 1 */
  studentisedResiduals: (number | null)[];
  /** externally studentised (deleted) residuals; null where hᵢᵢ = 1 or ν < 2 */
  externallyStudentisedResiduals: (number | null)[];
  /** the x range fitted, unit of x */
  xMin: number;
  xMax: number;
  /** the scaled basis and its R factor, kept for intervals at new x */
  basis: PolynomialBasis;
  r: number[][];
}
