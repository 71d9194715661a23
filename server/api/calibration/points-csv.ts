import type { CalibrationPointBody, CsvMapping } from '../../../shared/schemas/calibration.js';
import { calibrationPointSchema, MAX_POINTS_PER_SESSION, pointsLimitMessage } from '../../../shared/schemas/calibration.js';
import type { CaptureDefinition } from '../../../shared/schemas/chain.js';
import type { CsvTable } from '../../common/csv.js';
import { BadRequestError } from '../../common/errors.js';
import type { PointsPreview, RowProblem } from '../../../shared/schemas/calibration-views.js';
import { frequencyFromCounts } from './counts.js';

/** Words in a header that suggest its meaning; the first matching header wins. */
const GUESSES: [keyof CsvMapping, string[]][] = [
  ['appliedV', ['applied', 'reference', 'ref', 'input', 'v', 'volt', 'volts', 'voltage', 'x']],
  ['frequencyHz', ['f', 'freq', 'frequency', 'hz', 'measured', 'y']],
  ['counts', ['count', 'counts', 'ticks', 'raw']],
  ['uncertaintyHz', ['u', 'uncertainty', 'sigma', 'std']],
];
const wordsOf = (header: string) => header.split(/[^a-z0-9]+/).filter(Boolean);

/** Proposes a mapping from header names, for the mapping step. */
export function suggestMapping(headers: string[]): Partial<CsvMapping> {
  const out: Partial<Record<keyof CsvMapping, string>> = {};
  for (const [field, words] of GUESSES) {
    const hit = headers.find((h) => wordsOf(h).some((w) => words.includes(w)) && !Object.values(out).includes(h));
    if (hit) out[field] = hit;
  }
  if (out.frequencyHz && out.counts) delete out.counts;
  return out as Partial<CsvMapping>;
}

function numberIn(text: string, decimal: '.' | ','): number {
  const t = text.trim();
  if (decimal === ',') {
    if (!/^[+-]?(\d+,?\d*|,\d+)([eE][+-]?\d+)?$/.test(t)) return NaN;
    return Number(t.replace(',', '.'));
  }
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(t)) return NaN;
  return Number(t);
}

/**
 * Checks a calibration CSV against a column mapping. Without a mapping it only reports the header and a
 * suggested mapping, so the person can confirm which column is which. Semicolon files default to decimal commas.
 */
export function previewPointsCsv(table: CsvTable, mapping: CsvMapping | null, capture: CaptureDefinition): PointsPreview {
  const decimal = mapping?.decimalSeparator ?? (table.delimiter === ';' ? ',' : '.');
  const base = { headers: table.headers, delimiter: table.delimiter, decimalSeparator: decimal, mapping, suggestedMapping: suggestMapping(table.headers) };
  if (!mapping) return { ...base, rows: [], problems: [], validCount: 0, invalidCount: 0 };
  for (const [field, column] of Object.entries(mapping)) {
    if (field === 'decimalSeparator' || column === undefined) continue;
    if (!table.headers.includes(column)) {
      throw new BadRequestError(`the file has no column "${column}" (mapped to ${field}); its columns are ${table.headers.join(', ')}`, { [`mapping.${field}`]: `no column "${column}"` });
    }
  }
  const problems: RowProblem[] = [];
  const rows = table.rows.map(({ line, cells }) => {
    const before = problems.length;
    const read = (field: keyof CsvMapping, required: boolean): number | null => {
      const column = mapping[field] as string | undefined;
      if (!column) return null;
      const text = cells[column] ?? '';
      if (text === '') {
        if (required) problems.push({ row: line, column, problem: 'is empty' });
        return null;
      }
      const n = numberIn(text, decimal);
      if (!Number.isFinite(n)) problems.push({ row: line, column, problem: `"${text}" is not a number${decimal === ',' ? ' (decimal comma expected)' : ''}` });
      return Number.isFinite(n) ? n : null;
    };
    const appliedV = read('appliedV', true);
    const counts = read('counts', true);
    let frequencyHz = mapping.counts ? null : read('frequencyHz', true);
    const uncertaintyHz = read('uncertaintyHz', false);
    if (problems.length > before) return { row: line, point: null };
    if (counts !== null) {
      if (!Number.isInteger(counts) || counts <= 0) {
        problems.push({ row: line, column: mapping.counts!, problem: 'counts must be a whole number > 0' });
        return { row: line, point: null };
      }
      frequencyHz = frequencyFromCounts(capture, counts);
    }
    const parsed = calibrationPointSchema.safeParse({ appliedV, frequencyHz, counts, uncertaintyHz });
    if (parsed.success) return { row: line, point: parsed.data };
    for (const issue of parsed.error.issues) {
      const field = String(issue.path[0]) as keyof CsvMapping;
      problems.push({ row: line, column: (mapping[field] as string | undefined) ?? field, problem: issue.message });
    }
    return { row: line, point: null };
  });
  const validCount = rows.filter((r) => r.point).length;
  return { ...base, rows, problems, validCount, invalidCount: rows.length - validCount };
}

/** Line breaks in the file, counted on the bytes without parsing them, so a refusal can say how long the file is. */
function linesIn(bytes: Buffer): number {
  let lines = 0;
  for (let at = bytes.indexOf(10); at !== -1; at = bytes.indexOf(10, at + 1)) lines++;
  return bytes.length > 0 && bytes[bytes.length - 1] !== 10 ? lines + 1 : lines;
}

/**
 * Refuses, before any row is checked, a file that would take the session past the points limit: the session's
 * stored points plus every data row of the file (read with readCsv's maxRows, so a long file is not parsed to the end).
 */
export function assertCsvWithinLimit(table: CsvTable, bytes: Buffer, storedPoints: number): void {
  if (table.truncated) {
    const message = `the file has more than ${MAX_POINTS_PER_SESSION} data rows (${linesIn(bytes)} lines); a session holds at most ${MAX_POINTS_PER_SESSION} points`;
    throw new BadRequestError(message, { file: `more than ${MAX_POINTS_PER_SESSION} data rows` });
  }
  const total = storedPoints + table.rows.length;
  if (total > MAX_POINTS_PER_SESSION) {
    throw new BadRequestError(`${pointsLimitMessage(total)} (${storedPoints} stored and ${table.rows.length} rows in the file)`, { file: pointsLimitMessage(total) });
  }
}
