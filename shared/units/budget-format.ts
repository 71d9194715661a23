/**
 * How an uncertainty budget prints its numbers, shared by the study page, the printable report and the PDF so
 * all three read alike: dimensionless inputs in % or ppm, per-kelvin and per-volt ones in ppm/K and ppm/V,
 * everything else in engineering notation, every sensitivity with its derived unit.
 */
import { sensitivityUnit } from './derived-unit.js';
import { formatEng } from './format-engineering.js';

/**
 * A plain number (no SI prefix) rounded to significant digits, with its unit; an en dash for no finite number.
 * @example formatPlainNumber(12.345, '%') // '12.3 %'
 */
export function formatPlainNumber(value: number | null | undefined, unit = '', significantDigits = 3): string {
  if (typeof value !== 'number' || !Number.isFinite(value)) return '–';
  const text = String(Number(value.toPrecision(significantDigits)));
  return unit ? `${text} ${unit}` : text;
}

/**
 * An input's bound or standard uncertainty in the unit people read it in.
 * @param value in the input's SI unit
 * @param unit the input's unit as the chain engine states it ('1', '1/K', '1/V', '°C', 'count', 'Hz', 'Hz/K', …)
 * @example formatBudgetValue(0.00577, '1') // '0.577 %'
 */
export function formatBudgetValue(value: number, unit: string, significantDigits = 3): string {
  if (!Number.isFinite(value)) return '–';
  if (unit === '1') return Math.abs(value) >= 1e-3 ? formatPlainNumber(value * 100, '%', significantDigits) : formatPlainNumber(value * 1e6, 'ppm', significantDigits);
  if (unit === '1/K') return formatPlainNumber(value * 1e6, 'ppm/K', significantDigits);
  if (unit === '1/V') return formatPlainNumber(value * 1e6, 'ppm/V', significantDigits);
  if (unit === '°C' || unit === 'count') return formatPlainNumber(value, unit === 'count' ? 'counts' : unit, significantDigits);
  return formatEng(value, unit, significantDigits);
}

/**
 * A sensitivity coefficient c = ∂(error in V)/∂(input) with its unit V ÷ [input] (V ÷ ([x]·[y]) for a
 * second-order cross term), in engineering notation.
 * @example formatSensitivityValue(-6.3e-5, 'Hz/K') // '-63 µV·K/Hz'
 */
export function formatSensitivityValue(value: number, ...inputUnits: string[]): string {
  if (!Number.isFinite(value)) return '–';
  return formatEng(value, sensitivityUnit('V', ...inputUnits), 3);
}

const DISTRIBUTION_WORDS: Record<string, string> = {
  rectangular: 'rectangular', normal: 'normal', triangular: 'triangular', 'u-shaped': 'U-shaped', arcsine: 'U-shaped', product: 'product of two',
};

/** One budget row as the printable report and its PDF print it, cell by cell. */
export interface BudgetRowTexts { term: string; distribution: string; bound: string; standardUncertainty: string; sensitivity: string; contribution: string; share: string }

/**
 * The cells of one budget row, the same words and units wherever it is printed: the term capitalised (a
 * second-order row says so), the distribution in words, bound and u in the input's reading unit, the
 * sensitivity with its unit, contribution in volts and share of the combined variance.
 * @param row a row with its input's unit (for a second-order row the product of its two inputs' units)
 */
export function budgetRowTexts(row: {
  label: string; unit: string; distribution: string; halfWidth: number; standardUncertainty: number; sensitivity: number;
  contributionV: number; sharePct: number; order?: 1 | 2;
}): BudgetRowTexts {
  const term = row.label ? row.label.charAt(0).toUpperCase() + row.label.slice(1) : row.label;
  return {
    term: row.order === 2 ? `${term} (second order)` : term,
    distribution: DISTRIBUTION_WORDS[row.distribution] ?? row.distribution,
    bound: `±${formatBudgetValue(row.halfWidth, row.unit)}`,
    standardUncertainty: formatBudgetValue(row.standardUncertainty, row.unit, 2),
    sensitivity: formatSensitivityValue(row.sensitivity, row.unit),
    contribution: Number.isFinite(row.contributionV) ? formatEng(row.contributionV, 'V', 2) : '–',
    share: formatPlainNumber(row.sharePct, '%', 2),
  };
}
