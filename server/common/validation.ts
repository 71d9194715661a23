import type { ZodError, ZodType } from 'zod';
import { BadRequestError } from './errors.js';

/** Turns zod issues into `{ field: message }`, one message per field, naming unknown fields too. */
export function fieldsFromZod(error: ZodError, prefix = ''): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) fields[[...issue.path, key].join('.') || key] = `${key} is not an allowed field`;
      continue;
    }
    const name = issue.path.map(String).join('.') || prefix || 'body';
    fields[name] ??= issue.message;
  }
  return fields;
}

/** Parses `value` with `schema` or throws a 400 naming every bad field. */
export function parseOrThrow<T>(schema: ZodType<T>, value: unknown, where: string): T {
  const result = schema.safeParse(value);
  if (result.success) return result.data;
  const fields = fieldsFromZod(result.error, where);
  const names = Object.keys(fields);
  throw new BadRequestError(`invalid ${where}: ${names.map((n) => `${n} (${fields[n]})`).join(', ')}`, fields);
}
