import { IsNull, MoreThan, type DataSource } from 'typeorm';
import type { PasswordResetCompleteBody } from '../../../shared/schemas/auth.js';
import { recordAudit } from '../../common/audit.js';
import { GoneError, NotFoundError } from '../../common/errors.js';
import type { Mailer } from '../../common/mail.js';
import { hashOneTimeToken, newOneTimeToken } from '../../common/one-time-token.js';
import { hashPassword } from '../../common/passwords.js';
import { endSessionsOf } from '../../common/session.js';
import { userCacheFor } from '../../common/user-cache.js';
import { PasswordResetToken } from '../../entities/PasswordResetToken.js';
import { User } from '../../entities/User.js';
import { passwordResetMessage } from './password-reset.mail.js';

export const RESET_LIFETIME_MS = 3600 * 1000;
/** At most this many reset mails per person per hour, so nobody can flood a colleague's inbox. */
export const RESET_MAILS_PER_HOUR = 3;

/**
 * Mails a one-time reset link to an active account with this e-mail. Unknown, deactivated and over-limit
 * addresses get nothing and the caller answers the same either way, so the request reveals no account.
 */
export function requestPasswordReset(dataSource: DataSource, mailer: Mailer, email: string, baseUrl: string): Promise<void> {
  // One request at a time, so requests answered back to back cannot all pass the hourly count before any is stored.
  const next = requests.then(() => mailResetLink(dataSource, mailer, email, baseUrl));
  requests = next.catch(() => undefined);
  return next;
}
let requests: Promise<void> = Promise.resolve();

async function mailResetLink(dataSource: DataSource, mailer: Mailer, email: string, baseUrl: string): Promise<void> {
  const user = await dataSource.getRepository(User).findOneBy({ email });
  if (!user || !user.active) return;
  const tokens = dataSource.getRepository(PasswordResetToken);
  const recent = await tokens.countBy({ userId: user.id, createdAt: MoreThan(new Date(Date.now() - 3600 * 1000)) });
  if (recent >= RESET_MAILS_PER_HOUR) return;
  const { token, tokenHash } = newOneTimeToken();
  const expiresAt = new Date(Date.now() + RESET_LIFETIME_MS);
  const saved = await dataSource.transaction(async (manager) => {
    const repo = manager.getRepository(PasswordResetToken);
    const row = await repo.save(repo.create({ tokenHash, userId: user.id, expiresAt, usedAt: null }));
    await recordAudit(manager, null, 'password-reset.request', `user:${user.id}`, { reset: row.id });
    return row;
  });
  try {
    await mailer.send(passwordResetMessage(user.email, user.displayName, `${baseUrl}/reset-password/${token}`, expiresAt));
  } catch (err) {
    await tokens.delete({ id: saved.id });
    console.error('[mail] password-reset link not sent', err);
  }
}

/** A usable reset by its token, or a plain reason why the link cannot be used. */
export async function findUsableReset(dataSource: DataSource, token: string): Promise<PasswordResetToken & { user: User }> {
  const reset = await dataSource.getRepository(PasswordResetToken).findOne({
    where: { tokenHash: hashOneTimeToken(token) }, relations: { user: true },
  });
  if (!reset) throw new NotFoundError('this password-reset link is not valid; check it was copied whole, or ask for a new one');
  if (reset.usedAt) throw new GoneError('this password-reset link has already been used; sign in, or ask for a new one');
  if (reset.expiresAt.getTime() <= Date.now() || !reset.user.active) {
    throw new GoneError('this password-reset link has expired; ask for a new one');
  }
  return reset;
}

/**
 * Sets the new password and spends the token, every other open reset link of the person and all their
 * sessions in one transaction: whoever held the old password, or an old link, is out.
 */
export async function completePasswordReset(dataSource: DataSource, body: PasswordResetCompleteBody): Promise<User> {
  const reset = await findUsableReset(dataSource, body.token);
  const passwordHash = await hashPassword(body.password);
  const user = await dataSource.transaction(async (manager) => {
    const spent = await manager.createQueryBuilder().update(PasswordResetToken).set({ usedAt: new Date() })
      .where({ id: reset.id, usedAt: IsNull() }).execute();
    if (!spent.affected) throw new GoneError('this password-reset link has already been used; sign in, or ask for a new one');
    await manager.createQueryBuilder().update(PasswordResetToken).set({ usedAt: new Date() })
      .where({ userId: reset.userId, usedAt: IsNull() }).execute();
    await manager.getRepository(User).update({ id: reset.userId }, { passwordHash });
    await endSessionsOf(manager, reset.userId);
    await recordAudit(manager, reset.userId, 'password-reset.complete', `user:${reset.userId}`, { reset: reset.id });
    return reset.user;
  });
  userCacheFor(dataSource).forget(user.id);
  return user;
}
