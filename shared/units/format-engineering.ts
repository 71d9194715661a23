/**
 * Format a number in engineering notation: a mantissa in [1, 1000) and an SI
 * prefix whose exponent is a multiple of 3 (4700 Ω → "4.7 kΩ").
 */
import { SI_PREFIX_FOR_EXPONENT } from './si-prefixes.js';

/** Options for formatEng. */
export interface FormatEngOptions {
  /** keep trailing zeros to show the digits' precision ("4.70 kΩ"); default false */
  keepTrailingZeros?: boolean;
}

/**
 * Engineering notation with an SI prefix from f to P (SI Brochure Table 7), rounded to
 * significant digits by the decimal rounding of toExponential.
 * @param value the number in base units of `unit`, finite
 * @param unit unit symbol printed after the prefix, e.g. 'Ω', 'Hz/V'; '' prints e.g. "4.7k"
 * @param significantDigits 1…17, default 3
 * @throws Error when value is not finite or significantDigits is out of range
 * @example formatEng(4700, 'Ω') // '4.7 kΩ'
 */
export function formatEng(value: number, unit = '', significantDigits = 3, options: FormatEngOptions = {}): string {
  if (!Number.isFinite(value)) throw new Error('value must be a finite number');
  if (!Number.isInteger(significantDigits) || significantDigits < 1 || significantDigits > 17) {
    throw new Error('significantDigits must be an integer from 1 to 17');
  }
  const separator = unit === '' ? '' : ' ';
  if (value === 0) return `0${separator}${unit}`;
  const [mantissaText, exponentText] = Math.abs(value).toExponential(significantDigits - 1).split('e');
  const decimalExponent = Number(exponentText);
  const prefixExponent = Math.min(15, Math.max(-15, Math.floor(decimalExponent / 3) * 3));
  const digits = mantissaText.replace('.', '');
  const integerCount = decimalExponent - prefixExponent + 1;
  let integerPart: string;
  let fractionPart: string;
  if (integerCount <= 0) {
    integerPart = '0';
    fractionPart = '0'.repeat(-integerCount) + digits;
  } else {
    const padded = digits.padEnd(integerCount, '0');
    integerPart = padded.slice(0, integerCount);
    fractionPart = padded.slice(integerCount);
  }
  if (!options.keepTrailingZeros) fractionPart = fractionPart.replace(/0+$/, '');
  const sign = value < 0 ? '-' : '';
  const number = fractionPart === '' ? integerPart : `${integerPart}.${fractionPart}`;
  return `${sign}${number}${separator}${SI_PREFIX_FOR_EXPONENT[prefixExponent]}${unit}`;
}
