/**
 * The integer arithmetic of the firmware header's fixed-point reading, step for step, in BigInt: what the C
 * function returns for an input, so the server can state its departure and the tests can compare the compiled
 * code bit for bit. See fixed-point.ts for how the representation is chosen.
 */
import { divRound } from './dyadic.js';

/** Bits after the binary point of u. */
export const U_FRAC_BITS = 30;
/** The largest input, a uint32_t. */
export const INPUT_MAX = 2 ** 32 - 1;

/** What the header holds for the fixed-point reading. */
export interface FixedPointRepresentation {
  /** FB: the input is the frequency in Hz × 2^FB, as an unsigned 32-bit integer. */
  frequencyFracBits: number;
  /** MID and HALF in input units: u = (F − MID)/HALF. */
  midFx: number;
  halfFx: number;
  /** Inputs are clamped to [lowFx, highFx], i.e. |u| ≤ 2. */
  lowFx: number;
  highFx: number;
  uFracBits: number;
  /** A: the running sum and the result are volts × 2^A. */
  voltsFracBits: number;
  /** a_k = q/2^shift, the coefficients of V(u), k = 0…degree. */
  scaled: { q: number; shift: number }[];
}

/** Coefficient k as the integer the Horner step adds, units of 2^−A V (|q| ≤ 2^30, so a shift past 31 leaves 0). */
export const stepTerm = (form: FixedPointRepresentation, k: number): bigint => {
  const d = form.scaled[k].shift - form.voltsFracBits;
  return d > 31 ? 0n : divRound(BigInt(form.scaled[k].q), 1n << BigInt(d));
};

/**
 * The integer the header's fixed-point function returns for input F (volts × 2^A), by the same steps.
 * @param form a result of fixedPointForm
 * @param frequencyFx the frequency in Hz × 2^FB, an integer 0…2^32 − 1
 * @throws Error when the input is not such an integer
 * @example fixedPointReading(form, 20000 * 2 ** form.frequencyFracBits) / 2 ** form.voltsFracBits // volts at 20 kHz
 */
export function fixedPointReading(form: FixedPointRepresentation, frequencyFx: number): number {
  if (!Number.isInteger(frequencyFx) || frequencyFx < 0 || frequencyFx > INPUT_MAX) throw new Error('frequency input must be an integer 0…2^32 − 1');
  const f = BigInt(Math.min(Math.max(frequencyFx, form.lowFx), form.highFx));
  const u = divRound((f - BigInt(form.midFx)) * (1n << BigInt(U_FRAC_BITS)), BigInt(form.halfFx));
  let acc = 0n;
  for (let k = form.scaled.length - 1; k >= 0; k--) acc = divRound(acc * u, 1n << BigInt(U_FRAC_BITS)) + stepTerm(form, k);
  return Number(acc);
}
