import { computed, inject, provide, reactive, type InjectionKey } from 'vue';

/** Ids of quantity inputs whose text does not parse; the form that provides it can refuse to save. */
const KEY: InjectionKey<Set<string>> = Symbol('quantity-validity');

/** Called by a form: collects the quantity inputs below it that hold text that does not parse. */
export function provideQuantityValidity() {
  const invalid = reactive(new Set<string>());
  provide(KEY, invalid);
  return { invalidCount: computed(() => invalid.size) };
}

/** Called by a quantity input: marks its id as holding unparsed text, or clears it. */
export function useQuantityValidity() {
  const invalid = inject(KEY, null);
  return {
    mark: (id: string, bad: boolean) => {
      if (!invalid) return;
      if (bad) invalid.add(id);
      else invalid.delete(id);
    },
  };
}
