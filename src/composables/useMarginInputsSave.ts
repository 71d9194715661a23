import { computed, ref, watch, type Ref } from 'vue';
import { marginInputsSchema } from '@shared/schemas/margin';
import { useApiErrors } from '@/composables/useApiErrors';
import { notify } from '@/composables/useNotices';
import { isApiError } from '@/services/apiError';
import { useMarginStore, type MarginDraft } from '@/stores/margin';
import { capitalise } from '@/utils/formatQuantity';
import { applyDifferences, leafAt, plainValue, type KeptRow } from '@/utils/valueDifferences';
import { useSaveConflict } from './useSaveConflict';

// The form's own words for each input, so the kept-changes list reads like the form.
const INPUT_LABELS: Record<string, string> = {
  packMinV: 'Pack minimum', packMaxV: 'Pack maximum', closingThresholdPct: 'Closing threshold', requiredRatioPct: 'Required true ratio',
  maxStepV: 'Largest voltage step', prechargeOhm: 'Pre-charge resistance', prechargeTolerancePct: 'Pre-charge tolerance',
  linkCapacitanceF: 'Link capacitance', capacitanceTolerancePct: 'Capacitance tolerance', packChannelKey: 'Pack channel',
  linkChannelKey: 'Link channel', updateIntervalS: 'Update interval', consecutiveReadings: 'Consecutive readings', timeoutS: 'Timeout',
  plausibilityMarginPct: 'Plausibility margin', allowedProbability: 'Allowed probability', readingErrors: 'Reading errors',
  faults: 'Fault', leakagePaths: 'Leakage path',
};
function inputLabel(path: string): string {
  const [field, index, ...rest] = path.split('.');
  const name = INPUT_LABELS[field] ?? field;
  if (index === undefined) return name;
  return /^\d+$/.test(index) ? `${name} ${Number(index) + 1}${rest.length ? ` (${rest.join('.')})` : ''}` : `${name} (${[index, ...rest].join('.')})`;
}

/** A refused stale save of the margin inputs: who saved first, the person's kept values, and what to do with them. */
function useMarginInputsConflict() {
  const store = useMarginStore();
  const state = useSaveConflict<MarginDraft>();
  const reloading = ref(false);
  const reloadError = ref<string | null>(null);
  watch(() => store.revisionId, state.clear);

  async function reloadTheirs(): Promise<void> {
    if (store.revisionId === null || !store.draft || !store.view) return;
    const id = store.revisionId;
    const base = store.view.inputs as MarginDraft;
    reloading.value = true;
    reloadError.value = null;
    try {
      await state.reloadTheirs(base, store.draft, () => store.load(id));
    } catch (error) {
      reloadError.value = capitalise(error instanceof Error ? error.message : String(error));
    } finally {
      reloading.value = false;
    }
  }

  const rows = computed<KeptRow[]>(() => (state.kept.value && store.draft
    ? state.edits.value.map((d) => ({ label: inputLabel(d.path), mine: plainValue(d.mine, d.path), theirs: plainValue(leafAt(store.draft, d.path), d.path) }))
    : []));

  /** Lays the person's own changes over the inputs now loaded; the other person's changes elsewhere stay. */
  function putBack(): void {
    const edits = state.edits.value;
    if (state.putBack() && store.draft) store.draft = applyDifferences(store.draft, edits);
  }

  return { conflict: state.conflict, kept: state.kept, rows, reloading, reloadError, take: state.take, clear: state.clear,
    reloadTheirs, keepEditing: state.keepEditing, putBack, dismiss: state.dismiss };
}
export type MarginInputsConflict = ReturnType<typeof useMarginInputsConflict>;

/**
 * Saving a revision's margin inputs: the shared schema checks them first, then the server; every refused
 * input gets its message beside its field (`errors`) and in one list (`problems`).
 */
export function useMarginInputsSave(invalidCount: Ref<number>) {
  const store = useMarginStore();
  const saving = useApiErrors({ inline: true });
  const errors = ref<Record<string, string>>({});
  const problems = computed(() => Object.entries(errors.value));
  const conflict = useMarginInputsConflict();

  async function save() {
    saving.clearErrors();
    if (invalidCount.value > 0) {
      saving.formError.value = 'Some values do not read as a number; fix the fields marked in red first.';
      return;
    }
    const parsed = marginInputsSchema.safeParse(store.draft);
    if (!parsed.success) {
      errors.value = Object.fromEntries(parsed.error.issues.map((i) => [i.path.map(String).join('.') || 'inputs', capitalise(i.message)]));
      saving.formError.value = 'Some inputs are out of bounds; each is marked beside its field and listed here.';
      return;
    }
    errors.value = {};
    try {
      saving.busy.value = true;
      await store.save(parsed.data);
      conflict.clear();
      notify.success('Margin inputs saved', 'Run the margin study again: earlier studies used the previous inputs.');
    } catch (error) {
      if (conflict.take(error)) return;
      if (isApiError(error) && error.fields) {
        errors.value = Object.fromEntries(Object.entries(error.fields).map(([k, v]) => [k, capitalise(v)]));
        saving.formError.value = 'The server refused some inputs; each is marked beside its field.';
      } else saving.report(error);
    } finally {
      saving.busy.value = false;
    }
  }

  function discard() {
    store.discard();
    errors.value = {};
  }

  return { saving, errors, problems, save, discard, conflict };
}
