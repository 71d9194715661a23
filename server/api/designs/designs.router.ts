import { idParamSchema } from '../../../shared/schemas/common.js';
import { designCreateSchema, designListQuerySchema, designPatchSchema, nextRevisionSchema } from '../../../shared/schemas/designs.js';
import type { AppDeps } from '../../common/deps.js';
import { defineRoute, type RouteSpec } from '../../common/routes.js';
import { ROLE_GROUPS } from '../../../shared/schemas/roles.js';
import { startNextRevision } from '../revisions/revisions.service.js';
import { toDesignDetail, toDesignRow, toRevisionDetail } from './designs.mapper.js';
import { createDesign, getDesign, listDesigns, updateDesign } from './designs.service.js';

export function designsRoutes({ dataSource }: AppDeps): RouteSpec[] {
  return [
    defineRoute({
      method: 'get', path: '', access: ROLE_GROUPS.everyone, query: designListQuerySchema,
      handler: async ({ query, res }) => {
        const { designs, total } = await listDesigns(dataSource, query);
        res.json({ items: designs.map(toDesignRow), total });
      },
    }),
    defineRoute({
      method: 'post', path: '', access: ROLE_GROUPS.designWriters, body: designCreateSchema,
      handler: async ({ body, user, res }) => { res.status(201).json({ design: toDesignDetail(await createDesign(dataSource, user, body)) }); },
    }),
    defineRoute({
      method: 'get', path: '/:id', access: ROLE_GROUPS.everyone, params: idParamSchema,
      handler: async ({ params, res }) => { res.json({ design: toDesignDetail(await getDesign(dataSource, params.id)) }); },
    }),
    defineRoute({
      method: 'patch', path: '/:id', access: ROLE_GROUPS.designWriters, params: idParamSchema, body: designPatchSchema,
      handler: async ({ params, body, user, res }) => { res.json({ design: toDesignDetail(await updateDesign(dataSource, user, params.id, body)) }); },
    }),
    defineRoute({
      method: 'post', path: '/:id/revisions', access: ROLE_GROUPS.designWriters, params: idParamSchema, body: nextRevisionSchema,
      handler: async ({ params, body, user, res }) => {
        res.status(201).json({ revision: toRevisionDetail(await startNextRevision(dataSource, user, params.id, body.fromRevisionId)) });
      },
    }),
  ];
}
