import { http } from './http';
import type { User } from './users';
import type { SignInBody } from '@shared/schemas/auth';

export type SignInRequest = SignInBody;

export const authApi = {
  signIn: (request: SignInRequest) =>
    http.post<{ user: User }>('/api/auth/sign-in', request).then((r) => r.user),
  signOut: () => http.post<void>('/api/auth/sign-out'),
  me: () => http.get<{ user: User }>('/api/auth/me').then((r) => r.user),
};
