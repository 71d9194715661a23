import { http } from './http';
import type { PublicUser, UserPatchBody } from '@shared/schemas/users';

export { ROLES, type Role } from '@shared/schemas/roles';

/** A person as the API returns them. */
export type User = PublicUser;
/** What an admin may change about a person: role, active, or both. */
export type UserChange = UserPatchBody;

export interface UserList {
  items: User[];
  total: number;
}

export const usersApi = {
  list: () => http.get<UserList>('/api/users'),
  update: (id: number, change: UserChange) =>
    http.patch<{ user: User }>(`/api/users/${encodeURIComponent(id)}`, change).then((r) => r.user),
};
