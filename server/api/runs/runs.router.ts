import { z } from 'zod';
import { idParamSchema } from '../../../shared/schemas/common.js';
import { uncertaintyStudyRequestSchema } from '../../../shared/schemas/runs.js';
import type { AppDeps } from '../../common/deps.js';
import { defineRoute, type RouteSpec } from '../../common/routes.js';
import { ROLE_GROUPS } from '../../../shared/schemas/roles.js';
import { DEFAULT_COVERAGE_PROBABILITY, DEFAULT_GRID_POINTS } from '../../../shared/schemas/study-defaults.js';
import { getRevision } from '../revisions/revisions.service.js';
import { currentRunHash } from '../margin/margin.service.js';
import { toRunView } from './runs.mapper.js';
import type { RunScheduler } from './run-scheduler.js';
import { cancelRun, channelsHash, getRun, listRuns, requestUncertaintyStudy } from './runs.service.js';

const studyBody = uncertaintyStudyRequestSchema.default({ coverageProbability: DEFAULT_COVERAGE_PROBABILITY, gridPoints: DEFAULT_GRID_POINTS });
const noQuery = z.strictObject({});

/** Studies of a revision (under /api/revisions) and runs by id (under /api/runs). */
export function revisionStudiesRoutes({ dataSource }: AppDeps, scheduler: RunScheduler): RouteSpec[] {
  return [
    defineRoute({
      method: 'post', path: '/:id/studies', access: ROLE_GROUPS.designWriters, params: idParamSchema, body: studyBody,
      handler: async ({ params, body, user, res }) => {
        const run = await requestUncertaintyStudy(dataSource, scheduler, user, params.id, body);
        res.status(202).json({ run: toRunView(run, 0) });
      },
    }),
    defineRoute({
      method: 'get', path: '/:id/studies', access: ROLE_GROUPS.everyone, params: idParamSchema, query: noQuery,
      handler: async ({ params, res }) => {
        const revision = await getRevision(dataSource, params.id);
        const hash = channelsHash(revision.channels);
        const runs = await listRuns(dataSource, params.id, 'uncertainty');
        res.json({ items: runs.map((r) => toRunView(r, scheduler.liveProgress(r.id), hash)) });
      },
    }),
  ];
}

export function runsRoutes({ dataSource }: AppDeps, scheduler: RunScheduler): RouteSpec[] {
  return [
    defineRoute({
      method: 'get', path: '/:id', access: ROLE_GROUPS.everyone, params: idParamSchema,
      handler: async ({ params, res }) => {
        const run = await getRun(dataSource, params.id);
        const revision = await getRevision(dataSource, run.revisionId);
        res.json({ run: toRunView(run, scheduler.liveProgress(run.id), await currentRunHash(dataSource, revision, run.kind)) });
      },
    }),
    defineRoute({
      method: 'post', path: '/:id/cancel', access: ROLE_GROUPS.marginRunners, params: idParamSchema,
      handler: async ({ params, user, res }) => {
        await cancelRun(dataSource, scheduler, user, params.id);
        res.status(202).json({ ok: true });
      },
    }),
  ];
}
