/**
 * Integer-only reading of a calibration polynomial volts = Σ c_k·f^k for firmware without floating point.
 *
 * The frequency enters as an unsigned 32-bit count of 2^−FB Hz and is normalised over the calibrated range,
 * u = (F − MID)/HALF with |u| ≤ 1 there, held in Q30. The polynomial is re-expanded exactly in u, V = Σ a_k·u^k,
 * each a_k kept as q_k/2^shift_k with 30 significant bits, and evaluated by Horner's rule in 64-bit integers with
 * the running sum in units of 2^−A V. Every bound below is chosen so that no intermediate leaves int64 and no
 * negative value is shifted; rounding is done by truncating division only (C99 6.5.5), which the header's C
 * helper and fixedPointReading (fixed-point-reading.ts) do identically.
 */
import {
  absDyadic, addDyadic, ceilLog2, ceilToScale, dyadic, dyadicToNumber, mulDyadic, negDyadic, roundToScale, type Dyadic,
} from './dyadic.js';
import { fixedPointReading, INPUT_MAX, stepTerm, U_FRAC_BITS, type FixedPointRepresentation } from './fixed-point-reading.js';

/** Inputs are clamped to |u| ≤ 2 (half the calibrated span beyond either end) so the integers cannot overflow. */
const U_LIMIT_LOG2 = 1;
const SHIFT_MAX = 255;

export interface FixedPointForm extends FixedPointRepresentation {
  /** Upper bound of |fixed − float form| over the calibrated range, from the rounding steps, volts. */
  maxDepartureV: number;
  /** The largest |fixed − float form| found at gridPoints input values spread over the calibrated range, volts. */
  largestFoundV: number;
  gridPoints: number;
}

const binomial = (j: number, k: number): bigint => {
  let c = 1n;
  for (let i = 1; i <= k; i++) c = (c * BigInt(j - k + i)) / BigInt(i);
  return c;
};
const powers = (x: Dyadic, n: number): Dyadic[] => {
  const out: Dyadic[] = [{ n: 1n, e: 0 }];
  for (let k = 1; k <= n; k++) out.push(mulDyadic(out[k - 1], x));
  return out;
};

/** The largest FB whose clamped input range fits 32 bits, with MID and HALF in those units. */
function inputScale(minHz: Dyadic, maxHz: Dyadic) {
  const twiceMid = addDyadic(minHz, maxHz);
  const span = addDyadic(maxHz, negDyadic(minHz));
  for (let fb = 31; fb >= 0; fb--) {
    const mid = roundToScale(twiceMid, fb - 1);
    const half = ceilToScale(span, fb - 1) + 1n; // + 1: an input rounded from the range ends stays within |u| ≤ 1
    const high = mid + 2n * half;
    if (high <= BigInt(INPUT_MAX)) return { fb, mid, half, low: mid - 2n * half > 0n ? mid - 2n * half : 0n, high };
  }
  throw new Error('the calibrated range reaches beyond what a 32-bit frequency holds');
}

/**
 * The fixed-point form of volts = Σ c_k·f^k over a calibrated frequency range, with a rigorous bound of its
 * departure from the polynomial evaluated exactly, and the largest departure found on a grid of inputs by exact
 * emulation of the integer arithmetic.
 * @param coefficients c_0…c_n (n ≤ 3), volts per Hz^k
 * @param rangeHz the calibrated frequency range, Hz, 0 ≤ min < max
 * @param gridPoints inputs at which the departure is computed (default 4097)
 * @throws Error when a coefficient is not finite, the range is reversed or negative, or the reading needs more than int32
 * @example fixedPointForm([-6.37, 0.012436], { min: 512.5, max: 40717.5 }).maxDepartureV // ≈ 1.2e−6 V
 */
