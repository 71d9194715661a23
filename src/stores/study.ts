import { computed, ref } from 'vue';
import { defineStore } from 'pinia';
import { isApiError } from '@/services/apiError';
import { ACTIVE_RUN_STATES, runsApi, type Run, type StudyRequest } from '@/services/runs';

const POLL_MS = 500;

export const useStudyStore = defineStore('study', () => {
  const revisionId = ref<number | null>(null);
  const runs = ref<Run[]>([]);
  /** The run on screen, with its result once done. */
  const run = ref<Run | null>(null);
  /** False when the server has no studies yet (404). */
  const available = ref(true);
  let timer: ReturnType<typeof setTimeout> | undefined;

  const active = computed(() => run.value !== null && ACTIVE_RUN_STATES.includes(run.value.state));

  async function loadRuns(id: number): Promise<void> {
    if (revisionId.value !== id) {
      stopPolling();
      run.value = null;
      runs.value = [];
    }
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

  /** Opens a run: the newest finished one when the page loads, or one picked from the list. */
  async function open(id: number): Promise<void> {
    stopPolling();
    run.value = await runsApi.get(id);
    if (active.value) poll();
  }

  async function start(request: StudyRequest): Promise<Run> {
    if (revisionId.value === null) throw new Error('no revision is open');
    const started = await runsApi.start(revisionId.value, request);
    run.value = started;
    runs.value = [started, ...runs.value];
    poll();
    return started;
  }

  async function cancel(): Promise<void> {
    if (!run.value) return;
    await runsApi.cancel(run.value.id);
    await refresh();
  }

  async function refresh(): Promise<void> {
    if (!run.value) return;
    const next = await runsApi.get(run.value.id);
    if (run.value?.id !== next.id) return;
    run.value = next;
    // The list holds summaries: keep its row in step without the (large) result.
    runs.value = runs.value.map((r) => (r.id === next.id ? { ...next, result: undefined } : r));
  }

  function poll(): void {
    stopPolling();
    timer = setTimeout(async () => {
      try {
        await refresh();
      } catch {
        // A missed poll is retried on the next tick; a lasting failure shows as a run that stops moving.
      }
      if (active.value) poll();
    }, POLL_MS);
  }

  function stopPolling(): void {
    clearTimeout(timer);
    timer = undefined;
  }

  return { revisionId, runs, run, available, active, loadRuns, open, start, cancel, stopPolling };
});
