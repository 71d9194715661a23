import crypto from 'node:crypto';
import bcrypt from 'bcryptjs';

/** bcrypt cost 11: about 0.1 s per hash here, slow enough for guessing, quick enough for sign-in. */
export const BCRYPT_COST = 11;

/**
 * bcrypt reads at most 72 bytes, so two long passwords sharing their first 72 bytes would both match. Hashing the
 * password with SHA-256 first (44 base64 characters) makes every character count. Stored hashes carry this prefix;
 * a hash without it was made from the raw password before this scheme and is replaced at the next sign-in.
 */
const PREHASHED = 'sha256$';

const prehash = (password: string) => crypto.createHash('sha256').update(password.normalize('NFC'), 'utf8').digest('base64');

export async function hashPassword(password: string): Promise<string> {
  return PREHASHED + (await bcrypt.hash(prehash(password), BCRYPT_COST));
}

export interface PasswordCheck {
  ok: boolean;
  /** The stored hash is of an older scheme or cost: store `hashPassword(password)` now that the password is known. */
  stale: boolean;
}

/** Always exactly one bcrypt comparison, whatever the stored hash's scheme. */
export async function checkPassword(password: string, stored: string): Promise<PasswordCheck> {
  const prehashed = stored.startsWith(PREHASHED);
  const hash = prehashed ? stored.slice(PREHASHED.length) : stored;
  const ok = await bcrypt.compare(prehashed ? prehash(password) : password, hash);
  return { ok, stale: ok && (!prehashed || bcrypt.getRounds(hash) !== BCRYPT_COST) };
}

let dummy: Promise<string> | undefined;
/**
 * A hash at the real cost and scheme, compared against when the account is unknown, so an unknown e-mail costs the
 * same bcrypt work as a wrong password for a real one. Made once per process, on first use.
 */
export function dummyHash(): Promise<string> {
  dummy ??= hashPassword(crypto.randomBytes(16).toString('hex'));
  return dummy;
}
