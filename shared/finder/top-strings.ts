/**
 * Half strings for a meet-in-the-middle search: every multiset of m values (non-decreasing index
 * tuples, each value used at most its quantity), with its sum, sorted by sum.
 */

/**
 * Number of multisets of size n from k values, C(k + n − 1, n).
 * @param valueCount k ≥ 1
 * @param stringLength n ≥ 0
 * @example multisetCount(3, 2) // 6
 */
export function multisetCount(valueCount: number, stringLength: number): number {
  let count = 1;
  for (let i = 1; i <= stringLength; i++) count = (count * (valueCount + i - 1)) / i;
  return Math.round(count);
}

/** Index of the low and high 32-bit words of a float64 on this machine. */
const LOW_WORD = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1 ? 0 : 1;

/**
 * The stable order that sorts non-negative doubles ascending: a least-significant-digit radix sort
 * on their bit patterns (for x ≥ 0 the IEEE 754 bit pattern orders like the number), 16 bits a pass.
 * @param keys values ≥ 0
 * @example sortedOrder(Float64Array.of(3, 1, 2)) // [1, 2, 0]
 */
export function sortedOrder(keys: Float64Array): Uint32Array {
  const count = keys.length;
  const words = new Uint32Array(keys.buffer, keys.byteOffset, count * 2);
  let order = new Uint32Array(count);
  let next = new Uint32Array(count);
  for (let j = 0; j < count; j++) order[j] = j;
  const histogram = new Uint32Array(65536);
  for (let pass = 0; pass < 4; pass++) {
    const word = pass < 2 ? LOW_WORD : 1 - LOW_WORD;
    const shift = (pass % 2) * 16;
    histogram.fill(0);
    for (let j = 0; j < count; j++) histogram[(words[order[j] * 2 + word] >>> shift) & 0xffff]++;
    let start = 0;
    for (let digit = 0; digit < 65536; digit++) {
      const n = histogram[digit];
      histogram[digit] = start;
      start += n;
    }
    for (let j = 0; j < count; j++) {
      const index = order[j];
      next[histogram[(words[index * 2 + word] >>> shift) & 0xffff]++] = index;
    }
    [order, next] = [next, order];
  }
  return order;
}

/** Multisets of `size` values sorted by sum: tuple j is tuples[j·size … j·size + size − 1]. */
export interface HalfStrings {
  size: number;
  count: number;
  /** ascending (Ω) */
  sums: Float64Array;
  /** value indices, non-decreasing within each tuple */
  tuples: Int32Array;
  /** the largest value in each tuple (Ω; 0 for the empty one) */
  largest: Float64Array;
}

/**
 * Every multiset of `size` values whose use of each value stays within its quantity and whose sum
 * is at most `maxSum`, sorted by sum (ties in enumeration order, which is deterministic).
 * @param ohms values ascending (Ω)
 * @param quantity how many of each value may be used (Infinity for a series)
 * @param size m ≥ 0 (m = 0 gives the one empty multiset, sum 0)
 * @param cap most multisets to build
 * @param maxSum largest sum kept (Ω), Infinity for all
 * @returns the table, or null when there are more than `cap`
 * @example halfStrings([1, 2], [Infinity, Infinity], 2, 100)?.sums // [2, 3, 4]
 */
export function halfStrings(ohms: readonly number[], quantity: readonly number[], size: number, cap: number, maxSum = Infinity): HalfStrings | null {
  if (size === 0) return { size, count: 1, sums: new Float64Array(1), tuples: new Int32Array(0), largest: new Float64Array(1) };
  const room = Math.min(multisetCount(ohms.length, size), cap + 1);
  if (room > cap && maxSum === Infinity && quantity.every((q) => q >= size)) return null;
  const unsorted = new Float64Array(room);
  const rawTuples = new Int32Array(room * size);
  const tuple = new Int32Array(size);
  const prefix = new Float64Array(size + 1);
  let count = 0;
  // Non-decreasing tuples in lexicographic order. At each position a value repeated beyond its
  // quantity is skipped; once the cheapest completion with a value exceeds maxSum, so do all larger.
  let position = 0;
  for (;;) {
    if (tuple[position] < ohms.length) {
      const index = tuple[position];
      const partial = prefix[position];
      if (partial + (size - position) * ohms[index] > maxSum) {
        tuple[position] = ohms.length;
        continue;
      }
      let used = 1;
      for (let back = position - 1; back >= 0 && tuple[back] === index; back--) used++;
      if (used > quantity[index]) {
        tuple[position]++;
        continue;
      }
      if (position === size - 1) {
        if (count === cap) return null;
        unsorted[count] = partial + ohms[index];
        rawTuples.set(tuple, count * size);
        count++;
        tuple[position]++;
      } else {
        tuple[position + 1] = index;
        prefix[position + 1] = partial + ohms[index];
        position++;
      }
      continue;
    }
    if (position === 0) break;
    position--;
    tuple[position]++;
  }
  const keys = unsorted.subarray(0, count);
  const order = sortedOrder(keys);
  const sums = new Float64Array(count);
  const tuples = new Int32Array(count * size);
  const largest = new Float64Array(count);
  for (let j = 0; j < count; j++) {
    const from = order[j];
    sums[j] = keys[from];
    for (let i = 0; i < size; i++) tuples[j * size + i] = rawTuples[from * size + i];
    largest[j] = ohms[rawTuples[from * size + size - 1]];
  }
  return { size, count, sums, tuples, largest };
}

/**
 * Index of the first sum ≥ `ohms` (count when none).
 * @example firstSumAtOrAbove(table, 1e6)
 */
export function firstSumAtOrAbove(sums: Float64Array | readonly number[], ohms: number, low = 0, high = sums.length): number {
  while (low < high) {
    const middle = (low + high) >>> 1;
    if (sums[middle] < ohms) low = middle + 1;
    else high = middle;
  }
  return low;
}
