import type { ChannelDefinitionInput } from '../../../shared/schemas/chain.js';

/**
 * The chain a new design starts from: a four-resistor 1 MΩ top string and an E96 bottom resistor into a
 * 10 kHz/V converter read by period capture. Plausible bench numbers, meant to be edited.
 */
function templateChannel(name: string): ChannelDefinitionInput {
  const top = { nominalOhm: 1e6, tolerancePct: 0.5, tcrPpmPerK: 50, voltageCoefficientPpmPerV: 1, ratedVoltageV: 200, ratedPowerW: 0.25 };
  return {
    name,
    rangeV: { minV: 0, maxV: 500 },
    divider: {
      top: [top, top, top, top],
      bottom: { nominalOhm: 32.4e3, tolerancePct: 0.1, tcrPpmPerK: 25, ratedVoltageV: 75, ratedPowerW: 0.1 },
      deratingFraction: 0.8,
    },
    converter: {
      gainHzPerV: 10e3, offsetHz: 500, gainErrorPct: 1, offsetErrorHz: 50, gainTempcoPpmPerK: 50,
      offsetDriftHzPerK: 1, nonlinearityPctFs: 0.05, fullScaleHz: 100e3, inputResistanceOhm: 10e6,
    },
    isolator: { maxSignalRateBd: 1e6, pulseWidthDistortionS: 20e-9 },
    capture: { method: 'period', clockHz: 80e6, prescaler: 1, periodsAveraged: 16, counterBits: 32, clockTolerancePpm: 50 },
    reconstruction: { mode: 'nominal' },
    environment: { minC: -20, maxC: 60, referenceC: 25 },
  };
}

export const TEMPLATE_CHANNELS: { key: string; definition: ChannelDefinitionInput }[] = [
  { key: 'pack', definition: templateChannel('Pack side') },
  { key: 'link', definition: templateChannel('Link side') },
];
