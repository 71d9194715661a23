import { onBeforeUnmount } from 'vue';

/** Calls `action` once typing has paused for `delayMs`; pending calls are dropped on unmount. */
export function useDebounced(action: () => void, delayMs = 300) {
  let timer: ReturnType<typeof setTimeout> | undefined;
  onBeforeUnmount(() => clearTimeout(timer));
  return () => {
    clearTimeout(timer);
    timer = setTimeout(action, delayMs);
  };
}
