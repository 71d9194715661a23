import { formatEng } from '@shared/units';
import { formatPlain } from './formatQuantity';

/**
 * Significant digits of a value whose standard uncertainty is u: the last digit kept sits at the
 * uncertainty's second significant digit (common practice), 2–12 digits.
 */
export function digitsFor(value: number, uncertainty: number | null | undefined): number {
  if (!uncertainty || !Number.isFinite(uncertainty) || uncertainty <= 0 || value === 0) return 6;
  const digits = Math.floor(Math.log10(Math.abs(value))) - Math.floor(Math.log10(uncertainty)) + 2;
  return Math.min(12, Math.max(2, digits));
}

/** "80.2662 Hz/V" with the digits its uncertainty justifies, and the uncertainty with two digits. */
export function formatWithUncertainty(value: number, uncertainty: number | null | undefined, unit: string) {
  return {
    value: formatEng(value, unit, digitsFor(value, uncertainty)),
    uncertainty: uncertainty && uncertainty > 0 ? formatEng(uncertainty, unit, 2) : null,
  };
}

const MINUS = '\u2212';

/** A signed quantity for errors: "+41.4 mV", "−0.652 V". */
export function formatSigned(value: number | null | undefined, unit: string, digits = 3): string {
  if (typeof value !== 'number' || !Number.isFinite(value)) return '–';
  const text = formatEng(Math.abs(value), unit, digits, { keepTrailingZeros: true });
  return value === 0 ? text : `${value < 0 ? MINUS : '+'}${text}`;
}

/** A gain error fraction in per cent, signed: 0.00209 → "+0.209 %". */
export function formatGainErrorPct(fraction: number | null | undefined, digits = 3): string {
  if (typeof fraction !== 'number' || !Number.isFinite(fraction)) return '–';
  const pct = Math.abs(fraction * 100);
  // Trailing zeros stay, so the two ends of an interval carry the same digits (−1.19 % to +1.20 %).
  const text = pct >= 1e-4 && pct < 1e6 ? `${pct.toPrecision(digits)} %` : formatPlain(pct, '%', digits);
  return fraction === 0 ? text : `${fraction < 0 ? MINUS : '+'}${text}`;
}
