/**
 * SI prefixes (SI Brochure, 9th ed., Table 7) used in engineering notation,
 * and the unit spellings we accept for the same unit.
 */

/** Prefix symbol → power of ten. Both µ (U+00B5), μ (U+03BC) and u mean micro; K is accepted for kilo. */
export const SI_PREFIX_EXPONENTS: Readonly<Record<string, number>> = Object.freeze({
  f: -15,
  p: -12,
  n: -9,
  u: -6,
  '\u00b5': -6,
  '\u03bc': -6,
  m: -3,
  k: 3,
  K: 3,
  M: 6,
  G: 9,
  T: 12,
  P: 15,
});

/** Power of ten (multiple of 3) → the prefix we print. */
export const SI_PREFIX_FOR_EXPONENT: Readonly<Record<number, string>> = Object.freeze({
  [-15]: 'f',
  [-12]: 'p',
  [-9]: 'n',
  [-6]: '\u00b5',
  [-3]: 'm',
  0: '',
  3: 'k',
  6: 'M',
  9: 'G',
  12: 'T',
  15: 'P',
});

const UNIT_ALIASES: Readonly<Record<string, string>> = Object.freeze({
  ohm: 'Ω',
  ohms: 'Ω',
  Ohm: 'Ω',
  Ohms: 'Ω',
  '\u2126': 'Ω', // OHM SIGN → GREEK CAPITAL OMEGA
  hz: 'Hz',
  HZ: 'Hz',
  sec: 's',
});

/** Units that start with a prefix letter but are whole units, so "50 ppm" is not 50 p·"pm". */
const WHOLE_UNITS: ReadonlySet<string> = new Set(['ppm', 'ppm/K', 'ppm/V', 'mol', 'min', 'Pa']);

/**
 * The canonical spelling of a unit ('ohm', 'Ω' (U+2126) → 'Ω'); other units unchanged.
 * @param unit unit text, e.g. 'kHz/V' without its prefix
 * @example normaliseUnit('ohms') // 'Ω'
 */
export function normaliseUnit(unit: string): string {
  return UNIT_ALIASES[unit] ?? unit;
}

/** Unit symbols a value may carry; compounds join them with '/' (Hz/V, ppm/K). */
const BASE_UNITS: ReadonlySet<string> = new Set([
  '\u03a9', 'V', 'A', 'W', 'Hz', 'F', 'H', 's', 'S', 'C', 'J', 'K', '°C', '%', 'ppm', 'dB', 'bit', 'LSB', 'counts',
]);

/**
 * Whether text is a unit we know: a base symbol or base symbols joined by '/' (after aliases).
 * @param unit unit text without prefix, e.g. 'Hz/V', 'ohm'
 * @example isKnownUnit('Hz/V') // true
 */
export function isKnownUnit(unit: string): boolean {
  const parts = normaliseUnit(unit).split('/');
  return parts.every((part) => BASE_UNITS.has(normaliseUnit(part)));
}

/**
 * Whether a suffix is a whole unit that must not be split into prefix + unit.
 * @param suffix text after the number, e.g. 'ppm'
 * @example isWholeUnit('ppm') // true
 */
export function isWholeUnit(suffix: string): boolean {
  return WHOLE_UNITS.has(suffix);
}
