import { uncertainInput, type UncertainInput } from '../propagation/inputs.js';
import type { ChannelDefinition } from './types.js';

/**
 * The channel's board inputs (drawn once per simulated board) in compiled-vector order: per
 * resistor tolerance (fraction), TCR (1/K), voltage coefficient (1/V); then gain error
 * (fraction), offset error (Hz), gain tempco (1/K), offset drift (Hz/K), nonlinearity (fraction
 * of full scale), input bias current (A), input resistance tolerance (fraction) and tempco (1/K),
 * clock error (fraction), operating temperature (°C),
 * calibration gain (fraction) and offset (V). Bounds without a stated shape are rectangular.
 * @param channel fully specified, validated channel
 * @throws never for a validated channel
 * @example boardInputs(channel).map((i) => i.label)
 */
export function boardInputs(channel: ChannelDefinition): UncertainInput[] {
  const { divider, converter, capture, environment, reconstruction } = channel;
  const inputs: UncertainInput[] = [];
  const rect = (key: string, label: string, where: string, unit: string, halfWidth: number, centre = 0): void => {
    inputs.push(uncertainInput({ key, label, where, unit, distribution: 'rectangular', halfWidth, centre }));
  };
  [...divider.top, divider.bottom].forEach((r, i) => {
    const isTop = i < divider.top.length;
    const where = isTop ? `divider.top[${i}]` : 'divider.bottom';
    const name = isTop ? `R${i + 1}` : 'R bottom';
    inputs.push(uncertainInput({
      key: `${where}.tolerance`, label: `${name} tolerance`, where, unit: '1',
      distribution: r.toleranceDistribution, halfWidth: r.tolerancePct / 100, centre: 0,
      coverageFactor: r.toleranceDistribution === 'normal' ? r.toleranceCoverageFactor : 1,
    }));
    rect(`${where}.tcr`, `${name} TCR`, where, '1/K', r.tcrPpmPerK * 1e-6);
    rect(`${where}.voltageCoefficient`, `${name} voltage coefficient`, where, '1/V', r.voltageCoefficientPpmPerV * 1e-6);
  });
  rect('converter.gainError', 'converter gain error', 'converter', '1', converter.gainErrorPct / 100);
  rect('converter.offsetError', 'converter offset error', 'converter', 'Hz', converter.offsetErrorHz);
  rect('converter.gainTempco', 'converter gain tempco', 'converter', '1/K', converter.gainTempcoPpmPerK * 1e-6);
  rect('converter.offsetDrift', 'converter offset drift', 'converter', 'Hz/K', converter.offsetDriftHzPerK);
  rect('converter.nonlinearity', 'converter nonlinearity', 'converter', '1', converter.nonlinearityPctFs / 100);
  rect('converter.inputBiasCurrent', 'converter input bias current', 'converter', 'A', converter.inputBiasCurrentA);
  // Without an input resistance the divider is unloaded and its spread has nothing to act on.
  const loaded = converter.inputResistanceOhm !== undefined;
  rect('converter.inputResistanceTolerance', 'converter input resistance tolerance', 'converter', '1',
    loaded ? (converter.inputResistanceTolerancePct ?? 0) / 100 : 0);
  rect('converter.inputResistanceTempco', 'converter input resistance tempco', 'converter', '1/K',
    loaded ? (converter.inputResistanceTempcoPpmPerK ?? 0) * 1e-6 : 0);
  rect('capture.clockTolerance', 'timer clock tolerance', 'capture', '1', capture.clockTolerancePpm * 1e-6);
  rect('environment.temperature', 'operating temperature', 'environment', '°C', (environment.maxC - environment.minC) / 2, (environment.maxC + environment.minC) / 2);
  const calibrated = reconstruction.mode === 'calibrated';
  const k = calibrated ? reconstruction.coverageFactor : 2;
  inputs.push(uncertainInput({ key: 'reconstruction.calibrationGain', label: 'calibration gain', where: 'reconstruction', unit: '1', distribution: 'normal', halfWidth: calibrated ? reconstruction.gainUncertaintyFraction : 0, centre: 0, coverageFactor: k }));
  inputs.push(uncertainInput({ key: 'reconstruction.calibrationOffset', label: 'calibration offset', where: 'reconstruction', unit: 'V', distribution: 'normal', halfWidth: calibrated ? reconstruction.offsetUncertaintyV : 0, centre: 0, coverageFactor: k }));
  return inputs;
}

/**
 * The per-reading inputs as the GUM and worst case see them: quantisation as an additive
 * count error, triangular ±1 count (floor(n + U) − n with a random fractional part n; u = 1/√6),
 * and the isolator's start and end edge timing, rectangular ±PWD/2 each (period capture only).
 * @param channel fully specified, validated channel
 * @throws never for a validated channel
 * @example readingInputs(channel)[0].halfWidth // 1 count
 */
export function readingInputs(channel: ChannelDefinition): UncertainInput[] {
  const edgeS = channel.capture.method === 'period' && channel.isolator ? channel.isolator.pulseWidthDistortionS / 2 : 0;
  return [
    uncertainInput({ key: 'capture.quantisation', label: 'count quantisation', where: 'capture', unit: 'count', distribution: 'triangular', halfWidth: 1, centre: 0 }),
    uncertainInput({ key: 'isolator.startEdge', label: 'isolator start-edge timing', where: 'isolator', unit: 's', distribution: 'rectangular', halfWidth: edgeS, centre: 0 }),
    uncertainInput({ key: 'isolator.endEdge', label: 'isolator end-edge timing', where: 'isolator', unit: 's', distribution: 'rectangular', halfWidth: edgeS, centre: 0 }),
  ];
}
