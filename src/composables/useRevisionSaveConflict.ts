import { computed, ref } from 'vue';
import type { ChannelDefinition } from '@shared/schemas/chain';
import { useRevisionStore, type DraftChannel } from '@/stores/revision';
import { describeFieldPath } from '@/utils/describeFieldPath';
import { applyDifferences, leafAt, plainValue, type KeptRow } from '@/utils/valueDifferences';
import { useSaveConflict } from './useSaveConflict';

const NOTE = '~note';
type Keyed = Record<string, unknown>;

// Keyed by channel key, so a reordered or extended channel list compares channel with channel.
const keyed = (channels: DraftChannel[], note: string): Keyed => ({ ...Object.fromEntries(channels.map((c) => [c.key, c.definition])), [NOTE]: note });

/** The revision editor's side of a refused stale save: load theirs, list the person's own changes, re-apply them. */
export function useRevisionSaveConflict(reportError: (error: unknown) => void) {
  const store = useRevisionStore();
  const state = useSaveConflict<Keyed>();
  const reloading = ref(false);

  async function reloadTheirs(): Promise<void> {
    if (!store.revision) return;
    const id = store.revision.id;
    reloading.value = true;
    try {
      await state.reloadTheirs(keyed(store.savedChannels(), ''), keyed(store.channels, store.note), () => store.load(id));
    } catch (error) {
      reportError(error);
    } finally {
      reloading.value = false;
    }
  }

  const rows = computed<KeptRow[]>(() => {
    const kept = state.kept.value;
    if (!kept) return [];
    const now = keyed(store.channels, store.note);
    const names = Object.fromEntries([...store.channels, ...Object.entries(kept.mine).filter(([k]) => k !== NOTE)
      .map(([key, definition]) => ({ key, definition: definition as ChannelDefinition }))].map((c) => [c.key, c.definition.name]));
    return state.edits.value.map((d) => {
      const [key, ...rest] = d.path.split('.');
      const leaf = rest.at(-1) ?? '';
      const label = key === NOTE ? 'Change note'
        : `${names[key] ?? key} · ${describeFieldPath(rest.join('.'))}${rest.length > 1 && !/^\d+$/.test(leaf) ? ` (${leaf})` : ''}`;
      return { label, mine: plainValue(d.mine, d.path), theirs: plainValue(leafAt(now, d.path), d.path) };
    });
  });

  /** Lays the person's own changes over the version now loaded; the other person's changes elsewhere stay. */
  function putBack(): void {
    const edits = state.edits.value;
    const kept = state.putBack();
    if (!kept) return;
    const merged = applyDifferences(keyed(store.channels, store.note), edits);
    const present = (key: string) => key !== NOTE && merged[key] !== undefined && Object.keys(merged[key] as object).length > 0;
    const order = [...Object.keys(kept.mine).filter(present), ...Object.keys(merged).filter((k) => present(k) && !(k in kept.mine))];
    store.reapply({ channels: order.map((key) => ({ key, definition: merged[key] as ChannelDefinition })), note: String(merged[NOTE] ?? '') });
  }

  return { conflict: state.conflict, kept: state.kept, rows, reloading, take: state.take, reloadTheirs, keepEditing: state.keepEditing, putBack, dismiss: state.dismiss, clear: state.clear };
}
