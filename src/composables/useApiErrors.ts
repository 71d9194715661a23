import { ref } from 'vue';
import { isApiError } from '@/services/apiError';
import { notify } from './useNotices';
import { capitalise } from '@/utils/formatQuantity';

export interface ApiErrorOptions {
  /** Show non-field errors in `formError` (beside the form) instead of a toast. */
  inline?: boolean;
  /** Field names the form can show; errors for any other field fall back to the message. */
  fields?: readonly string[];
}

/**
 * Runs a request for a page or form and sorts what goes wrong: field messages to `fieldErrors`
 * (shown beside their inputs), everything else to a toast or to `formError`.
 */
export function useApiErrors(options: ApiErrorOptions = {}) {
  const fieldErrors = ref<Record<string, string>>({});
  const formError = ref<string | null>(null);
  const busy = ref(false);

  function clearErrors(): void {
    fieldErrors.value = {};
    formError.value = null;
  }

  function report(error: unknown): void {
    if (isApiError(error)) {
      if (error.sessionExpired) return;
      const fields = error.fields ?? {};
      const shown = Object.keys(fields).filter((name) => !options.fields || options.fields.includes(name));
      if (shown.length > 0) {
        fieldErrors.value = Object.fromEntries(shown.map((name) => [name, capitalise(fields[name])]));
        if (shown.length === Object.keys(fields).length) return;
      }
      showMessage(error.message);
      return;
    }
    console.error(error);
    showMessage('Something went wrong in the page. Reload it and try again.');
  }

  function showMessage(raw: string): void {
    // The server writes terse lower-case sentences; people read them with a capital.
    const message = capitalise(raw);
    if (options.inline) formError.value = message;
    else notify.error('Could not finish that', message);
  }

  /** Resolves to the action's result, or to undefined after reporting its failure. */
  async function run<T>(action: () => Promise<T>): Promise<T | undefined> {
    busy.value = true;
    clearErrors();
    try {
      return await action();
    } catch (error) {
      report(error);
      return undefined;
    } finally {
      busy.value = false;
    }
  }

  return { fieldErrors, formError, busy, run, report, clearErrors };
}
