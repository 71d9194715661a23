/** A coverage interval [low, high] in the output's unit. */
export interface CoverageInterval {
  low: number;
  high: number;
}

function coverageCounts(count: number, coverageProbability: number): number {
  if (!(coverageProbability > 0 && coverageProbability < 1)) throw new Error('coverage probability must be in (0, 1)');
  const pM = coverageProbability * count;
  const q = Number.isInteger(pM) ? pM : Math.floor(pM + 0.5);
  if (count - q < 1) throw new Error(`at least ${Math.ceil(1 / (1 - coverageProbability))} trials are needed for this coverage probability`);
  return q;
}

/**
 * Probabilistically symmetric coverage interval from ascending model values, JCGM 101:2008
 * 7.7.1: q = pM (or ⌊pM + ½⌋), r = (M − q)/2 (or ⌊(M − q + 1)/2⌋), interval [y₍ᵣ₎, y₍ᵣ₊q₎].
 * @param sorted model values in ascending order (unit of the output)
 * @param coverageProbability p in (0, 1)
 * @throws if p is outside (0, 1) or there are too few values
 * @example symmetricInterval(sortedErrors, 0.95)
 */
export function symmetricInterval(sorted: Float64Array, coverageProbability: number): CoverageInterval {
  const count = sorted.length;
  const q = coverageCounts(count, coverageProbability);
  const half = (count - q) / 2;
  const r = Number.isInteger(half) ? half : Math.floor((count - q + 1) / 2);
  return { low: sorted[r - 1], high: sorted[r + q - 1] };
}

/**
 * Shortest coverage interval from ascending model values, JCGM 101:2008 7.7.2: the r* in
 * 1…M − q minimising y₍ᵣ₊q₎ − y₍ᵣ₎ (the first such r on ties).
 * @param sorted model values in ascending order (unit of the output)
 * @param coverageProbability p in (0, 1)
 * @throws if p is outside (0, 1) or there are too few values
 * @example shortestInterval(sortedErrors, 0.95)
 */
export function shortestInterval(sorted: Float64Array, coverageProbability: number): CoverageInterval {
  const count = sorted.length;
  const q = coverageCounts(count, coverageProbability);
  let best = 1;
  let bestWidth = Infinity;
  for (let r = 1; r <= count - q; r++) {
    const width = sorted[r + q - 1] - sorted[r - 1];
    if (width < bestWidth) {
      bestWidth = width;
      best = r;
    }
  }
  return { low: sorted[best - 1], high: sorted[best + q - 1] };
}
