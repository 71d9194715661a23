/**
 * Form-field schemas for values typed in engineering notation or as RKM codes.
 */
import { z } from 'zod';
import { parseEngineering } from '../units/parse-engineering.js';

/**
 * A zod schema accepting a number or text such as '4.7k', '4.7 kΩ' or '4K7' and giving the
 * number in base units; text in another unit, or malformed, fails with the parser's message.
 * @param expectedUnit unit of the field, e.g. 'Ω', 'V', 'Hz/V' ('' accepts any)
 * @example engineeringValue('Ω').parse('4K7') // 4700
 */
export function engineeringValue(expectedUnit = '') {
  return z
    .unknown()
    .transform((value, context) => {
      if (typeof value === 'number') return value;
      if (typeof value === 'string') {
        try {
          return parseEngineering(value, expectedUnit);
        } catch (error) {
          context.addIssue({ code: 'custom', message: (error as Error).message });
          return z.NEVER;
        }
      }
      context.addIssue({ code: 'custom', message: 'expected a number or text such as 4.7k or 4K7' });
      return z.NEVER;
    })
    .pipe(z.number({ error: 'value must be a finite number' }));
}

/**
 * engineeringValue that must also be > 0, e.g. a resistance or a full-scale voltage.
 * @param expectedUnit unit of the field, e.g. 'Ω'
 * @example positiveEngineeringValue('Ω').parse('R47') // 0.47
 */
export function positiveEngineeringValue(expectedUnit = '') {
  return engineeringValue(expectedUnit).pipe(z.number().positive({ error: 'value must be > 0' }));
}
