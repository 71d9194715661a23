const dateTime = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });
const dateOnly = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium' });

/** Local date and time for an ISO timestamp; the raw text if it does not parse. */
export function formatDateTime(iso: string): string {
  const when = new Date(iso);
  return Number.isNaN(when.getTime()) ? iso : dateTime.format(when);
}

export function formatDate(iso: string): string {
  const when = new Date(iso);
  return Number.isNaN(when.getTime()) ? iso : dateOnly.format(when);
}
