/**
 * Parse a value written in engineering notation (4.7k, 4.7 kΩ, 4.7e3, 470 mV,
 * 10 kHz/V) or as an IEC 60062 RKM code (4K7, R47), optionally checking its unit.
 */
import { SI_PREFIX_EXPONENTS, isKnownUnit, isWholeUnit, normaliseUnit } from './si-prefixes.js';
import { isRkmCode, parseRkm } from './rkm-code.js';

/** A parsed value: the number in base units and the unit written after it ('' when none). */
export interface ParsedQuantity {
  value: number;
  unit: string;
}

const NUMBER_PATTERN = /^([+-]?(?:\d+\.?\d*|\.\d+))(?:[eE]([+-]?\d+))?/;
const SPACES = /[\s\u00a0\u202f\u2009]+/gu;

function malformed(text: string): Error {
  return new Error(
    `"${text}" is not a value: expected a number with an optional SI prefix (p n µ m k M G) or an RKM code such as 4K7`,
  );
}

function splitSuffix(suffix: string, text: string): { exponent: number; unit: string } {
  if (suffix === '' || isWholeUnit(suffix)) return { exponent: 0, unit: suffix };
  const prefixExponent = SI_PREFIX_EXPONENTS[suffix[0]];
  const rest = suffix.slice(1);
  if (prefixExponent !== undefined && (rest === '' || isKnownUnit(rest))) {
    return { exponent: prefixExponent, unit: normaliseUnit(rest) };
  }
  if (isKnownUnit(suffix)) return { exponent: 0, unit: normaliseUnit(suffix) };
  throw malformed(text);
}

/**
 * Parse engineering notation or an RKM code into base units and the written unit.
 * The prefix multiplies exactly in decimal: "4.7k" is 4700, not 4.7 × 1000.
 * @param text e.g. '4.7k', '4.7 kΩ', '4.7e3', '470 mV', '10 kHz/V', '4K7', 'R47'
 * @throws Error naming the text and the expected form when it is malformed
 * @example parseQuantity('470 mV') // { value: 0.47, unit: 'V' }
 */
export function parseQuantity(text: string): ParsedQuantity {
  if (typeof text !== 'string') throw new Error('value text must be a string');
  const compact = text.replace(SPACES, ' ').trim();
  if (compact === '') throw new Error('value is empty: expected a number such as 4.7k or an RKM code such as 4K7');
  const rkm = /^(\S+?)(?:\s*(\u03a9|\u2126|ohms?))?$/u.exec(compact);
  if (rkm !== null && isRkmCode(rkm[1])) return { value: parseRkm(rkm[1]), unit: rkm[2] ? 'Ω' : '' };
  const number = NUMBER_PATTERN.exec(compact);
  if (number === null) throw malformed(text);
  const suffix = compact.slice(number[0].length).trim();
  const { exponent, unit } = splitSuffix(suffix, text);
  const value = Number(`${number[1]}e${Number(number[2] ?? 0) + exponent}`);
  if (!Number.isFinite(value)) throw new Error(`"${text}" is out of range`);
  return { value, unit };
}

const DECIMAL_PATTERN = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/**
 * Parse a plain decimal number (digits, an optional point and exponent), as a CSV quantity is written.
 * JavaScript's Number() also reads 0x10, 0b11, 0o17 and Infinity; a stock file means none of them.
 * @param text e.g. '16', '-2.5', '.5', '2e2' (surrounding spaces are ignored)
 * @throws Error naming the text when it is not decimal notation or overflows a double
 * @example parseDecimal('010') // 10
 */
export function parseDecimal(text: string): number {
  const trimmed = typeof text === 'string' ? text.trim() : '';
  if (!DECIMAL_PATTERN.test(trimmed)) throw new Error(`"${text}" is not a decimal number`);
  const value = Number(trimmed);
  if (!Number.isFinite(value)) throw new Error(`"${text}" is out of range`);
  return value;
}

/**
 * Parse a value and require its unit (if written) to be the expected one.
 * @param text e.g. '4.7 kΩ', '4K7', '4.7k'
 * @param expectedUnit unit the field holds, e.g. 'Ω', 'V', 'Hz/V'; '' accepts any unit
 * @returns the value in base units of expectedUnit
 * @throws Error when malformed, or when a different unit is written ('"4.7 kV" is not in Ω')
 * @example parseEngineering('4.7 kΩ', 'Ω') // 4700
 */
export function parseEngineering(text: string, expectedUnit = ''): number {
  const parsed = parseQuantity(text);
  const wanted = normaliseUnit(expectedUnit);
  if (wanted !== '' && parsed.unit !== '' && parsed.unit !== wanted) {
    throw new Error(`"${text}" is not in ${wanted}: it is written in ${parsed.unit}`);
  }
  return parsed.value;
}
