import { http } from './http';
import { queryString } from '@/utils/queryString';
import type { BoardCreateBody, SessionCreateBody } from '@shared/schemas/calibration';
import type { BoardDetail, BoardRow, SessionDetail } from '@shared/schemas/calibration-views';

export type { BoardDetail, BoardRow, SessionSummary } from '@shared/schemas/calibration-views';

const path = (id: number) => `/api/boards/${encodeURIComponent(id)}`;

export const boardsApi = {
  list: (revisionId?: number) => http.get<{ items: BoardRow[]; total: number }>(`/api/boards?${queryString({ revisionId })}`),
  create: (body: BoardCreateBody) => http.post<{ board: BoardRow }>('/api/boards', body).then((r) => r.board),
  get: (id: number) => http.get<{ board: BoardDetail }>(path(id)).then((r) => r.board),
  createSession: (id: number, body: SessionCreateBody) =>
    http.post<{ session: SessionDetail }>(`${path(id)}/sessions`, body).then((r) => r.session),
};
