/**
 * Uncertainty of a voltage read back through a board's calibration: the applied voltage that a new
 * frequency reading stands for, with the fit's coefficients. Two contributions at each voltage V:
 * - the fit and the scatter of a new reading: the prediction standard error of f at V divided by the
 *   slope df/dV (the usual first-order inverse-regression result; for a straight line
 *   u = (s/|b₁|)·√(1/w₀ + 1/n + (V − V̄)²/Sxx)), with ν = n − p;
 * - the reference that set the applied voltages, ±(% of reading + volts): a rectangular limit a gives
 *   u = a/√3 (JCGM 100 4.3.7), a bound stated at k gives u = a/k; taken as exactly known (ν = ∞).
 * The reference's error is common to every point, so the fit passes it straight into the reading.
 * They combine in quadrature; k comes from Student's t at the Welch–Satterthwaite ν_eff (JCGM 100 G.4).
 */
import { studentTQuantile } from '../stats/quantiles.js';
import { effectiveDegreesOfFreedom } from '../stats/welch-satterthwaite.js';
import { predictInterval } from './predict-interval.js';
import type { PolynomialFit } from './polynomial-fit-types.js';

/** A reference instrument's accuracy as datasheets state it: ±(percentOfReading % · |V| + plusVolts). */
export interface ReferenceAccuracy {
  percentOfReading: number;
  plusVolts: number;
  /** 0: the bounds are a limit (rectangular); otherwise the k they are stated at */
  coverageFactor: number;
}

/** What a reference bound is divided by to give a standard uncertainty: √3 for a limit (JCGM 100 4.3.7), else its k. */
export function referenceDivisor(reference: ReferenceAccuracy): number {
  return reference.coverageFactor === 0 ? Math.sqrt(3) : reference.coverageFactor;
}

/**
 * Standard uncertainties of a board's calibrated straight line f = b₀ + b₁·V: its gain as a fraction of
 * `gainHzPerV` and its offset in volts, each from the coefficient's standard error and the reference's share
 * (its % of reading moves the gain, its volts move the offset; both common to every point), in quadrature.
 * @param standardErrors [u(b₀), u(b₁)] of the fit, Hz and Hz/V
 * @param gainHzPerV the gain the fraction is taken of (the board's own b₁, or the design's nominal gain)
 * @param reference the reference instrument's accuracy
 * @example lineUncertainty(fit.standardErrors, fit.coefficients[1], reference).gainFraction
 */
export function lineUncertainty(
  standardErrors: readonly number[], gainHzPerV: number, reference: ReferenceAccuracy,
): { gainFraction: number; offsetV: number } {
  const divisor = referenceDivisor(reference);
  const g = Math.abs(gainHzPerV);
  return {
    gainFraction: Math.hypot(standardErrors[1] / g, reference.percentOfReading / 100 / divisor),
    offsetV: Math.hypot(standardErrors[0] / g, reference.plusVolts / divisor),
  };
}

/** Standard uncertainties in volts at one applied voltage, and the expanded result. */
export interface ReadingUncertainty {
  appliedV: number;
  fitV: number;
  referenceV: number;
  combinedV: number;
  /** Welch–Satterthwaite ν_eff; Infinity when the fit's share is zero */
  degreesOfFreedom: number;
  coverageFactor: number;
  expandedV: number;
}

/** df/dV of the fitted polynomial. */
function slopeAt(fit: PolynomialFit, v: number): number {
  let slope = 0;
  for (let k = fit.degree; k >= 1; k--) slope = slope * v + k * fit.coefficients[k];
  return slope;
}

/**
 * @param fit a frequency-on-voltage fit (x in V, y in Hz) with ν ≥ 1
 * @param reference the reference instrument's accuracy
 * @param voltages applied voltages to evaluate, V
 * @param coverageProbability of the expanded uncertainty, 0 < p < 1 (default 0.95)
 * @param observationWeight w₀ of a new reading in the fit's weighting (1 for an unweighted fit)
 * @throws Error when ν < 1, the reference bounds are negative, or the fitted curve is flat at a voltage
 * @example readingUncertainty(fit, { percentOfReading: 0.01, plusVolts: 0.05, coverageFactor: 0 }, [0, 500])[1].expandedV
 */
export function readingUncertainty(
  fit: PolynomialFit,
  reference: ReferenceAccuracy,
  voltages: readonly number[],
  coverageProbability = 0.95,
  observationWeight = 1,
): ReadingUncertainty[] {
  if (fit.residualDegreesOfFreedom < 1) throw new Error('the fit needs at least one residual degree of freedom');
  if (!(reference.percentOfReading >= 0 && reference.plusVolts >= 0)) throw new Error('reference accuracy must be ≥ 0');
  if (!(reference.coverageFactor === 0 || reference.coverageFactor > 0)) throw new Error('reference coverage factor must be 0 or > 0');
  const divisor = referenceDivisor(reference);
  return voltages.map((appliedV) => {
    const slope = slopeAt(fit, appliedV);
    if (!(Math.abs(slope) > 0)) throw new Error(`the fitted curve is flat at ${appliedV} V, so a reading there cannot be turned back into volts`);
    const prediction = predictInterval(fit, appliedV, 0.95, 'prediction', observationWeight);
    const fitV = prediction.standardError / Math.abs(slope);
    const referenceV = ((reference.percentOfReading / 100) * Math.abs(appliedV) + reference.plusVolts) / divisor;
    const combinedV = Math.hypot(fitV, referenceV);
    const degreesOfFreedom = combinedV === 0 ? Infinity : effectiveDegreesOfFreedom([
      { standardUncertainty: fitV, degreesOfFreedom: fit.residualDegreesOfFreedom },
      { standardUncertainty: referenceV, degreesOfFreedom: Infinity },
    ]);
    const coverageFactor = studentTQuantile((1 + coverageProbability) / 2, degreesOfFreedom);
    return { appliedV, fitV, referenceV, combinedV, degreesOfFreedom, coverageFactor, expandedV: coverageFactor * combinedV };
  });
}
