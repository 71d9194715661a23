import crypto from 'node:crypto';

/** JSON with object keys sorted, so equal content always hashes the same. */
function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`;
  if (value && typeof value === 'object') {
    return `{${Object.keys(value).sort().map((k) => `${JSON.stringify(k)}:${canonical((value as Record<string, unknown>)[k])}`).join(',')}}`;
  }
  return JSON.stringify(value);
}

/** SHA-256 of the revision content a study used: tells whether a stored study still matches the draft. */
export const contentHash = (value: unknown): string => crypto.createHash('sha256').update(canonical(value)).digest('hex');
