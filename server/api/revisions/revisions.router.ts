import { idParamSchema } from '../../../shared/schemas/common.js';
import { revisionChannelsSchema } from '../../../shared/schemas/designs.js';
import type { AppDeps } from '../../common/deps.js';
import { defineRoute, type RouteSpec } from '../../common/routes.js';
import { ROLE_GROUPS } from '../../../shared/schemas/roles.js';
import { toRevisionDetail } from '../designs/designs.mapper.js';
import { getRevision, replaceChannels, revisionHistory } from './revisions.service.js';
import { isoTime } from '../../common/iso-time.js';
import type { HistoryEvent } from '../../../shared/schemas/design-views.js';

export function revisionsRoutes({ dataSource }: AppDeps): RouteSpec[] {
  return [
    defineRoute({
      method: 'get', path: '/:id', access: ROLE_GROUPS.everyone, params: idParamSchema,
      handler: async ({ params, res }) => { res.json({ revision: toRevisionDetail(await getRevision(dataSource, params.id)) }); },
    }),
    defineRoute({
      method: 'put', path: '/:id/channels', access: ROLE_GROUPS.designWriters, params: idParamSchema, body: revisionChannelsSchema,
      handler: async ({ params, body, user, res }) => {
        res.json({ revision: toRevisionDetail(await replaceChannels(dataSource, user, params.id, body)) });
      },
    }),
    defineRoute({
      method: 'get', path: '/:id/history', access: ROLE_GROUPS.everyone, params: idParamSchema,
      handler: async ({ params, res }) => {
        const events = await revisionHistory(dataSource, params.id);
        const items: HistoryEvent[] = events.map((e) => ({ ...e, at: isoTime(e.at) }));
        res.json({ items });
      },
    }),
  ];
}
