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

/** The range of R_t allowed by the total-resistance and bleed-current limits for one bottom. */
export function limitWindow(plan: SearchPlan, loadedOhms: number): [number, number] {
  const { limits, maxInputVolts } = plan;
  const lowestTotal = Math.max(limits.minTotalOhms, maxInputVolts / limits.maxBleedAmps);
  const highestTotal = Math.min(limits.maxTotalOhms, maxInputVolts / limits.minBleedAmps);
  return [lowestTotal - loadedOhms, highestTotal - loadedOhms];
}

/** The window of R_t for one bottom: limits and the error bound, widened a hair against rounding. */
function topWindow(state: SearchState, loadedOhms: number): [number, number] {
  const [limitLow, limitHigh] = limitWindow(state.plan, loadedOhms);
  const bound = Math.min(state.shortlist.bound(), state.plan.maxRatioErrorFraction);
  const [errorLow, errorHigh] = topOhmsWithin(state.plan, loadedOhms, bound);
  return [Math.max(limitLow, errorLow) * (1 - 1e-9), Math.min(limitHigh, errorHigh) * (1 + 1e-9)];
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
function offer(state: SearchState, topIndices: readonly number[], bottomIndex: number, topOhms: number): boolean {
  const { plan } = state;
  if (breaksLimits(plan, topOhms, plan.values[topIndices[topIndices.length - 1]].ohms, bottomIndex, state.loaded[bottomIndex])) return false;
  const key = `${topIndices.join(',')}|${bottomIndex}`;
  if (state.seen.has(key)) return false;
  let run = 0;
  for (let i = 0; i < topIndices.length; i++) {
    run = i > 0 && topIndices[i] === topIndices[i - 1] ? run + 1 : 1;
    const uses = run + (topIndices[i] === bottomIndex ? 1 : 0);
    if (uses > plan.values[topIndices[i]].quantity) return false;
  }
  state.seen.add(key);
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
    const split = firstSumAtOrAbove(loaded, idealLoaded);
    for (const step of [1, -1]) {
      let rejected = 0;
      for (let b = step === 1 ? split : split - 1; b >= 0 && b < loaded.length; b += step) {
        // The limit window [lowest total − R_b', highest total − R_b'] slides down as R_b' grows.
        const [low, high] = limitWindow(plan, loaded[b]);
        if (topOhms > high) { if (step === 1) break; continue; }
        if (topOhms < low) { if (step === -1) break; continue; }
        if (!mayRank(state, worstCaseError(plan, topOhms, loaded[b]))) break;
        if (offer(state, indices, b, topOhms)) rejected = 0;
        else if (++rejected >= MAX_REJECTIONS_IN_A_ROW) { state.cutWalks++; break; }
      }
    }
  });
}

/** Steps a mixed search of one length would take at most (for the budget), given the bound in plan. */
export function mixedWork(state: SearchState, halfA: HalfStrings, halfB: HalfStrings, length: number): number {
  let work = 0;
  const logB = Math.log2(halfB.count + 1) + 1;
  for (let b = 0; b < state.loaded.length; b++) {
    const [low, high] = topWindow(state, state.loaded[b]);
    if (!(low <= high)) continue;
    const aCount = firstSumAtOrAbove(halfA.sums, (high * halfA.size) / length + 1e-9 * high + Number.MIN_VALUE);
    const bCount = firstSumAtOrAbove(halfB.sums, high + Number.MIN_VALUE);
    work += Math.min(aCount + bCount, aCount * logB);
  }
  return work;
}

/**
 * Every top multiset of `length` values from the two half tables, with every bottom.
 * @param state search state
 * @param halfA multisets of ⌊length/2⌋ values
 * @param halfB multisets of ⌈length/2⌉ values
 * @param topIndex the plan.values index of each value the half tables number
 * @param length n = halfA.size + halfB.size
 */
export function searchMixedStrings(state: SearchState, topIndex: Int32Array, halfA: HalfStrings, halfB: HalfStrings, length: number): void {
  const { plan, loaded } = state;
  const { sums: aSums, size: aSize } = halfA;
  const { sums: bSums, size: bSize, count: bCount } = halfB;
  const logB = Math.log2(bCount + 1) + 1;
  const indices = new Array<number>(length);
  const tryPair = (ia: number, ib: number, bottom: number, topOhms: number): boolean => {
    for (let i = 0; i < aSize; i++) indices[i] = topIndex[halfA.tuples[ia * aSize + i]];
    for (let i = 0; i < bSize; i++) indices[aSize + i] = topIndex[halfB.tuples[ib * bSize + i]];
    if (aSize > 0 && bSize > 0 && indices[aSize - 1] > indices[aSize]) indices.sort((x, y) => x - y);
    return offer(state, indices, bottom, topOhms);
  };
  for (let bottom = 0; bottom < loaded.length; bottom++) {
    const loadedOhms = loaded[bottom];
    if (plan.values[bottom].quantity < 1 || !isMonotoneAbout(plan, loadedOhms)) continue;
    const [low, high] = topWindow(state, loadedOhms);
    if (!(low <= high)) continue;
    const ideal = idealTopOhms(plan, loadedOhms);
    // Through its canonical split a multiset's A-half holds its smallest values: a ≤ (|A|/n)·R_t.
    const aEnd = firstSumAtOrAbove(aSums, (high * aSize) / length + 1e-9 * high + Number.MIN_VALUE);
    const pointerMode = aEnd + firstSumAtOrAbove(bSums, high + Number.MIN_VALUE) < aEnd * logB;
    let split = pointerMode ? firstSumAtOrAbove(bSums, ideal - aSums[0]) : 0;
    for (let ia = 0; ia < aEnd; ia++) {
      const a = aSums[ia];
      const rest = ideal - a;
      if (pointerMode) while (split > 0 && bSums[split - 1] >= rest) split--;
      else split = firstSumAtOrAbove(bSums, rest);
      // Walks start at the ideal, or at the window's edge when the limits keep the ideal out.
      const up = rest < low - a ? firstSumAtOrAbove(bSums, low - a) : split;
      const down = rest > high - a ? firstSumAtOrAbove(bSums, high - a + Number.MIN_VALUE) - 1 : split - 1;
      for (const step of [1, -1]) {
        let rejected = 0;
        for (let ib = step === 1 ? up : down; ib >= 0 && ib < bCount; ib += step) {
          const topOhms = a + bSums[ib];
          if (topOhms > high || topOhms < low) break;
          if (!mayRank(state, worstCaseError(plan, topOhms, loadedOhms))) break;
          if (tryPair(ia, ib, bottom, topOhms)) rejected = 0;
          else if (++rejected >= MAX_REJECTIONS_IN_A_ROW) { state.cutWalks++; break; }
        }
      }
    }
  }
}
