import { http } from './http';
import type { User } from './users';
import type { Invite, InviteDetails, PendingInvite } from '@shared/schemas/admin-views';
import type { InviteAcceptBody, InviteCreateBody } from '@shared/schemas/auth';

export type InviteRequest = InviteCreateBody;
export type AcceptInviteRequest = InviteAcceptBody;

export type { Invite, InviteDetails, PendingInvite } from '@shared/schemas/admin-views';

export const invitesApi = {
  create: (request: InviteRequest) =>
    http.post<{ invite: Invite }>('/api/invites', request).then((r) => r.invite),
  lookup: (token: string) => http.get<InviteDetails>(`/api/invites/${encodeURIComponent(token)}`),
  accept: (request: AcceptInviteRequest) =>
    http.post<{ user: User }>('/api/invites/accept', request).then((r) => r.user),
  pending: () => http.get<{ items: PendingInvite[] }>('/api/invites').then((r) => r.items),
  resend: (id: number) => http.post<{ invite: PendingInvite }>(`/api/invites/${id}/resend`).then((r) => r.invite),
  revoke: (id: number) => http.delete<void>(`/api/invites/${id}`),
};
