import type { RequestHandler } from 'express';
import { z } from 'zod';
import {
  passwordResetCompleteSchema, passwordResetRequestSchema, passwordResetTokenSchema, type PasswordResetDetails,
} from '../../../shared/schemas/auth.js';
import type { AppDeps } from '../../common/deps.js';
import { publicBaseUrl } from '../../common/public-url.js';
import { defineRoute, type RouteSpec } from '../../common/routes.js';
import type { SignInDelay } from '../../common/sign-in-delay.js';
import { completePasswordReset, findUsableReset, requestPasswordReset } from './password-reset.service.js';

const tokenParams = z.strictObject({ token: passwordResetTokenSchema });

export const RESET_REQUESTED = 'if an active account has this e-mail, a link to set a new password is on its way; it works once, for an hour';

/** Password reset by e-mail: ask for a link, read what a link is for, set the new password. */
export function passwordResetRoutes({ dataSource, mailer, config }: AppDeps, limit: RequestHandler, delay: SignInDelay | null): RouteSpec[] {
  return [
    defineRoute({
      method: 'post', path: '', access: 'public', body: passwordResetRequestSchema, before: [limit],
      handler: ({ body, req, res }) => {
        const baseUrl = publicBaseUrl(config, req);
        // Answered before the lookup and the mail, so neither the reply nor its timing says whether the account exists.
        res.status(202).json({ message: RESET_REQUESTED });
        requestPasswordReset(dataSource, mailer, body.email, baseUrl).catch((err: unknown) => console.error('[password-reset]', err));
      },
    }),
    defineRoute({
      method: 'get', path: '/:token', access: 'public', params: tokenParams, before: [limit],
      handler: async ({ params, res }) => {
        const reset = await findUsableReset(dataSource, params.token);
        const details: PasswordResetDetails = { email: reset.user.email, expiresAt: reset.expiresAt.toISOString() };
        res.json(details);
      },
    }),
    defineRoute({
      method: 'post', path: '/complete', access: 'public', body: passwordResetCompleteSchema, before: [limit],
      handler: async ({ body, res }) => {
        const user = await completePasswordReset(dataSource, body);
        delay?.succeeded(user.email);
        res.json({ message: 'your password is set; sign in with it' });
      },
    }),
  ];
}
