import { http } from './http';
import type { Role, User } from './users';
import type { InviteAcceptBody, InviteCreateBody } from '@shared/schemas/auth';

export type InviteRequest = InviteCreateBody;
export type AcceptInviteRequest = InviteAcceptBody;

export interface Invite {
  id: number;
  email: string;
  role: Role;
  expiresAt: string;
}

/** What an invitation link reveals before it is accepted. */
export interface InviteDetails {
  email: string;
  role: Role;
  expiresAt: string;
}

export const invitesApi = {
  create: (request: InviteRequest) =>
    http.post<{ invite: Invite }>('/api/invites', request).then((r) => r.invite),
  lookup: (token: string) => http.get<InviteDetails>(`/api/invites/${encodeURIComponent(token)}`),
  accept: (request: AcceptInviteRequest) =>
    http.post<{ user: User }>('/api/invites/accept', request).then((r) => r.user),
};
