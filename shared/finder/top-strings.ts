/**
 * Enumeration of top strings: n equal values, or every multiset of n values
 * (non-decreasing index tuples) when their number fits the budget.
 */

/** Most mixed strings tried for one string length; beyond it only equal strings are searched. */
export const MIXED_STRING_BUDGET = 1_000_000;

/**
 * Number of multisets of size n from k values, C(k + n − 1, n).
 * @param valueCount k ≥ 1
 * @param stringLength n ≥ 1
 * @example multisetCount(3, 2) // 6
 */
export function multisetCount(valueCount: number, stringLength: number): number {
  let count = 1;
  for (let i = 1; i <= stringLength; i++) count = (count * (valueCount + i - 1)) / i;
  return Math.round(count);
}

/**
 * Calls visit(indices) for every non-decreasing tuple of n indices into k values whose
 * entries are not all equal; `indices` is reused between calls (copy it to keep it).
 * @param valueCount k
 * @param stringLength n ≥ 2
 * @param visit receives the index tuple
 * @example forEachMixedString(3, 2, (t) => console.log([...t]))
 */
export function forEachMixedString(valueCount: number, stringLength: number, visit: (indices: readonly number[]) => void): void {
  const indices = new Array<number>(stringLength).fill(0);
  for (;;) {
    if (indices[0] !== indices[stringLength - 1]) visit(indices);
    let position = stringLength - 1;
    while (position >= 0 && indices[position] === valueCount - 1) position--;
    if (position < 0) return;
    const next = indices[position] + 1;
    for (let i = position; i < stringLength; i++) indices[i] = next;
  }
}
