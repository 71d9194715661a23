import type { UncertainInput } from './inputs.js';
import type { MeasurementFunction } from './functional-model.js';

/** How the corners were chosen. */
export type WorstCaseMethod = 'exhaustive' | 'sensitivity-signs';

/** Extreme-value result for one output (output unit). */
export interface WorstCaseResult {
  minimum: number;
  maximum: number;
  maxAbs: number;
  method: WorstCaseMethod;
  /** Inputs with a non-zero half-width (the corner dimensions). */
  boundedInputs: number;
  cornersEvaluated: number;
}

/** Largest input count searched exhaustively (2^16 corners). */
export const EXHAUSTIVE_LIMIT = 16;

/**
 * Extreme-value (worst-case) analysis: evaluates f at corners x_i = centre_i ± a_i of all
 * bounded inputs (a normal input's a = k·σ). With n ≤ 16 bounded inputs all 2^n corners are
 * tried; otherwise the corner given by the signs of f(centre + a_i) − f(centre − a_i) (and its
 * opposite), each then improved by flipping one input at a time until no flip helps.
 * @param inputs inputs in the order f reads them
 * @param model the measurement function
 * @throws if there are no inputs or f is not finite at a corner
 * @example worstCase(inputs, (x) => x[0] - x[1]).maxAbs
 */
export function worstCase(inputs: readonly UncertainInput[], model: MeasurementFunction): WorstCaseResult {
  if (inputs.length === 0) throw new Error('inputs must not be empty');
  const x = Float64Array.from(inputs, (i) => i.centre);
  const bounded = inputs.map((_, i) => i).filter((i) => inputs[i].halfWidth > 0);
  const n = bounded.length;
  let evaluated = 0;
  const at = (signs: Int8Array): number => {
    for (let j = 0; j < n; j++) x[bounded[j]] = inputs[bounded[j]].centre + signs[j] * inputs[bounded[j]].halfWidth;
    evaluated++;
    const y = model(x);
    if (!Number.isFinite(y)) throw new Error('model is not finite at a worst-case corner');
    return y;
  };
  let minimum = Infinity;
  let maximum = -Infinity;
  const signs = new Int8Array(n);
  if (n <= EXHAUSTIVE_LIMIT) {
    for (let mask = 0; mask < 2 ** n; mask++) {
      for (let j = 0; j < n; j++) signs[j] = (mask >> j) & 1 ? 1 : -1;
      const y = at(signs);
      if (y < minimum) minimum = y;
      if (y > maximum) maximum = y;
    }
    return { minimum, maximum, maxAbs: Math.max(Math.abs(minimum), Math.abs(maximum)), method: 'exhaustive', boundedInputs: n, cornersEvaluated: evaluated };
  }
  const direction = new Int8Array(n);
  for (let j = 0; j < n; j++) {
    signs.fill(0);
    signs[j] = 1;
    const up = at(signs);
    signs[j] = -1;
    direction[j] = up >= at(signs) ? 1 : -1;
  }
  for (const goal of [1, -1]) {
    for (let j = 0; j < n; j++) signs[j] = goal * direction[j];
    let best = goal * at(signs);
    for (let pass = 0, improved = true; improved && pass < 4; pass++) {
      improved = false;
      for (let j = 0; j < n; j++) {
        signs[j] = -signs[j];
        const y = goal * at(signs);
        if (y > best) {
          best = y;
          improved = true;
        } else signs[j] = -signs[j];
      }
    }
    if (goal === 1) maximum = best;
    else minimum = -best;
  }
  return { minimum, maximum, maxAbs: Math.max(Math.abs(minimum), Math.abs(maximum)), method: 'sensitivity-signs', boundedInputs: n, cornersEvaluated: evaluated };
}
