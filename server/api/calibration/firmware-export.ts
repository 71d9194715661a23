import type { FitView } from '../../../shared/schemas/calibration-views.js';

export interface ExportContext {
  serialNumber: string;
  designName: string;
  revisionLetter: string;
  channelKey: string;
  channelName: string;
  sessionId: number;
  performedOn: string;
  ambientC: number;
  state: string;
  testerName: string;
}

const identifier = (s: string) => s.toUpperCase().replace(/[^A-Z0-9]+/g, '_').replace(/^_|_$/g, '');
/** Nine significant digits: enough to give back the same single-precision float. */
const floatLiteral = (v: number) => {
  const text = v.toPrecision(9);
  return `${/[.eE]/.test(text) ? text : `${text}.0`}f`;
};

/** Fixed-point form: coefficient = q / 2^shift with q a signed 32-bit integer and the shift as large as fits. */
export function scaledInteger(value: number): { q: number; shift: number } {
  if (value === 0) return { q: 0, shift: 0 };
  const shift = Math.max(0, Math.min(62, 30 - Math.ceil(Math.log2(Math.abs(value)))));
  const q = Math.round(value * 2 ** shift);
  return Math.abs(q) > 2 ** 31 - 1 ? { q: Math.round(value * 2 ** (shift - 1)), shift: shift - 1 } : { q, shift };
}

const safeComment = (s: string) => s.replace(/\*\//g, '* /').replace(/[\r\n]+/g, ' ');

const uncertaintyLine = (fit: FitView) =>
  fit.readingUncertainty.map((u) => `+-${u.expandedV.toPrecision(2)} V at ${u.appliedV.toPrecision(4)} V`).join(', ');

/**
 * A C header for the firmware: volts = Σ c_k·f^k with f in hertz, as `static const float` and as scaled
 * 32-bit integers (c_k = q_k / 2^shift_k), with the valid input range. Everything is prefixed by the channel
 * so headers of several channels can be included together.
 */
export function cHeader(ctx: ExportContext, fit: FitView): string {
  const p = `TV_${identifier(ctx.channelKey)}`;
  const lower = p.toLowerCase();
  const guard = `TALLYVOLT_CAL_${identifier(ctx.serialNumber)}_${identifier(ctx.channelKey)}_H`;
  const coeffs = fit.inverse.coefficients;
  const scaled = coeffs.map(scaledInteger);
  return `/*
 * Tallyvolt calibration coefficients. Generated file: do not edit by hand.
 * Board ${safeComment(ctx.serialNumber)}, design "${safeComment(ctx.designName)}" revision ${ctx.revisionLetter}, channel ${safeComment(ctx.channelKey)} (${safeComment(ctx.channelName)}).
 * Calibration session ${ctx.sessionId} on ${ctx.performedOn} by ${safeComment(ctx.testerName)} at ${ctx.ambientC.toFixed(1)} degC; session state: ${ctx.state}.
 * Reading: volts = sum over k of ${lower}_coeff[k] * f^k, with f the measured frequency in Hz.
 * ${fit.inverse.exact ? 'Exact inverse of the fitted straight line.' : `Least-squares inverse of the degree ${fit.settings.degree} fit; its largest departure is ${fit.inverse.maxInverseErrorV.toExponential(2)} V.`}
 * Fixed point: coefficient k = ${lower}_coeff_q[k] / 2^${lower}_coeff_shift[k].
 * Valid input: ${fit.rangeV.min} V to ${fit.rangeV.max} V (${fit.rangeHz.min.toPrecision(6)} Hz to ${fit.rangeHz.max.toPrecision(6)} Hz); outside it the fit is extrapolated.
 * Expanded uncertainty (95 %) of one reading, fit and reference, before drift: ${uncertaintyLine(fit)}.
 */
#ifndef ${guard}
#define ${guard}

#include <stdint.h>

#define ${p}_BOARD_SERIAL "${ctx.serialNumber.replace(/["\\]/g, '')}"
#define ${p}_REVISION "${ctx.revisionLetter}"
#define ${p}_CAL_DATE "${ctx.performedOn}"
#define ${p}_COEFF_COUNT ${coeffs.length}

static const float ${lower}_coeff[${coeffs.length}] = { ${coeffs.map(floatLiteral).join(', ')} };
static const int32_t ${lower}_coeff_q[${coeffs.length}] = { ${scaled.map((s) => `${s.q}`).join(', ')} };
static const uint8_t ${lower}_coeff_shift[${coeffs.length}] = { ${scaled.map((s) => `${s.shift}u`).join(', ')} };

static const float ${lower}_min_v = ${floatLiteral(fit.rangeV.min)};
static const float ${lower}_max_v = ${floatLiteral(fit.rangeV.max)};
static const float ${lower}_min_hz = ${floatLiteral(fit.rangeHz.min)};
static const float ${lower}_max_hz = ${floatLiteral(fit.rangeHz.max)};

#endif /* ${guard} */
`;
}

/** The same coefficients as JSON, with the forward fit and its statistics for records. */
export function jsonExport(ctx: ExportContext, fit: FitView) {
  return {
    format: 'tallyvolt-calibration',
    version: 1,
    board: ctx.serialNumber,
    design: ctx.designName,
    revision: ctx.revisionLetter,
    channel: { key: ctx.channelKey, name: ctx.channelName },
    session: { id: ctx.sessionId, performedOn: ctx.performedOn, ambientC: ctx.ambientC, state: ctx.state, tester: ctx.testerName },
    reading: {
      form: 'volts = sum(coefficients[k] * f^k), f in Hz',
      coefficients: fit.inverse.coefficients,
      exact: fit.inverse.exact,
      scaled: fit.inverse.coefficients.map(scaledInteger),
    },
    forwardFit: {
      form: 'f = sum(coefficients[k] * V^k), V in volts, f in Hz',
      degree: fit.settings.degree,
      intercept: fit.settings.intercept,
      weighted: fit.settings.weighted,
      coefficients: fit.coefficients,
      standardErrors: fit.standardErrors,
      residualStandardDeviationHz: fit.residualStandardDeviationHz,
      rSquared: fit.rSquared,
      pointsUsed: fit.pointsUsed,
    },
    validRange: { volts: fit.rangeV, hertz: fit.rangeHz },
    readingUncertainty: {
      form: 'one reading read back with these coefficients: standard uncertainties in volts, expanded at 95 %',
      points: fit.readingUncertainty.map((u) => ({
        appliedV: u.appliedV, fitV: u.fitV, referenceV: u.referenceV, combinedV: u.combinedV,
        degreesOfFreedom: Number.isFinite(u.degreesOfFreedom) ? u.degreesOfFreedom : null, coverageFactor: u.coverageFactor, expandedV: u.expandedV,
      })),
    },
  };
}
