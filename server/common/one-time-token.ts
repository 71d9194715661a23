import crypto from 'node:crypto';

/**
 * A one-time link token: 32 random bytes as base64url. The link carries the token, the database only its SHA-256,
 * so a copy of the database holds no usable link. Used by invitations and password resets.
 */
export function newOneTimeToken(): { token: string; tokenHash: string } {
  const token = crypto.randomBytes(32).toString('base64url');
  return { token, tokenHash: hashOneTimeToken(token) };
}

export function hashOneTimeToken(token: string): string {
  return crypto.createHash('sha256').update(token).digest('hex');
}
