import { computed, ref, type Ref } from 'vue';
import { useCalibrationStore } from '@/stores/calibration';
import { applyDifferences, type KeptRow } from '@/utils/valueDifferences';
import type { DraftPoint } from './useCalibrationPointsDraft';
import { useSaveConflict } from './useSaveConflict';

/** A row's content without the table's own bookkeeping (row key, stored id), which differs between versions. */
type RowData = Omit<DraftPoint, 'key' | 'id'>;
const content = (rows: DraftPoint[]): RowData[] => rows.map(({ key: _key, id: _id, ...rest }) => rest);

const describe = (row: RowData | undefined) => (row
  ? `${row.applied || '—'} V, ${row.frequency || '—'} Hz${row.counts ? `, ${row.counts} counts` : ''}${row.uncertainty ? `, u ${row.uncertainty} Hz` : ''}${row.excluded ? ` (excluded: ${row.excludedReason})` : ''}`
  : '—');

interface PointsDraft {
  rows: Ref<DraftPoint[]>;
  savedRows: () => DraftPoint[];
  restore: (rows: DraftPoint[]) => void;
}

/**
 * A points save (or exclusion) refused because someone else changed the points first: reload theirs, list the
 * person's own changes point by point beside the saved points, and lay them over the saved points on request
 * (points are matched by position, as the table numbers them).
 */
export function useCalibrationPointsConflict(draft: PointsDraft) {
  const calibration = useCalibrationStore();
  const state = useSaveConflict<RowData[]>();
  const reloading = ref(false);

  async function reloadTheirs(): Promise<void> {
    const id = calibration.session?.id;
    if (id === undefined) return;
    reloading.value = true;
    try {
      await state.reloadTheirs(content(draft.savedRows()), content(draft.rows.value), () => calibration.open(id));
    } finally {
      reloading.value = false;
    }
  }

  const rows = computed<KeptRow[]>(() => {
    const kept = state.kept.value;
    if (!kept) return [];
    const now = content(draft.rows.value);
    const changed = [...new Set(state.edits.value.map((e) => Number(e.path.split('.')[0])))].sort((a, b) => a - b);
    return changed.map((i) => ({ label: `Point ${i + 1}`, mine: describe(kept.mine[i]), theirs: describe(now[i]) }));
  });

  function putBack(): void {
    const edits = state.edits.value;
    if (!state.putBack()) return;
    const merged = applyDifferences(content(draft.rows.value), edits);
    draft.restore(merged.map((row) => ({ key: 0, id: null, ...row })));
  }

  return { conflict: state.conflict, kept: state.kept, rows, reloading, take: state.take, clear: state.clear,
    reloadTheirs, keepEditing: state.keepEditing, putBack, dismiss: state.dismiss };
}
