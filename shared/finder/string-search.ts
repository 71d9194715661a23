/**
 * The two searches behind the finder, both exact over what they cover. Equal strings: for each
 * value v and length n, walk the bottom values outward from the ideal R_b' = r₀·n·v/(1 − r₀).
 * Mixed strings (meet in the middle): a top multiset of n values splits into its ⌊n/2⌋ smallest
 * (half A) and the rest (half B); for each bottom and each A-sum a, the B-sums nearest the ideal
 * R_t − a are found in the sorted B table and walked outward while the error can still rank.
 * The worst-case error grows monotonically away from the ideal R_t (see loaded-divider), so a
 * walk may stop at the first sum that cannot rank; nothing that could rank is skipped.
 */
import type { CandidateShortlist } from './candidate-ranking.js';
import { evaluateDivider } from './divider-evaluation.js';
import type { SearchPlan, SearchValue } from './finder-request.js';
import { idealTopOhms, isMonotoneAbout, loadedBottomOhms, topOhmsWithin, worstCaseError } from './loaded-divider.js';
import { firstSumAtOrAbove, type HalfStrings } from './top-strings.js';

/** Rejections in a row (limits, stock, repeats) after which a walk gives up and says so. */
export const MAX_REJECTIONS_IN_A_ROW = 2000;

/** Shared state of one search. */
export interface SearchState {
  plan: SearchPlan;
  shortlist: CandidateShortlist;
  /** R_b' of each value, ascending like plan.values */
  loaded: Float64Array;
  /** top multisets already offered, with their bottom */
  seen: Set<string>;
  /** walks cut short by MAX_REJECTIONS_IN_A_ROW while candidates could still rank */
  cutWalks: number;
}

/** A search state for a plan. */
export function searchState(plan: SearchPlan, shortlist: CandidateShortlist): SearchState {
  const loaded = Float64Array.from(plan.values, (part) => loadedBottomOhms(part.ohms, plan.inputResistanceOhms));
  return { plan, shortlist, loaded, seen: new Set(), cutWalks: 0 };
}

/**
 * The range of R_t the limits allow with one bottom: total resistance and bleed current, and, when
 * the bottom part is given, its own voltage V_b = V·R_b'/(R_t + R_b') and power V_b²/R_b.
 * @param plan limits (V, W, A, Ω) and the highest input V
 * @param bottom the bottom part, or null for the totals alone
 * @param loadedOhms R_b' (Ω)
 * @returns [lowest, highest] R_t in Ω
 */
export function limitWindow(plan: SearchPlan, bottom: SearchValue | null, loadedOhms: number): [number, number] {
  const { limits, maxInputVolts } = plan;
  const lowestTotal = Math.max(limits.minTotalOhms, maxInputVolts / limits.maxBleedAmps);
  const highestTotal = Math.min(limits.maxTotalOhms, maxInputVolts / limits.minBleedAmps);
  let lowest = lowestTotal - loadedOhms;
  if (bottom !== null) {
    const maxVolts = Math.min(limits.maxVoltsPerResistor, bottom.maxVolts);
    const maxWatts = Math.min(limits.maxWattsPerResistor, bottom.maxWatts);
    lowest = Math.max(lowest, loadedOhms * (maxInputVolts / maxVolts - 1), (maxInputVolts * loadedOhms) / Math.sqrt(maxWatts * bottom.ohms) - loadedOhms);
  }
  return [lowest, highestTotal - loadedOhms];
}

/** The window of R_t for one bottom: limits and the error bound, widened a hair against rounding. */
function topWindow(state: SearchState, bottom: SearchValue, loadedOhms: number): [number, number] {
  const [limitLow, limitHigh] = limitWindow(state.plan, bottom, loadedOhms);
  const bound = Math.min(state.shortlist.bound(), state.plan.maxRatioErrorFraction);
  const [errorLow, errorHigh] = topOhmsWithin(state.plan, loadedOhms, bound);
  return [Math.max(limitLow, errorLow) * (1 - 1e-9), Math.min(limitHigh, errorHigh) * (1 + 1e-9)];
}

/**
 * The largest value a top string may hold when the total is at most `highestTotal`: its voltage
 * V·R/R_total and power (V/R_total)²·R within the per-resistor limits.
 */
function largestTopOhms(plan: SearchPlan, highestTotal: number): number {
  const { limits, maxInputVolts } = plan;
  const perVolt = highestTotal / maxInputVolts;
  return Math.min(limits.maxVoltsPerResistor * perVolt, limits.maxWattsPerResistor * perVolt * perVolt);
}

/**
 * The highest R_t a string of `length` resistors can have under the per-resistor voltage limit:
 * each holds at most maxV·(R_t + R_b')/V, so R_t ≤ n·maxV·R_b'/(V − n·maxV) when n·maxV < V.
 */
function stringCapOhms(plan: SearchPlan, length: number, loadedOhms: number): number {
  const share = length * plan.limits.maxVoltsPerResistor;
  return share < plan.maxInputVolts ? ((share * loadedOhms) / (plan.maxInputVolts - share)) * (1 + 1e-9) : Infinity;
}

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

/** Whether an error may still rank: admitted by the shortlist and within the search bound. */
function mayRank(state: SearchState, error: number): boolean {
  return error <= state.plan.maxRatioErrorFraction && state.shortlist.admits(error);
}

