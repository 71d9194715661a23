import type { UncertainInput } from './inputs.js';
import type { MeasurementFunction } from './functional-model.js';

/**
 * How the corners were chosen: every corner at each tried value of the scanned input, or
 * corners from effect signs improved by flips. `sensitivity-signs` is only found in studies
 * stored before the scan existed; that search could stop short of the extreme.
 */
export type WorstCaseMethod = 'exhaustive' | 'signs-and-flips' | 'sensitivity-signs';

/** Extreme-value result for one output (output unit). */
export interface WorstCaseResult {
  minimum: number;
  maximum: number;
  maxAbs: number;
  method: WorstCaseMethod;
  /** Inputs with a non-zero half-width (the corner dimensions, the scanned input included). */
  boundedInputs: number;
  /** Model evaluations the search made. */
  cornersEvaluated: number;
}

/** What the search should know about the model. */
export interface WorstCaseOptions {
  /**
   * Index of the one input whose effect may change sign inside its range because others
   * multiply it (temperature times every TCR and tempco): it is scanned, not only cornered.
   */
  scanned?: number;
  /** Values of the scanned input to try besides its ends and the evenly spaced interior ones. */
  scanValues?: readonly number[];
}

/** Most cornered inputs searched exhaustively at each scanned value (2^10 corners). */
export const EXHAUSTIVE_LIMIT = 10;
/** Evenly spaced interior values of the scanned input tried besides its ends (the midpoint). */
const INTERIOR_SCAN_POINTS = 1;
/** Golden-section steps next to an interior best scanned value (bracket shrinks to 0.618^12 ≈ 0.3 %). */
const GOLDEN_STEPS = 12;
const GOLDEN = (Math.sqrt(5) - 1) / 2;

interface Extreme {
  value: number;
  signs: Int8Array;
}

interface Corners {
  max: Extreme;
  min: Extreme;
}

/**
 * Extreme-value (worst-case) analysis over the box x_i ∈ [centre_i − a_i, centre_i + a_i] of all
 * bounded inputs (a normal input's a = k·σ). The scanned input (when given) is tried at both
 * ends, at given and evenly spaced interior values, and by golden-section search next to an
 * interior best; at each of its values the other inputs are cornered:
 * - with ≤ EXHAUSTIVE_LIMIT of them, all 2^n corners (exact at that value);
 * - otherwise from two starts (the signs of each input's effect f(x + a_i e_i) − f(x − a_i e_i)
 *   at that value, the others at their centres; and the best corner of the previous value),
 *   each improved by flipping one input at a time until no flip helps; the best corner found
 *   is then confirmed by flipping every pair of inputs, and improved further if a pair helps.
 * Guarantee: the result is attained by a point of the box, so it never overstates the extreme;
 * it equals the extreme when, at every value of the scanned input, f is monotone in each other
 * input with a direction the others cannot reverse, and the extreme over the scanned input lies
 * at a tried value or inside the golden-section bracket. A model monotone in each input at fixed
 * scanned value has its extremes at corners, so single and pair flips leave only couplings of
 * three or more inputs that reverse each other's directions.
 * @param inputs inputs in the order f reads them
 * @param model the measurement function
 * @param options the scanned input and its extra values (omit for a plain corner search)
 * @throws if there are no inputs, the scanned index is not an input, or f is not finite at a tried point
 * @example worstCase(inputs, (x) => x[0] - x[1]).maxAbs
 */
