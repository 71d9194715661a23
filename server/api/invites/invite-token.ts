import crypto from 'node:crypto';

export const INVITE_LIFETIME_MS = 72 * 3600 * 1000;

/** 32 random bytes as base64url: the link carries the token, the database only its SHA-256. */
export function newInviteToken(): { token: string; tokenHash: string } {
  const token = crypto.randomBytes(32).toString('base64url');
  return { token, tokenHash: hashInviteToken(token) };
}

export function hashInviteToken(token: string): string {
  return crypto.createHash('sha256').update(token).digest('hex');
}
