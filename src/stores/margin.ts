import { computed, ref } from 'vue';
import { defineStore } from 'pinia';
import type { MarginInputs, MarginInputsBody } from '@shared/schemas/margin';
import { marginApi, type MarginInputsView, type MarginRun, type MarginStudyStart } from '@/services/margin';
import { ACTIVE_RUN_STATES } from '@/services/runs';

const POLL_MS = 500;

type NumberKeys = { [K in keyof MarginInputs]-?: MarginInputs[K] extends number | undefined ? K : never }[keyof MarginInputs];
/** The form's copy of the inputs: a number may be blank while someone types. */
export type MarginDraft = Omit<MarginInputs, NumberKeys> & { [K in NumberKeys]: number | undefined };

const snapshot = (draft: MarginDraft | null) => JSON.stringify(draft);

export const useMarginStore = defineStore('margin', () => {
  const revisionId = ref<number | null>(null);
  const view = ref<MarginInputsView | null>(null);
  const draft = ref<MarginDraft | null>(null);
  const saved = ref('');
  const runs = ref<MarginRun[]>([]);
  const run = ref<MarginRun | null>(null);
  let timer: ReturnType<typeof setTimeout> | undefined;

  const active = computed(() => run.value !== null && ACTIVE_RUN_STATES.includes(run.value.state));
  const dirty = computed(() => draft.value !== null && snapshot(draft.value) !== saved.value);

  function adopt(next: MarginInputsView): void {
    view.value = next;
    draft.value = structuredClone(next.inputs) as MarginDraft;
    saved.value = snapshot(draft.value);
  }

  async function load(id: number): Promise<void> {
    if (revisionId.value !== id) {
      stopPolling();
      view.value = null;
      draft.value = null;
      run.value = null;
      runs.value = [];
    }
    revisionId.value = id;
    const [inputs, list] = await Promise.all([marginApi.inputs(id), marginApi.list(id)]);
    adopt(inputs);
    runs.value = list;
    const latest = list.find((r) => r.state === 'done') ?? list[0];
    if (latest) await open(latest.id);
  }

  /** Sends the draft; throws the ApiError (400 with fields, 409 not a draft) for the page to show. */
  async function save(body: MarginInputsBody): Promise<void> {
    if (revisionId.value === null) throw new Error('no revision is open');
    adopt(await marginApi.saveInputs(revisionId.value, body));
    runs.value = await marginApi.list(revisionId.value);
    if (run.value) run.value = { ...run.value, current: runs.value.find((r) => r.id === run.value?.id)?.current };
  }

  function discard(): void {
    if (view.value) adopt(view.value);
  }

  async function open(id: number): Promise<void> {
    stopPolling();
    run.value = await marginApi.run(id);
    if (active.value) poll();
  }

  async function start(request: MarginStudyStart): Promise<MarginRun> {
    if (revisionId.value === null) throw new Error('no revision is open');
    const started = await marginApi.start(revisionId.value, request);
    run.value = started;
    runs.value = [started, ...runs.value];
    poll();
    return started;
  }

  async function cancel(): Promise<void> {
    if (!run.value) return;
    await marginApi.cancel(run.value.id);
    await refresh();
  }

  async function refresh(): Promise<void> {
    if (!run.value) return;
    const next = await marginApi.run(run.value.id);
    if (run.value?.id !== next.id) return;
    run.value = next;
    runs.value = runs.value.map((r) => (r.id === next.id ? { ...next, result: undefined } : r));
  }

  function poll(): void {
    stopPolling();
    timer = setTimeout(async () => {
      try {
        await refresh();
      } catch {
        // A missed poll is retried on the next tick.
      }
      if (active.value) poll();
    }, POLL_MS);
  }

  function stopPolling(): void {
    clearTimeout(timer);
    timer = undefined;
  }

  return { revisionId, view, draft, runs, run, active, dirty, load, save, discard, open, start, cancel, stopPolling };
});
