import { resistorStresses } from './divider.js';
import type { ChainWarning, ChannelDefinition } from './types.js';

/** Fewer counts than this per reading earns a `few-counts` warning (1 count > 0.1 %). */
export const MIN_COUNTS_PER_READING = 1000;

/**
 * Design warnings from nominal values at the range ends: resistor voltage/power above rating
 * or above the derating fraction, converter over full scale, isolator signalling rate
 * (2 transitions per period, 2f Bd), counter overflow (period capture at the lowest frequency,
 * gated count at the highest) and few counts per reading at the range maximum.
 * @param channel fully specified, already validated channel
 * @param grid nominal frequency and counts per evaluation voltage (from nominalReadouts)
 * @throws never for a validated channel
 * @example chainWarnings(channel, readouts.grid).map((w) => w.code)
 */
export function chainWarnings(
  channel: ChannelDefinition,
  grid: readonly { voltageV: number; frequencyHz: number; countsPerReading: number }[],
): ChainWarning[] {
  const warnings: ChainWarning[] = [];
  const { divider, converter, isolator, capture } = channel;
  const parts = [...divider.top, divider.bottom];
  resistorStresses(divider, channel.rangeV.maxV, converter.inputResistanceOhm).forEach((stress, i) => {
    const part = parts[i];
    const name = i < divider.top.length ? `top resistor ${i + 1}` : 'bottom resistor';
    const check = (value: number, rating: number | undefined, unit: string, kind: 'voltage' | 'power'): void => {
      if (rating === undefined) return;
      if (value > rating) {
        warnings.push({ code: `over-${kind}-rating`, message: `${name} ${kind} ${value.toPrecision(3)} ${unit} exceeds its rating ${rating} ${unit}`, where: stress.where });
      } else if (value > divider.deratingFraction * rating) {
        warnings.push({ code: `over-${kind}-derating`, message: `${name} ${kind} ${value.toPrecision(3)} ${unit} exceeds ${divider.deratingFraction * 100} % of its rating`, where: stress.where });
      }
    };
    check(stress.voltageV, part.ratedVoltageV, 'V', 'voltage');
    check(stress.powerW, part.ratedPowerW, 'W', 'power');
  });
  const highest = grid[grid.length - 1];
  const lowest = grid[0];
  if (highest.frequencyHz > converter.fullScaleHz) {
    warnings.push({ code: 'converter-over-range', message: `${highest.frequencyHz.toPrecision(4)} Hz at the range maximum exceeds full scale ${converter.fullScaleHz} Hz`, where: 'converter.fullScaleHz' });
  }
  if (isolator && 2 * highest.frequencyHz > isolator.maxSignalRateBd) {
    warnings.push({ code: 'isolator-rate-exceeded', message: `${(2 * highest.frequencyHz).toPrecision(4)} Bd needed exceeds the isolator's ${isolator.maxSignalRateBd} Bd`, where: 'isolator.maxSignalRateBd' });
  }
  const counterMax = 2 ** capture.counterBits - 1;
  const worst = capture.method === 'period' ? lowest : highest;
  if (worst.countsPerReading > counterMax) {
    warnings.push({ code: 'counter-overflow', message: `${Math.ceil(worst.countsPerReading)} counts at ${worst.voltageV} V overflow a ${capture.counterBits}-bit counter`, where: 'capture.counterBits' });
  }
  if (highest.countsPerReading < MIN_COUNTS_PER_READING) {
    warnings.push({ code: 'few-counts', message: `only ${Math.floor(highest.countsPerReading)} counts per reading at the range maximum`, where: capture.method === 'period' ? 'capture.periodsAveraged' : 'capture.gateS' });
  }
  return warnings;
}