export function fixedPointForm(coefficients: readonly number[], rangeHz: { min: number; max: number }, gridPoints = 4097): FixedPointForm {
  if (coefficients.length < 1 || coefficients.length > 4) throw new Error('coefficients must hold 1 to 4 values');
  if (!(rangeHz.min >= 0 && rangeHz.max > rangeHz.min && Number.isFinite(rangeHz.max))) throw new Error('frequency range must satisfy 0 ≤ min < max Hz');
  if (!Number.isInteger(gridPoints) || gridPoints < 2) throw new Error('gridPoints must be a whole number ≥ 2');
  const c = coefficients.map(dyadic);
  const n = c.length - 1;
  const { fb, mid, half, low, high } = inputScale(dyadic(rangeHz.min), dyadic(rangeHz.max));
  // f = m + h·u with m = MID·2^−FB, h = HALF·2^−FB: a_k = Σ_{j≥k} c_j·C(j,k)·m^(j−k)·h^k, exactly
  const m = powers({ n: mid, e: -fb }, n);
  const h = powers({ n: half, e: -fb }, n);
  const a = c.map((_, k) => c.slice(k).reduce<Dyadic>((sum, cj, i) =>
    addDyadic(sum, mulDyadic(mulDyadic(cj, { n: binomial(k + i, k), e: 0 }), mulDyadic(m[i], h[k]))), { n: 0n, e: 0 }));
  // every Horner partial sum is at most Σ|a_j|·2^j for |u| ≤ 2, so it keeps below 2^30 units of 2^−A V
  const bound = a.reduce<Dyadic>((sum, ak, k) => addDyadic(sum, { n: absDyadic(ak).n, e: ak.e + k * U_LIMIT_LOG2 }), { n: 0n, e: 0 });
  const voltsFracBits = bound.n === 0n ? U_FRAC_BITS : U_FRAC_BITS - ceilLog2(bound);
  if (voltsFracBits < 0) throw new Error('the reading reaches beyond 2^30 V: no fixed-point form');
  if (voltsFracBits > SHIFT_MAX) throw new Error('the reading is below 2^−225 V throughout: no fixed-point form');
  const scaled = a.map((ak) => {
    const shift = ak.n === 0n ? voltsFracBits : U_FRAC_BITS - ceilLog2(ak);
    return shift > SHIFT_MAX ? { q: 0, shift: voltsFracBits } : { q: Number(roundToScale(ak, shift)), shift };
  });
  const form = { frequencyFracBits: fb, midFx: Number(mid), halfFx: Number(half), lowFx: Number(low), highFx: Number(high), uFracBits: U_FRAC_BITS, voltsFracBits, scaled };
  return { ...form, ...departure(form, a, c, rangeHz, gridPoints) };
}

/** Rounding bound over |u| ≤ 1 and the largest departure found on the grid, both against Σ c_k f^k evaluated exactly. */
function departure(form: FixedPointRepresentation, a: Dyadic[], c: Dyadic[], rangeHz: { min: number; max: number }, gridPoints: number) {
  const n = a.length - 1;
  const unit = 2 ** -form.voltsFracBits;
  const r = 1 + 2 ** -U_FRAC_BITS; // |ũ| after rounding u
  let bound = 0;
  for (let k = 0; k <= n; k++) {
    const coefficientError = Math.abs(dyadicToNumber(addDyadic(a[k], { n: -stepTerm(form, k), e: -form.voltsFracBits })));
    const productRounding = k < n ? unit / 2 : 0; // the top step multiplies 0
    const slope = k * Math.abs(dyadicToNumber(a[k])) * r ** (k - 1); // |dV/du| for the rounding of u, ≤ 2^−31
    bound += (coefficientError + productRounding) * r ** k + slope * 2 ** -(U_FRAC_BITS + 1);
  }
  const first = Number(ceilToScale(dyadic(rangeHz.min), form.frequencyFracBits));
  const last = Number(-ceilToScale(negDyadic(dyadic(rangeHz.max)), form.frequencyFracBits)); // floor(max·2^FB)
  let largest = 0;
  for (let i = 0; i < gridPoints; i++) {
    const fx = first + Math.round(((last - first) * i) / (gridPoints - 1));
    const exact = c.reduceRight<Dyadic>((sum, ck) => addDyadic(mulDyadic(sum, { n: BigInt(fx), e: -form.frequencyFracBits }), ck), { n: 0n, e: 0 });
    const fixed = { n: BigInt(fixedPointReading(form, fx)), e: -form.voltsFracBits };
    largest = Math.max(largest, Math.abs(dyadicToNumber(addDyadic(fixed, negDyadic(exact)))));
  }
  // a bound is stated rounded up, never down
  return { maxDepartureV: bound * (1 + 1e-9), largestFoundV: largest, gridPoints };
}
