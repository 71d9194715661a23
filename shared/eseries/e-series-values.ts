/**
 * Values of a preferred-value series across decades, and the nearest series value.
 * The series itself (one decade of values in [1, 10)) is passed in: the stored series are the one source.
 */

const MAX_DECADES = 30;

/**
 * Checks one decade of series values: at least one, each finite with 1 ≤ v < 10, strictly ascending.
 * @param decadeValues values of one decade, e.g. the stored E6 [1, 1.5, 2.2, 3.3, 4.7, 6.8]
 * @throws Error naming the first bad value
 * @example checkDecadeValues([1, 2.2, 4.7]) // no throw
 */
export function checkDecadeValues(decadeValues: readonly number[]): void {
  if (!Array.isArray(decadeValues) || decadeValues.length === 0) throw new Error('series values must hold at least one value');
  decadeValues.forEach((value, i) => {
    if (!(Number.isFinite(value) && value >= 1 && value < 10)) throw new Error(`series value ${value} must be ≥ 1 and < 10`);
    if (i > 0 && !(value > decadeValues[i - 1])) throw new Error('series values must be strictly ascending');
  });
}

/** mantissa × 10^decade, correctly rounded from its decimal form (4.7 × 10³ is exactly 4700). */
function scale(mantissa: number, decade: number): number {
  return Number(`${mantissa}e${decade}`);
}

/**
 * Every series value v with minValue ≤ v ≤ maxValue, ascending (each decade value × 10^k).
 * @param decadeValues one decade of the series, ascending in [1, 10)
 * @param minValue lowest value, > 0 (the unit of the result, e.g. Ω)
 * @param maxValue highest value, ≥ minValue, at most 30 decades above minValue
 * @throws Error on bad series values or a bad range
 * @example decadeValuesInRange([1, 1.5, 2.2, 3.3, 4.7, 6.8], 1000, 4700) // [1000, 1500, 2200, 3300, 4700]
 */
export function decadeValuesInRange(decadeValues: readonly number[], minValue: number, maxValue: number): number[] {
  checkDecadeValues(decadeValues);
  if (!(minValue > 0 && Number.isFinite(minValue))) throw new Error('minValue must be a finite number > 0');
  if (!(maxValue >= minValue && Number.isFinite(maxValue))) throw new Error('maxValue must be finite and ≥ minValue');
  const firstDecade = Math.floor(Math.log10(minValue)) - 1;
  const lastDecade = Math.floor(Math.log10(maxValue)) + 1;
  if (lastDecade - firstDecade > MAX_DECADES) throw new Error(`range must span at most ${MAX_DECADES} decades`);
  const values: number[] = [];
  for (let decade = firstDecade; decade <= lastDecade; decade++) {
    for (const mantissa of decadeValues) {
      const value = scale(mantissa, decade);
      if (value >= minValue && value <= maxValue) values.push(value);
    }
  }
  return values;
}

/**
 * The series value closest to a value on a logarithmic scale (smallest |ln(v/value)|),
 * or the nearest at or below / at or above it.
 * @param decadeValues one decade of the series, ascending in [1, 10)
 * @param value target, > 0 (any unit, e.g. Ω)
 * @param direction 'nearest' (default), 'below' (≤ value) or 'above' (≥ value)
 * @throws Error on bad series values or value ≤ 0
 * @example nearestDecadeValue(e24Values, 4600) // 4700
 */
export function nearestDecadeValue(
  decadeValues: readonly number[],
  value: number,
  direction: 'nearest' | 'below' | 'above' = 'nearest',
): number {
  checkDecadeValues(decadeValues);
  if (!(value > 0 && Number.isFinite(value))) throw new Error('value must be a finite number > 0');
  const decade = Math.floor(Math.log10(value));
  const around = decadeValuesInRange(decadeValues, scale(1, decade - 1), scale(1, decade + 2));
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
