import { ref } from 'vue';
import { defineStore } from 'pinia';
import { reviewsApi, type ReviewListState, type ReviewRow } from '@/services/reviews';

export const useReviewsStore = defineStore('reviews', () => {
  const state = ref<ReviewListState>('in_review');
  const page = ref(1);
  const pageSize = ref(20);
  const items = ref<ReviewRow[]>([]);
  const total = ref(0);
  const loading = ref(false);

  async function load(): Promise<void> {
    loading.value = true;
    try {
      const answer = await reviewsApi.list({ state: state.value, page: page.value, pageSize: pageSize.value });
      items.value = answer.items;
      total.value = answer.total;
    } finally {
      loading.value = false;
    }
  }

  return { state, page, pageSize, items, total, loading, load };
});
