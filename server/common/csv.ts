import Papa from 'papaparse';
import { BadRequestError } from './errors.js';

export interface CsvTable {
  /** Header names as written, trimmed and lower-cased. */
  headers: string[];
  /** Data rows keyed by header; `line` is the line number in the file (the header is line 1). */
  rows: { line: number; cells: Record<string, string> }[];
  delimiter: string;
  /** Set when the file holds more data rows than the caller's maxRows; rows then stops at maxRows + 1. */
  truncated?: boolean;
}

/**
 * The file's non-blank rows, the header first. With maxRows, parsing stops one data row past it: enough to know
 * the file is too long without reading the rest (papaparse's own preview counts blank lines, so it cannot tell).
 */
function parseRows(text: string, maxRows: number | undefined): { data: string[][]; delimiter: string } {
  const settings = { skipEmptyLines: 'greedy' as const, delimitersToGuess: [',', ';', '\t'] };
  if (maxRows === undefined) {
    const parsed = Papa.parse<string[]>(text, settings);
    return { data: parsed.data, delimiter: parsed.meta.delimiter };
  }
  const data: string[][] = [];
  let delimiter = ',';
  Papa.parse<string[]>(text, {
    ...settings,
    step: (row, parser) => {
      delimiter = row.meta.delimiter;
      data.push(row.data);
      if (data.length > maxRows + 1) parser.abort();
    },
  });
  return { data, delimiter };
}

/**
 * Decodes and parses an uploaded CSV with papaparse. Refuses, with the reason, what cannot be read as a
 * table: bytes that are not UTF-8, an empty file, a header with blank or repeated names.
 */
export function readCsv(bytes: Buffer, options: { maxRows?: number } = {}): CsvTable {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw new BadRequestError('file is not UTF-8 text; save it as CSV UTF-8 and upload again', { file: 'is not UTF-8' });
  }
  text = text.replace(/^\uFEFF/, '');
  if (text.trim() === '') throw new BadRequestError('file is empty', { file: 'is empty' });
  const { data, delimiter } = parseRows(text, options.maxRows);
  const [header, ...body] = data;
  if (!header || header.length === 0) throw new BadRequestError('file has no header line', { file: 'has no header' });
  const headers = header.map((h) => h.trim().toLowerCase());
  const blank = headers.findIndex((h) => h === '');
  if (blank >= 0) throw new BadRequestError(`header column ${blank + 1} has no name`, { file: `header column ${blank + 1} is blank` });
  const seen = new Set<string>();
  for (const h of headers) {
    if (seen.has(h)) throw new BadRequestError(`header names column "${h}" twice`, { file: `duplicated column "${h}"` });
    seen.add(h);
  }
  if (body.length === 0) throw new BadRequestError('file has a header but no data rows', { file: 'has no data rows' });
  const rows = body.map((cells, i) => ({
    line: i + 2,
    cells: Object.fromEntries(headers.map((h, j) => [h, (cells[j] ?? '').trim()])),
  }));
  const truncated = options.maxRows !== undefined && rows.length > options.maxRows;
  return { headers, rows, delimiter, ...(truncated ? { truncated } : {}) };
}

/**
 * The rows an import may store. Any bad row refuses the whole file unless the person chose to import only
 * the valid rows; a file with no valid row is refused either way.
 */
export function importableRows<T>(values: (T | null)[], onlyValid: boolean): T[] {
  const invalid = values.filter((v) => v === null).length;
  if (invalid > 0 && !onlyValid) {
    throw new BadRequestError(`${invalid} row${invalid > 1 ? 's have' : ' has'} problems; nothing was imported. Fix the file, or import only the valid rows`);
  }
  const valid = values.filter((v): v is T => v !== null);
  if (valid.length === 0) throw new BadRequestError('no valid rows to import');
  return valid;
}
