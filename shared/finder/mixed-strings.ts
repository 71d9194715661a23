/**
 * Mixed top strings by meeting in the middle: a top multiset of n values splits into its ⌊n/2⌋
 * smallest (half A) and the rest (half B); for each bottom and each A-sum a, the B-sums nearest the
 * ideal R_t − a are found in the sorted B table and walked outward while the error can still rank.
 * The worst-case error grows monotonically away from the ideal R_t (see loaded-divider), so a walk
 * may stop at the first sum that cannot rank; nothing that could rank is skipped.
 */
import { largestTopOhms, stringCapOhms } from './finder-limits.js';
import type { SearchPlan } from './finder-request.js';
import { idealTopOhms, isMonotoneAbout } from './loaded-divider.js';
import { offer, topWindow, MAX_REJECTIONS_IN_A_ROW, type SearchState } from './search-state.js';
import { firstSumAtOrAbove, type HalfStrings } from './top-strings.js';

/**
 * The A-sums worth pairing with one bottom, [first, end): through its canonical split a multiset's
 * A-half holds its |A| smallest values, so a ≤ (|A|/n)·R_t; its B-half holds |B| values each no
 * larger than the per-resistor limits allow, so a ≥ R_t − |B|·R_max.
 */
function aRange(plan: SearchPlan, halfA: HalfStrings, bSize: number, length: number, low: number, high: number, loadedOhms: number): [number, number] {
  const largest = largestTopOhms(plan, high + loadedOhms);
  const first = largest === Infinity ? 0 : firstSumAtOrAbove(halfA.sums, (low - bSize * largest) * (1 - 1e-9));
  const end = firstSumAtOrAbove(halfA.sums, (high * halfA.size) / length + 1e-9 * high + Number.MIN_VALUE);
  return [first, end];
}

/**
 * The largest R_t any bottom leaves room for in a string of `length` resistors (limits, error
 * bound, voltage share), or −Infinity when none does; no half string above it can be used.
 */
export function highestTopOhms(state: SearchState, length: number): number {
  const { plan, loaded } = state;
  let highest = -Infinity;
  for (let bottom = 0; bottom < loaded.length; bottom++) {
    if (plan.values[bottom].quantity < 1 || !isMonotoneAbout(plan, loaded[bottom])) continue;
    const [low, windowHigh] = topWindow(state, plan.values[bottom], loaded[bottom]);
    const high = Math.min(windowHigh, stringCapOhms(plan, length, loaded[bottom]));
    if (low <= high) highest = Math.max(highest, high);
  }
  return highest;
}

/** Steps a mixed search of one length would take at most (for the budget), with the bound as it stands. */
export function mixedWork(state: SearchState, halfA: HalfStrings, halfB: HalfStrings, length: number): number {
  const { plan, loaded } = state;
  let work = 0;
  const logB = Math.log2(halfB.count + 1) + 1;
  for (let bottom = 0; bottom < loaded.length; bottom++) {
    const [low, windowHigh] = topWindow(state, plan.values[bottom], loaded[bottom]);
    const high = Math.min(windowHigh, stringCapOhms(plan, length, loaded[bottom]));
    if (!(low <= high)) continue;
    const [first, end] = aRange(plan, halfA, halfB.size, length, low, high, loaded[bottom]);
    const aCount = Math.max(0, end - first);
    const bCount = firstSumAtOrAbove(halfB.sums, high + Number.MIN_VALUE);
    work += Math.min(aCount + bCount, aCount * logB);
  }
  return work;
}

/**
 * Every top multiset of `length` values from the two half tables, with every bottom.
 * @param state search state
 * @param topIndex the plan.values index of each value the half tables number
 * @param halfA multisets of ⌊length/2⌋ values
 * @param halfB multisets of ⌈length/2⌉ values
 * @param length n = halfA.size + halfB.size
 */
