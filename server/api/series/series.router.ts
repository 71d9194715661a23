import { z } from 'zod';
import type { AppDeps } from '../../common/deps.js';
import { defineRoute, type RouteSpec } from '../../common/routes.js';
import { getSeries, listSeries } from './series.service.js';
import type { ResistorSeries as SeriesView } from '../../../shared/schemas/admin-views.js';
import type { ResistorSeries } from '../../entities/ResistorSeries.js';

const nameParams = z.strictObject({ name: z.string().regex(/^[Ee]\d{1,3}$/, { error: 'series name looks like E24' }) });

const toSeriesView = (s: ResistorSeries): SeriesView => ({ name: s.name, valuesPerDecade: s.valuesPerDecade, values: s.values });

export function seriesRoutes({ dataSource }: AppDeps): RouteSpec[] {
  return [
    defineRoute({
      method: 'get', path: '', access: 'signed-in',
      handler: async ({ res }) => { res.json({ items: (await listSeries(dataSource)).map(toSeriesView) }); },
    }),
    defineRoute({
      method: 'get', path: '/:name', access: 'signed-in', params: nameParams,
      handler: async ({ params, res }) => { res.json({ series: toSeriesView(await getSeries(dataSource, params.name)) }); },
    }),
  ];
}
