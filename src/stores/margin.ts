import { computed, ref } from 'vue';
import { defineStore } from 'pinia';
import type { MarginInputs, MarginInputsBody } from '@shared/schemas/margin';
import { marginApi, type MarginInputsView, type MarginRun, type MarginStudyStart } from '@/services/margin';
import { useRunTracker } from '@/composables/useRunTracker';

type NumberKeys = { [K in keyof MarginInputs]-?: MarginInputs[K] extends number | undefined ? K : never }[keyof MarginInputs];
/** The form's copy of the inputs: a number may be blank while someone types. */
export type MarginDraft = Omit<MarginInputs, NumberKeys> & { [K in NumberKeys]: number | undefined };

const snapshot = (draft: MarginDraft | null) => JSON.stringify(draft);

export const useMarginStore = defineStore('margin', () => {
  const revisionId = ref<number | null>(null);
  const view = ref<MarginInputsView | null>(null);
  const draft = ref<MarginDraft | null>(null);
  const saved = ref('');
  const tracker = useRunTracker<MarginRun, MarginStudyStart>({ get: marginApi.run, start: marginApi.start, cancel: marginApi.cancel }, revisionId);
  const { runs, run, active, open, start, cancel, stopPolling } = tracker;

  const dirty = computed(() => draft.value !== null && snapshot(draft.value) !== saved.value);

  function adopt(next: MarginInputsView): void {
    view.value = next;
    draft.value = structuredClone(next.inputs) as MarginDraft;
    saved.value = snapshot(draft.value);
  }

  async function load(id: number): Promise<void> {
    if (revisionId.value !== id) {
      tracker.reset();
      view.value = null;
      draft.value = null;
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
    adopt(await marginApi.saveInputs(revisionId.value, body, view.value?.version ?? 0));
    runs.value = await marginApi.list(revisionId.value);
    if (run.value) run.value = { ...run.value, current: runs.value.find((r) => r.id === run.value?.id)?.current };
  }

  function discard(): void {
    if (view.value) adopt(view.value);
  }

  return { revisionId, view, draft, runs, run, active, dirty, load, save, discard, open, start, cancel, stopPolling };
});
