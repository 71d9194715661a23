import { z } from 'zod';
import { idParamSchema } from '../../../shared/schemas/common.js';
import { STOCK_CSV_COLUMNS, stockListQuerySchema, stockPartPatchSchema, stockPartSchema } from '../../../shared/schemas/stock.js';
import { readCsv } from '../../common/csv.js';
import { streamCsv, type CsvValue } from '../../common/csv-write.js';
import type { StockPart } from '../../entities/StockPart.js';
import type { AppDeps } from '../../common/deps.js';
import { defineRoute, type RouteSpec } from '../../common/routes.js';
import { ROLE_GROUPS } from '../../../shared/schemas/roles.js';
import { csvUpload } from '../../common/upload.js';
import { previewStockCsv, stockCsvRow } from './stock.csv.js';
import { createStockPart, deleteStockPart, importStock, listStock, stockInPages, stockPreviewShelf, updateStockPart } from './stock.service.js';
import type { StockImportOutcome, StockPreview } from '../../../shared/schemas/stock-views.js';

async function* rowsOf(pages: AsyncIterable<StockPart[]>): AsyncGenerator<CsvValue[][]> {
  for await (const page of pages) yield page.map(stockCsvRow);
}
const importQuery = z.strictObject({
  mode: z.enum(['preview', 'all', 'valid-only'], { error: 'mode must be preview, all or valid-only' }).default('preview'),
  duplicates: z.enum(['new-line', 'add-quantity'], { error: 'duplicates must be new-line or add-quantity' }).default('new-line'),
});

export function stockRoutes({ dataSource }: AppDeps): RouteSpec[] {
  return [
    defineRoute({
      method: 'get', path: '', access: ROLE_GROUPS.everyone, query: stockListQuerySchema,
      handler: async ({ query, res }) => { res.json(await listStock(dataSource, query)); },
    }),
    defineRoute({
      method: 'get', path: '/export.csv', access: ROLE_GROUPS.everyone,
      handler: async ({ res }) => {
        res.type('text/csv').attachment('tallyvolt-stock.csv');
        try {
          await streamCsv(res, STOCK_CSV_COLUMNS, rowsOf(stockInPages(dataSource)));
        } catch (err) {
          // Once rows are on their way the status is sent; a cut connection is all the reader can be told.
          if (!res.headersSent) throw err;
          console.error('[error] stock download stopped', err);
          res.destroy();
        }
      },
    }),
    defineRoute({
      method: 'post', path: '', access: ROLE_GROUPS.stockKeepers, body: stockPartSchema,
      handler: async ({ body, user, res }) => { res.status(201).json({ part: await createStockPart(dataSource, user, body) }); },
    }),
    defineRoute({
      method: 'patch', path: '/:id', access: ROLE_GROUPS.stockKeepers, params: idParamSchema, body: stockPartPatchSchema,
      handler: async ({ params, body, user, res }) => { res.json({ part: await updateStockPart(dataSource, user, params.id, body) }); },
    }),
    defineRoute({
      method: 'delete', path: '/:id', access: ROLE_GROUPS.stockKeepers, params: idParamSchema,
      handler: async ({ params, user, res }) => { await deleteStockPart(dataSource, user, params.id); res.status(204).end(); },
    }),
    defineRoute({
      method: 'post', path: '/import', access: ROLE_GROUPS.stockKeepers, query: importQuery, before: [csvUpload],
      handler: async ({ query, user, req, res }) => {
        const checked = previewStockCsv(readCsv(req.file!.buffer));
        if (query.mode === 'preview') {
          const preview: StockPreview = { ...checked, ...(await stockPreviewShelf(dataSource, checked.rows)) };
          res.json(preview);
          return;
        }
        const { imported, addedTo } = await importStock(dataSource, user, checked, query.mode === 'valid-only', query.duplicates);
        const outcome: StockImportOutcome = { imported, addedTo, skipped: checked.invalidCount, problems: checked.problems };
        res.status(201).json(outcome);
      },
    }),
  ];
}
