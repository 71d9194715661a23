/**
 * Units of derived quantities, such as a sensitivity coefficient c = ∂y/∂x whose unit is [y]/[x]
 * (JCGM 100:2008 5.1.3). Units are products of symbols with integer exponents; a temperature in °C enters as
 * a difference, in K, so that K·K⁻¹ cancels.
 */

type Powers = Map<string, number>;

const SUPERSCRIPT: Record<string, string> = { '-': '⁻', 0: '⁰', 1: '¹', 2: '²', 3: '³', 4: '⁴', 5: '⁵', 6: '⁶', 7: '⁷', 8: '⁸', 9: '⁹' };
const superscript = (n: number) => [...String(n)].map((ch) => SUPERSCRIPT[ch]).join('');
/** Symbols that stand for a difference of another: a change of 1 °C is a change of 1 K. */
const AS_DIFFERENCE: Record<string, string> = { '°C': 'K' };

function addTerm(into: Powers, term: string, sign: number): void {
  const match = /^(.+?)(?:\^?(-?\d+)|([⁻]?[⁰¹²³⁴⁵⁶⁷⁸⁹]+))?$/u.exec(term);
  if (!match || /[\^\d]/u.test(match[1])) throw new Error(`unit term "${term}" is not a symbol with an optional power`);
  let power = 1;
  if (match[2]) power = Number(match[2]);
  else if (match[3]) power = Number([...match[3]].map((ch) => Object.keys(SUPERSCRIPT).find((k) => SUPERSCRIPT[k] === ch)).join(''));
  const symbol = AS_DIFFERENCE[match[1]] ?? match[1];
  into.set(symbol, (into.get(symbol) ?? 0) + sign * power);
}

/** 'V', 'Hz/K', '1/K', 'V·K/Hz', 'V/(Hz·K)', '1' as symbol powers; '' and '1' are dimensionless. */
function parseUnit(unit: string): Powers {
  const powers: Powers = new Map();
  const [numerator, ...denominators] = unit.trim().split('/');
  const terms = (text: string) => text.replace(/^\((.*)\)$/u, '$1').split(/[·*]/u).map((t) => t.trim()).filter((t) => t !== '' && t !== '1');
  for (const t of terms(numerator ?? '')) addTerm(powers, t, 1);
  for (const d of denominators) for (const t of terms(d)) addTerm(powers, t, -1);
  return powers;
}

function formatPowers(powers: Powers): string {
  const term = (symbol: string, power: number) => (power === 1 ? symbol : `${symbol}${superscript(power)}`);
  const entries = [...powers].filter(([, p]) => p !== 0);
  const up = entries.filter(([, p]) => p > 0).map(([s, p]) => term(s, p));
  const down = entries.filter(([, p]) => p < 0).map(([s, p]) => term(s, -p));
  if (up.length === 0 && down.length === 0) return '1';
  if (down.length === 0) return up.join('·');
  if (up.length === 0) return entries.map(([s, p]) => term(s, p)).join('·');
  return `${up.join('·')}/${down.length > 1 ? `(${down.join('·')})` : down[0]}`;
}

/**
 * The unit of a quotient: [numerator] / ([d₁]·[d₂]·…), symbols kept as given (no SI reduction), equal symbols
 * combined, °C read as K. Used for sensitivity coefficients: output unit over input unit.
 * @param numerator e.g. 'V'
 * @param denominators one or more units, e.g. 'Hz/K'; '1' or '' for dimensionless
 * @returns e.g. 'V·K/Hz'; '1' when everything cancels; negative powers only when nothing is left above
 * @throws Error when a unit term cannot be read
 * @example divideUnits('V', 'Hz/K') // 'V·K/Hz'
 * @example divideUnits('V', '1/V') // 'V²'
 */
export function divideUnits(numerator: string, ...denominators: string[]): string {
  const powers = parseUnit(numerator);
  for (const d of denominators) {
    for (const [symbol, power] of parseUnit(d)) powers.set(symbol, (powers.get(symbol) ?? 0) - power);
  }
  return formatPowers(powers);
}

/**
 * The unit of a sensitivity coefficient ∂(output)/∂(input) (JCGM 100:2008 5.1.3).
 * @example sensitivityUnit('V', '°C') // 'V/K'
 */
export const sensitivityUnit = (outputUnit: string, ...inputUnits: string[]): string => divideUnits(outputUnit, ...inputUnits);
