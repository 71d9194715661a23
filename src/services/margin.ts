import { http } from './http';
import type { MarginInputsBody, MarginStudyRequest } from '@shared/schemas/margin';
import type { MarginInputsView, MarginRun } from '@shared/schemas/run-views';

export type { MarginInputs, MarginInputsBody, MarginStudyResult } from '@shared/schemas/margin';

export type { MarginInputsView, MarginRun } from '@shared/schemas/run-views';

export type MarginStudyStart = Partial<MarginStudyRequest>;

const path = (id: number) => `/api/revisions/${encodeURIComponent(id)}`;

export const marginApi = {
  inputs: (revisionId: number) => http.get<MarginInputsView>(`${path(revisionId)}/margin-inputs`),
  saveInputs: (revisionId: number, inputs: MarginInputsBody, baseVersion: number) =>
    http.put<MarginInputsView>(`${path(revisionId)}/margin-inputs`, { ...inputs, baseVersion }),
  start: (revisionId: number, request: MarginStudyStart) =>
    http.post<{ run: MarginRun }>(`${path(revisionId)}/margin-studies`, request).then((r) => r.run),
  list: (revisionId: number) => http.get<{ items: MarginRun[] }>(`${path(revisionId)}/margin-studies`).then((r) => r.items),
  run: (runId: number) => http.get<{ run: MarginRun }>(`/api/runs/${encodeURIComponent(runId)}`).then((r) => r.run),
  cancel: (runId: number) => http.post<{ ok: boolean }>(`/api/runs/${encodeURIComponent(runId)}/cancel`),
};
