import { http } from './http';
import { queryString } from '@/utils/queryString';
import type { ApprovalCheck, ReviewListState, ReviewRow, TransitionAnswer } from '@shared/schemas/review-views';
import type { ApproveBody } from '@shared/schemas/reviews';

export type { ApprovalCheck, FailingCheck, MailOutcome, ReviewListState, ReviewRow, TransitionAnswer } from '@shared/schemas/review-views';

const path = (id: number) => `/api/revisions/${encodeURIComponent(id)}`;

export const reviewsApi = {
  list: (query: { state: ReviewListState; page: number; pageSize: number }) =>
    http.get<{ items: ReviewRow[]; total: number }>(`/api/reviews?${queryString(query)}`),
  submit: (revisionId: number) => http.post<TransitionAnswer>(`${path(revisionId)}/submit`),
  approvalCheck: (revisionId: number) => http.get<ApprovalCheck>(`${path(revisionId)}/approval-check`),
  approve: (revisionId: number, body: ApproveBody) => http.post<TransitionAnswer>(`${path(revisionId)}/approve`, body),
  requestChanges: (revisionId: number, comment: string) =>
    http.post<TransitionAnswer>(`${path(revisionId)}/request-changes`, { comment }),
  reopen: (revisionId: number) => http.post<TransitionAnswer>(`${path(revisionId)}/reopen`),
};
