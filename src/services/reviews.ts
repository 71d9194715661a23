import { http } from './http';
import { queryString } from '@/utils/queryString';
import type { MarginVerdict } from '@shared/schemas/margin';
import type { PersonRef, RevisionSummary } from './designs';

export type ReviewListState = 'in_review' | 'changes_requested' | 'approved' | 'all';

export interface ReviewRow {
  revision: RevisionSummary;
  design: { id: number; name: string; owner: PersonRef };
  submittedAt: string | null;
  submittedBy: { id: number | null; displayName: string | null } | null;
  lastEvent: { action: string; at: string; actor: { id: number | null; displayName: string | null } } | null;
  margin: { runId: number; verdict: MarginVerdict | null; failed: number } | null;
}

export interface MailOutcome {
  sent: string[];
  failed: string[];
}

export interface TransitionAnswer {
  revision: RevisionSummary;
  mail?: MailOutcome;
}

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
