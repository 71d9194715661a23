/** A probability (fraction) as a percentage with sensible digits: 0.00012 → "0.012 %", 0.591 → "59.1 %". */
export function formatPercent(fraction: number | null | undefined, significantDigits?: number): string {
  if (typeof fraction !== 'number' || !Number.isFinite(fraction)) return '–';
  const pct = fraction * 100;
  if (pct === 0) return '0 %';
  const digits = significantDigits ?? (Math.abs(pct) >= 1 ? 3 : 2);
  return `${Number(pct.toPrecision(digits))} %`;
}

/**
 * A Monte Carlo estimate of a probability; an estimate of 0 says how few trials it rests on:
 * 0 of 20 000 → "< 0.005 %".
 */
export function formatEstimate(fraction: number | null | undefined, trials?: number | null): string {
  if (fraction === 0 && trials && trials > 0) return `< ${formatPercent(1 / trials)}`;
  return formatPercent(fraction);
}

/** Trials as people count them, with thin grouping: 20 000. */
export function formatCount(count: number | null | undefined): string {
  return typeof count === 'number' && Number.isFinite(count) ? count.toLocaleString('en-GB').replace(/,/g, '\u2009') : '–';
}
