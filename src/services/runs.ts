import { http } from './http';
import type { Run } from '@shared/schemas/run-views';
import type { RunState, UncertaintyStudyRequest } from '@shared/schemas/runs';

export type { RunState } from '@shared/schemas/runs';

export type { Run, StudyResult } from '@shared/schemas/run-views';

export type StudyRequest = Partial<UncertaintyStudyRequest>;

export const ACTIVE_RUN_STATES: readonly RunState[] = ['queued', 'running'];

export const runsApi = {
  start: (revisionId: number, request: StudyRequest) =>
    http.post<{ run: Run }>(`/api/revisions/${encodeURIComponent(revisionId)}/studies`, request).then((r) => r.run),
  list: (revisionId: number) =>
    http.get<{ items: Run[] }>(`/api/revisions/${encodeURIComponent(revisionId)}/studies`).then((r) => r.items),
  get: (id: number) => http.get<{ run: Run }>(`/api/runs/${encodeURIComponent(id)}`).then((r) => r.run),
  cancel: (id: number) => http.post<{ ok: boolean }>(`/api/runs/${encodeURIComponent(id)}/cancel`),
};
