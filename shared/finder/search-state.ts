/**
 * State shared by the searches of one request, and the one door every divider goes through on its
 * way into the shortlist: repeats, stock quantities and limits checked, figures evaluated.
 */
import type { CandidateShortlist } from './candidate-ranking.js';
import { evaluateDivider } from './divider-evaluation.js';
import { breaksLimits, limitWindow } from './finder-limits.js';
import type { SearchPlan, SearchValue } from './finder-request.js';
import { loadedBottomOhms, topOhmsWithin } from './loaded-divider.js';

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

/** The window of R_t for one bottom: limits and the error bound, widened a hair against rounding. */
export function topWindow(state: SearchState, bottom: SearchValue, loadedOhms: number): [number, number] {
  const [limitLow, limitHigh] = limitWindow(state.plan, bottom, loadedOhms);
  const bound = Math.min(state.shortlist.bound(), state.plan.maxRatioErrorFraction);
  const [errorLow, errorHigh] = topOhmsWithin(state.plan, loadedOhms, bound);
  return [Math.max(limitLow, errorLow) * (1 - 1e-9), Math.min(limitHigh, errorHigh) * (1 + 1e-9)];
}

/** Whether an error may still rank: admitted by the shortlist and within the search bound. */
export function mayRank(state: SearchState, error: number): boolean {
  return error <= state.plan.maxRatioErrorFraction && state.shortlist.admits(error);
}

/** Offers one divider (top value indices ascending); true when it was a new valid candidate. */
export function offer(state: SearchState, topIndices: readonly number[], bottomIndex: number, topOhms: number, unique: boolean): boolean {
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
