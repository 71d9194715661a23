import { computed, ref, type Ref } from 'vue';
import { saveConflictOf, type SaveConflict } from '@/services/apiError';
import { valueDifferences } from '@/utils/valueDifferences';

/** What a person had when their save was refused: the version they started from and their unsaved copy. */
export interface KeptEdits<T> {
  base: T;
  mine: T;
}

// A plain copy: drafts are reactive, and reloading replaces them.
const plainCopy = <T>(value: T): T => JSON.parse(JSON.stringify(value)) as T;

/**
 * A save refused because someone else saved first: `conflict` holds who and when until the person chooses.
 * Loading their version keeps the person's starting point and unsaved copy in `kept`; `edits` are the
 * person's own changes (starting point → unsaved copy), which the page lists beside the saved values and can
 * lay over the new version, so the next save is based on it and keeps what the other person changed.
 */
export function useSaveConflict<T>() {
  const conflict = ref<SaveConflict | null>(null);
  const kept = ref(null) as Ref<KeptEdits<T> | null>;
  // Each edit's `mine` is the person's value and its `theirs` the value they started from.
  const edits = computed(() => (kept.value ? valueDifferences(kept.value.mine, kept.value.base) : []));

  /** True (and remembered) when the error is a stale-save refusal; anything else is the caller's to report. */
  function take(error: unknown): boolean {
    const found = saveConflictOf(error);
    if (found) conflict.value = found;
    return found !== null;
  }

  async function reloadTheirs(base: T, mine: T, reload: () => Promise<unknown>): Promise<void> {
    const copy = { base: plainCopy(base), mine: plainCopy(mine) };
    await reload();
    kept.value = copy;
    conflict.value = null;
  }

  const keepEditing = () => { conflict.value = null; };

  /** Hands back what was kept, once, to be applied over the version now loaded. */
  function putBack(): KeptEdits<T> | null {
    const values = kept.value;
    kept.value = null;
    return values;
  }

  const dismiss = () => { kept.value = null; };
  const clear = () => { conflict.value = null; kept.value = null; };

  return { conflict, kept, edits, take, reloadTheirs, keepEditing, putBack, dismiss, clear };
}
