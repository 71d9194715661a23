import { formatEng } from '@shared/units';

/** Engineering notation with a unit, or an en dash when there is no finite number to show. */
export function formatQuantity(value: number | null | undefined, unit: string, significantDigits = 3): string {
  return typeof value === 'number' && Number.isFinite(value) ? formatEng(value, unit, significantDigits) : '–';
}

/** A plain number (no SI prefix) rounded to significant digits, e.g. for %, ppm/K and °C. */
export function formatPlain(value: number | null | undefined, unit = '', significantDigits = 3): string {
  if (typeof value !== 'number' || !Number.isFinite(value)) return '–';
  const text = String(Number(value.toPrecision(significantDigits)));
  return unit ? `${text} ${unit}` : text;
}

/** Server and engine messages are terse lower-case sentences; people read them capitalised. */
export function capitalise(message: string): string {
  return message ? message.charAt(0).toUpperCase() + message.slice(1) : message;
}
