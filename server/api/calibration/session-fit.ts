import {
  fitPolynomial, inverseLine, predictInterval, fitInversePolynomial, predictValue, readingUncertainty, type PolynomialFit, type ReferenceAccuracy,
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
 * Least-squares fit of frequency on applied voltage over the points not excluded (weights 1/u² when all have u),
 * with the uncertainty of a voltage read back through it given the session's reference instrument.
 */
export function fitSession(settings: FitSettings, points: readonly CalibrationPoint[], reference: ReferenceAccuracy): FitView {
  const used = points.filter((p) => !p.excluded);
  const x = used.map((p) => p.appliedV);
  const y = used.map((p) => p.frequencyHz);
  const weighted = settings.weighted && used.length > 0 && used.every((p) => p.uncertaintyHz !== null);
  const weights = weighted ? used.map((p) => 1 / (p.uncertaintyHz as number) ** 2) : undefined;
  const fit = fitPolynomial(x, y, { degree: settings.degree, intercept: settings.intercept, weights });
  // A new reading is taken to be as good as a typical bench point.
  const newReadingWeight = weights ? weights.reduce((a, b) => a + b, 0) / weights.length : 1;
  const voltages = Array.from({ length: UNCERTAINTY_POINTS }, (_, i) => fit.xMin + ((fit.xMax - fit.xMin) * i) / (UNCERTAINTY_POINTS - 1));
  const byId = new Map(used.map((p, i) => [p.id, i]));
  const view: FitView = {
    settings: { ...settings, weighted },
    pointsUsed: used.length,
    coefficients: fit.coefficients,
    standardErrors: fit.standardErrors,
    residualStandardDeviationHz: fit.residualStandardDeviation,
    rSquared: fit.rSquared,
    degreesOfFreedom: fit.residualDegreesOfFreedom,
    points: points.map((p) => {
      const i = byId.get(p.id);
      if (i === undefined) return { id: p.id, residualHz: null, studentised: null, suspect: false };
      const s = fit.externallyStudentisedResiduals[i] ?? fit.studentisedResiduals[i];
      return { id: p.id, residualHz: fit.residuals[i], studentised: s, suspect: s !== null && Math.abs(s) > SUSPECT_LIMIT };
    }),
    band: bandOf(fit),
    inverse: inverseOf(fit),
    readingUncertainty: readingUncertainty(fit, reference, voltages, 0.95, newReadingWeight),
    rangeV: { min: fit.xMin, max: fit.xMax },
    rangeHz: { min: Math.min(predictValue(fit, fit.xMin), predictValue(fit, fit.xMax)), max: Math.max(predictValue(fit, fit.xMin), predictValue(fit, fit.xMax)) },
  };
  return view;
}

function bandOf(fit: PolynomialFit): FitView['band'] {
  if (fit.residualDegreesOfFreedom < 1) return [];
  return Array.from({ length: BAND_POINTS }, (_, i) => {
    const v = fit.xMin + ((fit.xMax - fit.xMin) * i) / (BAND_POINTS - 1);
    const c = predictInterval(fit, v, 0.95, 'confidence');
    const p = predictInterval(fit, v, 0.95, 'prediction');
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
