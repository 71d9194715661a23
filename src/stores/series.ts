import { ref } from 'vue';
import { defineStore } from 'pinia';
import { seriesApi, type ResistorSeries } from '@/services/series';
import type { SeriesCreateBody } from '@shared/schemas/series';

/** The stored series (IEC 60063 and the team's own): the one source of preferred values for the finder. */
export const useSeriesStore = defineStore('series', () => {
  const items = ref<ResistorSeries[]>([]);
  const loaded = ref(false);

  async function load(): Promise<ResistorSeries[]> {
    items.value = await seriesApi.list();
    loaded.value = true;
    return items.value;
  }

  /** The list, read from the server the first time it is needed. */
  async function ensureLoaded(): Promise<ResistorSeries[]> {
    return loaded.value ? items.value : load();
  }

  const byName = (name: string): ResistorSeries | undefined => items.value.find((s) => s.name === name);

  async function create(body: SeriesCreateBody): Promise<ResistorSeries> {
    const created = await seriesApi.create(body);
    await load();
    return created;
  }

  async function remove(name: string): Promise<void> {
    await seriesApi.remove(name);
    await load();
  }

  return { items, loaded, load, ensureLoaded, byName, create, remove };
});
