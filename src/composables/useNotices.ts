import { reactive } from 'vue';

export type NoticeSeverity = 'success' | 'info' | 'warn' | 'error';

export interface Notice {
  id: number;
  severity: NoticeSeverity;
  summary: string;
  detail?: string;
}

// Module state, so route guards and the HTTP layer can raise notices outside setup().
// AppNotices shows them in a band of their own beneath the page, never over it.
const notices = reactive<Notice[]>([]);
let nextId = 1;
// More than a few at once is noise; the oldest give way.
const MAX_SHOWN = 3;

function dismiss(id: number): void {
  const at = notices.findIndex((n) => n.id === id);
  if (at >= 0) notices.splice(at, 1);
}

function show(severity: NoticeSeverity, summary: string, detail?: string, lifeMs?: number): void {
  const id = nextId++;
  notices.push({ id, severity, summary, detail });
  while (notices.length > MAX_SHOWN) notices.shift();
  if (lifeMs) setTimeout(() => dismiss(id), lifeMs);
}

/** Errors stay until dismissed; confirmations fade. */
export const notify = {
  success: (summary: string, detail?: string) => show('success', summary, detail, 4000),
  info: (summary: string, detail?: string) => show('info', summary, detail, 6000),
  warn: (summary: string, detail?: string) => show('warn', summary, detail, 8000),
  error: (summary: string, detail?: string) => show('error', summary, detail),
};

export function useNotices() {
  return { ...notify, notices, dismiss };
}
