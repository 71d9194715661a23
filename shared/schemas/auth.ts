import { z } from 'zod';
import { roleSchema } from './roles.js';
import { weakPasswordReason } from './password-rules.js';

/** Passwords shorter than this are refused; length beats composition rules for typed passphrases. */
export const PASSWORD_MIN_LENGTH = 12;
export const PASSWORD_MAX_LENGTH = 200;

const emailSchema = z
  .string({ error: 'e-mail is required' })
  .trim()
  .toLowerCase()
  .max(254, { error: 'e-mail must be at most 254 characters' })
  .pipe(z.email({ error: 'e-mail is not a valid address' }));

/** A new password: long enough, and not blank, a repetition, a run or a common password (see password-rules). */
export const passwordSchema = z
  .string({ error: 'password is required' })
  .min(PASSWORD_MIN_LENGTH, { error: `password must be at least ${PASSWORD_MIN_LENGTH} characters` })
  .max(PASSWORD_MAX_LENGTH, { error: `password must be at most ${PASSWORD_MAX_LENGTH} characters` })
  .superRefine((password, ctx) => {
    const reason = weakPasswordReason(password);
    if (reason) ctx.addIssue({ code: 'custom', message: reason });
  });

/** A person's name as others see it: trimmed, at least one visible character, no control characters. */
export const displayNameSchema = z
  .string({ error: 'display name is required' })
  .trim()
  .min(2, { error: 'display name must be at least 2 characters' })
  .max(120, { error: 'display name must be at most 120 characters' })
  .refine((name) => !/[\p{Cc}\p{Cs}]/u.test(name), { error: 'display name must not contain control characters' })
  .refine((name) => /[^\s\p{C}\p{Z}]/u.test(name), { error: 'display name must contain a visible character' });

export const signInSchema = z.strictObject({
  email: emailSchema,
  password: z.string({ error: 'password is required' }).min(1, { error: 'password is required' }).max(PASSWORD_MAX_LENGTH),
});
export type SignInBody = z.infer<typeof signInSchema>;

export const inviteCreateSchema = z.strictObject({
  email: emailSchema,
  role: roleSchema,
});
export type InviteCreateBody = z.infer<typeof inviteCreateSchema>;

export const inviteTokenSchema = z
  .string({ error: 'token is required' })
  .regex(/^[A-Za-z0-9_-]{20,100}$/, { error: 'token is not a valid invitation token' });

export const inviteAcceptSchema = z.strictObject({
  token: inviteTokenSchema,
  displayName: displayNameSchema,
  password: passwordSchema,
});
export type InviteAcceptBody = z.infer<typeof inviteAcceptSchema>;


export const passwordResetRequestSchema = z.strictObject({ email: emailSchema });
export type PasswordResetRequestBody = z.infer<typeof passwordResetRequestSchema>;

export const passwordResetTokenSchema = z
  .string({ error: 'token is required' })
  .regex(/^[A-Za-z0-9_-]{20,100}$/, { error: 'token is not a valid password-reset token' });

export const passwordResetCompleteSchema = z.strictObject({
  token: passwordResetTokenSchema,
  password: passwordSchema,
});
export type PasswordResetCompleteBody = z.infer<typeof passwordResetCompleteSchema>;

/** What a reset link reveals before it is used: whose password it sets, and until when it works. */
export interface PasswordResetDetails {
  email: string;
  expiresAt: string;
}

export { emailSchema };
