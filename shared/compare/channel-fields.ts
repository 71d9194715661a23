import type { ChannelDefinition, ResistorDefinition } from '../schemas/chain.js';
import type { CompareField } from './compare-types.js';

/** A channel's fields by stage, labelled in the revision editor's words. */
export interface ChannelStageFields {
  stage: string;
  fields: CompareField<ChannelDefinition>[];
}

const f = (label: string, unit: string, read: CompareField<ChannelDefinition>['read']): CompareField<ChannelDefinition> => ({ label, unit, read });

function resistorFields(name: string, pick: (c: ChannelDefinition) => ResistorDefinition | undefined): CompareField<ChannelDefinition>[] {
  const r = (read: (r: ResistorDefinition) => number | string | undefined) => (c: ChannelDefinition) => {
    const part = pick(c);
    return part ? read(part) : undefined;
  };
  return [
    f(`${name} resistance`, 'Ω', r((p) => p.nominalOhm)),
    f(`${name} tolerance`, '%', r((p) => p.tolerancePct)),
    f(`${name} tolerance distribution`, '', r((p) => p.toleranceDistribution)),
    f(`${name} coverage factor k`, '', r((p) => p.toleranceCoverageFactor)),
    f(`${name} TCR`, 'ppm/K', r((p) => p.tcrPpmPerK)),
    f(`${name} voltage coefficient`, 'ppm/V', r((p) => p.voltageCoefficientPpmPerV)),
    f(`${name} rated voltage`, 'V', r((p) => p.ratedVoltageV)),
    f(`${name} rated power`, 'W', r((p) => p.ratedPowerW)),
    f(`${name} thermal resistance`, 'K/W', r((p) => p.thermalResistanceKPerW)),
  ];
}

const iso = (read: (i: NonNullable<ChannelDefinition['isolator']>) => number | string | undefined) => (c: ChannelDefinition) => (c.isolator ? read(c.isolator) : undefined);
const period = (read: (p: Extract<ChannelDefinition['capture'], { method: 'period' }>) => number) => (c: ChannelDefinition) => (c.capture.method === 'period' ? read(c.capture) : undefined);
const calibrated = (read: (r: Extract<ChannelDefinition['reconstruction'], { mode: 'calibrated' }>) => number | undefined) =>
  (c: ChannelDefinition) => (c.reconstruction.mode === 'calibrated' ? read(c.reconstruction) : undefined);

/**
 * Every input of a channel as the revision editor names it, stage by stage; `topResistors` fields for the
 * top string so that two revisions with strings of different lengths line up resistor by resistor.
 * @param topResistors how many top-string resistors to list (the longer of the two strings compared), ≥ 1
 * @throws never
 * @example channelStageFields(4)[1].fields[0].label // 'Top resistor 1 resistance'
 */
export function channelStageFields(topResistors: number): ChannelStageFields[] {
  return [
    { stage: 'Range', fields: [f('Minimum voltage', 'V', (c) => c.rangeV.minV), f('Maximum voltage', 'V', (c) => c.rangeV.maxV)] },
    {
      stage: 'Divider',
      fields: [
        f('Top resistors', '', (c) => c.divider.top.length),
        ...Array.from({ length: topResistors }, (_, i) => resistorFields(`Top resistor ${i + 1}`, (c) => c.divider.top[i])).flat(),
        ...resistorFields('Bottom resistor', (c) => c.divider.bottom),
        f('Derating', '%', (c) => c.divider.deratingFraction * 100),
      ],
    },
    {
      stage: 'V/F converter',
      fields: [
        f('Gain', 'Hz/V', (c) => c.converter.gainHzPerV), f('Offset', 'Hz', (c) => c.converter.offsetHz),
        f('Gain error', '%', (c) => c.converter.gainErrorPct), f('Offset error', 'Hz', (c) => c.converter.offsetErrorHz),
        f('Gain tempco', 'ppm/K', (c) => c.converter.gainTempcoPpmPerK), f('Offset drift', 'Hz/K', (c) => c.converter.offsetDriftHzPerK),
        f('Nonlinearity', '% FS', (c) => c.converter.nonlinearityPctFs), f('Full-scale frequency', 'Hz', (c) => c.converter.fullScaleHz),
        f('Input resistance', 'Ω', (c) => c.converter.inputResistanceOhm),
        f('Input resistance tolerance', '%', (c) => c.converter.inputResistanceTolerancePct),
        f('Input resistance tempco', 'ppm/K', (c) => c.converter.inputResistanceTempcoPpmPerK),
        f('Input bias current', 'A', (c) => c.converter.inputBiasCurrentA),
      ],
    },
    {
      stage: 'Isolator',
      fields: [
        f('An isolator carries the signal', '', (c) => c.isolator !== undefined),
        f('Highest signalling rate', 'Bd', iso((i) => i.maxSignalRateBd)), f('Pulse-width distortion', 's', iso((i) => i.pulseWidthDistortionS)),
        f('Rated working voltage', 'V', iso((i) => i.ratedWorkingVoltageV)), f('Rated insulation test voltage', 'V', iso((i) => i.ratedTestVoltageV)),
        f('Creepage provided', 'mm', iso((i) => i.creepageMm)), f('Clearance provided', 'mm', iso((i) => i.clearanceMm)),
        f('Standard or rules followed', '', iso((i) => i.isolationRule)),
        f('Required creepage', 'mm', iso((i) => i.requiredCreepageMm)), f('Required clearance', 'mm', iso((i) => i.requiredClearanceMm)),
        f('Required insulation test voltage', 'V', iso((i) => i.requiredTestVoltageV)),
      ],
    },
    {
      stage: 'Timer capture',
      fields: [
        f('Method', '', (c) => (c.capture.method === 'period' ? 'period capture' : 'gated count')),
        f('Timer clock', 'Hz', period((p) => p.clockHz)), f('Prescaler', '', period((p) => p.prescaler)), f('Periods averaged', '', period((p) => p.periodsAveraged)),
        f('Gate time', 's', (c) => (c.capture.method === 'gated' ? c.capture.gateS : undefined)),
        f('Counter width', 'bit', (c) => c.capture.counterBits), f('Clock tolerance', 'ppm', (c) => c.capture.clockTolerancePpm),
      ],
    },
    {
      stage: 'Reading back',
      fields: [
        f('Coefficients', '', (c) => (c.reconstruction.mode === 'calibrated' ? 'each board calibrated (two points)' : 'design values')),
        f('Calibration temperature', '°C', calibrated((r) => r.temperatureC)),
        f('Low calibration voltage', 'V', calibrated((r) => r.pointsV?.[0])), f('High calibration voltage', 'V', calibrated((r) => r.pointsV?.[1])),
        f('Calibrated gain uncertainty', '%', calibrated((r) => r.gainUncertaintyFraction * 100)),
        f('Calibrated offset uncertainty', 'V', calibrated((r) => r.offsetUncertaintyV)),
        f('Coverage factor', '', calibrated((r) => r.coverageFactor)),
      ],
    },
    {
      stage: 'Environment',
      fields: [
        f('Lowest temperature', '°C', (c) => c.environment.minC), f('Highest temperature', '°C', (c) => c.environment.maxC),
        f('Reference temperature', '°C', (c) => c.environment.referenceC),
      ],
    },
  ];
}
