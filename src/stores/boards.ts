import { ref } from 'vue';
import { defineStore } from 'pinia';
import { boardsApi, type BoardDetail, type BoardRow } from '@/services/boards';
import { revisionsApi } from '@/services/revisions';
import type { BoardCreateBody, SessionCreateBody } from '@shared/schemas/calibration';
import type { SessionDetail } from '@/services/calibrations';

export interface ChannelName {
  key: string;
  name: string;
}

export const useBoardsStore = defineStore('boards', () => {
  const items = ref<BoardRow[]>([]);
  const total = ref(0);
  const loading = ref(false);
  /** Boards of one revision only; null lists every board. */
  const revisionId = ref<number | null>(null);
  const current = ref<BoardDetail | null>(null);
  /** Channel keys and names per revision id, read once per revision. */
  const channelsByRevision = ref<Record<number, ChannelName[]>>({});
  let ticket = 0;

  async function channelsOf(id: number): Promise<ChannelName[]> {
    const known = channelsByRevision.value[id];
    if (known) return known;
    const revision = await revisionsApi.get(id);
    const channels = revision.channels.map((c) => ({ key: c.key, name: c.definition.name }));
    channelsByRevision.value = { ...channelsByRevision.value, [id]: channels };
    return channels;
  }

  /** The channel's name as its revision calls it, or its key while the revision is not read yet. */
  function channelName(revision: number, key: string): string {
    return channelsByRevision.value[revision]?.find((c) => c.key === key)?.name ?? key;
  }

  async function load(): Promise<void> {
    const mine = ++ticket;
    loading.value = true;
    try {
      const list = await boardsApi.list(revisionId.value ?? undefined);
      if (mine !== ticket) return;
      items.value = list.items;
      total.value = list.total;
      await Promise.all([...new Set(list.items.map((b) => b.revisionId))].map(channelsOf));
    } finally {
      if (mine === ticket) loading.value = false;
    }
  }

  async function create(body: BoardCreateBody): Promise<BoardRow> {
    const board = await boardsApi.create(body);
    await load();
    return board;
  }

  async function open(id: number): Promise<BoardDetail> {
    const board = await boardsApi.get(id);
    await channelsOf(board.revisionId);
    current.value = board;
    return board;
  }

  async function startSession(boardId: number, body: SessionCreateBody): Promise<SessionDetail> {
    return boardsApi.createSession(boardId, body);
  }

  return { items, total, loading, revisionId, current, channelsByRevision, load, create, open, channelsOf, channelName, startSession };
});
