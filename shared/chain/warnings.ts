import { resistorStresses } from './divider.js';
import { isolationWarnings } from './isolation.js';
import type { ChainWarning, ChannelDefinition } from './types.js';

/** Fewer counts than this per reading earns a `few-counts` warning (1 count > 0.1 %). */
export const MIN_COUNTS_PER_READING = 1000;

/**
 * Below this share of the converter's input span at the range maximum, a `converter-range-unused`
 * warning: more than half the span (and so of the counts it could give) is never used.
 */
export const MIN_RANGE_USE_FRACTION = 0.5;

/**
 * Share of the converter's input span used at the channel's maximum: (f(Vmax) − f₀)/(f_FS − f₀), which
 * equals the converter input r·Vmax over its full-scale input (f_FS − f₀)/G for a linear converter.
 * @param frequencyAtMaxHz nominal converter output at the range maximum, Hz
 * @param converter offset f₀ and full-scale frequency f_FS, Hz
 * @returns the fraction (1 = full scale; above 1 clips), or null when f_FS ≤ f₀ (no input span to share)
 * @throws never
 * @example rangeUseFraction(6e3, { offsetHz: 1e3, fullScaleHz: 11e3 }) // 0.5
 */
export function rangeUseFraction(frequencyAtMaxHz: number, converter: { offsetHz: number; fullScaleHz: number }): number | null {
  const spanHz = converter.fullScaleHz - converter.offsetHz;
  return spanHz > 0 ? (frequencyAtMaxHz - converter.offsetHz) / spanHz : null;
}

/** Three significant digits without trailing zeros: 0.99, 990, 1.23e+6. */
const short = (value: number): string => String(Number(value.toPrecision(3)));
/** A grid voltage as entered or divided: up to six significant digits. */
const volts = (value: number): string => `${Number(value.toPrecision(6))} V`;

/**
 * Design warnings from nominal values: resistor voltage/power above rating or above the
 * derating fraction at the range maximum, or a rating not entered (level 'info': the check could
 * not be made), converter over full scale (clipping) or using under MIN_RANGE_USE_FRACTION of it, isolator signalling rate (2 transitions per period,
 * 2f Bd), counter overflow at every grid voltage whose nominal count passes 2^bits − 1 (the
 * counter reads it modulo 2^bits) and few counts per reading at the range maximum.
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
  const maxV = channel.rangeV.maxV;
  resistorStresses(divider, maxV, converter.inputResistanceOhm).forEach((stress, i) => {
    const part = parts[i];
    const name = i < divider.top.length ? `top resistor ${i + 1}` : 'bottom resistor';
    const check = (value: number, rating: number | undefined, unit: string, kind: 'voltage' | 'power'): void => {
      if (rating === undefined) return;
      if (value > rating) {
        warnings.push({ code: `over-${kind}-rating`, level: 'warning', message: `${name} ${kind} ${value.toPrecision(3)} ${unit} exceeds its rating ${rating} ${unit}`, where: stress.where });
      } else if (value > divider.deratingFraction * rating) {
        warnings.push({ code: `over-${kind}-derating`, level: 'warning', message: `${name} ${kind} ${value.toPrecision(3)} ${unit} exceeds ${divider.deratingFraction * 100} % of its rating`, where: stress.where });
      }
    };
    check(stress.voltageV, part.ratedVoltageV, 'V', 'voltage');
    check(stress.powerW, part.ratedPowerW, 'W', 'power');
    const noVoltage = part.ratedVoltageV === undefined;
    const noPower = part.ratedPowerW === undefined;
    if (noVoltage || noPower) {
      const what = noVoltage && noPower ? 'voltage and power ratings' : noVoltage ? 'voltage rating' : 'power rating';
      const seen = [noVoltage && `${short(stress.voltageV)} V across it`, noPower && `dissipates ${short(stress.powerW)} W`].filter(Boolean).join(', ');
      warnings.push({ code: 'rating-missing', level: 'info', message: `${name} ${what} not entered: stress not checked (${seen} at ${volts(maxV)})`, where: stress.where });
    }
  });
  const highest = grid[grid.length - 1];
  if (highest.frequencyHz > converter.fullScaleHz) {
    warnings.push({ code: 'converter-over-range', level: 'warning', message: `${highest.frequencyHz.toPrecision(4)} Hz at the range maximum exceeds full scale ${converter.fullScaleHz} Hz`, where: 'converter.fullScaleHz' });
  }
  const share = rangeUseFraction(highest.frequencyHz, converter);
  if (share !== null && share < MIN_RANGE_USE_FRACTION) {
    warnings.push({
      code: 'converter-range-unused', level: 'warning', where: 'converter.fullScaleHz',
      message: `converter input at the range maximum uses only ${short(100 * share)} % of its full scale (below ${MIN_RANGE_USE_FRACTION * 100} %): resolution is thrown away`,
    });
  }
  if (isolator && 2 * highest.frequencyHz > isolator.maxSignalRateBd) {
    warnings.push({ code: 'isolator-rate-exceeded', level: 'warning', message: `${(2 * highest.frequencyHz).toPrecision(4)} Bd needed exceeds the isolator's ${isolator.maxSignalRateBd} Bd`, where: 'isolator.maxSignalRateBd' });
  }
  warnings.push(...isolationWarnings(channel));
  const modulus = 2 ** capture.counterBits;
  const over = grid.filter((g) => g.countsPerReading > modulus - 1);
  if (over.length) {
    const worst = over.reduce((a, b) => (b.countsPerReading > a.countsPerReading ? b : a));
    const counts = Math.floor(worst.countsPerReading);
    warnings.push({
      code: 'counter-overflow', level: 'warning', where: 'capture.counterBits',
      message: `counter overflows at ${over.map((g) => volts(g.voltageV)).join(', ')}: ${counts} counts at ${volts(worst.voltageV)}`
        + ` pass a ${capture.counterBits}-bit counter, which reads ${counts % modulus}; the studies include the wrap`,
    });
  }
  if (highest.countsPerReading < MIN_COUNTS_PER_READING) {
    warnings.push({ code: 'few-counts', level: 'warning', message: `only ${Math.floor(highest.countsPerReading)} counts per reading at the range maximum`, where: capture.method === 'period' ? 'capture.periodsAveraged' : 'capture.gateS' });
  }
  return warnings;
}
