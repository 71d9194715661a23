import type { Role } from './roles.js';

/** What the server returns about invitations, the outbox and the resistor series; one definition for both sides. */

export interface Invite {
  id: number;
  email: string;
  role: Role;
  expiresAt: string;
}

/** What an invitation link reveals before it is accepted. */
export type InviteDetails = Omit<Invite, 'id'>;

/** An invitation not yet accepted, as the admins' list shows it. */
export interface PendingInvite extends Invite {
  /** When the current link was made (the first sending, or the last resend). */
  sentAt: string;
  invitedBy: string | null;
  expired: boolean;
}

export interface OutboxMessage {
  id: number;
  to: string;
  from: string;
  subject: string;
  receivedAt: string;
  text: string;
  html: string | null;
}

export interface OutboxList {
  items: OutboxMessage[];
  total: number;
}

