import { parseDecimal } from '../../../shared/units/index.js';
import { MAX_SERIES_VALUES, SERIES_CSV_COLUMNS, seriesValueSchema } from '../../../shared/schemas/series.js';
import type { RowProblem } from '../../../shared/schemas/common.js';
import type { SeriesPreview } from '../../../shared/schemas/series-views.js';
import type { CsvTable } from '../../common/csv.js';
import { BadRequestError } from '../../common/errors.js';

/** Checks a series CSV row by row (one decade value per row); every problem names its row (file line) and column. */
export function previewSeriesCsv(name: string, table: CsvTable): SeriesPreview {
  if (!table.headers.includes('value')) throw new BadRequestError('missing column: value', { file: 'missing value' });
  const unknown = table.headers.filter((h) => !(SERIES_CSV_COLUMNS as readonly string[]).includes(h));
  if (unknown.length) throw new BadRequestError(`unknown column${unknown.length > 1 ? 's' : ''}: ${unknown.join(', ')} (expected value)`, { file: `unknown ${unknown.join(', ')}` });
  if (table.rows.length > MAX_SERIES_VALUES) {
    throw new BadRequestError(`a series holds at most ${MAX_SERIES_VALUES} values per decade; this file has ${table.rows.length} rows`, { file: `more than ${MAX_SERIES_VALUES} rows` });
  }
  const problems: RowProblem[] = [];
  const seen = new Map<number, number>();
  const rows = table.rows.map(({ line, cells }) => {
    let value: number;
    try {
      value = parseDecimal(cells.value ?? '');
    } catch (err) {
      problems.push({ row: line, column: 'value', problem: (err as Error).message });
      return { row: line, value: null };
    }
    const checked = seriesValueSchema.safeParse(value);
    if (!checked.success) {
      problems.push({ row: line, column: 'value', problem: checked.error.issues[0].message });
      return { row: line, value: null };
    }
    const earlier = seen.get(value);
    if (earlier !== undefined) {
      problems.push({ row: line, column: 'value', problem: `repeats the value of row ${earlier}` });
      return { row: line, value: null };
    }
    seen.set(value, line);
    return { row: line, value };
  });
  const validCount = rows.filter((r) => r.value !== null).length;
  return { name, rows, problems, validCount, invalidCount: rows.length - validCount };
}
