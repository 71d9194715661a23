import { http } from './http';
import { queryString } from '@/utils/queryString';
import type { BoardCreateBody, CalibrationState, SessionCreateBody } from '@shared/schemas/calibration';
import type { PersonRef } from './designs';
import type { SessionDetail } from './calibrations';

export interface SessionSummary {
  id: number;
  boardId: number;
  channelKey: string;
  state: CalibrationState;
  performedOn: string;
  ambientC: number;
  tester?: PersonRef;
  completedAt: string | null;
  createdAt: string;
  updatedAt: string;
}

export interface BoardRow {
  id: number;
  serialNumber: string;
  revisionId: number;
  revisionLetter: string;
  designId: number;
  designName: string;
  buildDate: string;
  note: string;
  createdAt: string;
  /** The newest session of each channel, by channel key. */
  latestByChannel: Record<string, SessionSummary>;
}

export interface BoardDetail extends BoardRow {
  sessions: SessionSummary[];
}

const path = (id: number) => `/api/boards/${encodeURIComponent(id)}`;

export const boardsApi = {
  list: (revisionId?: number) => http.get<{ items: BoardRow[]; total: number }>(`/api/boards?${queryString({ revisionId })}`),
  create: (body: BoardCreateBody) => http.post<{ board: BoardRow }>('/api/boards', body).then((r) => r.board),
  get: (id: number) => http.get<{ board: BoardDetail }>(path(id)).then((r) => r.board),
  createSession: (id: number, body: SessionCreateBody) =>
    http.post<{ session: SessionDetail }>(`${path(id)}/sessions`, body).then((r) => r.session),
};
