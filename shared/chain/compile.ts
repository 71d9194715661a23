import type { UncertainInput } from '../propagation/inputs.js';
import { nominalFrequencyHz } from './capture.js';
import { dividerNominal, resistorStresses } from './divider.js';
import { evaluationGrid } from './grid.js';
import { boardInputs, readingInputs } from './inputs.js';
import type { ChannelDefinition } from './types.js';
import { assertChannel } from './validate.js';
import { DEFAULT_GRID_POINTS } from '../schemas/study-defaults.js';

/**
 * A channel reduced to typed arrays for the error model. Points are the evaluation grid
 * followed by the two calibration points; stresses are nominal at each point.
 */
export interface CompiledChannel {
  channel: ChannelDefinition;
  gridV: Float64Array;
  /** Grid voltages then the two calibration voltages. */
  pointV: Float64Array;
  pointCount: number;
  topCount: number;
  resistorCount: number;
  nominalOhm: Float64Array;
  /** Voltage across resistor r at point p: [r·pointCount + p], V. */
  resistorV: Float64Array;
  /** Self-heating of resistor r at point p (P·θ): [r·pointCount + p], K. */
  selfHeatingK: Float64Array;
  /** Converter input resistance, Ω (Infinity when not loaded). */
  inputResistanceOhm: number;
  nominalRatio: number;
  gainHzPerV: number;
  offsetHz: number;
  fullScaleHz: number;
  periodCapture: boolean;
  /** f_clk / prescaler, Hz (period capture). */
  tickHz: number;
  periodsAveraged: number;
  gateS: number;
  /** 2^counterBits: the count the counter reads as 0. */
  counterModulus: number;
  referenceC: number;
  calibrated: boolean;
  calibrationC: number;
  board: UncertainInput[];
  reading: UncertainInput[];
}

/**
 * Validates a channel and precomputes what the per-trial error model needs.
 * @param channel fully specified channel
 * @param gridPoints evaluation voltages across the range, integer ≥ 2 (default 11)
 * @throws Error naming the first bad input; also if period capture sees ≤ 0 Hz at the range minimum
 * @example const compiled = compileChannel(channel, 11)
 */
export function compileChannel(channel: ChannelDefinition, gridPoints = DEFAULT_GRID_POINTS): CompiledChannel {
  assertChannel(channel);
  const { divider, converter, capture, rangeV, reconstruction, environment } = channel;
  const gridV = evaluationGrid(rangeV, gridPoints);
  const calibrated = reconstruction.mode === 'calibrated';
  const calibrationPoints = calibrated ? reconstruction.pointsV ?? [rangeV.minV, rangeV.maxV] : [rangeV.minV, rangeV.maxV];
  const pointV = Float64Array.from([...gridV, ...calibrationPoints]);
  const pointCount = pointV.length;
  const parts = [...divider.top, divider.bottom];
  const resistorCount = parts.length;
  const resistorV = new Float64Array(resistorCount * pointCount);
  const selfHeatingK = new Float64Array(resistorCount * pointCount);
  pointV.forEach((v, p) => {
    resistorStresses(divider, Math.abs(v), converter.inputResistanceOhm).forEach((stress, r) => {
      resistorV[r * pointCount + p] = stress.voltageV;
      selfHeatingK[r * pointCount + p] = stress.powerW * parts[r].thermalResistanceKPerW;
    });
  });
  const nominal = dividerNominal(divider, converter.inputResistanceOhm);
  if (capture.method === 'period' && !(nominalFrequencyHz(converter, nominal.ratio, rangeV.minV) > 0)) {
    throw new Error('frequency at the range minimum must be > 0 Hz for period capture');
  }
  return {
    channel,
    gridV,
    pointV,
    pointCount,
    topCount: divider.top.length,
    resistorCount,
    nominalOhm: Float64Array.from(parts, (r) => r.nominalOhm),
    resistorV,
    selfHeatingK,
    inputResistanceOhm: converter.inputResistanceOhm ?? Infinity,
    nominalRatio: nominal.ratio,
    gainHzPerV: converter.gainHzPerV,
    offsetHz: converter.offsetHz,
    fullScaleHz: converter.fullScaleHz,
    periodCapture: capture.method === 'period',
    tickHz: capture.method === 'period' ? capture.clockHz / capture.prescaler : 0,
    periodsAveraged: capture.method === 'period' ? capture.periodsAveraged : 1,
    gateS: capture.method === 'gated' ? capture.gateS : 0,
    counterModulus: 2 ** capture.counterBits,
    referenceC: environment.referenceC,
    calibrated,
    calibrationC: calibrated ? reconstruction.temperatureC : environment.referenceC,
    board: boardInputs(channel),
    reading: readingInputs(channel),
  };
}
