import { IsNull, type DataSource } from 'typeorm';
import type { InviteAcceptBody, InviteCreateBody } from '../../../shared/schemas/auth.js';
import { recordAudit } from '../../common/audit.js';
import { ConflictError, GoneError, HttpError, NotFoundError } from '../../common/errors.js';
import type { Mailer } from '../../common/mail.js';
import { hashPassword } from '../../common/passwords.js';
import { InviteToken } from '../../entities/InviteToken.js';
import { User } from '../../entities/User.js';
import { hashInviteToken, INVITE_LIFETIME_MS, newInviteToken } from './invite-token.js';
import { inviteMessage } from './invites.mail.js';
import { assertDisplayNameFree } from '../users/display-names.js';

/** Creates the invitation and mails its link; if the mail cannot be sent the invitation is withdrawn. */
export async function createInvite(
  dataSource: DataSource, mailer: Mailer, actor: User, body: InviteCreateBody, baseUrl: string,
): Promise<InviteToken> {
  if (await dataSource.getRepository(User).existsBy({ email: body.email })) {
    throw new ConflictError(`${body.email} already has an account`, { email: 'already has an account' });
  }
  const { token, tokenHash } = newInviteToken();
  const expiresAt = new Date(Date.now() + INVITE_LIFETIME_MS);
  const invite = await dataSource.transaction(async (manager) => {
    const repo = manager.getRepository(InviteToken);
    const saved = await repo.save(repo.create({ tokenHash, email: body.email, role: body.role, expiresAt, usedAt: null, invitedBy: actor }));
    await recordAudit(manager, actor.id, 'invite.create', `invite:${saved.id}`, { email: body.email, role: body.role });
    return saved;
  });
  try {
    await mailer.send(inviteMessage(body.email, body.role, `${baseUrl}/invite/${token}`, actor.displayName, expiresAt));
  } catch (err) {
    await dataSource.getRepository(InviteToken).delete({ id: invite.id });
    console.error('[mail] invitation not sent', err);
    throw new HttpError(503, 'the invitation e-mail could not be sent; nothing was saved, try again later');
  }
  return invite;
}

/** Finds a usable invitation by its token, or says plainly why it cannot be used. */
export async function findUsableInvite(dataSource: DataSource, token: string): Promise<InviteToken> {
  const invite = await dataSource.getRepository(InviteToken).findOneBy({ tokenHash: hashInviteToken(token) });
  if (!invite) throw new NotFoundError('this invitation link is not valid; check it was copied whole, or ask an admin for a new one');
  if (invite.usedAt) throw new GoneError('this invitation has already been used; sign in, or ask an admin for a new one');
  if (invite.expiresAt.getTime() <= Date.now()) {
    throw new GoneError(`this invitation expired on ${invite.expiresAt.toISOString().slice(0, 16).replace('T', ' ')} UTC; ask an admin for a new one`);
  }
  return invite;
}

/** Turns an invitation into an account; the token is spent in the same transaction that creates the user. */
export async function acceptInvite(dataSource: DataSource, body: InviteAcceptBody): Promise<User> {
  const invite = await findUsableInvite(dataSource, body.token);
  const passwordHash = await hashPassword(body.password);
  return dataSource.transaction(async (manager) => {
    const spent = await manager
      .createQueryBuilder()
      .update(InviteToken)
      .set({ usedAt: new Date() })
      .where({ id: invite.id, usedAt: IsNull() })
      .execute();
    if (!spent.affected) throw new GoneError('this invitation has already been used; sign in, or ask an admin for a new one');
    const users = manager.getRepository(User);
    if (await users.existsBy({ email: invite.email })) throw new ConflictError(`${invite.email} already has an account`);
    await assertDisplayNameFree(manager, body.displayName);
    const user = await users.save(users.create({ email: invite.email, displayName: body.displayName, role: invite.role, passwordHash, active: true }));
    await recordAudit(manager, user.id, 'invite.accept', `user:${user.id}`, { inviteId: invite.id });
    return user;
  });
}
