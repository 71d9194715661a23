/**
 * Values of an IEC 60063 series across decades, and the nearest series value.
 */
import { E_SERIES_MANTISSAS } from './e-series-tables.js';
import type { ESeriesName } from './e-series-tables.js';

const SERIES_NAMES: readonly ESeriesName[] = Object.freeze(['E3', 'E6', 'E12', 'E24', 'E48', 'E96', 'E192']);
const MAX_DECADES = 30;

/**
 * Names of the series held, coarsest first.
 * @example listESeriesNames() // ['E3', 'E6', 'E12', 'E24', 'E48', 'E96', 'E192']
 */
export function listESeriesNames(): ESeriesName[] {
  return [...SERIES_NAMES];
}

/**
 * Whether a string names a held series (IEC 60063 E3…E192).
 * @param name candidate such as 'E96'
 * @example isESeriesName('E96') // true
 */
export function isESeriesName(name: string): name is ESeriesName {
  return (SERIES_NAMES as readonly string[]).includes(name);
}

/**
 * The mantissas of one decade, ascending in [1, 10) (IEC 60063 table).
 * @param name series name such as 'E24'
 * @throws Error when the name is not E3, E6, E12, E24, E48, E96 or E192
 * @example eSeriesMantissas('E3') // [1, 2.2, 4.7]
 */
export function eSeriesMantissas(name: string): readonly number[] {
  if (!isESeriesName(name)) throw new Error(`series must be one of ${SERIES_NAMES.join(', ')}; got "${name}"`);
  return E_SERIES_MANTISSAS[name];
}

/** mantissa × 10^decade, correctly rounded from its decimal form (4.7 × 10³ is exactly 4700). */
function scale(mantissa: number, decade: number): number {
  return Number(`${mantissa}e${decade}`);
}

/**
 * Every series value v with minValue ≤ v ≤ maxValue, ascending.
 * @param name series name such as 'E96'
 * @param minValue lowest value, > 0 (the unit of the result, e.g. Ω)
 * @param maxValue highest value, ≥ minValue, at most 30 decades above minValue
 * @throws Error on an unknown series or a bad range
 * @example eSeriesValuesInRange('E6', 1000, 4700) // [1000, 1500, 2200, 3300, 4700]
 */
export function eSeriesValuesInRange(name: string, minValue: number, maxValue: number): number[] {
  const mantissas = eSeriesMantissas(name);
  if (!(minValue > 0 && Number.isFinite(minValue))) throw new Error('minValue must be a finite number > 0');
  if (!(maxValue >= minValue && Number.isFinite(maxValue))) throw new Error('maxValue must be finite and ≥ minValue');
  const firstDecade = Math.floor(Math.log10(minValue)) - 1;
  const lastDecade = Math.floor(Math.log10(maxValue)) + 1;
  if (lastDecade - firstDecade > MAX_DECADES) throw new Error(`range must span at most ${MAX_DECADES} decades`);
  const values: number[] = [];
  for (let decade = firstDecade; decade <= lastDecade; decade++) {
    for (const mantissa of mantissas) {
      const value = scale(mantissa, decade);
      if (value >= minValue && value <= maxValue) values.push(value);
    }
  }
  return values;
}

/**
 * The series value closest to a value on a logarithmic scale (smallest |ln(v/value)|),
 * or the nearest at or below / at or above it.
 * @param name series name such as 'E24'
 * @param value target, > 0 (any unit, e.g. Ω)
 * @param direction 'nearest' (default), 'below' (≤ value) or 'above' (≥ value)
 * @throws Error on an unknown series or value ≤ 0
 * @example nearestESeriesValue('E24', 4600) // 4700
 */
export function nearestESeriesValue(
  name: string,
  value: number,
  direction: 'nearest' | 'below' | 'above' = 'nearest',
): number {
  eSeriesMantissas(name);
  if (!(value > 0 && Number.isFinite(value))) throw new Error('value must be a finite number > 0');
  const decade = Math.floor(Math.log10(value));
  const around = eSeriesValuesInRange(name, scale(1, decade - 1), scale(1, decade + 2));
  let below = around[0];
  let above = around[around.length - 1];
  for (const candidate of around) {
    if (candidate <= value) below = candidate;
    if (candidate >= value) {
      above = candidate;
      break;
    }
  }
  if (direction === 'below') return below;
  if (direction === 'above') return above;
  return Math.log(value / below) <= Math.log(above / value) ? below : above;
}
