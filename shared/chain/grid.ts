/**
 * Evaluation voltages: `points` equally spaced values from minV to maxV inclusive.
 * @param rangeV measuring range in V (minV ≥ 0, maxV > minV)
 * @param points number of voltages, integer ≥ 2
 * @throws if the range is reversed or points is not an integer ≥ 2
 * @example evaluationGrid({ minV: 0, maxV: 400 }, 5) // 0, 100, 200, 300, 400 V
 */
export function evaluationGrid(rangeV: { minV: number; maxV: number }, points: number): Float64Array {
  if (!(rangeV.maxV > rangeV.minV)) throw new Error('voltage range reversed');
  if (!Number.isInteger(points) || points < 2) throw new Error('grid points must be an integer ≥ 2');
  const step = (rangeV.maxV - rangeV.minV) / (points - 1);
  return Float64Array.from({ length: points }, (_, i) => (i === points - 1 ? rangeV.maxV : rangeV.minV + i * step));
}
