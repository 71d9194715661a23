import { computed, inject, provide, type ComputedRef, type InjectionKey } from 'vue';
import type { FieldMessages } from '@/stores/revision';

interface ChannelForm {
  /** Input id for a field path such as `divider.bottom.nominalOhm`, unique on the page. */
  idFor: (path: string) => string;
  /** The message for a field path, if the last check or the server named it. */
  errorFor: (path: string) => string | undefined;
  readonly: ComputedRef<boolean>;
}

const KEY: InjectionKey<ChannelForm> = Symbol('channel-form');

/** Called by a channel's panel so its stage sections can name their inputs and find their errors. */
export function provideChannelForm(channelKey: () => string, errors: () => FieldMessages, readonly: () => boolean): ChannelForm {
  const form: ChannelForm = {
    idFor: (path) => `${channelKey()}-${path.replace(/[.[\]]+/g, '-').replace(/-$/, '')}`,
    errorFor: (path) => errors()[path],
    readonly: computed(readonly),
  };
  provide(KEY, form);
  return form;
}

export function useChannelForm(): ChannelForm {
  const form = inject(KEY);
  if (!form) throw new Error('useChannelForm needs a channel panel above it');
  return form;
}
