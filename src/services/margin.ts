import { http } from './http';
import type { MarginInputs, MarginInputsBody, MarginStudyRequest, MarginStudyResult } from '@shared/schemas/margin';
import type { Run } from './runs';

export type { MarginInputs, MarginInputsBody, MarginStudyResult } from '@shared/schemas/margin';

export interface MarginInputsView {
  inputs: MarginInputs;
  /** False while the revision still uses the defaults. */
  stored: boolean;
  /** Only a draft's inputs may change. */
  editable: boolean;
  updatedAt: string | null;
  updatedById: number | null;
}

/** A margin study run: the shared run fields with the margin result once done. */
export type MarginRun = Omit<Run, 'result' | 'kind'> & { kind: 'margin'; result?: MarginStudyResult };

export type MarginStudyStart = Partial<MarginStudyRequest>;

const path = (id: number) => `/api/revisions/${encodeURIComponent(id)}`;

export const marginApi = {
  inputs: (revisionId: number) => http.get<MarginInputsView>(`${path(revisionId)}/margin-inputs`),
  saveInputs: (revisionId: number, inputs: MarginInputsBody) => http.put<MarginInputsView>(`${path(revisionId)}/margin-inputs`, inputs),
  start: (revisionId: number, request: MarginStudyStart) =>
    http.post<{ run: MarginRun }>(`${path(revisionId)}/margin-studies`, request).then((r) => r.run),
  list: (revisionId: number) => http.get<{ items: MarginRun[] }>(`${path(revisionId)}/margin-studies`).then((r) => r.items),
  run: (runId: number) => http.get<{ run: MarginRun }>(`/api/runs/${encodeURIComponent(runId)}`).then((r) => r.run),
  cancel: (runId: number) => http.post<{ ok: boolean }>(`/api/runs/${encodeURIComponent(runId)}/cancel`),
};
