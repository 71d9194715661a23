import { describe, expect, it } from 'vitest';
import { parseDecimal, parseEngineering } from '../../../shared/units/index.js';

describe('parseDecimal', () => {
  it.each([
    ['16', 16],
    ['010', 10], // decimal reading: a leading zero is not octal (from memory: C and old JavaScript read 010 as 8)
    ['-2.5', -2.5],
    ['+3', 3],
    ['.5', 0.5],
    ['5.', 5],
    ['1e3', 1000],
    ['2.2E-3', 0.0022],
    [' 7 ', 7],
  ])('reads %s as %d', (text, expected) => {
    expect(parseDecimal(text)).toBe(expected); // decimal notation, exact for these values in binary64
  });

  it.each(['0x10', '0X1f', '0b11', '0o17', '1_000', 'Infinity', '-Infinity', 'NaN', '1e', 'e3', '', '  ', '1,5', '١٢', '１２', '4k7', '1 2'])(
    'refuses %j, which is not decimal notation',
    (text) => {
      expect(() => parseDecimal(text)).toThrow(`"${text}" is not a decimal number`);
    },
  );

  it('refuses a decimal too large for a double', () => {
    expect(() => parseDecimal('1e400')).toThrow('"1e400" is out of range');
  });

  it('engineering values stay decimal too: hexadecimal, binary and octal forms are refused', () => {
    for (const text of ['0x10', '0b11', '0o17', '0x10k']) expect(() => parseEngineering(text)).toThrow('is not a value');
  });
});
