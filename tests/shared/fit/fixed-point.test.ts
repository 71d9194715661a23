import { describe, expect, it } from 'vitest';
import { addDyadic, ceilLog2, divRound, dyadic, dyadicToNumber, mulDyadic, negDyadic, type Dyadic } from '../../../shared/fit/dyadic.js';
import { fixedPointForm, type FixedPointForm } from '../../../shared/fit/fixed-point.js';
import { fixedPointReading } from '../../../shared/fit/fixed-point-reading.js';

/** Σ c_k·(F·2^−FB)^k exactly, from the coefficients' exact binary values (in this test). */
function exactVolts(coefficients: readonly number[], frequencyFx: number, fb: number): Dyadic {
  let sum: Dyadic = { n: 0n, e: 0 };
  for (let k = coefficients.length - 1; k >= 0; k--) sum = addDyadic(mulDyadic(sum, { n: BigInt(frequencyFx), e: -fb }), dyadic(coefficients[k]));
  return sum;
}
const departureV = (form: FixedPointForm, coefficients: readonly number[], frequencyFx: number) => {
  const fixed = { n: BigInt(fixedPointReading(form, frequencyFx)), e: -form.voltsFracBits };
  return Math.abs(dyadicToNumber(addDyadic(fixed, negDyadic(exactVolts(coefficients, frequencyFx, form.frequencyFracBits)))));
};

/** A small linear congruential generator, so the sampled inputs are the same on every run (Numerical Recipes 7.1 constants). */
function* inputsIn(first: number, last: number, count: number) {
  let state = 12345;
  for (let i = 0; i < count; i++) {
    state = (1664525 * state + 1013904223) % 2 ** 32;
    yield first + Math.floor((state / 2 ** 32) * (last - first + 1));
  }
}

/** The inverse of an invented converter with a cubic bow, read over 0…1000 V up to a 4 MHz full scale: V = Σ c_k f^k. */
const CUBIC = [1.5, 2.45e-4, 3e-12, -2.1e-19];
const CUBIC_RANGE_HZ = { min: 8e4, max: 4e6 };

describe('exact binary fractions', () => {
  it('decomposes doubles exactly, subnormals included', () => {
    expect(dyadic(0.1)).toEqual({ n: 7205759403792794n, e: -56 }); // IEEE 754 binary64: 0.1 is 0x3FB999999999999A (from memory)
    expect(dyadic(-0.75)).toEqual({ n: -6755399441055744n, e: -53 }); // −3/4 = −(2^52 + 2^51)·2^−53, by hand
    expect(dyadic(5e-324)).toEqual({ n: 1n, e: -1074 }); // IEEE 754 binary64: the smallest subnormal is 2^−1074
    expect(() => dyadic(Number.NaN)).toThrow('finite');
  });

  it('adds and multiplies without rounding', () => {
    const sum = addDyadic(dyadic(0.1), dyadic(0.2));
    // 0.1 + 0.2 of the two doubles is 10808639105689191·2^−55 exactly, not the double 0.30000000000000004 (IEEE 754 binary64, by hand)
    expect(sum).toEqual({ n: 2n * 10808639105689191n, e: -56 });
    expect(dyadicToNumber(mulDyadic(dyadic(3), dyadic(0.5)))).toBe(1.5); // by hand
    expect(ceilLog2(dyadic(1))).toBe(0); // 1 = 2^0
    expect(ceilLog2(dyadic(1.5))).toBe(1); // by hand
    expect(ceilLog2(dyadic(0.25))).toBe(-2); // by hand
  });

  it('rounds a quotient half away from zero using truncating division only', () => {
    expect(divRound(5n, 2n)).toBe(3n); // C99 6.5.5: 5/2 truncates to 2; the added half makes it 3
    expect(divRound(-5n, 2n)).toBe(-3n); // by hand, symmetric
    expect(divRound(-7n, 3n)).toBe(-2n); // −2.33 → −2, by hand
    expect(divRound(7n, 1n)).toBe(7n); // by hand
    expect(() => divRound(1n, 0n)).toThrow('divisor must be > 0');
  });
});

