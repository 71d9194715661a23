import type { MeasurementFunction } from './functional-model.js';
import type { UncertainInput } from './inputs.js';

/** A corner (one sign per cornered input) and the model's value there. */
export interface Extreme {
  value: number;
  signs: Int8Array;
}

/** The largest and the smallest corner found. */
export interface Corners {
  max: Extreme;
  min: Extreme;
}

/**
 * Corner searches over the bounded inputs of a model, the other inputs held where the caller set
 * them (the scanned input at its current value). Counts every model evaluation.
 */
export class CornerSearch {
  readonly x: Float64Array;
  readonly cornered: number[];
  evaluated = 0;

  /**
   * @param inputs inputs in the order f reads them
   * @param model the measurement function
   * @param skip index of an input that is not cornered (−1 for none)
   * @throws never; evaluations throw if f is not finite
   * @example new CornerSearch(inputs, model, 7).exhaustive()
   */
  constructor(private readonly inputs: readonly UncertainInput[], private readonly model: MeasurementFunction, skip: number) {
    this.x = Float64Array.from(inputs, (i) => i.centre);
    this.cornered = inputs.map((_, i) => i).filter((i) => i !== skip && inputs[i].halfWidth > 0);
  }

  /** Number of cornered inputs n (2^n corners). */
  get size(): number {
    return this.cornered.length;
  }

  /** f at the current x, counted; throws rather than let a NaN pass for an extreme. */
  evaluate(): number {
    this.evaluated++;
    const y = this.model(this.x);
    if (!Number.isFinite(y)) throw new Error('model is not finite at a worst-case corner');
    return y;
  }

  private place(j: number, sign: number): void {
    const input = this.inputs[this.cornered[j]];
    this.x[this.cornered[j]] = input.centre + sign * input.halfWidth;
  }

  private at(signs: Int8Array): number {
    for (let j = 0; j < signs.length; j++) this.place(j, signs[j]);
    return this.evaluate();
  }

  /** Every one of the 2^n corners, in Gray-code order (one input changes per step). */
  exhaustive(): Corners {
    const n = this.size;
    const max = { value: -Infinity, signs: new Int8Array(n) };
    const min = { value: Infinity, signs: new Int8Array(n) };
    const signs = new Int8Array(n).fill(-1);
    for (let k = 0; k < 2 ** n; k++) {
      if (k > 0) signs[31 - Math.clz32(k & -k)] *= -1;
      const y = this.at(signs);
      if (y > max.value) { max.value = y; max.signs.set(signs); }
      if (y < min.value) { min.value = y; min.signs.set(signs); }
    }
    return { max, min };
  }

  /**
   * From the signs of each input's effect f(x + a_i e_i) − f(x − a_i e_i) (the others at their
   * centres), and from the warm start's corners, single flips until none helps (see climb).
   */
  fromSigns(warm?: Corners): Corners {
    const n = this.size;
    const direction = new Int8Array(n);
    for (let j = 0; j < n; j++) this.x[this.cornered[j]] = this.inputs[this.cornered[j]].centre;
    for (let j = 0; j < n; j++) {
      this.place(j, 1);
      const up = this.evaluate();
      this.place(j, -1);
      direction[j] = up >= this.evaluate() ? 1 : -1;
      this.x[this.cornered[j]] = this.inputs[this.cornered[j]].centre;
    }
    const found: Corners = { max: { value: -Infinity, signs: direction }, min: { value: Infinity, signs: direction } };
    for (const goal of [1, -1]) {
      const starts = [Int8Array.from(direction, (s) => goal * s)];
      const previous = goal === 1 ? warm?.max.signs : warm?.min.signs;
      if (previous && previous.some((s, j) => s !== starts[0][j])) starts.push(Int8Array.from(previous));
      for (const signs of starts) {
        const value = goal * this.climb(signs, goal);
        if (goal === 1 && value > found.max.value) found.max = { value, signs };
        if (goal === -1 && value < found.min.value) found.min = { value, signs };
      }
    }
    return found;
  }

  /** Single flips until none raises goal·f; updates signs in place and returns goal·f there. */
  climb(signs: Int8Array, goal: number): number {
    let best = goal * this.at(signs);
    for (let improved = true; improved;) {
      improved = false;
      for (let j = 0; j < signs.length; j++) {
        this.place(j, -signs[j]);
        const y = goal * this.evaluate();
        if (y > best) {
          best = y;
          signs[j] = -signs[j];
          improved = true;
        } else this.place(j, signs[j]);
      }
    }
    return best;
  }

  /** Single flips, then every pair of flips; a pair that helps restarts both. Returns goal·f. */
  confirm(signs: Int8Array, goal: number): number {
    const n = signs.length;
    let best = this.climb(signs, goal);
    for (let improved = true; improved;) {
      improved = false;
      for (let j = 0; j < n && !improved; j++) {
        for (let k = j + 1; k < n && !improved; k++) {
          this.place(j, -signs[j]);
          this.place(k, -signs[k]);
          const y = goal * this.evaluate();
          if (y > best) {
            signs[j] = -signs[j];
            signs[k] = -signs[k];
            best = this.climb(signs, goal);
            improved = true;
          } else {
            this.place(j, signs[j]);
            this.place(k, signs[k]);
          }
        }
      }
    }
    return best;
  }
}
