import type { ZodError } from 'zod';
import { capitalise } from './formatQuantity';

/** A form's own check, in the server's shape: one capitalised message per dotted field path. */
export function fieldsOf(error: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) fields[issue.path.map(String).join('.')] ??= capitalise(issue.message);
  return fields;
}

/** Today's date in the person's time zone, as the date inputs and the server write it (2026-12-02). */
export function todayIso(): string {
  const now = new Date();
  return new Date(now.getTime() - now.getTimezoneOffset() * 60_000).toISOString().slice(0, 10);
}
