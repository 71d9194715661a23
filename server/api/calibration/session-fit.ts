import {
  fitPolynomial, inverseLine, predictInterval, fitInversePolynomial, predictValue, readingUncertainty, referenceShare, interpolatedUncertainty,
  type PolynomialFit, type ReferenceAccuracy,
} from '../../../shared/fit/index.js';
import type { FitSettings } from '../../../shared/schemas/calibration.js';
import type { FitView } from '../../../shared/schemas/calibration-views.js';
import type { CalibrationPoint } from '../../entities/CalibrationPoint.js';

/** |studentised residual| above this marks a point as suspect. */
export const SUSPECT_LIMIT = 3;

const BAND_POINTS = 25;

/** Voltages across the fitted range at which the reading uncertainty is reported: the ends and the quarters. */
const UNCERTAINTY_POINTS = 5;

/**
 * Least-squares fit of frequency on applied voltage over the points not excluded (weights 1/u² when all have u, read
 * as relative or absolute as the settings say), with the uncertainty of a voltage read back through it given the
 * session's reference instrument. A new reading of a weighted fit carries its own u(f), interpolated linearly over
 * the bench points' frequencies and held at the end values beyond them.
 */
export function fitSession(settings: FitSettings, points: readonly CalibrationPoint[], reference: ReferenceAccuracy): FitView {
  const used = points.filter((p) => !p.excluded);
  const x = used.map((p) => p.appliedV);
  const y = used.map((p) => p.frequencyHz);
  const weighted = settings.weighted && used.length > 0 && used.every((p) => p.uncertaintyHz !== null);
  const weighting = weighted ? settings.weighting ?? 'relative' : 'relative';
  const uncertainties = weighted ? used.map((p) => p.uncertaintyHz as number) : null;
  const weights = uncertainties?.map((u) => 1 / u ** 2);
  const fit = fitPolynomial(x, y, { degree: settings.degree, intercept: settings.intercept, weights, weighting });
  const newReadingHz = (v: number) => (uncertainties ? interpolatedUncertainty(y, uncertainties, predictValue(fit, v)) : undefined);
  const voltages = Array.from({ length: UNCERTAINTY_POINTS }, (_, i) => fit.xMin + ((fit.xMax - fit.xMin) * i) / (UNCERTAINTY_POINTS - 1));
  const inverse = inverseOf(fit);
  const share = referenceShare(x, reference, { degree: settings.degree, intercept: settings.intercept, weights });
  const byId = new Map(used.map((p, i) => [p.id, i]));
  const view: FitView = {
    settings: { ...settings, weighted, weighting },
    pointsUsed: used.length,
    coefficients: fit.coefficients,
    standardErrors: fit.standardErrors,
    residualStandardDeviationHz: fit.residualStandardDeviation,
    weighting,
    birgeRatio: weighted ? fit.residualStandardDeviation : null,
    rSquared: fit.rSquared,
    degreesOfFreedom: fit.residualDegreesOfFreedom,
    points: points.map((p) => {
      const i = byId.get(p.id);
      if (i === undefined) return { id: p.id, residualHz: null, studentised: null, suspect: false };
      const s = fit.externallyStudentisedResiduals[i] ?? fit.studentisedResiduals[i];
      return { id: p.id, residualHz: fit.residuals[i], studentised: s, suspect: s !== null && Math.abs(s) > SUSPECT_LIMIT };
    }),
    band: bandOf(fit, newReadingHz),
    inverse,
    readingUncertainty: readingUncertainty(fit, share, voltages, {
      newReadingHz: uncertainties ? voltages.map((v) => newReadingHz(v) as number) : undefined,
      inverseDepartureV: inverse.maxInverseErrorV,
    }),
    rangeV: { min: fit.xMin, max: fit.xMax },
    rangeHz: { min: Math.min(predictValue(fit, fit.xMin), predictValue(fit, fit.xMax)), max: Math.max(predictValue(fit, fit.xMin), predictValue(fit, fit.xMax)) },
  };
  return view;
}

function bandOf(fit: PolynomialFit, newReadingHz: (v: number) => number | undefined): FitView['band'] {
  if (fit.residualDegreesOfFreedom < 1) return [];
  return Array.from({ length: BAND_POINTS }, (_, i) => {
    const v = fit.xMin + ((fit.xMax - fit.xMin) * i) / (BAND_POINTS - 1);
    const c = predictInterval(fit, v, 0.95, 'confidence');
    const u = newReadingHz(v);
    const p = predictInterval(fit, v, 0.95, 'prediction', u === undefined ? 1 : 1 / u ** 2);
    return { appliedV: v, fittedHz: c.fitted, confidenceLowHz: c.low, confidenceHighHz: c.high, predictionLowHz: p.low, predictionHighHz: p.high };
  });
}

/** The firmware's form: volts from hertz. */
function inverseOf(fit: PolynomialFit): FitView['inverse'] {
  if (fit.degree === 1) {
    const line = inverseLine(fit);
    return { coefficients: [line.offset, line.gain], exact: true, maxInverseErrorV: 0 };
  }
  // A dense sample of the fitted forward curve, inverted by least squares.
  const volts = Array.from({ length: 101 }, (_, i) => fit.xMin + ((fit.xMax - fit.xMin) * i) / 100);
  const hertz = volts.map((v) => predictValue(fit, v));
  const inverse = fitInversePolynomial(volts, hertz, fit.degree);
  const maxInverseErrorV = Math.max(...volts.map((v, i) => Math.abs(predictValue(inverse, hertz[i]) - v)));
  return { coefficients: inverse.coefficients, exact: false, maxInverseErrorV };
}
