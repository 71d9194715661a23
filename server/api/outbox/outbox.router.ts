import { listQuerySchema } from '../../../shared/schemas/common.js';
import type { AppDeps } from '../../common/deps.js';
import { defineRoute, type RouteSpec } from '../../common/routes.js';
import { listOutbox } from './outbox.service.js';
import { isoTime } from '../../common/iso-time.js';

export function outboxRoutes({ dataSource }: AppDeps): RouteSpec[] {
  return [
    defineRoute({
      method: 'get', path: '', access: ['admin'], query: listQuerySchema,
      handler: async ({ query, res }) => {
        const { items, total } = await listOutbox(dataSource, query.page, query.pageSize);
        res.json({
          items: items.map((m) => ({ ...m, receivedAt: isoTime(m.receivedAt) })),
          total,
        });
      },
    }),
  ];
}
