/**
 * Millivolts straight from the raw capture, integers only, for firmware without floating point: the counts
 * become the fixed-point frequency input F = f·2^FB of fixed-point.ts, whose reading is then rounded to whole
 * millivolts. Period capture counts timer ticks over N input periods, f = N·f_clk/(P·counts), so
 * F = round(K/counts) with the constant K = round(N·f_clk·2^FB/P); a gated count counts input edges in the gate,
 * f = counts/T_gate, so F = round(counts·M/2^S) with M = round(2^(FB+S)/T_gate). Every division truncates and
 * every shift is of a non-negative value, as C99 6.5.5 and 6.5.7 define them for the header's C function.
 */
import type { CaptureDefinition } from '../schemas/chain.js';
import { divRound, dyadic } from './dyadic.js';
import { fixedPointReading, type FixedPointRepresentation } from './fixed-point-reading.js';

const INT63 = 1n << 63n;
const GRID_POINTS = 1025;

/** What the header holds for the count reading, frozen with a calibration record (integers as decimal strings). */
export interface CountReadingForm {
  method: 'period' | 'gated';
  /** The capture settings the constants were made from. */
  capture: { clockHz: number; prescaler: number; periodsAveraged: number } | { gateS: number };
  /** Period: K; gated: M. */
  constant: string;
  /** Gated: S (0 for period capture). */
  shift: number;
  /** Gated: counts above this are clamped to it first (F is beyond HIGH_FX there anyway); '0' for period capture. */
  countsClamp: string;
  /** The counts of the calibrated frequency range. */
  countsRange: { min: number; max: number };
  /** Upper bound of |millivolts returned − 1000·Σ c_k·f^k| with f from the counts exactly, over the calibrated range, mV. */
  maxErrorMv: number;
  /** The largest such error found at gridPoints counts of the range (all of them when there are fewer), mV. */
  largestFoundMv: number;
  gridPoints: number;
}

const bigPow2 = (n: number) => 1n << BigInt(n);

/** round(x·2^s/d) for a double x ≥ 0 and an integer d > 0, exactly. */
function roundScaled(x: number, s: number, d: bigint): bigint {
  const { n, e } = dyadic(x);
  const shift = e + s;
  return shift >= 0 ? divRound(n << BigInt(shift), d) : divRound(n, d << BigInt(-shift));
}

/** The fixed-point frequency input the counts give, by the header's integer steps. */
export function countsToFrequencyFx(form: CountReadingForm, fixed: FixedPointRepresentation, counts: bigint): number {
  const high = BigInt(fixed.highFx);
  let f: bigint;
  if (form.method === 'period') {
    f = counts === 0n ? high : (BigInt(form.constant) + counts / 2n) / counts;
  } else {
    const c = counts > BigInt(form.countsClamp) ? BigInt(form.countsClamp) : counts;
    f = (c * BigInt(form.constant) + (form.shift > 0 ? bigPow2(form.shift - 1) : 0n)) >> BigInt(form.shift);
  }
  return Number(f > high ? high : f);
}

/**
 * Whole millivolts from raw counts, exactly as the header's C function computes them.
 * @param counts 0…2^64 − 1
 * @throws Error when counts are outside that
 * @example countReadingMv(form, fixed, 1600n) // millivolts for 1600 counts
 */
export function countReadingMv(form: CountReadingForm, fixed: FixedPointRepresentation, counts: bigint): number {
  if (counts < 0n || counts >= 1n << 64n) throw new Error('counts must be 0…2^64 − 1');
  const v = BigInt(fixedPointReading(fixed, countsToFrequencyFx(form, fixed, counts)));
  return Number(divRound(v * 1000n, bigPow2(fixed.voltsFracBits)));
}

/** f in Hz from counts by the capture's formula, in double precision. */
export const frequencyOfCounts = (capture: CaptureDefinition, counts: number): number => (capture.method === 'gated'
  ? counts / capture.gateS
  : (capture.periodsAveraged * capture.clockHz) / (capture.prescaler * counts));

/**
 * The count reading for a calibrated fixed-point form and the channel's capture settings, with a bound of its
 * error against the exact formula over the calibrated range and the largest error found by exact emulation.
 * @param coefficients the reading volts = Σ c_k·f^k the fixed form was made from, volts per Hz^k
 * @param fixed its fixed-point form (fixedPointForm), whose maxDepartureV is part of the bound
 * @param rangeHz the calibrated frequency range, Hz
 * @throws Error when the constants or the result do not fit the integer widths (the header then has no count reading)
 * @example countReadingForm(c, fixed, { min: 512, max: 40717 }, { method: 'gated', gateS: 0.1, counterBits: 32, clockTolerancePpm: 0 })
 */
