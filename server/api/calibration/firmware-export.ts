import type { FitView } from '../../../shared/schemas/calibration-views.js';
import { fixedPointForm, type FixedPointForm } from '../../../shared/fit/fixed-point.js';
import type { ReferenceTraceability } from '../../../shared/schemas/reference-traceability.js';
import { ConflictError } from '../../common/errors.js';
import { commentText, floatLiteral, identifierPart, stringLiteral } from './c-text.js';
import { boundText, cCountReadingCode, cReadingCode } from './c-reading.js';
import { countReadingForm, type CountReadingForm } from '../../../shared/fit/count-reading.js';
import type { CaptureDefinition } from '../../../shared/schemas/chain.js';

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
  /** The reference's traceability with its overdue flag; all null for a record frozen before it was kept. */
  traceability?: ReferenceTraceability;
  /** The channel's capture settings from the revision, for the count reading when the record holds none. */
  capture?: CaptureDefinition;
}

/** The count reading as exported: its form, or why there is none; frozen says it came from the record. */
export interface CountReadingExport {
  form: CountReadingForm | null;
  reason: string | null;
  frozen: boolean;
}

/** Which frozen record an export comes from, and the fixed-point form stored in it (never recomputed). */
export interface ExportRecord {
  sequence: number;
  sha256: string;
  fixed: FixedPointForm;
  /** The count reading frozen with the record; absent for records frozen before it existed. */
  count?: CountReadingExport;
}

/** The sentence every export of a record carries, so a flashed header can be traced to the stored record. */
export const recordStatement = (sessionId: number, record: ExportRecord): string =>
  `record ${record.sequence} of session ${sessionId}, SHA-256 ${record.sha256}`;

/** The float literals and the fixed-point form of the reading (a record's own, or computed for a draft), or a 409 saying why this fit has none. */
function readingForms(fit: FitView, record?: ExportRecord) {
  try {
    return { literals: fit.inverse.coefficients.map(floatLiteral), fixed: record?.fixed ?? fixedPointForm(fit.inverse.coefficients, fit.rangeHz) };
  } catch (e) {
    throw new ConflictError(`this fit cannot be exported for firmware: ${(e as Error).message}`);
  }
}

/** The count reading from a record, else computed now from the revision's capture settings (and said so). */
export function countReadingOf(fit: FitView, fixed: FixedPointForm, capture: CaptureDefinition | undefined, record?: ExportRecord): CountReadingExport {
  if (record?.count) return record.count;
  if (!capture) return { form: null, reason: 'the channel\'s capture settings are not known', frozen: false };
  try {
    return { form: countReadingForm(fit.inverse.coefficients, fixed, fit.rangeHz, capture), reason: null, frozen: false };
  } catch (e) {
    return { form: null, reason: (e as Error).message, frozen: false };
  }
}

const countLines = (p: string, count: CountReadingExport, record?: ExportRecord): string => {
  const l = p.toLowerCase();
  if (!count.form) return ` * No integer count reading: ${commentText(count.reason ?? 'none')}.\n`;
  const f = count.form;
  const c = f.capture;
  const formula = 'gateS' in c
    ? `gated count, f = counts / T_gate with T_gate = ${c.gateS} s`
    : `period capture, f = N x f_clk / (P x counts) with N = ${c.periodsAveraged}, f_clk = ${c.clockHz} Hz, P = ${c.prescaler}`;
  return ` * Count reading (${l}_millivolts_from_counts, integers only): whole millivolts from the raw counts, ${formula}.
 * Largest rounding error against 1000 x sum of ${l}_coeff[k] * f^k with f from the counts exactly, over the calibrated
 * range (${f.countsRange.min} to ${f.countsRange.max} counts): at most ${boundText(f.maxErrorMv)} mV (a bound from the rounding steps, half a
 * millivolt of it the final rounding); the largest at ${f.gridPoints} counts computed exactly is ${f.largestFoundMv.toFixed(3)} mV.
${record && !count.frozen ? ' * The count constants were computed at export from the revision\'s capture settings: this record predates them.\n' : ''}`;
};

const recordLine = (ctx: ExportContext, record?: ExportRecord) => (record
  ? ` * From the frozen calibration ${recordStatement(ctx.sessionId, record)} (of the record's canonical JSON); a later change of the fit does not change it.\n`
  : ' * Not from a frozen record: the session is a draft, and its fit may still change.\n');

