import { computed, ref, type Ref } from 'vue';
import { marginInputsSchema } from '@shared/schemas/margin';
import { useApiErrors } from '@/composables/useApiErrors';
import { notify } from '@/composables/useNotices';
import { isApiError } from '@/services/apiError';
import { useMarginStore } from '@/stores/margin';
import { capitalise } from '@/utils/formatQuantity';

/**
 * Saving a revision's margin inputs: the shared schema checks them first, then the server; every refused
 * input gets its message beside its field (`errors`) and in one list (`problems`).
 */
export function useMarginInputsSave(invalidCount: Ref<number>) {
  const store = useMarginStore();
  const saving = useApiErrors({ inline: true });
  const errors = ref<Record<string, string>>({});
  const problems = computed(() => Object.entries(errors.value));

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
      notify.success('Margin inputs saved', 'Run the margin study again: earlier studies used the previous inputs.');
    } catch (error) {
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

  return { saving, errors, problems, save, discard };
}
