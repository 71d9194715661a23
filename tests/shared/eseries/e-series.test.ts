import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import {
  E_SERIES_MANTISSAS,
  eSeriesMantissas,
  eSeriesValuesInRange,
  isESeriesName,
  listESeriesNames,
  nearestESeriesValue,
} from '../../../shared/eseries/index.js';
import type { ESeriesName } from '../../../shared/eseries/index.js';

const fixture = JSON.parse(readFileSync(fileURLToPath(new URL('../../fixtures/e-series.json', import.meta.url)), 'utf8')) as Record<string, number[]>;
const names: ESeriesName[] = ['E3', 'E6', 'E12', 'E24', 'E48', 'E96', 'E192'];

describe('IEC 60063 tables', () => {
  it.each(names)('holds %s exactly as tabulated', (name) => {
    expect(eSeriesMantissas(name)).toEqual(fixture[name]); // IEC 60063 (via refdata e-series.json)
    expect(eSeriesMantissas(name)).toHaveLength(Number(name.slice(1)));
  });

  it('keeps the E24 values that differ from the rounded formula', () => {
    const e24 = eSeriesMantissas('E24');
    for (const value of [2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2]) expect(e24).toContain(value); // IEC 60063 (via refdata e-series.json)
    for (const formula of [2.6, 2.9, 3.2, 3.5, 3.8, 4.2, 4.6, 8.3]) expect(e24).not.toContain(formula); // round(10^(i/24)), by hand
  });

  it('has 9.20 in E192 where the formula gives 9.19', () => {
    expect(eSeriesMantissas('E192')).toContain(9.2); // IEC 60063 (via refdata e-series.json)
    expect(eSeriesMantissas('E192')).not.toContain(9.19);
    expect(Math.round(10 ** (185 / 192) * 100) / 100).toBe(9.19); // the formula, for contrast
  });

  it('nests the series as every 2nd, 4th or 8th value', () => {
    const every = (values: readonly number[], step: number) => values.filter((_, i) => i % step === 0);
    expect(every(eSeriesMantissas('E192'), 2)).toEqual(eSeriesMantissas('E96')); // IEC 60063 structure
    expect(every(eSeriesMantissas('E192'), 4)).toEqual(eSeriesMantissas('E48'));
    expect(every(eSeriesMantissas('E24'), 2)).toEqual(eSeriesMantissas('E12'));
    expect(every(eSeriesMantissas('E24'), 4)).toEqual(eSeriesMantissas('E6'));
    expect(every(eSeriesMantissas('E24'), 8)).toEqual(eSeriesMantissas('E3'));
  });

  it('is frozen so that no caller can change a table', () => {
    expect(Object.isFrozen(E_SERIES_MANTISSAS)).toBe(true);
    expect(Object.isFrozen(E_SERIES_MANTISSAS.E96)).toBe(true);
    expect(() => (eSeriesMantissas('E3') as number[]).push(9.9)).toThrow();
  });

  it('lists and recognises series names', () => {
    expect(listESeriesNames()).toEqual(names);
    expect(isESeriesName('E96')).toBe(true);
    expect(isESeriesName('E97')).toBe(false);
    expect(() => eSeriesMantissas('E5')).toThrow('series must be one of E3, E6, E12, E24, E48, E96, E192');
  });
});

describe('series values across decades', () => {
  it('lists exact values in a range, both ends included', () => {
    expect(eSeriesValuesInRange('E6', 1000, 4700)).toEqual([1000, 1500, 2200, 3300, 4700]); // IEC 60063 E6
    expect(eSeriesValuesInRange('E3', 0.1, 10)).toEqual([0.1, 0.22, 0.47, 1, 2.2, 4.7, 10]);
    expect(eSeriesValuesInRange('E96', 16e3, 16.5e3)).toEqual([16200, 16500]); // 16.2 and 16.5 are E96
  });

  it('gives 192 values per decade for E192', () => {
    expect(eSeriesValuesInRange('E192', 1e3, 9.99e3)).toHaveLength(192);
    expect(eSeriesValuesInRange('E192', 1e3, 9.99e3)).toContain(9200);
  });

  it('returns a single value or none for a narrow range', () => {
    expect(eSeriesValuesInRange('E12', 4700, 4700)).toEqual([4700]);
    expect(eSeriesValuesInRange('E12', 4800, 5500)).toEqual([]);
  });

  it('rejects bad ranges', () => {
    expect(() => eSeriesValuesInRange('E12', 0, 10)).toThrow('minValue must be a finite number > 0');
    expect(() => eSeriesValuesInRange('E12', 10, 1)).toThrow('maxValue must be finite and ≥ minValue');
    expect(() => eSeriesValuesInRange('E12', 1e-20, 1e20)).toThrow('at most 30 decades');
    expect(() => eSeriesValuesInRange('X12', 1, 10)).toThrow('series must be one of');
  });
});

describe('nearestESeriesValue', () => {
  it('finds the nearest value on a logarithmic scale', () => {
    expect(nearestESeriesValue('E24', 4600)).toBe(4700);
    expect(nearestESeriesValue('E12', 9500)).toBe(10000); // crosses into the next decade
    expect(nearestESeriesValue('E12', 1.05)).toBe(1);
    expect(nearestESeriesValue('E96', 16.2e3)).toBe(16.2e3);
    expect(nearestESeriesValue('E6', Math.sqrt(1000 * 1500) * 0.999)).toBe(1000); // geometric midpoint, by hand
  });

  it('rounds down or up on request', () => {
    expect(nearestESeriesValue('E12', 4600, 'below')).toBe(3900);
    expect(nearestESeriesValue('E12', 4600, 'above')).toBe(4700);
    expect(nearestESeriesValue('E12', 4700, 'below')).toBe(4700);
  });

  it('rejects values that are not positive', () => {
    expect(() => nearestESeriesValue('E12', 0)).toThrow('value must be a finite number > 0');
    expect(() => nearestESeriesValue('E12', -5)).toThrow('value must be a finite number > 0');
    expect(() => nearestESeriesValue('E12', Infinity)).toThrow('value must be a finite number > 0');
  });
});
