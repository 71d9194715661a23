import { z } from 'zod';
import type { AppDeps } from '../../common/deps.js';
import { defineRoute, type RouteSpec } from '../../common/routes.js';
import { getSeries, listSeries } from './series.service.js';

const nameParams = z.strictObject({ name: z.string().regex(/^[Ee]\d{1,3}$/, { error: 'series name looks like E24' }) });

export function seriesRoutes({ dataSource }: AppDeps): RouteSpec[] {
  return [
    defineRoute({
      method: 'get', path: '', access: 'signed-in',
      handler: async ({ res }) => { res.json({ items: await listSeries(dataSource) }); },
    }),
    defineRoute({
      method: 'get', path: '/:name', access: 'signed-in', params: nameParams,
      handler: async ({ params, res }) => { res.json({ series: await getSeries(dataSource, params.name) }); },
    }),
  ];
}
