import { describe, expect, it } from 'vitest';
import { halfStrings, multisetCount, sortedOrder } from '../../../shared/finder/top-strings.js';

describe('half strings for the meet-in-the-middle search', () => {
  const ohms = Object.freeze([1, 2, 3, 5, 8]);

  it('counts every multiset once, C(n + m − 1, m), sorted by sum', () => {
    for (const size of [1, 2, 3]) {
      const table = halfStrings(ohms, ohms.map(() => Infinity), size, 1000);
      expect(table?.count).toBe(multisetCount(5, size)); // C(n + m − 1, m), stars and bars (from memory)
      const seen = new Set<string>();
      for (let j = 0; j < table!.count; j++) {
        const tuple = [...table!.tuples.subarray(j * size, j * size + size)];
        expect(tuple).toEqual([...tuple].sort((a, b) => a - b));
        expect(table!.sums[j]).toBe(tuple.reduce((sum, i) => sum + ohms[i], 0)); // the sum of its values (in this test)
        expect(table!.largest[j]).toBe(ohms[tuple[size - 1]]);
        if (j > 0) expect(table!.sums[j]).toBeGreaterThanOrEqual(table!.sums[j - 1]);
        seen.add(tuple.join(','));
      }
      expect(seen.size).toBe(table!.count);
    }
  });

  it('uses no value more often than its quantity and keeps no sum above the cut', () => {
    const table = halfStrings(ohms, [2, 1, 3, 0, Infinity], 3, 1000, 12)!;
    for (let j = 0; j < table.count; j++) {
      const tuple = [...table.tuples.subarray(j * 3, j * 3 + 3)];
      const uses = [0, 1, 2, 3, 4].map((i) => tuple.filter((t) => t === i).length);
      expect(uses[0]).toBeLessThanOrEqual(2);
      expect(uses[1]).toBeLessThanOrEqual(1);
      expect(uses[3]).toBe(0);
      expect(table.sums[j]).toBeLessThanOrEqual(12);
    }
    // Listed by hand: 1+1+2, 1+1+3, 1+1+8, 1+2+3, 1+2+8, 1+3+3, 1+3+8, 2+3+3, 3+3+3 (5 has none on hand, 2 only one).
    expect([...table.sums]).toEqual([4, 5, 6, 7, 8, 9, 10, 11, 12]);
  });

  it('gives the one empty multiset for size 0 and refuses more than the cap', () => {
    expect(halfStrings(ohms, ohms.map(() => Infinity), 0, 10)?.count).toBe(1);
    expect(halfStrings(ohms, ohms.map(() => Infinity), 3, 34)).toBeNull(); // C(7, 3) = 35 > 34
  });

  it('sorts doubles like Array.prototype.sort, ties in their first order', () => {
    const keys = Float64Array.from([3.5, 0, 1e-300, 7e12, 3.5, 2.25, 1e9, 0.1, 3.5]);
    const expected = [...keys.keys()].sort((a, b) => keys[a] - keys[b] || a - b); // Array.prototype.sort is stable (ECMAScript 2019)
    expect([...sortedOrder(keys)]).toEqual(expected);
  });
});
