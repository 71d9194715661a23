import { computed, ref } from 'vue';
import { useCalibrationStore } from '@/stores/calibration';
import type { KeptRow } from '@/utils/valueDifferences';
import type { DraftPoint } from './useCalibrationPointsDraft';
import { useSaveConflict } from './useSaveConflict';

const describe = (row: DraftPoint | undefined) => (row
  ? `${row.applied || '—'} V, ${row.frequency || '—'} Hz${row.counts ? `, ${row.counts} counts` : ''}${row.uncertainty ? `, u ${row.uncertainty} Hz` : ''}${row.excluded ? ' (excluded)' : ''}`
  : '—');

/**
 * A points save (or exclusion) refused because someone else changed the points first: reload theirs, list the
 * person's unsaved rows beside the saved ones by position, and put them back on request.
 */
export function useCalibrationPointsConflict(draft: { rows: { value: DraftPoint[] }; restore: (rows: DraftPoint[]) => void }) {
  const calibration = useCalibrationStore();
  const state = useSaveConflict<DraftPoint[]>();
  const reloading = ref(false);

  async function reloadTheirs(): Promise<void> {
    const id = calibration.session?.id;
    if (id === undefined) return;
    reloading.value = true;
    try {
      await state.reloadTheirs(draft.rows.value, draft.rows.value, () => calibration.open(id));
    } finally {
      reloading.value = false;
    }
  }

  const rows = computed<KeptRow[]>(() => {
    const kept = state.kept.value?.mine;
    if (!kept) return [];
    const now = draft.rows.value;
    return Array.from({ length: Math.max(kept.length, now.length) }, (_, i) => ({ label: `Point ${i + 1}`, mine: describe(kept[i]), theirs: describe(now[i]) }))
      .filter((r) => r.mine !== r.theirs);
  });

  // The points are saved as one table, so putting back restores the person's whole table (shown row by row first).
  function putBack(): void {
    const kept = state.putBack();
    if (kept) draft.restore(kept.mine);
  }

  return { conflict: state.conflict, kept: state.kept, rows, reloading, take: state.take, clear: state.clear,
    reloadTheirs, keepEditing: state.keepEditing, putBack, dismiss: state.dismiss };
}
