import { z } from 'zod';
import { idParamSchema } from '../../../shared/schemas/common.js';
import { marginStudyRequestSchema } from '../../../shared/schemas/margin.js';
import { marginInputsSaveSchema } from '../../../shared/schemas/margin-inputs-save.js';
import type { AppDeps } from '../../common/deps.js';
import { defineRoute, type RouteSpec } from '../../common/routes.js';
import { ROLE_GROUPS } from '../../../shared/schemas/roles.js';
import { MARGIN_TRIAL_DEFAULTS } from '../../../shared/schemas/study-defaults.js';
import { getRevision } from '../revisions/revisions.service.js';
import { toRunView } from '../runs/runs.mapper.js';
import { listRuns } from '../runs/runs.service.js';
import { currentRunHash, marginInputsOf, requestMarginStudy, saveMarginInputs, type StoredMarginInputs } from './margin.service.js';
import { isoTime } from '../../common/iso-time.js';
import type { MarginInputsView } from '../../../shared/schemas/run-views.js';

const noQuery = z.strictObject({});

const inputsView = (s: StoredMarginInputs, editable: boolean): MarginInputsView => ({
  inputs: s.inputs, stored: s.stored, editable, updatedAt: s.updatedAt ? isoTime(s.updatedAt) : null, updatedById: s.updatedById,
  version: s.version, updatedBy: s.updatedBy ? { id: s.updatedBy.id, displayName: s.updatedBy.displayName } : null,
});

/** Margin inputs and margin studies of a revision (mounted under /api/revisions). */
export function marginRoutes({ dataSource, scheduler }: AppDeps): RouteSpec[] {
  return [
    defineRoute({
      method: 'get', path: '/:id/margin-inputs', access: ROLE_GROUPS.everyone, params: idParamSchema,
      handler: async ({ params, res }) => {
        const revision = await getRevision(dataSource, params.id);
        res.json(inputsView(await marginInputsOf(dataSource, params.id), revision.state === 'draft'));
      },
    }),
    defineRoute({
      method: 'put', path: '/:id/margin-inputs', access: ROLE_GROUPS.designWriters, params: idParamSchema, body: marginInputsSaveSchema,
      handler: async ({ params, body, user, res }) => {
        const { baseVersion, ...inputs } = body;
        res.json(inputsView(await saveMarginInputs(dataSource, user, params.id, inputs, baseVersion), true));
      },
    }),
    defineRoute({
      method: 'post', path: '/:id/margin-studies', access: ROLE_GROUPS.marginRunners, params: idParamSchema, body: marginStudyRequestSchema.default(MARGIN_TRIAL_DEFAULTS),
      handler: async ({ params, body, user, res }) => {
        const run = await requestMarginStudy(dataSource, scheduler, user, params.id, body);
        res.status(202).json({ run: { ...toRunView(run, 0), inputs: undefined } });
      },
    }),
    defineRoute({
      method: 'get', path: '/:id/margin-studies', access: ROLE_GROUPS.everyone, params: idParamSchema, query: noQuery,
      handler: async ({ params, res }) => {
        const revision = await getRevision(dataSource, params.id);
        const hash = await currentRunHash(dataSource, revision, 'margin');
        const runs = await listRuns(dataSource, params.id, 'margin');
        res.json({ items: runs.map((r) => toRunView(r, scheduler.liveProgress(r.id), hash)) });
      },
    }),
  ];
}
