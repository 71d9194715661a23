/** Equal-width histogram: `edges` has one more entry than `counts`. */
export interface Histogram {
  edges: number[];
  counts: number[];
}

/**
 * Equal-width histogram over [min, max] of the finite values (non-finite ones are skipped).
 * @param values samples in any unit
 * @param binCount number of bins, integer ≥ 1
 * @throws if binCount is not an integer ≥ 1
 * @example histogramOf(new Float64Array([0, 1, 1, 2]), 2) // edges [0, 1, 2], counts [1, 3]
 */
export function histogramOf(values: ArrayLike<number>, binCount: number): Histogram {
  if (!Number.isInteger(binCount) || binCount < 1) throw new Error('bin count must be an integer ≥ 1');
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (!Number.isFinite(v)) continue;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  const counts = new Array<number>(binCount).fill(0);
  if (min === Infinity) return { edges: [], counts: [] };
  const width = max > min ? (max - min) / binCount : 1;
  const edges = Array.from({ length: binCount + 1 }, (_, i) => min + i * width);
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (!Number.isFinite(v)) continue;
    counts[Math.min(binCount - 1, Math.floor((v - min) / width))]++;
  }
  return { edges, counts };
}
