import { describe, expect, it } from 'vitest';
import { engineeringValue, positiveEngineeringValue } from '../../../shared/schemas/units.js';

describe('engineeringValue schema', () => {
  it('accepts numbers, engineering notation and RKM codes', () => {
    const ohms = engineeringValue('Ω');
    expect(ohms.parse(4700)).toBe(4700);
    expect(ohms.parse('4.7k')).toBe(4700);
    expect(ohms.parse('4.7 kΩ')).toBe(4700);
    expect(ohms.parse('4K7')).toBe(4700);
  });

  it('fails with the parser’s message for malformed text or the wrong unit', () => {
    const ohms = engineeringValue('Ω');
    const bad = ohms.safeParse('4.7kk');
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0].message).toContain('"4.7kk" is not a value');
    expect(ohms.safeParse('4.7 kV').error?.issues[0].message).toContain('is not in Ω');
    expect(ohms.safeParse(Infinity).success).toBe(false);
    expect(ohms.safeParse(null).success).toBe(false);
  });

  it('rejects zero and negative values where a positive one is needed', () => {
    const ohms = positiveEngineeringValue('Ω');
    expect(ohms.parse('R47')).toBe(0.47);
    expect(ohms.safeParse('0').success).toBe(false);
    expect(ohms.safeParse('-1k').success).toBe(false);
  });
});
