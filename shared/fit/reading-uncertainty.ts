/**
 * Uncertainty of a voltage read back through a board's calibration: the applied voltage that a new
 * frequency reading stands for, with the fit's coefficients. Three contributions at each voltage V:
 * - the fit and the scatter of a new reading: the prediction standard error of f at V divided by the
 *   slope df/dV (the usual first-order inverse-regression result; for a straight line
 *   u = (s/|b₁|)·√(1/w₀ + 1/n + (V − V̄)²/Sxx)). A weighted fit gives the new reading its own weight
 *   w₀ = 1/u(f)², u(f) from the bench points where the reading falls; ν = n − p for relative weights,
 *   ∞ for absolute ones (their u are known);
 * - the reference that set the applied voltages, as the fit carries it (reference-share.ts): one bound
 *   a(V) at each voltage, common to every point; taken as exactly known (ν = ∞);
 * - the firmware's inverse polynomial (degrees 2–3), which departs from the fit by at most d over the
 *   range: a rectangular bound, u = d/√3 (JCGM 100 4.3.7), ν = ∞.
 * They combine in quadrature; k comes from Student's t at the Welch–Satterthwaite ν_eff (JCGM 100 G.4).
 */
import { studentTQuantile } from '../stats/quantiles.js';
import { effectiveDegreesOfFreedom } from '../stats/welch-satterthwaite.js';
import { predictInterval } from './predict-interval.js';
import type { PolynomialFit } from './polynomial-fit-types.js';
import { referenceShareAt, type ReferenceShare } from './reference-share.js';

/** A calibrated line's gain (fraction) and offset (V) standard uncertainties, in total and by source. */
export interface LineUncertainty {
  gainFraction: number;
  offsetV: number;
  fit: { gainFraction: number; offsetV: number };
  /** both from the reference's one common error, so fully correlated with each other */
  reference: { gainFraction: number; offsetV: number };
}

/**
 * Standard uncertainties of a board's calibrated straight line f = b₀ + b₁·V: its gain as a fraction of
 * `gainHzPerV` and its offset in volts, each from the coefficient's standard error and the reference's share
 * as the line carries it (reference-share.ts), the two sources independent and so in quadrature.
 * @param standardErrors [u(b₀), u(b₁)] of the fit, Hz and Hz/V
 * @param gainHzPerV the gain the fraction is taken of (the board's own b₁, or the design's nominal gain)
 * @param share the reference's share projected onto the same straight line (referenceShare with degree 1)
 * @throws Error when the share is not a straight line's or the gain is zero
 * @example lineUncertainty(fit.standardErrors, fit.coefficients[1], referenceShare(volts, reference, { degree: 1 })).gainFraction
 */
export function lineUncertainty(standardErrors: readonly number[], gainHzPerV: number, share: ReferenceShare): LineUncertainty {
  if (share.coefficients.length !== 2) throw new Error("the reference share must be a straight line's");
  const g = Math.abs(gainHzPerV);
  if (!(g > 0)) throw new Error('gain must not be zero');
  const fit = { gainFraction: standardErrors[1] / g, offsetV: standardErrors[0] / g };
  const reference = { gainFraction: Math.abs(share.coefficients[1]), offsetV: Math.abs(share.coefficients[0]) };
  return {
    gainFraction: Math.hypot(fit.gainFraction, reference.gainFraction),
    offsetV: Math.hypot(fit.offsetV, reference.offsetV),
    fit,
    reference,
  };
}

/** Standard uncertainties in volts at one applied voltage, and the expanded result. */
export interface ReadingUncertainty {
  appliedV: number;
  /** the fit and a new reading's scatter */
  fitV: number;
  referenceV: number;
  /** the inverse polynomial's largest departure as a rectangular bound (0 for an exact inverse) */
  inverseV: number;
  /** the new reading's own u(f) used, Hz; null when the fit is unweighted (the residual scatter stands for it) */
  newReadingHz: number | null;
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

/** How a reading is evaluated beyond the fit and the reference. */
export interface ReadingOptions {
  /** of the expanded uncertainty, 0 < p < 1 (default 0.95) */
  coverageProbability?: number;
  /** u(f) of a new reading at each voltage, Hz, for a weighted fit (w₀ = 1/u²); omitted: w₀ = 1 */
  newReadingHz?: readonly number[];
  /** the firmware inverse's largest departure from the fit over the range, V (default 0: exact) */
  inverseDepartureV?: number;
}

/**
 * @param fit a frequency-on-voltage fit (x in V, y in Hz) with ν ≥ 1
 * @param share the reference's share as this fit carries it (referenceShare with the fit's points and options)
 * @param voltages applied voltages to evaluate, V
 * @param options coverage probability, the new reading's u(f) per voltage, the inverse's departure
 * @throws Error when ν < 1, the options are out of range, or the fitted curve is flat at a voltage
 * @example readingUncertainty(fit, referenceShare(volts, reference, { degree: 1 }), [0, 500])[1].expandedV
 */
export function readingUncertainty(
  fit: PolynomialFit,
  share: ReferenceShare,
  voltages: readonly number[],
  options: ReadingOptions = {},
): ReadingUncertainty[] {
  const { coverageProbability = 0.95, newReadingHz, inverseDepartureV = 0 } = options;
  if (fit.residualDegreesOfFreedom < 1) throw new Error('the fit needs at least one residual degree of freedom');
  if (!(coverageProbability > 0 && coverageProbability < 1)) throw new Error('coverage probability must be strictly between 0 and 1');
  if (newReadingHz !== undefined && newReadingHz.length !== voltages.length) throw new Error('newReadingHz needs one value per voltage');
  if (!(inverseDepartureV >= 0 && Number.isFinite(inverseDepartureV))) throw new Error('inverse departure must be a finite number ≥ 0 V');
  const inverseV = inverseDepartureV / Math.sqrt(3);
  return voltages.map((appliedV, i) => {
    const slope = slopeAt(fit, appliedV);
    if (!(Math.abs(slope) > 0)) throw new Error(`the fitted curve is flat at ${appliedV} V, so a reading there cannot be turned back into volts`);
    const u0 = newReadingHz?.[i];
    const prediction = predictInterval(fit, appliedV, 0.95, 'prediction', u0 === undefined ? 1 : 1 / (u0 * u0));
    const fitV = prediction.standardError / Math.abs(slope);
    const referenceV = referenceShareAt(share, appliedV);
    const combinedV = Math.sqrt(fitV ** 2 + referenceV ** 2 + inverseV ** 2);
    const degreesOfFreedom = combinedV === 0 ? Infinity : effectiveDegreesOfFreedom([
      { standardUncertainty: fitV, degreesOfFreedom: fit.covarianceDegreesOfFreedom },
      { standardUncertainty: referenceV, degreesOfFreedom: Infinity },
      { standardUncertainty: inverseV, degreesOfFreedom: Infinity },
    ]);
    const coverageFactor = studentTQuantile((1 + coverageProbability) / 2, degreesOfFreedom);
    return {
      appliedV, fitV, referenceV, inverseV, newReadingHz: u0 ?? null, combinedV, degreesOfFreedom, coverageFactor,
      expandedV: coverageFactor * combinedV,
    };
  });
}
