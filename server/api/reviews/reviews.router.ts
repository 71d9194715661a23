import { idParamSchema } from '../../../shared/schemas/common.js';
import { approveSchema, requestChangesSchema, reviewListQuerySchema } from '../../../shared/schemas/reviews.js';
import type { AppDeps } from '../../common/deps.js';
import { defineRoute, type RouteSpec } from '../../common/routes.js';
import { ROLE_GROUPS } from '../../../shared/schemas/roles.js';
import { toRevisionSummary } from '../designs/designs.mapper.js';
import { approvalCheck, decideReview, listReviews, reopenRevision, submitForReview } from './reviews.service.js';
import { publicBaseUrl } from '../../common/public-url.js';
import type { MailOutcome, ReviewRow, TransitionAnswer } from '../../../shared/schemas/review-views.js';
import type { Revision } from '../../entities/Revision.js';


/** Review transitions of a revision (mounted under /api/revisions). */
const answer = (revision: Revision, mail?: MailOutcome): TransitionAnswer => ({ revision: toRevisionSummary(revision), mail });

export function revisionReviewRoutes({ dataSource, mailer, config }: AppDeps): RouteSpec[] {
  return [
    defineRoute({
      method: 'post', path: '/:id/submit', access: ROLE_GROUPS.designWriters, params: idParamSchema,
      handler: async ({ params, user, req, res }) => {
        const { revision, mail } = await submitForReview(dataSource, mailer, user, params.id, publicBaseUrl(config, req));
        res.json(answer(revision, mail));
      },
    }),
    defineRoute({
      method: 'post', path: '/:id/approve', access: ROLE_GROUPS.reviewers, params: idParamSchema, body: approveSchema,
      handler: async ({ params, body, user, req, res }) => {
        const { revision, mail } = await decideReview(dataSource, mailer, user, params.id, 'approve', body, publicBaseUrl(config, req));
        res.json(answer(revision, mail));
      },
    }),
    defineRoute({
      method: 'post', path: '/:id/request-changes', access: ROLE_GROUPS.reviewers, params: idParamSchema, body: requestChangesSchema,
      handler: async ({ params, body, user, req, res }) => {
        const { revision, mail } = await decideReview(dataSource, mailer, user, params.id, 'request-changes', body, publicBaseUrl(config, req));
        res.json(answer(revision, mail));
      },
    }),
    defineRoute({
      method: 'get', path: '/:id/approval-check', access: ROLE_GROUPS.reviewers, params: idParamSchema,
      handler: async ({ params, user, res }) => { res.json(await approvalCheck(dataSource, user, params.id)); },
    }),
    defineRoute({
      method: 'post', path: '/:id/reopen', access: ROLE_GROUPS.designWriters, params: idParamSchema,
      handler: async ({ params, user, res }) => { res.json(answer(await reopenRevision(dataSource, user, params.id))); },
    }),
  ];
}

/** The leads' list of revisions waiting for (or past) review (mounted under /api/reviews). */
export function reviewsRoutes({ dataSource }: AppDeps): RouteSpec[] {
  return [
    defineRoute({
      method: 'get', path: '', access: ROLE_GROUPS.everyone, query: reviewListQuerySchema,
      handler: async ({ query, res }) => {
        const { items, total } = await listReviews(dataSource, query);
        const rows: ReviewRow[] = items.map((i) => ({
          ...i,
          revision: toRevisionSummary(i.revision),
          design: { id: i.revision.design.id, name: i.revision.design.name, owner: { id: i.revision.design.owner.id, displayName: i.revision.design.owner.displayName } },
        }));
        res.json({ items: rows, total });
      },
    }),
  ];
}
