import { describe, expect, it } from 'vitest';
import { weakPasswordReason } from '../../../shared/schemas/password-rules.js';
import { passwordSchema, displayNameSchema } from '../../../shared/schemas/auth.js';

describe('new-password rules', () => {
  it('refuses blank, repeated, straight-run and common passwords', () => {
    expect(weakPasswordReason(' '.repeat(12))).toMatch(/only spaces/); // the issue's example
    expect(weakPasswordReason('123456789012')).not.toBeNull(); // the issue's example
    expect(weakPasswordReason('987654321098')).toMatch(/straight run/); // common practice: descending run with 0↔9 wrap
    expect(weakPasswordReason('zzzzzzzzzzzz')).toMatch(/different characters/); // common practice
    expect(weakPasswordReason('passwordpassword')).toMatch(/common/); // common practice: a listed word repeated
    expect(weakPasswordReason('$ecret!!2026')).toMatch(/common/); // common practice: look-alike symbols
    expect(weakPasswordReason('tallyvolt-1234')).toMatch(/common/); // the product name
  });

  it('accepts a passphrase of unrelated words', () => {
    expect(weakPasswordReason('copper kettle under moss')).toBeNull(); // common practice: several unrelated words
    expect(passwordSchema.safeParse('copper kettle under moss').success).toBe(true);
  });

  it('gives the schema the rule, so the client form shows the same message', () => {
    const parsed = passwordSchema.safeParse('Qwertyuiop12');
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues[0].message).toMatch(/common password/);
  });
});

describe('display names', () => {
  it('trims, and refuses names with nothing visible or with control characters', () => {
    expect(displayNameSchema.parse('  Nell Quarry ')).toBe('Nell Quarry');
    expect(displayNameSchema.safeParse('\u200b\u200b').success).toBe(false); // zero-width spaces only
    expect(displayNameSchema.safeParse('\u00a0\u2003\u3000').success).toBe(false); // Unicode spaces only
    expect(displayNameSchema.safeParse('Nell\u0000Q').success).toBe(false); // a control character
  });
});