export function searchMixedStrings(state: SearchState, topIndex: Int32Array, halfA: HalfStrings, halfB: HalfStrings, length: number): void {
  const { plan, loaded, shortlist } = state;
  const { sums: aSums, size: aSize, largest: aLargest } = halfA;
  const { sums: bSums, size: bSize, count: bCount, largest: bLargest } = halfB;
  const { targetRatio, maxRatioErrorFraction } = plan;
  const logB = Math.log2(bCount + 1) + 1;
  const indices = new Array<number>(length);
  const byIndex = (x: number, y: number): number => x - y;
  const tryPair = (ia: number, ib: number, bottom: number, topOhms: number): boolean => {
    for (let i = 0; i < aSize; i++) indices[i] = topIndex[halfA.tuples[ia * aSize + i]];
    for (let i = 0; i < bSize; i++) indices[aSize + i] = topIndex[halfB.tuples[ib * bSize + i]];
    if (aSize > 0 && bSize > 0 && indices[aSize - 1] > indices[aSize]) indices.sort(byIndex);
    // Equal strings were searched exactly before, under a bound no tighter than now.
    if (indices[0] === indices[length - 1]) return false;
    return offer(state, indices, bottom, topOhms, false);
  };
  for (let bottom = 0; bottom < loaded.length; bottom++) {
    const loadedOhms = loaded[bottom];
    if (plan.values[bottom].quantity < 1 || !isMonotoneAbout(plan, loadedOhms)) continue;
    const [low, windowHigh] = topWindow(state, plan.values[bottom], loadedOhms);
    const high = Math.min(windowHigh, stringCapOhms(plan, length, loadedOhms));
    if (!(low <= high)) continue;
    const ideal = idealTopOhms(plan, loadedOhms);
    // worstCaseError written in u = R_b'/(R_t + R_b'): |u/r₀ − 1| + β·(1 − u), β = I_b·R_b'/(V·r₀).
    const beta = (plan.inputBiasAmps * loadedOhms) / (plan.maxInputVolts * targetRatio);
    const mayRankAt = (topOhms: number): boolean => {
      const u = loadedOhms / (topOhms + loadedOhms);
      const error = Math.abs(u / targetRatio - 1) + beta * (1 - u);
      return error <= maxRatioErrorFraction && shortlist.admits(error);
    };
    const [aFirst, aEnd] = aRange(plan, halfA, bSize, length, low, high, loadedOhms);
    if (aFirst >= aEnd) continue;
    const pointerMode = aEnd - aFirst + firstSumAtOrAbove(bSums, high + Number.MIN_VALUE) < (aEnd - aFirst) * logB;
    let split = pointerMode ? firstSumAtOrAbove(bSums, ideal - aSums[aFirst]) : 0;
    for (let ia = aFirst; ia < aEnd; ia++) {
      const a = aSums[ia];
      const rest = ideal - a;
      if (pointerMode) while (split > 0 && bSums[split - 1] >= rest) split--;
      else split = firstSumAtOrAbove(bSums, rest);
      // Walks start at the ideal, or at the window's edge when the limits keep the ideal out.
      const up = rest < low - a ? firstSumAtOrAbove(bSums, low - a) : split;
      const down = rest > high - a ? firstSumAtOrAbove(bSums, high - a + Number.MIN_VALUE) - 1 : split - 1;
      let rejected = 0;
      for (let ib = up; ib < bCount; ib++) {
        const topOhms = a + bSums[ib];
        if (topOhms > high || !mayRankAt(topOhms)) break;
        if (Math.max(aLargest[ia], bLargest[ib]) > largestTopOhms(plan, topOhms + loadedOhms)) continue;
        if (tryPair(ia, ib, bottom, topOhms)) rejected = 0;
        else if (++rejected >= MAX_REJECTIONS_IN_A_ROW) { state.cutWalks++; break; }
      }
      rejected = 0;
      for (let ib = down; ib >= 0; ib--) {
        const topOhms = a + bSums[ib];
        if (topOhms < low || !mayRankAt(topOhms)) break;
        if (Math.max(aLargest[ia], bLargest[ib]) > largestTopOhms(plan, topOhms + loadedOhms)) continue;
        if (tryPair(ia, ib, bottom, topOhms)) rejected = 0;
        else if (++rejected >= MAX_REJECTIONS_IN_A_ROW) { state.cutWalks++; break; }
      }
    }
  }
}
