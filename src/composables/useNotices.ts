import type { ToastServiceMethods } from 'primevue/toastservice';

// Bound once by the PrimeVue plugin, so route guards and the HTTP layer can raise toasts outside setup().
let toastService: ToastServiceMethods | null = null;

export function bindToastService(service: ToastServiceMethods): void {
  toastService = service;
}

function show(severity: 'success' | 'info' | 'warn' | 'error', summary: string, detail?: string, lifeMs?: number) {
  toastService?.add({ severity, summary, detail, life: lifeMs });
}

/** Errors stay until dismissed; confirmations fade. */
export const notify = {
  success: (summary: string, detail?: string) => show('success', summary, detail, 4000),
  info: (summary: string, detail?: string) => show('info', summary, detail, 6000),
  warn: (summary: string, detail?: string) => show('warn', summary, detail, 8000),
  error: (summary: string, detail?: string) => show('error', summary, detail),
};

export function useNotices() {
  return notify;
}