export function worstCase(inputs: readonly UncertainInput[], model: MeasurementFunction, options: WorstCaseOptions = {}): WorstCaseResult {
  if (inputs.length === 0) throw new Error('inputs must not be empty');
  const scanned = options.scanned ?? -1;
  if (scanned !== -1 && !(Number.isInteger(scanned) && scanned >= 0 && scanned < inputs.length)) throw new Error('scanned input must be an input index');
  const x = Float64Array.from(inputs, (i) => i.centre);
  const cornered = inputs.map((_, i) => i).filter((i) => i !== scanned && inputs[i].halfWidth > 0);
  const n = cornered.length;
  const scanning = scanned >= 0 && inputs[scanned].halfWidth > 0;
  let evaluated = 0;
  const evaluate = (): number => {
    evaluated++;
    const y = model(x);
    if (!Number.isFinite(y)) throw new Error('model is not finite at a worst-case corner');
    return y;
  };
  const place = (j: number, sign: number): void => {
    const input = inputs[cornered[j]];
    x[cornered[j]] = input.centre + sign * input.halfWidth;
  };
  const at = (signs: Int8Array): number => {
    for (let j = 0; j < n; j++) place(j, signs[j]);
    return evaluate();
  };

  /** Every corner at the current scanned value. */
  const exhaustive = (): Corners => {
    const max = { value: -Infinity, signs: new Int8Array(n) };
    const min = { value: Infinity, signs: new Int8Array(n) };
    const signs = new Int8Array(n).fill(-1);
    for (let k = 0; k < 2 ** n; k++) {
      // Gray-code order: corner k differs from corner k − 1 in input ctz(k) only.
      if (k > 0) signs[31 - Math.clz32(k & -k)] *= -1;
      const y = at(signs);
      if (y > max.value) { max.value = y; max.signs.set(signs); }
      if (y < min.value) { min.value = y; min.signs.set(signs); }
    }
    return { max, min };
  };

  /** Single flips until none raises goal·f; returns goal·f at the final corner. */
  const climb = (signs: Int8Array, goal: number): number => {
    let best = goal * at(signs);
    for (let improved = true; improved;) {
      improved = false;
      for (let j = 0; j < n; j++) {
        place(j, -signs[j]);
        const y = goal * evaluate();
        if (y > best) {
          best = y;
          signs[j] = -signs[j];
          improved = true;
        } else place(j, signs[j]);
      }
    }
    return best;
  };

  /** Corners by effect signs at the current scanned value, and from the warm starts. */
  const local = (warm?: Corners): Corners => {
    const direction = new Int8Array(n);
    for (let j = 0; j < n; j++) x[cornered[j]] = inputs[cornered[j]].centre;
    for (let j = 0; j < n; j++) {
      place(j, 1);
      const up = evaluate();
      place(j, -1);
      direction[j] = up >= evaluate() ? 1 : -1;
      x[cornered[j]] = inputs[cornered[j]].centre;
    }
    const result = { max: { value: -Infinity, signs: direction }, min: { value: Infinity, signs: direction } };
    for (const goal of [1, -1]) {
      const starts = [Int8Array.from(direction, (s) => goal * s)];
      const previous = goal === 1 ? warm?.max.signs : warm?.min.signs;
      if (previous && previous.some((s, j) => s !== starts[0][j])) starts.push(Int8Array.from(previous));
      for (const signs of starts) {
        const value = goal * climb(signs, goal);
        if (goal === 1 && value > result.max.value) result.max = { value, signs };
        if (goal === -1 && value < result.min.value) result.min = { value, signs };
      }
    }
    return result;
  };

  const search = (warm?: Corners): Corners => (n <= EXHAUSTIVE_LIMIT ? exhaustive() : local(warm));
  const best: { max: Extreme & { at: number }; min: Extreme & { at: number } } = {
    max: { value: -Infinity, signs: new Int8Array(n), at: NaN },
    min: { value: Infinity, signs: new Int8Array(n), at: NaN },
  };
  /** Searches the corners at scanned value t and keeps any new extreme. */
  const tryAt = (t: number, warm?: Corners): Corners => {
    if (scanning) x[scanned] = t;
    const found = search(warm);
    if (found.max.value > best.max.value) best.max = { ...found.max, signs: Int8Array.from(found.max.signs), at: t };
    if (found.min.value < best.min.value) best.min = { ...found.min, signs: Int8Array.from(found.min.signs), at: t };
    return found;
  };
  const values = scanning ? scanValuesOf(inputs[scanned], options.scanValues ?? []) : [NaN];
  const tried: { t: number; found: Corners }[] = [];
  for (const t of values) tried.push({ t, found: tryAt(t, tried.at(-1)?.found) });
  for (const goal of scanning ? [1, -1] : []) {
    const k = tried.findIndex((v) => v.t === (goal === 1 ? best.max.at : best.min.at));
    if (k > 0 && k < tried.length - 1) refine(tried[k - 1].t, tried[k + 1].t, goal, tried[k].found);
  }
  if (n > EXHAUSTIVE_LIMIT) {
    for (const goal of [1, -1]) confirm(goal);
  }
  const minimum = best.min.value;
  const maximum = best.max.value;
  return {
    minimum, maximum, maxAbs: Math.max(Math.abs(minimum), Math.abs(maximum)),
    method: n <= EXHAUSTIVE_LIMIT ? 'exhaustive' : 'signs-and-flips', boundedInputs: n + (scanning ? 1 : 0), cornersEvaluated: evaluated,
  };

  /** Golden-section search of the scanned value in [low, high] for the largest goal·f. */
  function refine(low: number, high: number, goal: number, warm: Corners): void {
    const score = (t: number): number => {
      const found = tryAt(t, warm);
      return goal === 1 ? found.max.value : -found.min.value;
    };
    let a = low;
    let b = high;
    let c = b - GOLDEN * (b - a);
    let d = a + GOLDEN * (b - a);
    let fc = score(c);
    let fd = score(d);
    for (let step = 0; step < GOLDEN_STEPS; step++) {
      if (fc >= fd) {
        b = d; d = c; fd = fc; c = b - GOLDEN * (b - a); fc = score(c);
      } else {
        a = c; c = d; fc = fd; d = a + GOLDEN * (b - a); fd = score(d);
      }
    }
  }

  /** Pair flips at the best corner; any gain restarts single flips there. */
  function confirm(goal: number): void {
    const kept = goal === 1 ? best.max : best.min;
    if (scanning) x[scanned] = kept.at;
    const signs = Int8Array.from(kept.signs);
    let score = climb(signs, goal);
    for (let improved = true; improved;) {
      improved = false;
      for (let j = 0; j < n && !improved; j++) {
        for (let k = j + 1; k < n && !improved; k++) {
          place(j, -signs[j]);
          place(k, -signs[k]);
          const y = goal * evaluate();
          if (y > score) {
            signs[j] = -signs[j];
            signs[k] = -signs[k];
            score = climb(signs, goal);
            improved = true;
          } else {
            place(j, signs[j]);
            place(k, signs[k]);
          }
        }
      }
    }
    if (score > goal * kept.value) {
      kept.value = goal * score;
      kept.signs = signs;
    }
  }
}

/** Ends, evenly spaced interior values and the given ones inside the range, ascending, distinct. */
function scanValuesOf(input: UncertainInput, extra: readonly number[]): number[] {
  const low = input.centre - input.halfWidth;
  const high = input.centre + input.halfWidth;
  const values = [low, high, ...extra.filter((v) => v > low && v < high)];
  for (let k = 1; k <= INTERIOR_SCAN_POINTS; k++) values.push(low + ((high - low) * k) / (INTERIOR_SCAN_POINTS + 1));
  return [...new Set(values)].sort((a, b) => a - b);
}
