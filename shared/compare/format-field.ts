import { formatEng } from '../units/format-engineering.js';
import type { FieldValue } from './compare-types.js';

/** Units that take SI prefixes; the others (%, ppm/K, °C, mm, bit) are printed plainly. */
const SI_UNITS = new Set(['Ω', 'V', 'Hz', 'Hz/V', 'A', 's', 'W', 'Bd', 'F']);

/**
 * A compared value as the page prints it: six significant digits so that any input change shows,
 * with its unit ('1 MΩ', '0.5 %', 'yes'); null for a value that side does not have.
 * @param value number in the unit's base (Ω, V, s…), a word, a yes/no, or absent
 * @param unit unit symbol, '' for none
 * @throws Error for a number that is not finite
 * @example formatField(4700, 'Ω') // '4.7 kΩ'
 */
export function formatField(value: FieldValue, unit: string): string | null {
  if (value === undefined || value === null) return null;
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'string') return value;
  if (SI_UNITS.has(unit)) return formatEng(value, unit, 6);
  const plain = String(Number(value.toPrecision(6)));
  return unit ? `${plain} ${unit}` : plain;
}
