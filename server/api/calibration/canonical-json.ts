import { createHash } from 'node:crypto';

/**
 * JSON text that depends only on the value, not on how it was built: object keys in code-unit order at every
 * level, no white space, numbers as JSON writes them (the shortest text that reads back to the same double).
 * Values JSON cannot hold read as JSON.stringify reads them: a non-finite number as null, an undefined member
 * left out, an undefined array element as null.
 */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== 'object') return JSON.stringify(value ?? null);
  if (typeof (value as { toJSON?: unknown }).toJSON === 'function') return canonicalJson((value as { toJSON: () => unknown }).toJSON());
  if (Array.isArray(value)) return `[${value.map((v) => (v === undefined ? 'null' : canonicalJson(v))).join(',')}]`;
  const members = Object.keys(value).sort()
    .filter((k) => (value as Record<string, unknown>)[k] !== undefined && typeof (value as Record<string, unknown>)[k] !== 'function')
    .map((k) => `${JSON.stringify(k)}:${canonicalJson((value as Record<string, unknown>)[k])}`);
  return `{${members.join(',')}}`;
}

/** SHA-256 of the text's UTF-8 bytes, lower-case hex. */
export const sha256Hex = (text: string): string => createHash('sha256').update(text, 'utf8').digest('hex');
