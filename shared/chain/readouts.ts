import { countsPerReading, frequencyResolutionHz, nominalFrequencyHz, readingTimeS } from './capture.js';
import { dividerNominal, resistorStresses, type ResistorStress } from './divider.js';
import { evaluationGrid } from './grid.js';
import type { ChainWarning, ChannelDefinition } from './types.js';
import { assertChannel } from './validate.js';
import { chainWarnings, rangeUseFraction } from './warnings.js';

/** Nominal numbers at one evaluation voltage. */
export interface GridReadout {
  voltageV: number;
  frequencyHz: number;
  countsPerReading: number;
  /** Resolution: volts per count. */
  voltsPerCount: number;
  readingTimeS: number;
}

/** What a form shows live beside a channel's inputs. */
export interface NominalReadouts {
  ratio: number;
  theveninOhm: number;
  fullScaleFrequencyHz: number;
  /** Share of the converter's input span used at the range maximum (1 = full scale, > 1 clips); null when f_FS ≤ f₀. */
  rangeUseFraction: number | null;
  /** Bleed current at the range maximum, A. */
  bleedCurrentA: number;
  /** Per resistor at the range maximum. */
  stresses: ResistorStress[];
  grid: GridReadout[];
  /** Longest reading time over the range, s. */
  slowestReadingS: number;
  warnings: ChainWarning[];
}

/**
 * Cheap nominal readouts of a channel (no simulation): ratio, frequency at full range, counts
 * and volts per count on a grid, reading time, resistor stresses, bleed current and warnings.
 * @param channel fully specified channel
 * @param gridPoints number of evaluation voltages across the range, integer ≥ 2 (default 5)
 * @throws Error naming the first bad input (see assertChannel)
 * @example nominalReadouts(channel).grid[4].voltsPerCount
 */
export function nominalReadouts(channel: ChannelDefinition, gridPoints = 5): NominalReadouts {
  assertChannel(channel);
  const { divider, converter, capture, rangeV } = channel;
  const nominal = dividerNominal(divider, converter.inputResistanceOhm);
  const voltsPerHz = 1 / (converter.gainHzPerV * nominal.ratio);
  const grid = Array.from(evaluationGrid(rangeV, gridPoints), (voltageV) => {
    const frequencyHz = nominalFrequencyHz(converter, nominal.ratio, voltageV);
    if (!(frequencyHz > 0)) {
      if (capture.method === 'period') throw new Error('frequency at the range minimum must be > 0 Hz for period capture');
      return { voltageV, frequencyHz, countsPerReading: 0, voltsPerCount: voltsPerHz / capture.gateS, readingTimeS: capture.gateS };
    }
    return {
      voltageV,
      frequencyHz,
      countsPerReading: countsPerReading(capture, frequencyHz),
      voltsPerCount: frequencyResolutionHz(capture, frequencyHz) * voltsPerHz,
      readingTimeS: readingTimeS(capture, frequencyHz),
    };
  });
  return {
    ratio: nominal.ratio,
    theveninOhm: nominal.theveninOhm,
    fullScaleFrequencyHz: nominalFrequencyHz(converter, nominal.ratio, rangeV.maxV),
    rangeUseFraction: rangeUseFraction(nominalFrequencyHz(converter, nominal.ratio, rangeV.maxV), converter),
    bleedCurrentA: rangeV.maxV * nominal.bleedAPerV,
    stresses: resistorStresses(divider, rangeV.maxV, converter.inputResistanceOhm),
    grid,
    slowestReadingS: Math.max(...grid.map((g) => g.readingTimeS)),
    warnings: chainWarnings(channel, grid),
  };
}
