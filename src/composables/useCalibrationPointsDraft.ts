import { computed, ref, watch, type Ref } from 'vue';
import { parseEngineering } from '@shared/units';
import { calibrationPointSchema } from '@shared/schemas/calibration';
import type { PointWrite, StoredPoint } from '@/services/calibrations';
import { capitalise } from '@/utils/formatQuantity';

/** The editable columns of the points table, as the person types them. */
export const DRAFT_FIELDS = ['applied', 'frequency', 'counts', 'uncertainty'] as const;
export type DraftField = (typeof DRAFT_FIELDS)[number];

export interface DraftPoint {
  key: number;
  /** The stored point this row came from; null for a row added since the last save. */
  id: number | null;
  applied: string;
  frequency: string;
  counts: string;
  uncertainty: string;
  excluded: boolean;
  excludedReason: string;
}

const BODY_FIELD: Record<DraftField, keyof PointWrite> = {
  applied: 'appliedV', frequency: 'frequencyHz', counts: 'counts', uncertainty: 'uncertaintyHz',
};
const UNIT: Record<DraftField, string> = { applied: 'V', frequency: 'Hz', counts: '', uncertainty: 'Hz' };
const LABEL: Record<DraftField, string> = {
  applied: 'applied voltage', frequency: 'frequency', counts: 'counts', uncertainty: 'standard uncertainty',
};

const text = (value: number | null) => (value === null ? '' : String(value));

function readNumber(field: DraftField, raw: string): number | null {
  const body = raw.trim();
  if (body === '') return null;
  try {
    return parseEngineering(body.endsWith(UNIT[field]) && UNIT[field] ? body.slice(0, -UNIT[field].length).trim() : body, UNIT[field]);
  } catch {
    throw new Error(`${LABEL[field]} "${body}" is not a number`);
  }
}

/**
 * The points table's working copy: rows typed as text, checked cell by cell with the same schema the
 * server uses, sent whole on save. Re-reads the stored points whenever the session changes under it.
 */
export function useCalibrationPointsDraft(stored: Ref<StoredPoint[]>) {
  const rows = ref<DraftPoint[]>([]);
  let nextKey = 1;

  const fromStored = (p: StoredPoint): DraftPoint => ({
    key: nextKey++, id: p.id, applied: text(p.appliedV), frequency: text(p.frequencyHz), counts: text(p.counts),
    uncertainty: text(p.uncertaintyHz), excluded: p.excluded, excludedReason: p.excludedReason,
  });
  const reset = () => { rows.value = stored.value.map(fromStored); };
  watch(stored, reset, { immediate: true });

  function check(row: DraftPoint): { body: PointWrite | null; errors: Partial<Record<DraftField, string>> } {
    const errors: Partial<Record<DraftField, string>> = {};
    const values: Partial<Record<DraftField, number | null>> = {};
    for (const field of DRAFT_FIELDS) {
      try {
        values[field] = readNumber(field, row[field]);
      } catch (error) {
        errors[field] = capitalise((error as Error).message);
      }
    }
    if (values.applied === null) errors.applied ??= 'Applied voltage is required';
    if (values.frequency === null) errors.frequency ??= 'Frequency is required';
    if (Object.keys(errors).length > 0) return { body: null, errors };
    const parsed = calibrationPointSchema.safeParse({
      appliedV: values.applied, frequencyHz: values.frequency, counts: values.counts ?? null,
      uncertaintyHz: values.uncertainty ?? null, excluded: row.excluded, excludedReason: row.excludedReason,
    });
    if (parsed.success) return { body: parsed.data, errors };
    for (const issue of parsed.error.issues) {
      const field = DRAFT_FIELDS.find((f) => BODY_FIELD[f] === issue.path[0]) ?? 'applied';
      errors[field] ??= capitalise(issue.message);
    }
    return { body: null, errors };
  }

  const checked = computed(() => new Map(rows.value.map((row) => [row.key, check(row)])));
  const errorsOf = (row: DraftPoint) => checked.value.get(row.key)?.errors ?? {};
  const invalidCount = computed(() => [...checked.value.values()].filter((c) => !c.body).length);
  const serialise = (list: DraftPoint[]) => JSON.stringify(list.map(({ key: _key, ...rest }) => rest));
  const dirty = computed(() => serialise(rows.value) !== serialise(stored.value.map(fromStoredQuiet)));

  function fromStoredQuiet(p: StoredPoint): DraftPoint {
    return { key: 0, id: p.id, applied: text(p.appliedV), frequency: text(p.frequencyHz), counts: text(p.counts),
      uncertainty: text(p.uncertaintyHz), excluded: p.excluded, excludedReason: p.excludedReason };
  }

  function add(): DraftPoint {
    const row: DraftPoint = { key: nextKey++, id: null, applied: '', frequency: '', counts: '', uncertainty: '', excluded: false, excludedReason: '' };
    rows.value.push(row);
    return row;
  }

  function remove(row: DraftPoint): void {
    rows.value = rows.value.filter((r) => r.key !== row.key);
  }

  /** Lays kept rows (a person's unsaved table) over the points now loaded; they are all unsaved again. */
  function restore(kept: DraftPoint[]): void {
    rows.value = kept.map((row) => ({ ...row, key: nextKey++, id: null }));
  }

  /** The request body, or null while any row has a problem. */
  function body(): PointWrite[] | null {
    const bodies = rows.value.map((row) => checked.value.get(row.key)?.body ?? null);
    return bodies.every((b) => b !== null) ? (bodies as PointWrite[]) : null;
  }

  /** The rows as last loaded or saved, in the draft's text form. */
  const savedRows = () => stored.value.map(fromStoredQuiet);

  return { rows, errorsOf, invalidCount, dirty, add, remove, reset, restore, savedRows, body };
}