/**
 * Whether a value can sit in a top string at all: even at the lowest current the limits allow
 * (V over the highest total) its voltage and power stay within the limits and its own ratings.
 */
export function usableInTop(plan: SearchPlan, part: SearchValue): boolean {
  const { limits, maxInputVolts } = plan;
  const amps = maxInputVolts / Math.min(limits.maxTotalOhms, maxInputVolts / limits.minBleedAmps);
  const volts = amps * part.ohms;
  return volts <= Math.min(limits.maxVoltsPerResistor, part.maxVolts) && volts * amps <= Math.min(limits.maxWattsPerResistor, part.maxWatts);
}

/** The cheap part of the limit check (totals, bleed, largest top resistor, bottom), before any allocation. */
function breaksLimits(plan: SearchPlan, topOhms: number, largestTopOhms: number, bottomIndex: number, loadedOhms: number): boolean {
  const { limits, maxInputVolts } = plan;
  const total = topOhms + loadedOhms;
  const amps = maxInputVolts / total;
  if (total < limits.minTotalOhms || total > limits.maxTotalOhms || amps > limits.maxBleedAmps || amps < limits.minBleedAmps) return true;
  const topVolts = amps * largestTopOhms;
  if (topVolts > limits.maxVoltsPerResistor || topVolts * amps > limits.maxWattsPerResistor) return true;
  const bottom = plan.values[bottomIndex];
  const bottomVolts = amps * loadedOhms;
  return bottomVolts > Math.min(limits.maxVoltsPerResistor, bottom.maxVolts) ||
    (bottomVolts * bottomVolts) / bottom.ohms > Math.min(limits.maxWattsPerResistor, bottom.maxWatts);
}

/** Offers one divider (top value indices ascending); true when it was a new valid candidate. */
function offer(state: SearchState, topIndices: readonly number[], bottomIndex: number, topOhms: number, unique: boolean): boolean {
  const { plan } = state;
  if (breaksLimits(plan, topOhms, plan.values[topIndices[topIndices.length - 1]].ohms, bottomIndex, state.loaded[bottomIndex])) return false;
  // A mixed multiset is reached through more than one split of its halves; an equal string only once.
  const key = unique ? '' : `${topIndices.join(',')}|${bottomIndex}`;
  if (!unique && state.seen.has(key)) return false;
  let run = 0;
  for (let i = 0; i < topIndices.length; i++) {
    run = i > 0 && topIndices[i] === topIndices[i - 1] ? run + 1 : 1;
    const uses = run + (topIndices[i] === bottomIndex ? 1 : 0);
    if (uses > plan.values[topIndices[i]].quantity) return false;
  }
  if (!unique) state.seen.add(key);
  const top: SearchValue[] = topIndices.map((index) => plan.values[index]);
  const candidate = evaluateDivider(plan, top, plan.values[bottomIndex]);
  if (candidate === null) return false;
  state.shortlist.add(candidate);
  return true;
}

/**
 * Strings of `length` equal values: each value's best bottoms, walked outward from the ideal.
 * @param state search state
 * @param length n ≥ 1
 */
export function searchEqualStrings(state: SearchState, length: number): void {
  const { plan, loaded } = state;
  const indices = new Array<number>(length);
  plan.values.forEach((part, valueIndex) => {
    if (part.quantity < length || !usableInTop(plan, part)) return;
    const topOhms = length * part.ohms;
    // Bias current through the top alone would drop the whole input: no usable divider.
    if (!(plan.inputBiasAmps * topOhms < plan.maxInputVolts)) return;
    indices.fill(valueIndex);
    const idealLoaded = (plan.targetRatio * topOhms) / (1 - plan.targetRatio);
    // Each top resistor keeps V·v/(n·v + R_b') within its voltage and (V/(n·v + R_b'))²·v within its
    // power only from some R_b' up: R_b' ≥ v·(V/maxV − n) and R_b' ≥ V·√(v/maxW) − n·v.
    const { limits, maxInputVolts } = plan;
    const lowestLoaded = Math.max(
      part.ohms * (maxInputVolts / Math.min(limits.maxVoltsPerResistor, part.maxVolts) - length),
      maxInputVolts * Math.sqrt(part.ohms / Math.min(limits.maxWattsPerResistor, part.maxWatts)) - topOhms,
    );
    const firstBottom = firstSumAtOrAbove(loaded, lowestLoaded * (1 - 1e-12));
    const highestTotal = Math.min(limits.maxTotalOhms, maxInputVolts / limits.minBleedAmps);
    const split = Math.max(firstSumAtOrAbove(loaded, idealLoaded), firstBottom);
    for (const step of [1, -1]) {
      let rejected = 0;
      for (let b = step === 1 ? split : split - 1; b >= firstBottom && b < loaded.length; b += step) {
        // The highest allowed R_t, highest total − R_b', falls as R_b' grows.
        if (topOhms > highestTotal - loaded[b]) { if (step === 1) break; continue; }
        // A top resistor's share of the input shrinks as R_b' grows.
        if (topOhms > stringCapOhms(plan, length, loaded[b])) { if (step === -1) break; continue; }
        if (!mayRank(state, worstCaseError(plan, topOhms, loaded[b]))) break;
        if (offer(state, indices, b, topOhms, true)) rejected = 0;
        else if (++rejected >= MAX_REJECTIONS_IN_A_ROW) { state.cutWalks++; break; }
      }
    }
  });
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