/** The reference instrument line of a header, with the overdue warning where the session came after its due date. */
export function traceabilityText(t: ReferenceTraceability | undefined): string {
  if (!t || t.instrumentId === null && t.certificateNumber === null && t.dueOn === null) return 'Reference instrument traceability: not recorded.';
  const text = `Reference instrument ${t.instrumentId === null ? '(identifier not recorded)' : commentText(t.instrumentId)}, calibration certificate `
    + `${t.certificateNumber === null ? '(not recorded)' : commentText(t.certificateNumber)}, calibration due ${t.dueOn ?? '(not recorded)'}.`;
  return t.overdue ? `${text} WARNING: the session was performed after the reference's calibration due date.` : text;
}

const uncertaintyLine = (fit: FitView) =>
  fit.readingUncertainty.map((u) => `+-${u.expandedV.toPrecision(2)} V at ${u.appliedV.toPrecision(4)} V`).join(', ');

/**
 * A C header for the firmware: volts = Σ c_k·f^k with f in hertz as `static const float`, the same reading in
 * integers only (normalised frequency, Horner's rule in int64, see shared/fit/fixed-point.ts) with its largest
 * departure, ready-made static inline reading functions for both, and the valid input range. Everything is
 * prefixed by the channel so headers of several channels can be included together; names people typed appear
 * only as comment text or escaped string literals, so the header compiles whatever they hold.
 */
export function cHeader(ctx: ExportContext, fit: FitView, record?: ExportRecord): string {
  const p = `TV_${identifierPart(ctx.channelKey)}`;
  const lower = p.toLowerCase();
  const guard = `TALLYVOLT_CAL_${identifierPart(ctx.serialNumber)}_${identifierPart(ctx.channelKey)}_H`;
  const { literals, fixed } = readingForms(fit, record);
  const count = countReadingOf(fit, fixed, ctx.capture, record);
  return `/*
 * Tallyvolt calibration coefficients. Generated file: do not edit by hand.
 * Board ${commentText(ctx.serialNumber)}, design "${commentText(ctx.designName)}" revision ${commentText(ctx.revisionLetter)}, channel ${commentText(ctx.channelKey)} (${commentText(ctx.channelName)}).
 * Calibration session ${ctx.sessionId} on ${commentText(ctx.performedOn)} by ${commentText(ctx.testerName)} at ${ctx.ambientC.toFixed(1)} degC; session state: ${commentText(ctx.state)}.
${recordLine(ctx, record)} * ${traceabilityText(ctx.traceability)}
 * Reading: volts = sum over k of ${lower}_coeff[k] * f^k, with f the measured frequency in Hz (${lower}_volts_float).
 * ${fit.inverse.exact ? 'Exact inverse of the fitted straight line.' : `Least-squares inverse of the degree ${fit.settings.degree} fit; its largest departure is ${fit.inverse.maxInverseErrorV.toExponential(2)} V.`}
 * Fixed point (${lower}_volts_fixed, integers only): the input is f x 2^${fixed.frequencyFracBits} as a uint32_t; u = (input - ${p}_MID_FX) / ${p}_HALF_FX
 * in Q${fixed.uFracBits}, within -1..1 over the calibrated range (inputs beyond half the span outside it are clamped); volts = sum over k of ${lower}_u_q[k] / 2^${lower}_u_shift[k] * u^k by Horner's
 * rule in int64, each coefficient with 30 significant bits, the result in units of 2^-${fixed.voltsFracBits} V.
 * Largest fixed-point departure from the float form (the sum above in exact arithmetic with the fitted coefficients) over the
 * calibrated range: at most ${boundText(fixed.maxDepartureV)} V (a bound from the rounding steps); the largest at ${fixed.gridPoints} inputs computed exactly is ${fixed.largestFoundV.toExponential(1)} V.
 * Valid input: ${fit.rangeV.min} V to ${fit.rangeV.max} V (${fit.rangeHz.min.toPrecision(6)} Hz to ${fit.rangeHz.max.toPrecision(6)} Hz); outside it the fit is extrapolated.
${countLines(p, count, record)} * Expanded uncertainty (95 %) of one reading, before drift: the fit and a new reading's scatter, the reference${fit.inverse.exact ? '' : ' and the inverse polynomial\'s largest departure (as a rectangular bound)'}: ${uncertaintyLine(fit)}.
 */
#ifndef ${guard}
#define ${guard}

#include <stdint.h>

#define ${p}_BOARD_SERIAL ${stringLiteral(ctx.serialNumber)}
#define ${p}_REVISION ${stringLiteral(ctx.revisionLetter)}
#define ${p}_CAL_DATE ${stringLiteral(ctx.performedOn)}
${cReadingCode(p, literals, fixed)}${count.form ? `\n${cCountReadingCode(p, count.form)}` : ''}
static const float ${lower}_min_v = ${floatLiteral(fit.rangeV.min)};
static const float ${lower}_max_v = ${floatLiteral(fit.rangeV.max)};
static const float ${lower}_min_hz = ${floatLiteral(fit.rangeHz.min)};
static const float ${lower}_max_hz = ${floatLiteral(fit.rangeHz.max)};

#endif /* ${guard} */
`;
}

