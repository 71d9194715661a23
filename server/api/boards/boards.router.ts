import { z } from 'zod';
import { boardCreateSchema, sessionCreateSchema } from '../../../shared/schemas/calibration.js';
import { idParamSchema } from '../../../shared/schemas/common.js';
import type { AppDeps } from '../../common/deps.js';
import { defineRoute, type RouteSpec } from '../../common/routes.js';
import { ROLE_GROUPS } from '../../../shared/schemas/roles.js';
import { toBoardView, toSessionDetail, toSessionSummary } from '../calibration/calibration.mapper.js';
import { createSession } from '../calibration/sessions.service.js';
import { createBoard, getBoard, listBoards, sessionsOfBoards } from './boards.service.js';

const listQuery = z.strictObject({
  revisionId: z.coerce.number({ error: 'revisionId must be a number' }).int().positive({ error: 'revisionId must be positive' }).optional(),
});

export function boardsRoutes({ dataSource }: AppDeps): RouteSpec[] {
  return [
    defineRoute({
      method: 'get', path: '', access: ROLE_GROUPS.everyone, query: listQuery,
      handler: async ({ query, res }) => {
        const boards = await listBoards(dataSource, query.revisionId);
        const sessions = await sessionsOfBoards(dataSource, boards.map((b) => b.id));
        res.json({ items: boards.map((b) => toBoardView(b, sessions)), total: boards.length });
      },
    }),
    defineRoute({
      method: 'post', path: '', access: ROLE_GROUPS.calibrators, body: boardCreateSchema,
      handler: async ({ body, user, res }) => { res.status(201).json({ board: toBoardView(await createBoard(dataSource, user, body), []) }); },
    }),
    defineRoute({
      method: 'get', path: '/:id', access: ROLE_GROUPS.everyone, params: idParamSchema,
      handler: async ({ params, res }) => {
        const board = await getBoard(dataSource, params.id);
        const sessions = await sessionsOfBoards(dataSource, [board.id]);
        res.json({ board: { ...toBoardView(board, sessions), sessions: sessions.map(toSessionSummary) } });
      },
    }),
    defineRoute({
      method: 'post', path: '/:id/sessions', access: ROLE_GROUPS.calibrators, params: idParamSchema, body: sessionCreateSchema,
      handler: async ({ params, body, user, res }) => {
        const session = await createSession(dataSource, user, params.id, body);
        res.status(201).json({ session: toSessionDetail(session, { fit: null, comparison: null, reason: 'no points yet' }) });
      },
    }),
  ];
}
