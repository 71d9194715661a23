import { computed, ref } from 'vue';
import { defineStore } from 'pinia';
import { channelSchema, type ChannelDefinition } from '@shared/schemas/chain';
import { revisionChannelsSchema } from '@shared/schemas/designs';
import { revisionsApi, type RevisionDetail } from '@/services/revisions';

export interface DraftChannel {
  key: string;
  definition: ChannelDefinition;
}

/** Fills the schema defaults, so the form always edits a fully specified channel. */
function normalise(definition: ChannelDefinition): ChannelDefinition {
  const parsed = channelSchema.safeParse(definition);
  return parsed.success ? parsed.data : structuredClone(definition);
}

const snapshot = (channels: DraftChannel[]) => JSON.stringify(channels);

/**
 * Field messages keyed by dotted path (`channels.1.definition.divider.bottom.nominalOhm`), the same form
 * the server uses, so local checks and server answers land beside the same inputs.
 */
export type FieldMessages = Record<string, string>;

export const useRevisionStore = defineStore('revision', () => {
  const revision = ref<RevisionDetail | null>(null);
  const channels = ref<DraftChannel[]>([]);
  const note = ref('');
  const fieldErrors = ref<FieldMessages>({});
  const loading = ref(false);
  const saving = ref(false);
  const saved = ref('');

  const editable = computed(() => revision.value?.state === 'draft');
  const dirty = computed(() => revision.value !== null && snapshot(channels.value) !== saved.value);

  function adopt(next: RevisionDetail): void {
    revision.value = next;
    channels.value = [...next.channels]
      .sort((a, b) => a.position - b.position)
      .map((c) => ({ key: c.key, definition: normalise(c.definition) }));
    note.value = '';
    saved.value = snapshot(channels.value);
    fieldErrors.value = {};
  }

  async function load(id: number): Promise<void> {
    if (revision.value?.id !== id) revision.value = null;
    loading.value = true;
    try {
      adopt(await revisionsApi.get(id));
    } finally {
      loading.value = false;
    }
  }

  /** Checks the draft with the request schema; returns false and fills fieldErrors when it fails. */
  function check(): boolean {
    const result = revisionChannelsSchema.safeParse({ channels: channels.value, note: note.value || undefined, baseVersion: revision.value?.version ?? 0 });
    if (result.success) {
      fieldErrors.value = {};
      return true;
    }
    const messages: FieldMessages = {};
    for (const issue of result.error.issues) messages[issue.path.map(String).join('.') || 'channels'] ??= issue.message;
    fieldErrors.value = messages;
    return false;
  }

  /** Sends the channels with the version they were edited from; throws the ApiError (409 stale or not a draft, 400 with fields). */
  async function save(): Promise<RevisionDetail> {
    if (!revision.value) throw new Error('no revision is open');
    saving.value = true;
    try {
      const next = await revisionsApi.saveChannels(revision.value.id, {
        channels: channels.value,
        note: note.value.trim() || undefined,
        baseVersion: revision.value.version,
      });
      adopt(next);
      return next;
    } finally {
      saving.value = false;
    }
  }

  function discard(): void {
    if (revision.value) adopt(revision.value);
  }

  /** Lays channels and a note (a person's edits over the version now loaded) into the draft; the next save is based on that version. */
  function reapply(next: { channels: DraftChannel[]; note: string }): void {
    channels.value = next.channels.map((c) => ({ key: c.key, definition: normalise(c.definition) }));
    note.value = next.note;
  }

  /** The channels as last loaded or saved (schema defaults filled, like the draft). */
  const savedChannels = (): DraftChannel[] => JSON.parse(saved.value || '[]') as DraftChannel[];

  /** Messages for one channel, with the `channels.N.definition.` prefix taken off. */
  function channelErrors(index: number): FieldMessages {
    const prefix = `channels.${index}.definition.`;
    return Object.fromEntries(
      Object.entries(fieldErrors.value)
        .filter(([path]) => path.startsWith(prefix))
        .map(([path, message]) => [path.slice(prefix.length), message]),
    );
  }

  return {
    revision, channels, note, fieldErrors, loading, saving, editable, dirty,
    load, check, save, discard, reapply, savedChannels, channelErrors,
  };
});