/**
 * The same coefficients as JSON, with the forward fit and its statistics for records. Version 2: the fixed-point
 * form moved from reading.scaled (coefficients of f) to reading.fixedPoint (coefficients of the normalised u).
 */
export function jsonExport(ctx: ExportContext, fit: FitView, record?: ExportRecord) {
  const { fixed } = readingForms(fit, record);
  const count = countReadingOf(fit, fixed, ctx.capture, record);
  return {
    format: 'tallyvolt-calibration',
    version: 2,
    board: ctx.serialNumber,
    design: ctx.designName,
    revision: ctx.revisionLetter,
    channel: { key: ctx.channelKey, name: ctx.channelName },
    session: { id: ctx.sessionId, performedOn: ctx.performedOn, ambientC: ctx.ambientC, state: ctx.state, tester: ctx.testerName },
    /** Identifier, certificate and due date of the reference instrument (null where not recorded); overdue: performed after the due date. */
    referenceInstrument: ctx.traceability ?? null,
    /** The frozen record this export was made from; null for a draft session's export. */
    record: record
      ? { sequence: record.sequence, sha256: record.sha256, statement: recordStatement(ctx.sessionId, record), hashOf: 'the record\'s canonical JSON (UTF-8)' }
      : null,
    reading: {
      form: 'volts = sum(coefficients[k] * f^k), f in Hz',
      coefficients: fit.inverse.coefficients,
      exact: fit.inverse.exact,
      fixedPoint: {
        form: 'F = f * 2^frequencyFracBits as uint32, clamped to [lowFx, highFx]; u = (F - midFx) / halfFx in Q(uFracBits); '
          + 'volts * 2^voltsFracBits = sum(scaled[k].q / 2^scaled[k].shift * u^k) by Horner in int64, rounding halves away from zero',
        ...fixed,
      },
      /** Whole millivolts from raw counts in integers only; null with the reason when the capture allows none. */
      countReading: count.form
        ? { form: count.form.method === 'period' ? 'F = (K + counts / 2) / counts' : 'F = (min(counts, countsClamp) * M + 2^(S-1)) >> S', frozen: count.frozen, ...count.form }
        : null,
      countReadingNote: count.reason,
    },
    forwardFit: {
      form: 'f = sum(coefficients[k] * V^k), V in volts, f in Hz',
      degree: fit.settings.degree,
      intercept: fit.settings.intercept,
      weighted: fit.settings.weighted,
      weighting: fit.weighting,
      birgeRatio: fit.birgeRatio,
      coefficients: fit.coefficients,
      standardErrors: fit.standardErrors,
      residualStandardDeviationHz: fit.residualStandardDeviationHz,
      rSquared: fit.rSquared,
      pointsUsed: fit.pointsUsed,
    },
    validRange: { volts: fit.rangeV, hertz: fit.rangeHz },
    readingUncertainty: {
      form: 'one reading read back with these coefficients: standard uncertainties in volts (fit and scatter, reference, inverse polynomial departure as a rectangular bound), expanded at 95 %',
      points: fit.readingUncertainty.map((u) => ({
        appliedV: u.appliedV, fitV: u.fitV, referenceV: u.referenceV, inverseV: u.inverseV, newReadingHz: u.newReadingHz, combinedV: u.combinedV,
        degreesOfFreedom: Number.isFinite(u.degreesOfFreedom) ? u.degreesOfFreedom : null, coverageFactor: u.coverageFactor, expandedV: u.expandedV,
      })),
    },
  };
}
