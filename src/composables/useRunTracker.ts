import { computed, ref, type Ref } from 'vue';
import { ACTIVE_RUN_STATES } from '@/services/runs';
import type { RunState } from '@shared/schemas/runs';

const POLL_MS = 500;

interface TrackedRun {
  id: number;
  state: RunState;
  result?: unknown;
}

export interface RunApi<R extends TrackedRun, Q> {
  get(id: number): Promise<R>;
  start(revisionId: number, request: Q): Promise<R>;
  cancel(id: number): Promise<unknown>;
}

/**
 * One study on screen and the list beside it: open a run, start one, cancel it, and poll every half
 * second while it is queued or running. Shared by the uncertainty and margin study stores.
 */
export function useRunTracker<R extends TrackedRun, Q>(api: RunApi<R, Q>, revisionId: Ref<number | null>) {
  const runs = ref<R[]>([]) as Ref<R[]>;
  /** The run on screen, with its result once done. */
  const run = ref<R | null>(null) as Ref<R | null>;
  let timer: ReturnType<typeof setTimeout> | undefined;

  const active = computed(() => run.value !== null && ACTIVE_RUN_STATES.includes(run.value.state));

  function stopPolling(): void {
    clearTimeout(timer);
    timer = undefined;
  }

  async function refresh(): Promise<void> {
    if (!run.value) return;
    const next = await api.get(run.value.id);
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

  async function open(id: number): Promise<void> {
    stopPolling();
    run.value = await api.get(id);
    if (active.value) poll();
  }

  async function start(request: Q): Promise<R> {
    if (revisionId.value === null) throw new Error('no revision is open');
    const started = await api.start(revisionId.value, request);
    run.value = started;
    runs.value = [started, ...runs.value];
    poll();
    return started;
  }

  async function cancel(): Promise<void> {
    if (!run.value) return;
    await api.cancel(run.value.id);
    await refresh();
  }

  function reset(): void {
    stopPolling();
    run.value = null;
    runs.value = [];
  }

  return { runs, run, active, open, start, cancel, refresh, stopPolling, reset };
}
