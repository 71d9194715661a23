import { http } from './http';
import type { User } from './users';
import type { Invite, InviteDetails } from '@shared/schemas/admin-views';
import type { InviteAcceptBody, InviteCreateBody } from '@shared/schemas/auth';

export type InviteRequest = InviteCreateBody;
export type AcceptInviteRequest = InviteAcceptBody;

export type { Invite, InviteDetails } from '@shared/schemas/admin-views';

export const invitesApi = {
  create: (request: InviteRequest) =>
    http.post<{ invite: Invite }>('/api/invites', request).then((r) => r.invite),
  lookup: (token: string) => http.get<InviteDetails>(`/api/invites/${encodeURIComponent(token)}`),
  accept: (request: AcceptInviteRequest) =>
    http.post<{ user: User }>('/api/invites/accept', request).then((r) => r.user),
};
