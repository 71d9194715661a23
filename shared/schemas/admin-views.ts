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

/** An IEC 60063 series: its values in one decade, [1, 10). */
export interface ResistorSeries {
  name: string;
  valuesPerDecade: number;
  values: number[];
}
