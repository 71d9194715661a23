import { z } from 'zod';
import { csvMappingSchema, MAX_POINTS_PER_SESSION, pointExclusionSchema, pointsReplaceSchema, sessionPatchSchema } from '../../../shared/schemas/calibration.js';
import { idParamSchema } from '../../../shared/schemas/common.js';
import { importableRows, readCsv } from '../../common/csv.js';
import type { AppDeps } from '../../common/deps.js';
import { BadRequestError } from '../../common/errors.js';
import { defineRoute, type RouteSpec } from '../../common/routes.js';
import { csvUpload } from '../../common/upload.js';
import { parseOrThrow } from '../../common/validation.js';
import { ROLE_GROUPS } from '../../../shared/schemas/roles.js';
import { calibrationOverview } from './calibration-overview.js';
import { toSessionDetail } from './calibration.mapper.js';
import { cHeader, jsonExport } from './firmware-export.js';
import { listRecords } from './calibration-records.js';
import { currentRecord, exportSource, shownAnalysis } from './session-export.js';
import { assertCsvWithinLimit, previewPointsCsv } from './points-csv.js';
import { analyseSession, completeSession, getSession, reopenSession, sessionChannel, setExclusion, updateSession, writePoints } from './sessions.service.js';
import { publicBaseUrl } from '../../common/public-url.js';

const importQuery = z.strictObject({
  mode: z.enum(['preview', 'all', 'valid-only'], { error: 'mode must be preview, all or valid-only' }).default('preview'),
});
const pointParams = z.strictObject({
  id: idParamSchema.shape.id,
  pointId: idParamSchema.shape.id,
});
/** Which frozen record to export; absent means the latest (or, for a draft, the fit computed now). */
const exportQuery = z.strictObject({
  record: z.coerce.number({ error: 'record must be a number' }).int({ error: 'record must be a whole number' })
    .positive({ error: 'record must be 1 or more' }).optional(),
});
const overviewQuery = z.strictObject({
  revisionId: z.coerce.number({ error: 'revisionId must be a number' }).int().positive(),
  channelKey: z.string().min(1, { error: 'channelKey is required' }).max(40),
});

/** Reads the `mapping` form field (JSON) of a points upload; absent means "tell me the columns first". */
function mappingOf(field: unknown) {
  if (field === undefined || field === '') return null;
  let value: unknown;
  try {
    value = JSON.parse(String(field));
  } catch {
    throw new BadRequestError('mapping is not valid JSON', { mapping: 'is not valid JSON' });
  }
  return parseOrThrow(csvMappingSchema, value, 'mapping');
}

export function calibrationRoutes({ dataSource, mailer, config }: AppDeps): RouteSpec[] {
  const detail = async (id: number) => {
    const session = await getSession(dataSource, id);
    const analysis = shownAnalysis(await analyseSession(dataSource, session), await currentRecord(dataSource, session));
    return toSessionDetail(session, analysis, await listRecords(dataSource, id));
  };
  return [
    defineRoute({
      method: 'get', path: '/overview', access: ROLE_GROUPS.everyone, query: overviewQuery,
      handler: async ({ query, res }) => { res.json(await calibrationOverview(dataSource, query.revisionId, query.channelKey)); },
    }),
    defineRoute({
      method: 'get', path: '/:id', access: ROLE_GROUPS.everyone, params: idParamSchema,
      handler: async ({ params, res }) => { res.json({ session: await detail(params.id) }); },
    }),
    defineRoute({
      method: 'patch', path: '/:id', access: ROLE_GROUPS.calibrators, params: idParamSchema, body: sessionPatchSchema,
      handler: async ({ params, body, user, res }) => {
        await updateSession(dataSource, user, params.id, body);
        res.json({ session: await detail(params.id) });
      },
    }),
    defineRoute({
      method: 'put', path: '/:id/points', access: ROLE_GROUPS.calibrators, params: idParamSchema, body: pointsReplaceSchema,
      handler: async ({ params, body, user, res }) => {
        await writePoints(dataSource, user, params.id, body.points, 'replace', body.baseVersion);
        res.json({ session: await detail(params.id) });
      },
    }),
    defineRoute({
      method: 'post', path: '/:id/points/import', access: ROLE_GROUPS.calibrators, params: idParamSchema, query: importQuery, before: [csvUpload],
      handler: async ({ params, query, user, req, res }) => {
        const mapping = mappingOf(req.body?.mapping);
        const session = await getSession(dataSource, params.id);
        const table = readCsv(req.file!.buffer, { maxRows: MAX_POINTS_PER_SESSION });
        assertCsvWithinLimit(table, req.file!.buffer, session.points.length);
        const preview = previewPointsCsv(table, mapping, (await sessionChannel(dataSource, session)).capture);
        if (query.mode === 'preview') {
          res.json(preview);
          return;
        }
        if (!mapping) throw new BadRequestError('choose which column holds what before importing', { mapping: 'is required to import' });
        const points = importableRows(preview.rows.map((r) => r.point), query.mode === 'valid-only');
        await writePoints(dataSource, user, params.id, points, 'append');
        res.status(201).json({ imported: points.length, skipped: preview.invalidCount, problems: preview.problems, session: await detail(params.id) });
      },
    }),
    defineRoute({
      method: 'patch', path: '/:id/points/:pointId', access: ROLE_GROUPS.calibrators, params: pointParams, body: pointExclusionSchema,
      handler: async ({ params, body, user, res }) => {
        const session = await getSession(dataSource, params.id);
        if (!session.points.some((p) => p.id === params.pointId)) throw new BadRequestError(`point ${params.pointId} is not part of session ${params.id}`);
        await setExclusion(dataSource, user, params.pointId, body.excluded, body.reason, body.baseVersion);
        res.json({ session: await detail(params.id) });
      },
    }),
    defineRoute({
      method: 'post', path: '/:id/complete', access: ROLE_GROUPS.calibrators, params: idParamSchema,
      handler: async ({ params, user, req, res }) => {
        const baseUrl = publicBaseUrl(config, req);
        await completeSession(dataSource, mailer, user, params.id, baseUrl);
        res.json({ session: await detail(params.id) });
      },
    }),
    defineRoute({
      method: 'post', path: '/:id/reopen', access: ROLE_GROUPS.calibrators, params: idParamSchema,
      handler: async ({ params, user, res }) => {
        await reopenSession(dataSource, user, params.id);
        res.json({ session: await detail(params.id) });
      },
    }),
    defineRoute({
      method: 'get', path: '/:id/export.h', access: ROLE_GROUPS.everyone, params: idParamSchema, query: exportQuery,
      handler: async ({ params, query, res }) => {
        const { ctx, fit, record } = await exportSource(dataSource, params.id, query.record);
        const name = `tallyvolt_${ctx.serialNumber}_${ctx.channelKey}${record ? `_r${record.sequence}` : ''}`.replace(/[^A-Za-z0-9_]+/g, '_').toLowerCase();
        res.type('text/x-c').attachment(`${name}.h`).send(cHeader(ctx, fit, record));
      },
    }),
    defineRoute({
      method: 'get', path: '/:id/export.json', access: ROLE_GROUPS.everyone, params: idParamSchema, query: exportQuery,
      handler: async ({ params, query, res }) => {
        const { ctx, fit, record } = await exportSource(dataSource, params.id, query.record);
        const name = `tallyvolt-${ctx.serialNumber}-${ctx.channelKey}${record ? `-r${record.sequence}` : ''}.json`;
        res.attachment(name.replace(/[^A-Za-z0-9_.-]+/g, '-')).json(jsonExport(ctx, fit, record));
      },
    }),
  ];
}
