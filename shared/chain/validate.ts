import { MAX_TOP_RESISTORS } from '../schemas/chain.js';
import type { ChannelDefinition, ResistorDefinition } from './types.js';

function check(ok: boolean, message: string): void {
  if (!ok) throw new Error(message);
}

const isPositive = (v: unknown): boolean => typeof v === 'number' && Number.isFinite(v) && v > 0;
const isNonNegative = (v: unknown): boolean => typeof v === 'number' && Number.isFinite(v) && v >= 0;

function checkResistor(r: ResistorDefinition, name: string): void {
  check(isPositive(r.nominalOhm), `${name} must be > 0 Ω`);
  check(isNonNegative(r.tolerancePct), `${name} tolerance must be ≥ 0 %`);
  check(isNonNegative(r.tcrPpmPerK), `${name} TCR must be ≥ 0 ppm/K`);
  check(isNonNegative(r.voltageCoefficientPpmPerV), `${name} voltage coefficient must be ≥ 0 ppm/V`);
  check(isNonNegative(r.thermalResistanceKPerW), `${name} thermal resistance must be ≥ 0 K/W`);
  check(r.toleranceDistribution !== 'normal' || isPositive(r.toleranceCoverageFactor), `${name} coverage factor must be > 0`);
  check(r.ratedVoltageV === undefined || isPositive(r.ratedVoltageV), `${name} rated voltage must be > 0 V`);
  check(r.ratedPowerW === undefined || isPositive(r.ratedPowerW), `${name} rated power must be > 0 W`);
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
  check(isNonNegative(rangeV.minV), 'range minimum must be ≥ 0 V');
  check(isPositive(rangeV.maxV) && rangeV.maxV > rangeV.minV, 'voltage range reversed');
  check(isPositive(converter.gainHzPerV), 'converter gain must be > 0 Hz/V');
  check(isNonNegative(converter.offsetHz), 'converter offset must be ≥ 0 Hz');
  check(isPositive(converter.fullScaleHz), 'full-scale frequency must be > 0 Hz');
  for (const [value, name, unit] of [
    [converter.gainErrorPct, 'gain error', '%'],
    [converter.offsetErrorHz, 'offset error', 'Hz'],
    [converter.gainTempcoPpmPerK, 'gain tempco', 'ppm/K'],
    [converter.offsetDriftHzPerK, 'offset drift', 'Hz/K'],
    [converter.nonlinearityPctFs, 'nonlinearity', '% FS'],
    [converter.inputBiasCurrentA, 'input bias current', 'A'],
  ] as const) check(isNonNegative(value), `${name} must be ≥ 0 ${unit}`);
  check(converter.inputResistanceOhm === undefined || isPositive(converter.inputResistanceOhm), 'converter input resistance must be > 0 Ω');
  if (isolator) {
    check(isPositive(isolator.maxSignalRateBd), 'isolator signalling rate must be > 0 Bd');
    check(isNonNegative(isolator.pulseWidthDistortionS), 'pulse-width distortion must be ≥ 0 s');
  }
  check(isNonNegative(capture.clockTolerancePpm), 'clock tolerance must be ≥ 0 ppm');
  check(Number.isInteger(capture.counterBits) && capture.counterBits >= 8 && capture.counterBits <= 64, 'counter width must be 8–64 bits');
  if (capture.method === 'period') {
    check(isPositive(capture.clockHz), 'timer clock must be > 0 Hz');
    check(Number.isInteger(capture.prescaler) && capture.prescaler >= 1, 'prescaler must be a whole number ≥ 1');
    check(Number.isInteger(capture.periodsAveraged) && capture.periodsAveraged >= 1, 'periods averaged must be a whole number ≥ 1');
  } else if (capture.method === 'gated') {
    check(isPositive(capture.gateS), 'gate time must be > 0 s');
  } else throw new Error('capture method must be period or gated');
  check(Number.isFinite(environment.minC) && Number.isFinite(environment.maxC), 'temperature range must be finite');
  check(environment.maxC >= environment.minC, 'temperature range reversed');
  check(Number.isFinite(environment.referenceC), 'reference temperature must be finite');
  if (reconstruction.mode === 'calibrated') {
    check(Number.isFinite(reconstruction.temperatureC), 'calibration temperature must be finite');
    const [low, high] = reconstruction.pointsV ?? [rangeV.minV, rangeV.maxV];
    check(Number.isFinite(low) && Number.isFinite(high) && low !== high, 'calibration points must differ');
    check(isNonNegative(reconstruction.gainUncertaintyFraction), 'calibration gain uncertainty must be ≥ 0');
    check(isNonNegative(reconstruction.offsetUncertaintyV), 'calibration offset uncertainty must be ≥ 0 V');
    check(isPositive(reconstruction.coverageFactor), 'calibration coverage factor must be > 0');
  }
}
