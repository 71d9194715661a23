import { http } from './http';
import type { ChannelStudy } from '@shared/propagation/channel-study';
import type { RunState, UncertaintyStudyRequest } from '@shared/schemas/runs';
import type { PersonRef } from './designs';

export type { RunState } from '@shared/schemas/runs';

/** What a finished uncertainty study holds: one engine study per channel. */
export interface StudyResult {
  channels: { key: string; name: string; study: ChannelStudy }[];
}

export interface Run {
  id: number;
  revisionId: number;
  kind: 'uncertainty' | 'margin';
  state: RunState;
  progress: number;
  seed: number;
  trials: number | null;
  adaptiveDigits: number | null;
  error: string | null;
  /** Whether the run used the revision's channels as they are now. */
  current?: boolean;
  requestedBy?: PersonRef;
  createdAt: string | null;
  startedAt: string | null;
  finishedAt: string | null;
  durationMs: number | null;
  result?: StudyResult;
}

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