export function countReadingForm(
  coefficients: readonly number[], fixed: FixedPointRepresentation & { maxDepartureV: number },
  rangeHz: { min: number; max: number }, capture: CaptureDefinition,
): CountReadingForm {
  const fb = fixed.frequencyFracBits;
  if (fixed.voltsFracBits < 10 || fixed.voltsFracBits > 52) throw new Error('the reading does not fit whole millivolts in 32 bits');
  const counterMax = 2 ** Math.min(capture.counterBits, 53) - 1;
  let constant: bigint;
  let shift = 0;
  let countsClamp = 0n;
  let countsRange: { min: number; max: number };
  let inputStepFx: number; // largest |F − F_exact| before the fixed-point reading, in input units
  if (capture.method === 'period') {
    const k = (capture.periodsAveraged * capture.clockHz) / capture.prescaler;
    constant = roundScaled(capture.periodsAveraged * capture.clockHz, fb, BigInt(capture.prescaler));
    if (constant >= INT63) throw new Error('the period-capture constant needs more than 63 bits');
    countsRange = { min: Math.max(1, Math.ceil(k / rangeHz.max)), max: rangeHz.min > 0 ? Math.min(counterMax, Math.floor(k / rangeHz.min)) : counterMax };
    // |K − exact| ≤ ½ gives ≤ ½/counts, then the division rounds by ≤ ½
    inputStepFx = 0.5 + 0.5 / countsRange.min;
  } else {
    countsClamp = BigInt(Math.floor((fixed.highFx * capture.gateS) / 2 ** fb)) + 2n;
    for (shift = 62; shift >= 0; shift--) {
      constant = roundScaled(1 / capture.gateS, fb + shift, 1n);
      if (constant >= 1n && countsClamp * constant + bigPow2(Math.max(shift - 1, 0)) < INT63) break;
    }
    if (shift < 0) throw new Error('the gate time leaves no count constant within 63 bits');
    countsRange = { min: Math.ceil(rangeHz.min * capture.gateS), max: Math.min(counterMax, Math.floor(rangeHz.max * capture.gateS)) };
    const exactM = 2 ** (fb + shift) / capture.gateS;
    // |M − exact| ≤ ½ (the 1/T of a double is itself rounded: its relative 2^−53 counted too), then the shift rounds by ≤ ½
    inputStepFx = 0.5 + (countsRange.max * (0.5 + exactM * 2 ** -52)) / 2 ** shift;
  }
  if (!(countsRange.max >= countsRange.min)) throw new Error('the calibrated range holds no whole count');
  const form: CountReadingForm = {
    method: capture.method,
    capture: capture.method === 'period' ? { clockHz: capture.clockHz, prescaler: capture.prescaler, periodsAveraged: capture.periodsAveraged } : { gateS: capture.gateS },
    constant: constant!.toString(), shift, countsClamp: countsClamp.toString(), countsRange, maxErrorMv: 0, largestFoundMv: 0, gridPoints: 0,
  };
  // |dV/df| over the range and a little beyond, bounded term by term
  const fTop = Math.max(Math.abs(rangeHz.min), Math.abs(rangeHz.max)) + inputStepFx * 2 ** -fb;
  const slope = coefficients.reduce((s, ck, k) => s + k * Math.abs(ck) * fTop ** Math.max(k - 1, 0), 0);
  const bound = 0.5 + 1000 * (fixed.maxDepartureV + slope * inputStepFx * 2 ** -fb);
  const span = countsRange.max - countsRange.min;
  const points = Math.min(GRID_POINTS, span + 1);
  let largest = 0;
  for (let i = 0; i < points; i++) {
    const counts = points === 1 ? countsRange.min : countsRange.min + Math.round((span * i) / (points - 1));
    const f = frequencyOfCounts(capture, counts);
    const exactMv = 1000 * coefficients.reduceRight((sum, ck) => sum * f + ck, 0);
    largest = Math.max(largest, Math.abs(countReadingMv(form, fixed, BigInt(counts)) - exactMv));
  }
  // a bound is stated rounded up, never down
  return { ...form, maxErrorMv: bound * (1 + 1e-9), largestFoundMv: largest, gridPoints: points };
}
