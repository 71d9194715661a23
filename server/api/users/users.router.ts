import { idParamSchema, listQuerySchema } from '../../../shared/schemas/common.js';
import { userPatchSchema } from '../../../shared/schemas/users.js';
import type { AppDeps } from '../../common/deps.js';
import { defineRoute, type RouteSpec } from '../../common/routes.js';
import { ROLE_GROUPS } from '../../../shared/schemas/roles.js';
import { toPublicUser } from './users.mapper.js';
import { listUsers, updateUser } from './users.service.js';

export function usersRoutes({ dataSource }: AppDeps): RouteSpec[] {
  return [
    defineRoute({
      method: 'get', path: '', access: ROLE_GROUPS.administrators, query: listQuerySchema,
      handler: async ({ query, res }) => {
        const { items, total } = await listUsers(dataSource, query.page, query.pageSize);
        res.json({ items: items.map(toPublicUser), total });
      },
    }),
    defineRoute({
      method: 'patch', path: '/:id', access: ROLE_GROUPS.administrators, params: idParamSchema, body: userPatchSchema,
      handler: async ({ params, body, user, res }) => {
        res.json({ user: toPublicUser(await updateUser(dataSource, user, params.id, body)) });
      },
    }),
  ];
}
