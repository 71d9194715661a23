import { reactive, ref } from 'vue';
import { defineStore } from 'pinia';
import { stockApi, type StockListQuery, type StockPart } from '@/services/stock';
import type { StockPartBody } from '@shared/schemas/stock';

/** The finder reads at most this many parts: the API's largest page. */
const FINDER_PAGE_SIZE = 200;

export const useStockStore = defineStore('stock', () => {
  const items = ref<StockPart[]>([]);
  const total = ref(0);
  const loading = ref(false);
  const query = reactive<StockListQuery>({ search: '', sort: 'ohms', order: 'asc', page: 1, pageSize: 25 });
  let ticket = 0;

  async function load(): Promise<void> {
    const mine = ++ticket;
    loading.value = true;
    try {
      const list = await stockApi.list({ ...query, search: query.search?.trim() || undefined });
      if (mine !== ticket) return;
      items.value = list.items;
      total.value = list.total;
    } finally {
      if (mine === ticket) loading.value = false;
    }
  }

  /** Every part on hand (up to 200), for the divider finder. */
  async function loadAll(): Promise<StockPart[]> {
    const list = await stockApi.list({ sort: 'ohms', order: 'asc', page: 1, pageSize: FINDER_PAGE_SIZE });
    return list.items;
  }

  async function create(part: StockPartBody): Promise<StockPart> {
    const created = await stockApi.create(part);
    await load();
    return created;
  }

  async function update(id: number, patch: Partial<StockPartBody>): Promise<StockPart> {
    const updated = await stockApi.update(id, patch);
    items.value = items.value.map((item) => (item.id === id ? updated : item));
    return updated;
  }

  async function remove(id: number): Promise<void> {
    await stockApi.remove(id);
    await load();
  }

  return { items, total, loading, query, load, loadAll, create, update, remove };
});
