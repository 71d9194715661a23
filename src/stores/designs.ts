import { reactive, ref } from 'vue';
import { defineStore } from 'pinia';
import { designsApi, type DesignDetail, type DesignListQuery, type DesignRow } from '@/services/designs';
import type { DesignCreateBody, DesignPatchBody } from '@shared/schemas/designs';

export const useDesignsStore = defineStore('designs', () => {
  const items = ref<DesignRow[]>([]);
  const total = ref(0);
  const loading = ref(false);
  const query = reactive<DesignListQuery>({ search: '', sort: 'updatedAt', order: 'desc', page: 1, pageSize: 20 });
  /** The design open on the design page. */
  const current = ref<DesignDetail | null>(null);
  let listTicket = 0;

  async function load(): Promise<void> {
    const ticket = ++listTicket;
    loading.value = true;
    try {
      const list = await designsApi.list({ ...query, search: query.search?.trim() || undefined });
      // A slower earlier answer must not overwrite a later search.
      if (ticket !== listTicket) return;
      items.value = list.items;
      total.value = list.total;
    } finally {
      if (ticket === listTicket) loading.value = false;
    }
  }

  async function create(body: DesignCreateBody): Promise<DesignDetail> {
    const design = await designsApi.create(body);
    current.value = design;
    return design;
  }

  async function open(id: number): Promise<DesignDetail> {
    if (current.value?.id !== id) current.value = null;
    current.value = await designsApi.get(id);
    return current.value;
  }

  async function update(id: number, patch: DesignPatchBody): Promise<DesignDetail> {
    current.value = await designsApi.update(id, patch);
    return current.value;
  }

  /** Starts the next revision from `fromRevisionId` and refreshes the open design. */
  async function startRevision(designId: number, fromRevisionId: number) {
    const revision = await designsApi.startRevision(designId, fromRevisionId);
    await open(designId);
    return revision;
  }

  return { items, total, loading, query, current, load, create, open, update, startRevision };
});
