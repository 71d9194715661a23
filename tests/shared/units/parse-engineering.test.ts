import { describe, expect, it } from 'vitest';
import { formatEng, formatRkm, parseEngineering, parseQuantity, parseRkm } from '../../../shared/units/index.js';
import { fixtureValuesInRange } from '../../helpers/stored-series.js';

describe('parseEngineering', () => {
  it.each([
    ['4.7k', 4700],
    ['4.7K', 4700],
    ['4.7 k', 4700],
    ['4.7 kΩ', 4700],
    ['4.7kΩ', 4700],
    ['4.7 k\u2126', 4700], // OHM SIGN
    ['4.7 kohm', 4700],
    ['4.7e3', 4700],
    ['4.7E3 Ω', 4700],
    ['470 mV', 0.47],
    ['10 kHz/V', 10000],
    ['2.2 µF', 2.2e-6],
    ['2.2 μF', 2.2e-6],
    ['2.2uF', 2.2e-6],
    ['100 nA', 1e-7],
    ['15 pF', 15e-12],
    ['1.5 MΩ', 1.5e6],
    ['3 GΩ', 3e9],
    ['-12.5 mV', -0.0125],
    ['+3', 3],
    ['.5', 0.5],
    ['600 µF', 6e-4],
    ['462 V', 462],
    ['50 ppm', 50],
    ['1\u00a0kΩ', 1000], // no-break space
    ['  7  ', 7],
  ])('reads %s as %d', (text, expected) => {
    expect(parseEngineering(text)).toBe(expected); // SI Brochure Table 7 prefixes, exact decimal scaling
  });

  it('reports the unit it read', () => {
    expect(parseQuantity('10 kHz/V')).toEqual({ value: 10000, unit: 'Hz/V' });
    expect(parseQuantity('4.7 kohms')).toEqual({ value: 4700, unit: 'Ω' });
    expect(parseQuantity('4.7k')).toEqual({ value: 4700, unit: '' });
    expect(parseQuantity('4K7 Ω')).toEqual({ value: 4700, unit: 'Ω' });
  });

  it('checks the unit against the expected one', () => {
    expect(parseEngineering('4.7 kΩ', 'Ω')).toBe(4700);
    expect(parseEngineering('4.7k', 'Ω')).toBe(4700);
    expect(parseEngineering('4K7', 'ohm')).toBe(4700);
    expect(() => parseEngineering('4.7 kV', 'Ω')).toThrow('"4.7 kV" is not in Ω: it is written in V');
    expect(() => parseEngineering('10 Hz', 'Hz/V')).toThrow('is not in Hz/V');
  });

  it.each(['4.7kk', '4K7K', 'abc', '1..2', '4.7 k k', 'k4.7', '1e', '--3', '4,7k', 'NaN', 'Infinity'])(
    'rejects %s with a message naming the expected form',
    (text) => {
      expect(() => parseEngineering(text)).toThrow(
        `"${text}" is not a value: expected a number with an optional SI prefix (p n µ m k M G) or an RKM code such as 4K7`,
      );
    },
  );

  it('rejects empty text and values out of range', () => {
    expect(() => parseEngineering('')).toThrow('value is empty');
    expect(() => parseEngineering('   ')).toThrow('value is empty');
    expect(() => parseEngineering('1e400')).toThrow('out of range');
    expect(() => parseEngineering(42 as unknown as string)).toThrow('value text must be a string');
  });
});

