import { ref } from 'vue';
import { defineStore } from 'pinia';
import { isApiError } from '@/services/apiError';
import { runsApi, type Run, type StudyRequest } from '@/services/runs';
import { useRunTracker } from '@/composables/useRunTracker';

export const useStudyStore = defineStore('study', () => {
  const revisionId = ref<number | null>(null);
  /** False when the server has no studies yet (404). */
  const available = ref(true);
  const tracker = useRunTracker<Run, StudyRequest>(runsApi, revisionId);
  const { runs, run, active, open, start, cancel, stopPolling } = tracker;

  async function loadRuns(id: number): Promise<void> {
    if (revisionId.value !== id) tracker.reset();
    revisionId.value = id;
    try {
      runs.value = await runsApi.list(id);
      available.value = true;
    } catch (error) {
      if (isApiError(error) && error.status === 404) {
        available.value = false;
        return;
      }
      throw error;
    }
  }

  return { revisionId, runs, run, available, active, loadRuns, open, start, cancel, stopPolling };
});
