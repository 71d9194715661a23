import { inviteAcceptSchema, inviteCreateSchema, inviteTokenSchema } from '../../../shared/schemas/auth.js';
import { z } from 'zod';
import type { AppDeps } from '../../common/deps.js';
import { defineRoute, type RouteSpec } from '../../common/routes.js';
import { ROLE_GROUPS } from '../../../shared/schemas/roles.js';
import { toPublicUser } from '../users/users.mapper.js';
import { acceptInvite, createInvite, findUsableInvite } from './invites.service.js';
import { listPendingInvites, resendInvite, revokeInvite } from './invites-pending.service.js';
import { idParamSchema } from '../../../shared/schemas/common.js';
import type { RequestHandler } from 'express';
import { publicBaseUrl } from '../../common/public-url.js';
import type { Invite, InviteDetails } from '../../../shared/schemas/admin-views.js';

const tokenParams = z.strictObject({ token: inviteTokenSchema });

export function invitesRoutes({ dataSource, mailer, config }: AppDeps, limit: RequestHandler): RouteSpec[] {
  return [
    defineRoute({
      method: 'post', path: '', access: ROLE_GROUPS.administrators, body: inviteCreateSchema,
      handler: async ({ body, user, req, res }) => {
        const baseUrl = publicBaseUrl(config, req);
        const invite = await createInvite(dataSource, mailer, user, body, baseUrl);
        const view: Invite = { id: invite.id, email: invite.email, role: invite.role, expiresAt: invite.expiresAt.toISOString() };
        res.status(201).json({ invite: view });
      },
    }),
    defineRoute({
      method: 'get', path: '', access: ROLE_GROUPS.administrators,
      handler: async ({ res }) => { res.json({ items: await listPendingInvites(dataSource) }); },
    }),
    defineRoute({
      method: 'post', path: '/:id/resend', access: ROLE_GROUPS.administrators, params: idParamSchema,
      handler: async ({ params, user, req, res }) => {
        res.json({ invite: await resendInvite(dataSource, mailer, user, params.id, publicBaseUrl(config, req)) });
      },
    }),
    defineRoute({
      method: 'delete', path: '/:id', access: ROLE_GROUPS.administrators, params: idParamSchema,
      handler: async ({ params, user, res }) => { await revokeInvite(dataSource, user, params.id); res.status(204).end(); },
    }),
    defineRoute({
      method: 'post', path: '/accept', access: 'public', body: inviteAcceptSchema, before: [limit],
      handler: async ({ body, req, res }) => {
        const created = await acceptInvite(dataSource, body);
        await new Promise<void>((resolve, reject) => req.logIn(created, (err) => (err ? reject(err) : resolve())));
        res.status(201).json({ user: toPublicUser(created) });
      },
    }),
    defineRoute({
      method: 'get', path: '/:token', access: 'public', params: tokenParams, before: [limit],
      handler: async ({ params, res }) => {
        const invite = await findUsableInvite(dataSource, params.token);
        const details: InviteDetails = { email: invite.email, role: invite.role, expiresAt: invite.expiresAt.toISOString() };
        res.json(details);
      },
    }),
  ];
}
