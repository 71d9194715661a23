import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { radixSortFloat64 } from '../../../shared/stats/index.js';

/** Same order and the same bits (so −0 stays −0) as the built-in typed-array sort. */
function expectSameAsBuiltIn(values: Float64Array): void {
  const expected = Float64Array.from(values).sort(); // ECMA-262 %TypedArray%.prototype.sort: −0 before +0
  const sorted = radixSortFloat64(Float64Array.from(values));
  const got = new Uint32Array(sorted.buffer);
  const want = new Uint32Array(expected.buffer);
  let firstDifference = -1;
  for (let i = 0; i < want.length && firstDifference < 0; i++) if (got[i] !== want[i]) firstDifference = i;
  expect(firstDifference).toBe(-1); // bit-for-bit against ECMA-262 order
}

describe('radix sort of doubles', () => {
  it('orders special values like the built-in sort', () => {
    const special = new Float64Array([
      0, -0, 5e-324, -5e-324, 2.2250738585072014e-308, -2.2250738585072014e-308, 2.225073858507201e-308,
      Number.MAX_VALUE, -Number.MAX_VALUE, Infinity, -Infinity, 1, -1, 1e300, -1e300, 0, -0, 1 + 2 ** -52, 1 - 2 ** -53,
    ]); // IEEE 754-2019 §3.4: subnormals, signed zeros, largest finite, infinities
    expectSameAsBuiltIn(special);
    const sorted = radixSortFloat64(Float64Array.from(special));
    expect([6, 7, 8, 9].map((i) => Object.is(sorted[i], -0))).toEqual([true, true, false, false]); // ECMA-262: both −0 before both +0
    expect(sorted[0]).toBe(-Infinity); // IEEE 754 total order
    expect(sorted[sorted.length - 1]).toBe(Infinity); // IEEE 754 total order
  });

  it('matches the built-in sort on random doubles of every magnitude and sign', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ noNaN: true }), { minLength: 0, maxLength: 300 }), (list) => {
        expectSameAsBuiltIn(Float64Array.from(list)); // property check against the built-in sort (in this test)
      }),
      { seed: 15, numRuns: 300 },
    );
  });

  it('matches the built-in sort on a large sample of reading-error-like values', () => {
    let state = 12345;
    const next = () => ((state = (Math.imul(state, 1103515245) + 12345) >>> 0) / 2 ** 32); // LCG, Numerical Recipes constants
    const values = Float64Array.from({ length: 50_000 }, (_, i) => (next() - 0.5) * 0.2 + (i % 7 === 0 ? 1e-9 : 0));
    expectSameAsBuiltIn(values); // comparison with the built-in sort (in this test)
  });

  it('sorts in place, uses a caller scratch array and keeps equal keys', () => {
    const values = new Float64Array([3, 1, 2, 1, 3]);
    const scratch = new Float64Array(8);
    expect(radixSortFloat64(values, scratch)).toBe(values); // in place, by construction
    expect([...values]).toEqual([1, 1, 2, 3, 3]); // by hand
    const view = new Float64Array([9, 4, -1, 7, 0]).subarray(1, 4);
    radixSortFloat64(view);
    expect([...view]).toEqual([-1, 4, 7]); // by hand: a view sorts only its own entries
  });

  it('handles empty and one-element input and rejects NaN and a short scratch array', () => {
    expect(radixSortFloat64(new Float64Array(0)).length).toBe(0); // by hand
    expect([...radixSortFloat64(new Float64Array([-0]))]).toEqual([-0]); // by hand
    expect(() => radixSortFloat64(new Float64Array([1, NaN, 2]))).toThrow(/NaN/);
    expect(() => radixSortFloat64(new Float64Array([NaN]))).toThrow(/NaN/);
    expect(() => radixSortFloat64(new Float64Array([2, 1]), new Float64Array(1))).toThrow(/scratch/);
  });
});
