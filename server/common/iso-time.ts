/** Times leave the API as ISO 8601 strings in UTC, whatever form the driver gave them in. */
export const isoTime = (d: Date | string): string => new Date(d).toISOString();
export const isoTimeOrNull = (d: Date | string | null | undefined): string | null => (d ? isoTime(d) : null);