describe('the fixed-point form of a calibration reading', () => {
  it('keeps a small cubic term with 30 significant bits, where it moves the reading by volts', () => {
    const form = fixedPointForm(CUBIC, CUBIC_RANGE_HZ);
    for (const s of form.scaled) expect(Math.abs(s.q)).toBeGreaterThan(2 ** 29); // 2^29 < |q| ≤ 2^30: 30 significant bits, by construction
    for (const s of form.scaled) expect(s.shift >= 0 && s.shift <= 255 && Number.isInteger(s.shift)).toBe(true); // fits a uint8_t
    expect(Math.abs(CUBIC[3] * CUBIC_RANGE_HZ.max ** 3)).toBeGreaterThan(10); // the cubic term is worth 13 V at 4 MHz (arithmetic)
    expect(form.maxDepartureV).toBeLessThan(1e-5); // a few units of 2^−19 V: one half-unit rounding per step (the bound's derivation in fixed-point.ts)
  });

  it('stays within its stated bound at every sampled input, against the polynomial in exact arithmetic', () => {
    for (const [coefficients, range] of [
      [CUBIC, CUBIC_RANGE_HZ],
      [[-6.37, 0.012436], { min: 512.5, max: 40717.5 }], // an invented straight-line inverse
      [[-2.1, 1.02e-6, -3.1e-17], { min: 2e7, max: 1e9 }], // an invented bow near the 1 GHz schema limit
    ] as const) {
      const form = fixedPointForm(coefficients, range);
      const first = Math.ceil(range.min * 2 ** form.frequencyFracBits);
      const last = Math.floor(range.max * 2 ** form.frequencyFracBits);
      let largest = 0;
      for (const fx of [first, last, ...inputsIn(first, last, 3000)]) largest = Math.max(largest, departureV(form, coefficients, fx)); // exact rational evaluation in this test
      expect(largest).toBeLessThanOrEqual(form.maxDepartureV);
      expect(form.largestFoundV).toBeLessThanOrEqual(form.maxDepartureV);
      expect(form.largestFoundV).toBeGreaterThan(0); // rounding shows somewhere among 4097 inputs (common practice)
    }
  });

  it('clamps inputs half a span beyond the calibrated range instead of overflowing', () => {
    const form = fixedPointForm(CUBIC, CUBIC_RANGE_HZ);
    expect(form.highFx).toBeLessThanOrEqual(2 ** 32 - 1); // a uint32_t holds the clamped range, by construction
    expect(fixedPointReading(form, 0)).toBe(fixedPointReading(form, form.lowFx)); // clamp, by definition
    expect(fixedPointReading(form, 2 ** 32 - 1)).toBe(fixedPointReading(form, form.highFx)); // clamp, by definition
    expect(Math.abs(fixedPointReading(form, 2 ** 32 - 1))).toBeLessThan(2 ** 31); // the result fits an int32_t
    expect(() => fixedPointReading(form, 1.5)).toThrow('integer 0…2^32 − 1');
    expect(() => fixedPointReading(form, -1)).toThrow('integer 0…2^32 − 1');
    expect(() => fixedPointReading(form, 2 ** 32)).toThrow('integer 0…2^32 − 1');
  });

  it('refuses what it cannot represent, naming the input, and leaves its inputs alone', () => {
    const coefficients = Object.freeze([1.5, 2.45e-4]);
    const range = Object.freeze({ min: 8e4, max: 4e6 });
    expect(() => fixedPointForm(coefficients, range)).not.toThrow();
    expect(() => fixedPointForm([], range)).toThrow('coefficients must hold 1 to 4 values');
    expect(() => fixedPointForm([1, 2, 3, 4, 5], range)).toThrow('coefficients must hold 1 to 4 values');
    expect(() => fixedPointForm([1, Number.POSITIVE_INFINITY], range)).toThrow('finite');
    expect(() => fixedPointForm(coefficients, { min: 4e6, max: 8e4 })).toThrow('frequency range must satisfy 0 ≤ min < max Hz');
    expect(() => fixedPointForm(coefficients, { min: -1, max: 8e4 })).toThrow('frequency range must satisfy 0 ≤ min < max Hz');
    expect(() => fixedPointForm(coefficients, { min: 1e6, max: 3e9 })).toThrow('beyond what a 32-bit frequency holds');
    expect(() => fixedPointForm([2 ** 31, 0], range)).toThrow('beyond 2^30 V');
    expect(() => fixedPointForm(coefficients, range, 1)).toThrow('gridPoints must be a whole number ≥ 2');
  });
});
