import { computed, ref } from 'vue';
import { defineStore } from 'pinia';
import { outboxApi, type OutboxMessage } from '@/services/outbox';

export const useOutboxStore = defineStore('outbox', () => {
  const items = ref<OutboxMessage[]>([]);
  const total = ref(0);
  const loading = ref(false);
  const selectedId = ref<number | null>(null);

  const selected = computed(() => items.value.find((item) => item.id === selectedId.value) ?? null);

  async function load(): Promise<void> {
    loading.value = true;
    try {
      const list = await outboxApi.list();
      // Newest first, whatever order the server keeps.
      items.value = [...list.items].sort((a, b) => b.receivedAt.localeCompare(a.receivedAt));
      total.value = list.total;
      // Open the newest message unless the one being read is still there.
      if (!selected.value) selectedId.value = items.value[0]?.id ?? null;
    } finally {
      loading.value = false;
    }
  }

  function select(id: number | null): void {
    selectedId.value = id;
  }

  return { items, total, loading, selectedId, selected, load, select };
});
