import { http } from './http';
import { queryString } from '@/utils/queryString';
import type { ReviewListState, ReviewRow, TransitionAnswer } from '@shared/schemas/review-views';

export type { MailOutcome, ReviewListState, ReviewRow, TransitionAnswer } from '@shared/schemas/review-views';

const path = (id: number) => `/api/revisions/${encodeURIComponent(id)}`;

export const reviewsApi = {
  list: (query: { state: ReviewListState; page: number; pageSize: number }) =>
    http.get<{ items: ReviewRow[]; total: number }>(`/api/reviews?${queryString(query)}`),
  submit: (revisionId: number) => http.post<TransitionAnswer>(`${path(revisionId)}/submit`),
  approve: (revisionId: number, comment: string) => http.post<TransitionAnswer>(`${path(revisionId)}/approve`, { comment }),
  requestChanges: (revisionId: number, comment: string) =>
    http.post<TransitionAnswer>(`${path(revisionId)}/request-changes`, { comment }),
  reopen: (revisionId: number) => http.post<TransitionAnswer>(`${path(revisionId)}/reopen`),
};
