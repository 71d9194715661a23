import { formatEng, parseDecimal, parseEngineering } from '../../../shared/units/index.js';
import { STOCK_CSV_COLUMNS, STOCK_CSV_REQUIRED, stockPartSchema, type StockPartBody } from '../../../shared/schemas/stock.js';
import type { CsvTable } from '../../common/csv.js';
import type { CsvValue } from '../../common/csv-write.js';
import type { RowProblem } from '../../../shared/schemas/common.js';
import { BadRequestError } from '../../common/errors.js';
import type { StockPart } from '../../entities/StockPart.js';
import type { StockPreview } from '../../../shared/schemas/stock-views.js';


const NUMERIC: Record<string, keyof StockPartBody> = {
  tolerance_pct: 'tolerancePct',
  tcr_ppm_per_k: 'tcrPpmPerK',
  voltage_coefficient_ppm_per_v: 'voltageCoefficientPpmPerV',
  rated_voltage_v: 'ratedVoltageV',
  rated_power_w: 'ratedPowerW',
  quantity: 'quantity',
};
const FIELD_TO_COLUMN = Object.fromEntries([...Object.entries(NUMERIC).map(([c, f]) => [f, c]), ['ohms', 'value'], ['package', 'package'], ['note', 'note']]);

/** Checks a stock CSV row by row; every problem names its row (file line) and column. */
export function previewStockCsv(table: CsvTable): Omit<StockPreview, 'room' | 'duplicates'> {
  const missing = STOCK_CSV_REQUIRED.filter((c) => !table.headers.includes(c));
  if (missing.length) throw new BadRequestError(`missing column${missing.length > 1 ? 's' : ''}: ${missing.join(', ')}`, { file: `missing ${missing.join(', ')}` });
  const unknown = table.headers.filter((h) => !(STOCK_CSV_COLUMNS as readonly string[]).includes(h));
  if (unknown.length) throw new BadRequestError(`unknown column${unknown.length > 1 ? 's' : ''}: ${unknown.join(', ')} (expected ${STOCK_CSV_COLUMNS.join(', ')})`, { file: `unknown ${unknown.join(', ')}` });

  const problems: RowProblem[] = [];
  const rows = table.rows.map(({ line, cells }) => {
    const raw: Record<string, unknown> = {};
    const before = problems.length;
    try {
      raw.ohms = parseEngineering(cells.value, 'Ω');
    } catch (err) {
      problems.push({ row: line, column: 'value', problem: (err as Error).message });
    }
    for (const [column, field] of Object.entries(NUMERIC)) {
      const text = cells[column];
      if (text === undefined || text === '') continue;
      try {
        raw[field] = parseDecimal(text);
      } catch (err) {
        problems.push({ row: line, column, problem: (err as Error).message });
      }
    }
    if (cells.package !== undefined) raw.package = cells.package;
    if (cells.note !== undefined) raw.note = cells.note;
    if (problems.length > before) return { row: line, part: null };
    const parsed = stockPartSchema.safeParse(raw);
    if (parsed.success) return { row: line, part: parsed.data };
    for (const issue of parsed.error.issues) {
      problems.push({ row: line, column: FIELD_TO_COLUMN[String(issue.path[0])] ?? String(issue.path[0]), problem: issue.message });
    }
    return { row: line, part: null };
  });
  const validCount = rows.filter((r) => r.part).length;
  return { rows, problems, validCount, invalidCount: rows.length - validCount };
}

/** One part as a row of the stock CSV, in the same columns the import takes; the value in engineering notation. */
export function stockCsvRow(p: StockPart): CsvValue[] {
  return [
    formatEng(p.ohms, '', 4).replace(/\s/g, ''), p.tolerancePct, p.tcrPpmPerK, p.voltageCoefficientPpmPerV,
    p.ratedVoltageV, p.ratedPowerW, p.package, p.quantity, p.note,
  ];
}
