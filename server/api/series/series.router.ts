import { z } from 'zod';
import type { AppDeps } from '../../common/deps.js';
import { readCsv } from '../../common/csv.js';
import { defineRoute, type RouteSpec } from '../../common/routes.js';
import { ROLE_GROUPS } from '../../../shared/schemas/roles.js';
import { csvUpload } from '../../common/upload.js';
import { seriesCreateSchema, seriesImportQuerySchema, seriesNameParamsSchema, seriesValuesSchema } from '../../../shared/schemas/series.js';
import type { ResistorSeries as SeriesView, SeriesImportOutcome } from '../../../shared/schemas/series-views.js';
import type { ResistorSeries } from '../../entities/ResistorSeries.js';
import { previewSeriesCsv } from './series.csv.js';
import { createSeries, deleteSeries, getSeries, importSeries, listSeries, replaceSeriesValues } from './series.service.js';

const valuesBody = z.strictObject({ values: seriesValuesSchema });

const toSeriesView = (s: ResistorSeries): SeriesView => ({ name: s.name, valuesPerDecade: s.valuesPerDecade, values: s.values, standard: s.standard });

export function seriesRoutes({ dataSource }: AppDeps): RouteSpec[] {
  return [
    defineRoute({
      method: 'get', path: '', access: 'signed-in',
      handler: async ({ res }) => { res.json({ items: (await listSeries(dataSource)).map(toSeriesView) }); },
    }),
    defineRoute({
      method: 'post', path: '', access: ROLE_GROUPS.stockKeepers, body: seriesCreateSchema,
      handler: async ({ body, user, res }) => { res.status(201).json({ series: toSeriesView(await createSeries(dataSource, user!, body)) }); },
    }),
    defineRoute({
      method: 'post', path: '/import', access: ROLE_GROUPS.stockKeepers, query: seriesImportQuerySchema, before: [csvUpload],
      handler: async ({ query, user, req, res }) => {
        const preview = previewSeriesCsv(query.name, readCsv(req.file!.buffer));
        if (query.mode === 'preview') {
          res.json(preview);
          return;
        }
        const series = await importSeries(dataSource, user!, preview, query.mode === 'valid-only');
        const outcome: SeriesImportOutcome = { series: toSeriesView(series), imported: series.valuesPerDecade, skipped: preview.invalidCount, problems: preview.problems };
        res.status(201).json(outcome);
      },
    }),
    defineRoute({
      method: 'get', path: '/:name', access: 'signed-in', params: seriesNameParamsSchema,
      handler: async ({ params, res }) => { res.json({ series: toSeriesView(await getSeries(dataSource, params.name)) }); },
    }),
    defineRoute({
      method: 'put', path: '/:name', access: ROLE_GROUPS.stockKeepers, params: seriesNameParamsSchema, body: valuesBody,
      handler: async ({ params, body, user, res }) => { res.json({ series: toSeriesView(await replaceSeriesValues(dataSource, user!, params.name, body.values)) }); },
    }),
    defineRoute({
      method: 'delete', path: '/:name', access: ROLE_GROUPS.stockKeepers, params: seriesNameParamsSchema,
      handler: async ({ params, user, res }) => { await deleteSeries(dataSource, user!, params.name); res.status(204).end(); },
    }),
  ];
}
