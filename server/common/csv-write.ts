import { once } from 'node:events';
import type { Writable } from 'node:stream';

export type CsvValue = string | number | null | undefined;

/** Text a spreadsheet would run as a formula (OWASP "CSV Injection"): = + - @, tab, carriage return. */
const FORMULA_START = /^[=+\-@\t\r]/;
const NEEDS_QUOTES = /[",\r\n]|^\s|\s$/;

/**
 * One CSV cell. Numbers are written as numbers. Text that a spreadsheet would read as a formula gets a
 * leading single quote and is always quoted, so it opens as the text it is; other text is quoted when
 * it holds a separator, quote or line break (RFC 4180).
 */
export function csvCell(value: CsvValue): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new Error(`a CSV cell cannot hold ${value}`);
    return String(value);
  }
  const escaped = FORMULA_START.test(value) ? `'${value}` : value;
  const quoted = escaped !== value || NEEDS_QUOTES.test(escaped);
  return quoted ? `"${escaped.replace(/"/g, '""')}"` : escaped;
}

export const csvLine = (cells: readonly CsvValue[]): string => `${cells.map(csvCell).join(',')}\r\n`;

/** Resolves true once `out` can take more, false if it closed first (the reader went away). */
async function roomIn(out: Writable): Promise<boolean> {
  if (out.destroyed) return false;
  if (!out.writableNeedDrain) return true;
  const closed = once(out, 'close').then(() => false);
  const drained = once(out, 'drain').then(() => true);
  return Promise.race([drained, closed]).catch(() => false);
}

/**
 * Writes a CSV to a stream batch by batch: each batch waits until the reader has taken the last one
 * (backpressure) and the event loop gets a turn between batches, so a large download never holds up
 * other requests. Stops reading batches if the reader goes away. Ends the stream when done.
 */
export async function streamCsv(out: Writable, fields: readonly string[], batches: AsyncIterable<readonly CsvValue[][]>): Promise<void> {
  out.write(csvLine(fields));
  // The next batch is read only once the reader has room for it, so at most one batch waits in memory.
  const iterator = batches[Symbol.asyncIterator]();
  try {
    for (;;) {
      if (!(await roomIn(out))) return;
      const next = await iterator.next();
      if (next.done) break;
      if (out.destroyed) return;
      out.write(next.value.map(csvLine).join(''));
      await new Promise<void>((resolve) => setImmediate(resolve));
    }
  } finally {
    await iterator.return?.();
  }
  if (await roomIn(out)) out.end();
}
