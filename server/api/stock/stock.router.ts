import { z } from 'zod';
import { idParamSchema } from '../../../shared/schemas/common.js';
import { stockListQuerySchema, stockPartPatchSchema, stockPartSchema } from '../../../shared/schemas/stock.js';
import { readCsv } from '../../common/csv.js';
import type { AppDeps } from '../../common/deps.js';
import { defineRoute, type RouteSpec } from '../../common/routes.js';
import { csvUpload } from '../../common/upload.js';
import { previewStockCsv, stockToCsv } from './stock.csv.js';
import { allStock, createStockPart, deleteStockPart, importStock, listStock, updateStockPart } from './stock.service.js';
import type { StockImportOutcome } from '../../../shared/schemas/stock-views.js';

const WRITERS = ['designer', 'admin'] as const;
const READERS = ['designer', 'admin', 'tester', 'lead'] as const;
const importQuery = z.strictObject({
  mode: z.enum(['preview', 'all', 'valid-only'], { error: 'mode must be preview, all or valid-only' }).default('preview'),
});

export function stockRoutes({ dataSource }: AppDeps): RouteSpec[] {
  return [
    defineRoute({
      method: 'get', path: '', access: READERS, query: stockListQuerySchema,
      handler: async ({ query, res }) => { res.json(await listStock(dataSource, query)); },
    }),
    defineRoute({
      method: 'get', path: '/export.csv', access: READERS,
      handler: async ({ res }) => {
        res.type('text/csv').attachment('tallyvolt-stock.csv').send(stockToCsv(await allStock(dataSource)));
      },
    }),
    defineRoute({
      method: 'post', path: '', access: WRITERS, body: stockPartSchema,
      handler: async ({ body, user, res }) => { res.status(201).json({ part: await createStockPart(dataSource, user!, body) }); },
    }),
    defineRoute({
      method: 'patch', path: '/:id', access: WRITERS, params: idParamSchema, body: stockPartPatchSchema,
      handler: async ({ params, body, user, res }) => { res.json({ part: await updateStockPart(dataSource, user!, params.id, body) }); },
    }),
    defineRoute({
      method: 'delete', path: '/:id', access: WRITERS, params: idParamSchema,
      handler: async ({ params, user, res }) => { await deleteStockPart(dataSource, user!, params.id); res.status(204).end(); },
    }),
    defineRoute({
      method: 'post', path: '/import', access: WRITERS, query: importQuery, before: [csvUpload],
      handler: async ({ query, user, req, res }) => {
        const preview = previewStockCsv(readCsv(req.file!.buffer));
        if (query.mode === 'preview') {
          res.json(preview);
          return;
        }
        const imported = await importStock(dataSource, user!, preview, query.mode === 'valid-only');
        const outcome: StockImportOutcome = { imported, skipped: preview.invalidCount, problems: preview.problems };
        res.status(201).json(outcome);
      },
    }),
  ];
}
