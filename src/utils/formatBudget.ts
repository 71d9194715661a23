import { formatEng } from '@shared/units';
import { formatPlain } from './formatQuantity';

/** Dimensionless inputs read better in ppm or %, per-kelvin and per-volt ones in ppm/K and ppm/V. */
export function formatInputValue(value: number, unit: string, significantDigits = 3): string {
  if (!Number.isFinite(value)) return '–';
  if (unit === '1') return Math.abs(value) >= 1e-3 ? formatPlain(value * 100, '%', significantDigits) : formatPlain(value * 1e6, 'ppm', significantDigits);
  if (unit === '1/K') return formatPlain(value * 1e6, 'ppm/K', significantDigits);
  if (unit === '1/V') return formatPlain(value * 1e6, 'ppm/V', significantDigits);
  if (unit === '°C' || unit === 'count') return formatPlain(value, unit === 'count' ? 'counts' : unit, significantDigits);
  return formatEng(value, unit, significantDigits);
}

/** Sensitivity coefficient c = ∂(error in V)/∂(input), with its unit. */
export function formatSensitivity(value: number, unit: string): string {
  if (!Number.isFinite(value)) return '–';
  const units: Record<string, string> = { '1': 'V', '1/K': 'V·K', '1/V': 'V²', count: 'V/count', '°C': 'V/K' };
  return formatEng(value, units[unit] ?? `V/${unit}`, 3);
}
