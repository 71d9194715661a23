import { CornerSearch, type Corners, type Extreme } from './corner-search.js';
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

/** Most cornered inputs searched exhaustively at each scanned value (2^8 corners, about what the sign search costs). */
export const EXHAUSTIVE_LIMIT = 8;
/** Evenly spaced interior values of the scanned input tried besides its ends (the midpoint). */
const INTERIOR_SCAN_POINTS = 1;
/** Golden-section steps next to an interior best scanned value (bracket shrinks to 0.618^12 ≈ 0.3 %). */
const GOLDEN_STEPS = 12;
const GOLDEN = (Math.sqrt(5) - 1) / 2;

/**
 * Extreme-value (worst-case) analysis over the box x_i ∈ [centre_i − a_i, centre_i + a_i] of all
 * bounded inputs (a normal input's a = k·σ). The scanned input (when given) is tried at both
 * ends, at given and evenly spaced interior values, and by golden-section search next to an
 * interior best; at each of its values the other inputs are cornered:
 * - with ≤ EXHAUSTIVE_LIMIT of them, all 2^n corners (exact at that value);
 * - otherwise from two starts (the signs of each input's effect f(x + a_i e_i) − f(x − a_i e_i)
 *   at that value, the others at their centres; and the best corner of the previous value),
 *   each improved by flipping one input at a time until no flip helps; the best corners at the
 *   two ends of the scanned range and the best overall are then confirmed by flipping every
 *   pair of inputs, and improved further if a pair helps.
 * What it guarantees: every value returned is f at a point of the box, so it never lies outside
 * the true range. It is the true extreme when (a) at each value of the scanned input, f is
 * monotone in every other input in a direction the other inputs cannot reverse: the corner of the
 * effect signs is then the extreme (move one input at a time to its better end; f never falls),
 * and that corner is the first start; and (b) the extreme over the scanned input lies at a tried
 * value or inside the refined bracket. With ≤ EXHAUSTIVE_LIMIT cornered inputs only (b) is needed.
 * Where one input does reverse another's direction, the flips repair it; that part is a search,
 * checked against exhaustive enumeration in the tests, not a proof.
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
  const scanning = scanned >= 0 && inputs[scanned].halfWidth > 0;
  const corners = new CornerSearch(inputs, model, scanned);
  const n = corners.size;
  const exhaustive = n <= EXHAUSTIVE_LIMIT;
  const best: { max: Extreme & { at: number }; min: Extreme & { at: number } } = {
    max: { value: -Infinity, signs: new Int8Array(n), at: NaN },
    min: { value: Infinity, signs: new Int8Array(n), at: NaN },
  };
  /** Searches the corners at scanned value t and keeps any new extreme. */
  const tryAt = (t: number, warm?: Corners): Corners => {
    if (scanning) corners.x[scanned] = t;
    const found = exhaustive ? corners.exhaustive() : corners.fromSigns(warm);
    if (found.max.value > best.max.value) best.max = { value: found.max.value, signs: Int8Array.from(found.max.signs), at: t };
    if (found.min.value < best.min.value) best.min = { value: found.min.value, signs: Int8Array.from(found.min.signs), at: t };
    return found;
  };
  const tried: { t: number; found: Corners }[] = [];
  for (const t of scanning ? scanValuesOf(inputs[scanned], options.scanValues ?? []) : [NaN]) tried.push({ t, found: tryAt(t, tried.at(-1)?.found) });
  for (const goal of scanning ? [1, -1] : []) {
    const k = tried.findIndex((v) => v.t === (goal === 1 ? best.max.at : best.min.at));
    if (k > 0 && k < tried.length - 1) refine(tried[k - 1].t, tried[k + 1].t, goal, tried[k].found);
  }
  // Pair flips at the best corner of each end of the scanned range and at the best overall: an
  // input whose effect is nil at the centre (bias current before a TCR moves it) can sit at the
  // wrong end of a pair there.
  for (const goal of exhaustive ? [] : [1, -1]) {
    const kept = goal === 1 ? best.max : best.min;
    const starts = [{ t: kept.at, signs: kept.signs }];
    for (const end of scanning ? [tried[0], tried[tried.length - 1]] : []) {
      if (end.t !== kept.at) starts.push({ t: end.t, signs: goal === 1 ? end.found.max.signs : end.found.min.signs });
    }
    for (const start of starts) {
      if (scanning) corners.x[scanned] = start.t;
      const signs = Int8Array.from(start.signs);
      const value = goal * corners.confirm(signs, goal);
      if (goal * value > goal * kept.value || start.signs === kept.signs) Object.assign(kept, { value, signs, at: start.t });
    }
  }
  const minimum = best.min.value;
  const maximum = best.max.value;
  return {
    minimum, maximum, maxAbs: Math.max(Math.abs(minimum), Math.abs(maximum)),
    method: exhaustive ? 'exhaustive' : 'signs-and-flips', boundedInputs: n + (scanning ? 1 : 0), cornersEvaluated: corners.evaluated,
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
}

/** Ends, evenly spaced interior values and the given ones inside the range, ascending, distinct. */
function scanValuesOf(input: UncertainInput, extra: readonly number[]): number[] {
  const low = input.centre - input.halfWidth;
  const high = input.centre + input.halfWidth;
  const values = [low, high, ...extra.filter((v) => v > low && v < high)];
  for (let k = 1; k <= INTERIOR_SCAN_POINTS; k++) values.push(low + ((high - low) * k) / (INTERIOR_SCAN_POINTS + 1));
  return [...new Set(values)].sort((a, b) => a - b);
}