describe('RKM codes (IEC 60062)', () => {
  it.each([
    ['4K7', 4700],
    ['R47', 0.47],
    ['4R7', 4.7],
    ['1M0', 1e6],
    ['2M2', 2.2e6],
    ['470R', 470],
    ['10K', 10000],
    ['1K', 1000],
    ['4k7', 4700],
    ['16K2', 16200],
    ['1G5', 1.5e9],
    ['R005', 0.005],
    ['4n7', 4.7e-9],
    ['2µ2', 2.2e-6],
  ])('reads %s as %d', (code, expected) => {
    expect(parseRkm(code)).toBe(expected); // IEC 60062 letter-and-digit code
    expect(parseEngineering(code)).toBe(expected);
  });

  it.each(['4K7K', 'K', '4.7K', '47', '4KK7', '', 'R'])('rejects %s', (code) => {
    expect(() => parseRkm(code)).toThrow('is not an RKM code: expected digits around one letter of R K M G T');
  });

  it.each([
    [4700, '4K7'],
    [0.47, 'R47'],
    [4.7, '4R7'],
    [1e6, '1M0'],
    [2.2e6, '2M2'],
    [470, '470R'],
    [1000, '1K0'],
    [10000, '10K'],
    [100e3, '100K'],
    [16200, '16K2'],
    [4990, '4K99'],
    [1, '1R0'],
    [0.047, 'R047'],
    [3.3e9, '3G3'],
  ])('writes %d as %s', (ohms, code) => {
    expect(formatRkm(ohms)).toBe(code); // IEC 60062 letter-and-digit code
  });

  it('rounds to the significant digits asked for', () => {
    expect(formatRkm(4699.7)).toBe('4K7');
    expect(formatRkm(4711, 4)).toBe('4K711');
    expect(formatRkm(4711, 2)).toBe('4K7');
  });

  it('round-trips every E192 value from 0.1 Ω to 100 GΩ', () => {
    for (const ohms of fixtureValuesInRange('E192', 0.1, 100e9)) expect(parseRkm(formatRkm(ohms))).toBe(ohms);
  });

  it('rejects values it cannot code', () => {
    expect(() => formatRkm(0)).toThrow('ohms must be a finite number > 0');
    expect(() => formatRkm(-1)).toThrow('ohms must be a finite number > 0');
    expect(() => formatRkm(NaN)).toThrow('ohms must be a finite number > 0');
    expect(() => formatRkm(5e15)).toThrow('below 1000 TΩ');
    expect(() => formatRkm(100, 1)).toThrow('significantDigits must be an integer from 2 to 6');
  });
});

describe('formatEng', () => {
  it.each([
    [4700, 'Ω', 3, '4.7 kΩ'],
    [4700, 'Ω', 2, '4.7 kΩ'],
    [4712, 'Ω', 3, '4.71 kΩ'],
    [0.47, 'V', 3, '470 mV'],
    [10000, 'Hz/V', 3, '10 kHz/V'],
    [38200, 'Hz', 3, '38.2 kHz'],
    [6e-4, 'F', 3, '600 µF'],
    [-0.42, 'V', 2, '-420 mV'],
    [999.96, 'Ω', 4, '1 kΩ'],
    [999.96, 'Ω', 5, '999.96 Ω'],
    [1.5e6, 'Ω', 3, '1.5 MΩ'],
    [0, 'V', 3, '0 V'],
    [4700, '', 3, '4.7k'],
    [2e-18, 'A', 3, '0.002 fA'],
    [3e18, 'Ω', 3, '3000 PΩ'],
  ])('writes %d %s to %d digits as %s', (value, unit, digits, expected) => {
    expect(formatEng(value, unit, digits)).toBe(expected); // SI Brochure Table 7 prefixes, common practice
  });

  it('keeps trailing zeros when asked', () => {
    expect(formatEng(4700, 'Ω', 3, { keepTrailingZeros: true })).toBe('4.70 kΩ');
    expect(formatEng(1e6, 'Ω', 4, { keepTrailingZeros: true })).toBe('1.000 MΩ');
  });

  it('round-trips through parseEngineering at full precision', () => {
    const values = [4700, 0.47, 1.234567891234e-7, 462.123456789, 16200, 9.2e9, 1 / 3, Math.PI * 1e5, 6.02e-13];
    for (const value of values) {
      expect(parseEngineering(formatEng(value, 'Ω', 17), 'Ω')).toBe(value);
      expect(parseEngineering(formatEng(-value, 'V', 17), 'V')).toBe(-value);
    }
  });

  it('rejects non-finite values and bad digit counts', () => {
    expect(() => formatEng(NaN, 'V')).toThrow('value must be a finite number');
    expect(() => formatEng(Infinity, 'V')).toThrow('value must be a finite number');
    expect(() => formatEng(1, 'V', 0)).toThrow('significantDigits must be an integer from 1 to 17');
    expect(() => formatEng(1, 'V', 18)).toThrow('significantDigits');
  });
});
