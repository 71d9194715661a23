import { MAX_TOP_RESISTORS } from '../schemas/chain.js';
import { BOUNDS, boundProblem, MAX_PERIODS_AVERAGED, MAX_PRESCALER, TEMPERATURE_BOUND, type InputBound } from './bounds.js';
import type { ChannelDefinition, ResistorDefinition } from './types.js';

function check(ok: boolean, message: string): void {
  if (!ok) throw new Error(message);
}

const isPositive = (v: unknown): boolean => typeof v === 'number' && Number.isFinite(v) && v > 0;

/** Throws the bound's message (`top resistor 2 tolerance must be ≤ 50 %`) when the value lies outside it. */
function checkBound(value: unknown, name: string, bound: InputBound): void {
  const problem = boundProblem(value, name, bound);
  if (problem) throw new Error(problem);
}

function checkResistor(r: ResistorDefinition, name: string): void {
  checkBound(r.nominalOhm, name, BOUNDS.resistance);
  checkBound(r.tolerancePct, `${name} tolerance`, BOUNDS.tolerance);
  checkBound(r.tcrPpmPerK, `${name} TCR`, BOUNDS.tcr);
  checkBound(r.voltageCoefficientPpmPerV, `${name} voltage coefficient`, BOUNDS.voltageCoefficient);
  checkBound(r.thermalResistanceKPerW, `${name} thermal resistance`, BOUNDS.thermalResistance);
  if (r.toleranceDistribution === 'normal') checkBound(r.toleranceCoverageFactor, `${name} coverage factor`, BOUNDS.coverageFactor);
  if (r.ratedVoltageV !== undefined) checkBound(r.ratedVoltageV, `${name} rated voltage`, BOUNDS.ratedVoltage);
  if (r.ratedPowerW !== undefined) checkBound(r.ratedPowerW, `${name} rated power`, BOUNDS.ratedPower);
}

/**
 * Checks that a channel is physically meaningful, so the engine never returns NaN. Mirrors
 * channelSchema for callers that did not parse with it.
 * @param channel a fully specified channel (defaults applied)
 * @throws Error naming the first bad input, e.g. `bottom resistor must be > 0 Ω`,
 *   `gate time must be > 0 s`, `temperature range reversed`
 * @example assertChannel(channelSchema.parse(form))
 */
export function assertChannel(channel: ChannelDefinition): void {
  const { divider, converter, capture, environment, rangeV, reconstruction, isolator } = channel;
  check(Array.isArray(divider?.top) && divider.top.length >= 1, 'top string must have at least 1 resistor');
  check(divider.top.length <= MAX_TOP_RESISTORS, `top string must have at most ${MAX_TOP_RESISTORS} resistors`);
  divider.top.forEach((r, i) => checkResistor(r, `top resistor ${i + 1}`));
  checkResistor(divider.bottom, 'bottom resistor');
  check(isPositive(divider.deratingFraction) && divider.deratingFraction <= 1, 'derating fraction must be in (0, 1]');
  checkBound(rangeV.minV, 'range minimum', BOUNDS.rangeMin);
  checkBound(rangeV.maxV, 'range maximum', BOUNDS.rangeMax);
  check(rangeV.maxV > rangeV.minV, 'voltage range reversed');
  for (const [value, name, bound] of [
    [converter.gainHzPerV, 'converter gain', BOUNDS.converterGain],
    [converter.offsetHz, 'converter offset', BOUNDS.frequency],
    [converter.fullScaleHz, 'full-scale frequency', BOUNDS.fullScale],
    [converter.gainErrorPct, 'gain error', BOUNDS.gainError],
    [converter.offsetErrorHz, 'offset error', BOUNDS.frequency],
    [converter.gainTempcoPpmPerK, 'gain tempco', BOUNDS.gainTempco],
    [converter.offsetDriftHzPerK, 'offset drift', BOUNDS.offsetDrift],
    [converter.nonlinearityPctFs, 'nonlinearity', BOUNDS.nonlinearity],
    [converter.inputBiasCurrentA, 'input bias current', BOUNDS.inputBiasCurrent],
    [converter.inputResistanceTolerancePct ?? 0, 'input resistance tolerance', BOUNDS.inputResistanceTolerance],
    [converter.inputResistanceTempcoPpmPerK ?? 0, 'input resistance tempco', BOUNDS.inputResistanceTempco],
  ] as const) checkBound(value, name, bound);
  if (converter.inputResistanceOhm !== undefined) checkBound(converter.inputResistanceOhm, 'converter input resistance', BOUNDS.inputResistance);
  if (isolator) {
    checkBound(isolator.maxSignalRateBd, 'isolator signalling rate', BOUNDS.signalRate);
    checkBound(isolator.pulseWidthDistortionS, 'pulse-width distortion', BOUNDS.pulseWidthDistortion);
  }
  checkBound(capture.clockTolerancePpm, 'clock tolerance', BOUNDS.clockTolerance);
  check(Number.isInteger(capture.counterBits) && capture.counterBits >= 8 && capture.counterBits <= 64, 'counter width must be 8–64 bits');
  if (capture.method === 'period') {
    checkBound(capture.clockHz, 'timer clock', BOUNDS.clock);
    check(Number.isInteger(capture.prescaler) && capture.prescaler >= 1 && capture.prescaler <= MAX_PRESCALER, `prescaler must be a whole number from 1 to ${MAX_PRESCALER}`);
    check(Number.isInteger(capture.periodsAveraged) && capture.periodsAveraged >= 1 && capture.periodsAveraged <= MAX_PERIODS_AVERAGED,
      `periods averaged must be a whole number from 1 to ${MAX_PERIODS_AVERAGED}`);
  } else if (capture.method === 'gated') {
    checkBound(capture.gateS, 'gate time', BOUNDS.gate);
  } else throw new Error('capture method must be period or gated');
  checkBound(environment.minC, 'minimum temperature', TEMPERATURE_BOUND);
  checkBound(environment.maxC, 'maximum temperature', TEMPERATURE_BOUND);
  check(environment.maxC >= environment.minC, 'temperature range reversed');
  checkBound(environment.referenceC, 'reference temperature', TEMPERATURE_BOUND);
  if (reconstruction.mode === 'calibrated') {
    checkBound(reconstruction.temperatureC, 'calibration temperature', TEMPERATURE_BOUND);
    const [low, high] = reconstruction.pointsV ?? [rangeV.minV, rangeV.maxV];
    checkBound(low, 'calibration point', BOUNDS.calibrationPoint);
    checkBound(high, 'calibration point', BOUNDS.calibrationPoint);
    check(low !== high, 'calibration points must differ');
    checkBound(reconstruction.gainUncertaintyFraction, 'calibration gain uncertainty', BOUNDS.calibrationGainUncertainty);
    checkBound(reconstruction.offsetUncertaintyV, 'calibration offset uncertainty', BOUNDS.calibrationOffsetUncertainty);
    checkBound(reconstruction.coverageFactor, 'calibration coverage factor', BOUNDS.coverageFactor);
  }
}
