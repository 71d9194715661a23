import { http } from './http';
import type { ChannelDefinition } from '@shared/schemas/chain';
import type { HistoryEvent, RevisionDetail } from '@shared/schemas/design-views';

export type { HistoryEvent, RevisionChannel, RevisionDetail } from '@shared/schemas/design-views';

export interface ChannelsBody {
  channels: { key: string; definition: ChannelDefinition }[];
  note?: string;
  /** The revision version the channels were edited from. */
  baseVersion: number;
}

const path = (id: number) => `/api/revisions/${encodeURIComponent(id)}`;

export const revisionsApi = {
  get: (id: number) => http.get<{ revision: RevisionDetail }>(path(id)).then((r) => r.revision),
  saveChannels: (id: number, body: ChannelsBody) =>
    http.put<{ revision: RevisionDetail }>(`${path(id)}/channels`, body).then((r) => r.revision),
  history: (id: number) => http.get<{ items: HistoryEvent[] }>(`${path(id)}/history`).then((r) => r.items),
};
