import { describe, expect, it } from 'vitest';
import { checkDecadeValues, decadeValuesInRange, nearestDecadeValue } from '../../../shared/eseries/index.js';
import { eSeriesFixture as iec } from '../../helpers/stored-series.js';

const deepFrozen = (values: number[]) => Object.freeze([...values]);

describe('series values across decades', () => {
  it('lists exact values in a range, both ends included', () => {
    expect(decadeValuesInRange(iec.E6, 1000, 4700)).toEqual([1000, 1500, 2200, 3300, 4700]); // IEC 60063 E6 (tests/fixtures/e-series.json)
    expect(decadeValuesInRange(iec.E3, 0.1, 10)).toEqual([0.1, 0.22, 0.47, 1, 2.2, 4.7, 10]); // IEC 60063 E3 (tests/fixtures/e-series.json)
    expect(decadeValuesInRange(iec.E96, 16e3, 16.5e3)).toEqual([16200, 16500]); // IEC 60063 E96 has 1.62 and 1.65 (tests/fixtures/e-series.json)
  });

  it('gives 192 values per decade for E192, 9.20 among them', () => {
    expect(decadeValuesInRange(iec.E192, 1e3, 9.99e3)).toHaveLength(192); // IEC 60063: E192 has 192 values per decade
    expect(decadeValuesInRange(iec.E192, 1e3, 9.99e3)).toContain(9200); // IEC 60063 E192 (tests/fixtures/e-series.json)
  });

  it('takes a team series the same way as a standard one', () => {
    expect(decadeValuesInRange([1, 2, 5], 1, 100)).toEqual([1, 2, 5, 10, 20, 50, 100]); // 1-2-5 decade steps, by hand
  });

  it('returns a single value or none for a narrow range', () => {
    expect(decadeValuesInRange(iec.E12, 4700, 4700)).toEqual([4700]); // IEC 60063 E12 has 4.7
    expect(decadeValuesInRange(iec.E12, 4800, 5500)).toEqual([]); // IEC 60063 E12: 4.7 then 5.6
  });

  it('does not change the values it is given', () => {
    const values = deepFrozen(iec.E24);
    expect(() => decadeValuesInRange(values, 1, 1e6)).not.toThrow();
    expect(values).toEqual(iec.E24);
  });

  it('rejects bad ranges', () => {
    expect(() => decadeValuesInRange(iec.E12, 0, 10)).toThrow('minValue must be a finite number > 0');
    expect(() => decadeValuesInRange(iec.E12, 10, 1)).toThrow('maxValue must be finite and ≥ minValue');
    expect(() => decadeValuesInRange(iec.E12, 1e-20, 1e20)).toThrow('at most 30 decades');
  });
});

describe('checkDecadeValues', () => {
  it('accepts every IEC 60063 series from the fixture', () => {
    for (const values of Object.values(iec)) if (Array.isArray(values)) expect(() => checkDecadeValues(values)).not.toThrow();
  });

  it('rejects an empty, unsorted, repeated or out-of-decade list, naming the value', () => {
    expect(() => checkDecadeValues([])).toThrow('series values must hold at least one value');
    expect(() => checkDecadeValues([2.2, 1])).toThrow('series values must be strictly ascending');
    expect(() => checkDecadeValues([1, 1])).toThrow('series values must be strictly ascending');
    expect(() => checkDecadeValues([0.5])).toThrow('series value 0.5 must be ≥ 1 and < 10');
    expect(() => checkDecadeValues([1, 10])).toThrow('series value 10 must be ≥ 1 and < 10');
    expect(() => checkDecadeValues([1, NaN])).toThrow('series value NaN must be ≥ 1 and < 10');
  });
});

describe('nearestDecadeValue', () => {
  it('finds the nearest value on a logarithmic scale', () => {
    expect(nearestDecadeValue(iec.E24, 4600)).toBe(4700); // IEC 60063 E24: 4.3, 4.7
    expect(nearestDecadeValue(iec.E12, 9500)).toBe(10000); // IEC 60063 E12: 8.2 then 10; crosses into the next decade
    expect(nearestDecadeValue(iec.E12, 1.05)).toBe(1); // IEC 60063 E12: 1.0, 1.2
    expect(nearestDecadeValue(iec.E96, 16.2e3)).toBe(16.2e3); // IEC 60063 E96 has 1.62
    expect(nearestDecadeValue(iec.E6, Math.sqrt(1000 * 1500) * 0.999)).toBe(1000); // geometric midpoint of 1.0 and 1.5, by hand
  });

  it('rounds down or up on request', () => {
    expect(nearestDecadeValue(iec.E12, 4600, 'below')).toBe(3900); // IEC 60063 E12: 3.9, 4.7
    expect(nearestDecadeValue(iec.E12, 4600, 'above')).toBe(4700); // IEC 60063 E12
    expect(nearestDecadeValue(iec.E12, 4700, 'below')).toBe(4700); // IEC 60063 E12
  });

  it('rejects values that are not positive', () => {
    expect(() => nearestDecadeValue(iec.E12, 0)).toThrow('value must be a finite number > 0');
    expect(() => nearestDecadeValue(iec.E12, -5)).toThrow('value must be a finite number > 0');
    expect(() => nearestDecadeValue(iec.E12, Infinity)).toThrow('value must be a finite number > 0');
  });
});
