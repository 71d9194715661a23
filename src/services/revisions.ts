import { http } from './http';
import type { ChannelDefinition } from '@shared/schemas/chain';
import type { PersonRef, RevisionSummary } from './designs';

export interface RevisionChannel {
  id: number;
  key: string;
  position: number;
  definition: ChannelDefinition;
}

export interface RevisionDetail extends RevisionSummary {
  design: { id: number; name: string; owner: PersonRef };
  channels: RevisionChannel[];
}

export interface HistoryEvent {
  id: number;
  actorId: number | null;
  action: string;
  subject: string;
  detail: unknown;
  at: string;
}

export interface ChannelsBody {
  channels: { key: string; definition: ChannelDefinition }[];
  note?: string;
}

const path = (id: number) => `/api/revisions/${encodeURIComponent(id)}`;

export const revisionsApi = {
  get: (id: number) => http.get<{ revision: RevisionDetail }>(path(id)).then((r) => r.revision),
  saveChannels: (id: number, body: ChannelsBody) =>
    http.put<{ revision: RevisionDetail }>(`${path(id)}/channels`, body).then((r) => r.revision),
  history: (id: number) => http.get<{ items: HistoryEvent[] }>(`${path(id)}/history`).then((r) => r.items),
};
