/**
 * IEC 60062 RKM codes: the multiplier letter stands where the decimal point
 * would be (4K7 = 4.7 kΩ, R47 = 0.47 Ω, 1M0 = 1 MΩ, 4n7 = 4.7 n).
 */

/** RKM letter → power of ten (R for resistance units; p n µ m for small values). */
const RKM_EXPONENTS: Readonly<Record<string, number>> = Object.freeze({
  p: -12,
  n: -9,
  u: -6,
  '\u00b5': -6,
  '\u03bc': -6,
  m: -3,
  R: 0,
  r: 0,
  K: 3,
  k: 3,
  M: 6,
  G: 9,
  T: 12,
});

const RKM_PATTERN = /^(\d*)([pnuµμmRrKkMGT])(\d*)$/u;

/**
 * Whether text has the shape of an RKM code (digits, one multiplier letter, digits).
 * @param text candidate such as '4K7'
 * @example isRkmCode('4K7') // true
 */
export function isRkmCode(text: string): boolean {
  const match = RKM_PATTERN.exec(text.trim());
  return match !== null && match[1].length + match[3].length > 0;
}

/**
 * The value of an RKM code (IEC 60062 §4): digits before the letter are the
 * integer part, digits after it the fraction, the letter the multiplier.
 * @param code such as '4K7', 'R47', '4R7', '1M0', '470R', '2M2'
 * @returns the value in base units (Ω for resistor codes), exact to the decimal
 * @throws Error when the code is not digits–letter–digits with at least one digit
 * @example parseRkm('4K7') // 4700
 */
export function parseRkm(code: string): number {
  const match = RKM_PATTERN.exec(code.trim());
  if (match === null || match[1].length + match[3].length === 0) {
    throw new Error(`"${code}" is not an RKM code: expected digits around one letter of R K M G T (or p n µ m), such as 4K7 or R47`);
  }
  const [, whole, letter, fraction] = match;
  return Number(`${whole || '0'}.${fraction || '0'}e${RKM_EXPONENTS[letter]}`);
}

const FORMAT_LETTERS: readonly [number, string][] = [
  [12, 'T'],
  [9, 'G'],
  [6, 'M'],
  [3, 'K'],
  [0, 'R'],
];

/**
 * The RKM code of a resistance, with at least two significant digits (1 kΩ → 1K0, 10 kΩ → 10K).
 * @param ohms resistance in Ω, > 0 and < 1000 TΩ
 * @param significantDigits digits kept, 2…6 (default 3); trailing zeros beyond two are dropped
 * @throws Error when ohms is not a finite number > 0 or significantDigits is out of range
 * @example formatRkm(4700) // '4K7'
 */
export function formatRkm(ohms: number, significantDigits = 3): string {
  if (!(ohms > 0 && Number.isFinite(ohms))) throw new Error('ohms must be a finite number > 0');
  if (!Number.isInteger(significantDigits) || significantDigits < 2 || significantDigits > 6) {
    throw new Error('significantDigits must be an integer from 2 to 6');
  }
  const [mantissaText, exponentText] = ohms.toExponential(significantDigits - 1).split('e');
  const decimalExponent = Number(exponentText);
  let digits = mantissaText.replace('.', '');
  while (digits.length > 2 && digits.endsWith('0')) digits = digits.slice(0, -1);
  const entry = FORMAT_LETTERS.find(([power]) => decimalExponent >= power);
  if (entry === undefined) return `R${'0'.repeat(-decimalExponent - 1)}${digits}`;
  const [power, letter] = entry;
  if (decimalExponent - power > 2) throw new Error('ohms must be below 1000 TΩ for an RKM code');
  const integerDigits = decimalExponent - power + 1;
  const padded = digits.padEnd(integerDigits, '0');
  return `${padded.slice(0, integerDigits)}${letter}${padded.slice(integerDigits)}`;
}
