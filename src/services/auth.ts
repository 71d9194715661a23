import { http } from './http';
import type { User } from './users';
import type { PasswordResetCompleteBody, PasswordResetDetails, SignInBody } from '@shared/schemas/auth';

export type SignInRequest = SignInBody;
export type { PasswordResetDetails } from '@shared/schemas/auth';

export const authApi = {
  signIn: (request: SignInRequest) =>
    http.post<{ user: User }>('/api/auth/sign-in', request).then((r) => r.user),
  signOut: () => http.post<void>('/api/auth/sign-out'),
  me: () => http.get<{ user: User }>('/api/auth/me').then((r) => r.user),
  /** Who is signed in, or null: answers 200 either way, so a signed-out start logs no failed request. */
  session: () => http.get<{ user: User | null }>('/api/auth/session').then((r) => r.user),
  requestPasswordReset: (email: string) =>
    http.post<{ message: string }>('/api/auth/password-reset', { email }).then((r) => r.message),
  passwordReset: (token: string) => http.get<PasswordResetDetails>(`/api/auth/password-reset/${encodeURIComponent(token)}`),
  completePasswordReset: (request: PasswordResetCompleteBody) =>
    http.post<{ message: string }>('/api/auth/password-reset/complete', request).then((r) => r.message),
};
