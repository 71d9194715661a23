/** Round axis limits for charts: ticks on 1, 2 or 5 × 10^k, limits on whole ticks. */

export interface NiceScale {
  min: number;
  max: number;
  stepSize: number;
}

/**
 * The round step nearest to `rough`: 1, 2, 5 or 10 times a power of ten.
 * @param rough a positive step, in the axis's unit
 * @throws when rough is not a positive finite number
 * @example niceStep(1.98) // 2
 */
export function niceStep(rough: number): number {
  if (!(rough > 0) || !Number.isFinite(rough)) throw new Error(`step must be a positive finite number, got ${rough}`);
  const power = 10 ** Math.floor(Math.log10(rough));
  const fraction = rough / power;
  const nice = fraction < 1.5 ? 1 : fraction < 3 ? 2 : fraction < 7 ? 5 : 10;
  // Rounded to 12 significant digits so 0.1 × 3 prints as 0.3, not 0.30000000000000004.
  return Number((nice * power).toPrecision(12));
}

/**
 * Axis limits that cover [low, high] with about `ticks` intervals of a round step, the limits on whole steps
 * (the "nice numbers" labelling of Heckbert, Graphics Gems, 1990). A zero-width range is widened by one step
 * of its own magnitude, so a single value still gets an axis.
 * @param low smallest value to show, in the axis's unit
 * @param high largest value to show, in the axis's unit
 * @param ticks about how many intervals to draw (≥ 1)
 * @throws when a limit is not finite, low > high, or ticks < 1
 * @example niceScale(-8.02, 6.3, 8) // { min: -10, max: 8, stepSize: 2 }
 */
export function niceScale(low: number, high: number, ticks = 6): NiceScale {
  if (!Number.isFinite(low) || !Number.isFinite(high)) throw new Error(`axis limits must be finite, got ${low} and ${high}`);
  if (low > high) throw new Error(`axis low ${low} must not exceed high ${high}`);
  if (!(ticks >= 1)) throw new Error(`ticks must be ≥ 1, got ${ticks}`);
  const span = high - low || Math.abs(high) || 1;
  const stepSize = niceStep(span / ticks);
  const round = (v: number) => Number(v.toPrecision(12));
  let min = round(Math.floor(low / stepSize) * stepSize);
  let max = round(Math.ceil(high / stepSize) * stepSize);
  if (min === max) {
    min = round(min - stepSize);
    max = round(max + stepSize);
  }
  return { min, max, stepSize };
}
