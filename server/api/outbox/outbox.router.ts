import { listQuerySchema } from '../../../shared/schemas/common.js';
import type { AppDeps } from '../../common/deps.js';
import { defineRoute, type RouteSpec } from '../../common/routes.js';
import { ROLE_GROUPS } from '../../../shared/schemas/roles.js';
import { listOutbox } from './outbox.service.js';
import { isoTime } from '../../common/iso-time.js';
import type { OutboxList } from '../../../shared/schemas/admin-views.js';

export function outboxRoutes({ dataSource }: AppDeps): RouteSpec[] {
  return [
    defineRoute({
      method: 'get', path: '', access: ROLE_GROUPS.administrators, query: listQuerySchema,
      handler: async ({ query, res }) => {
        const { items, total } = await listOutbox(dataSource, query.page, query.pageSize);
        const list: OutboxList = {
          items: items.map((m) => ({ id: m.id, to: m.to, from: m.from, subject: m.subject, receivedAt: isoTime(m.receivedAt), text: m.text, html: m.html })),
          total,
        };
        res.json(list);
      },
    }),
  ];
}
