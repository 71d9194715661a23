import { IsNull, type DataSource } from 'typeorm';
import type { PendingInvite } from '../../../shared/schemas/admin-views.js';
import { recordAudit } from '../../common/audit.js';
import { GoneError, HttpError, NotFoundError } from '../../common/errors.js';
import type { Mailer } from '../../common/mail.js';
import { InviteToken } from '../../entities/InviteToken.js';
import type { User } from '../../entities/User.js';
import { INVITE_LIFETIME_MS, newInviteToken } from './invite-token.js';
import { inviteMessage } from './invites.mail.js';

function toPendingInvite(invite: InviteToken, now: number): PendingInvite {
  return {
    id: invite.id, email: invite.email, role: invite.role,
    expiresAt: invite.expiresAt.toISOString(),
    // Every link lives INVITE_LIFETIME_MS from its sending, so this is the first sending or the last resend.
    sentAt: new Date(invite.expiresAt.getTime() - INVITE_LIFETIME_MS).toISOString(),
    invitedBy: invite.invitedBy?.displayName ?? null,
    expired: invite.expiresAt.getTime() <= now,
  };
}

/** Invitations nobody has accepted yet, newest first; expired ones stay listed so they can be sent again. */
export async function listPendingInvites(dataSource: DataSource): Promise<PendingInvite[]> {
  const invites = await dataSource.getRepository(InviteToken).find({
    where: { usedAt: IsNull() }, relations: { invitedBy: true }, order: { createdAt: 'DESC', id: 'DESC' },
  });
  const now = Date.now();
  return invites.map((i) => toPendingInvite(i, now));
}

async function findPending(dataSource: DataSource, id: number): Promise<InviteToken> {
  const invite = await dataSource.getRepository(InviteToken).findOne({ where: { id }, relations: { invitedBy: true } });
  if (!invite) throw new NotFoundError(`no invitation with id ${id}`);
  if (invite.usedAt) throw new GoneError(`the invitation to ${invite.email} has already been accepted`);
  return invite;
}

/**
 * Sends the invitation again under a new token and a fresh lifetime; the old link stops working at once.
 * If the mail cannot be sent the invitation keeps its old token and expiry, so nothing changes.
 */
export async function resendInvite(dataSource: DataSource, mailer: Mailer, actor: User, id: number, baseUrl: string): Promise<PendingInvite> {
  const invite = await findPending(dataSource, id);
  const before = { tokenHash: invite.tokenHash, expiresAt: invite.expiresAt };
  const { token, tokenHash } = newInviteToken();
  const expiresAt = new Date(Date.now() + INVITE_LIFETIME_MS);
  await dataSource.transaction(async (manager) => {
    // Only an unaccepted invitation is renewed, so a link accepted a moment ago is not revived.
    const renewed = await manager.createQueryBuilder().update(InviteToken).set({ tokenHash, expiresAt }).where({ id, usedAt: IsNull() }).execute();
    if (!renewed.affected) throw new GoneError(`the invitation to ${invite.email} has already been accepted`);
    await recordAudit(manager, actor.id, 'invite.resend', `invite:${id}`, { email: invite.email });
  });
  try {
    await mailer.send(inviteMessage(invite.email, invite.role, `${baseUrl}/invite/${token}`, actor.displayName, expiresAt));
  } catch (err) {
    await dataSource.getRepository(InviteToken).update({ id }, before);
    console.error('[mail] invitation not sent again', err);
    throw new HttpError(503, 'the invitation e-mail could not be sent; the earlier link still works, try again later');
  }
  return toPendingInvite(Object.assign(invite, { tokenHash, expiresAt }), Date.now());
}

/** Withdraws an invitation that has not been accepted; its link stops working. */
export async function revokeInvite(dataSource: DataSource, actor: User, id: number): Promise<void> {
  const invite = await findPending(dataSource, id);
  await dataSource.transaction(async (manager) => {
    const removed = await manager.getRepository(InviteToken).delete({ id, usedAt: IsNull() });
    if (!removed.affected) throw new GoneError(`the invitation to ${invite.email} has already been accepted`);
    await recordAudit(manager, actor.id, 'invite.revoke', `invite:${id}`, { email: invite.email });
  });
}
