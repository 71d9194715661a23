/**
 * The divider finder: top strings of equal values, and (when asked) every mixed top string the
 * search budget allows, each with the bottom values that bring the ratio the converter sees
 * closest to the target; ranked by worst-case error at the highest input, then parts, then power.
 * Whatever kind of string is not searched is named in the result.
 */
import { CandidateShortlist } from './candidate-ranking.js';
import { planSearch } from './finder-request.js';
import type { SearchPlan } from './finder-request.js';
import type { FinderRequest, FinderResult } from './finder-types.js';
import { searchEqualStrings } from './equal-strings.js';
import { limitWindow, usableInTop } from './finder-limits.js';
import { highestTopOhms, mixedWork, searchMixedStrings } from './mixed-strings.js';
import { searchState, MAX_REJECTIONS_IN_A_ROW } from './search-state.js';
import { halfStrings, multisetCount, type HalfStrings } from './top-strings.js';

/** Most multisets held in one half table. */
export const MAX_HALF_STRINGS = 1_000_000;
/** Most meet-in-the-middle steps (A-sums visited plus B-sums looked up) in one search. */
export const MIXED_WORK_BUDGET = 60_000_000;
/** How many of the nearest candidates are shown when none is within the asked tolerance. */
export const CLOSEST_SHOWN = 5;

/** A count in words a person reads at a glance: 3400, 2.1 million, 1.4 billion. */
function aboutCount(count: number): string {
  if (count >= 1e12) return `${Number((count / 1e12).toPrecision(2))} trillion`;
  if (count >= 1e9) return `${Number((count / 1e9).toPrecision(2))} billion`;
  if (count >= 1e6) return `${Number((count / 1e6).toPrecision(2))} million`;
  return String(Math.round(count));
}

function notSearchedMixed(length: number, why: string): string {
  return `Mixed top strings of ${length} resistors were not searched (${why}); strings of ${length} equal values were. ` +
    'Narrow the resistor range, ask for a tolerance or allow fewer top resistors to include them.';
}

/** Half tables kept between the searches of one request, each with the largest sum it holds. */
type TableCache = Map<number, { maxSum: number; table: HalfStrings | null }>;

function runSearch(plan: SearchPlan, tables: TableCache): { candidates: FinderResult['candidates']; notSearched: string[] } {
  const shortlist = new CandidateShortlist(plan.maxCandidates);
  const state = searchState(plan, shortlist);
  const notSearched: string[] = [];
  // Equal strings first: cheap, and they tighten the bound the mixed search prunes with.
  for (let length = plan.minTopCount; length <= plan.maxTopCount; length++) searchEqualStrings(state, length);
  if (!plan.mixedTopStrings && plan.maxTopCount >= 2) {
    notSearched.push('Only top strings of equal values were searched; strings of different values were not asked for.');
  }
  if (plan.mixedTopStrings) {
    // Only values that fit in a top string at all, and none beyond the largest top the limits allow.
    const highestTop = limitWindow(plan, null, state.loaded[0])[1];
    const usable = plan.values.flatMap((part, index) => (part.ohms <= highestTop && usableInTop(plan, part) ? [index] : []));
    const topIndex = Int32Array.from(usable);
    const ohms = usable.map((index) => plan.values[index].ohms);
    const quantity = usable.map((index) => plan.values[index].quantity);
    const table = (size: number, maxSum: number): HalfStrings | null => {
      const kept = tables.get(size);
      if (kept && kept.maxSum >= maxSum) return kept.table;
      const built = halfStrings(ohms, quantity, size, MAX_HALF_STRINGS, maxSum);
      tables.set(size, { maxSum, table: built });
      return built;
    };
    let budget = MIXED_WORK_BUDGET;
    for (let length = Math.max(2, plan.minTopCount); length <= plan.maxTopCount; length++) {
      // No bottom leaves room for a string of this length within the limits and bound: none can be valid.
      const reach = highestTopOhms(state, length);
      if (!(reach >= 0)) continue;
      const halfA = table(Math.floor(length / 2), reach);
      const halfB = halfA && table(length - Math.floor(length / 2), reach);
      if (!halfA || !halfB) {
        notSearched.push(notSearchedMixed(length, `about ${aboutCount(multisetCount(ohms.length, length))} combinations of values`));
        continue;
      }
      const work = mixedWork(state, halfA, halfB, length);
      if (work > budget) {
        notSearched.push(notSearchedMixed(length, `about ${aboutCount(work)} search steps, more than the ${aboutCount(budget)} left for this search`));
        continue;
      }
      budget -= work;
      searchMixedStrings(state, topIndex, halfA, halfB, length);
    }
  }
  if (state.cutWalks > 0) {
    notSearched.push(`Limits or stock ruled out more than ${MAX_REJECTIONS_IN_A_ROW} combinations in a row near the target ` +
      `(${state.cutWalks} ${state.cutWalks === 1 ? 'time' : 'times'}); combinations beyond those were not checked.`);
  }
  const within = shortlist.best().filter((candidate) => candidate.worstCaseErrorFraction <= plan.maxRatioErrorFraction);
  return { candidates: within, notSearched };
}

/**
 * Ranked divider candidates for a measurement channel: a top string of minTopCount…maxTopCount
 * resistors and one bottom resistor from a stored series (IEC 60063 or a team's own) or a stock list, aiming at the
 * target ratio fullScaleVolts/maxInputVolts (or targetRatio) as the converter sees it: the bottom
 * resistor in parallel with inputResistanceOhms, and the bias current's offset ±I_b·(R_t‖R_b')
 * counted at its worst sign at maxInputVolts. Equal-value strings are always searched exactly;
 * mixed strings (when asked) exactly for every length within the search budget, and the result
 * names every length that was not.
 * @param request volts in V, ohms in Ω, watts in W, amps in A (see FinderRequest)
 * @returns candidates within the tolerance, best first (at most maxCandidates); when none is, the
 *   closest found outside it; and what was not searched
 * @throws Error naming the first bad field of the request
 * @example findDividers({ maxInputVolts: 462, fullScaleVolts: 1.85, series: storedE96, minTopCount: 4, maxTopCount: 4 }).candidates[0]
 */
export function findDividers(request: FinderRequest): FinderResult {
  const plan = planSearch(request);
  const tables: TableCache = new Map();
  const found = runSearch(plan, tables);
  const asked = {
    targetRatio: plan.targetRatio,
    maxInputVolts: plan.maxInputVolts,
    toleranceFraction: plan.maxRatioErrorFraction === Infinity ? null : plan.maxRatioErrorFraction,
  };
  if (found.candidates.length > 0 || asked.toleranceFraction === null) return { ...asked, candidates: found.candidates, closest: [], notSearched: found.notSearched };
  const nearest = runSearch({ ...plan, maxRatioErrorFraction: Infinity, maxCandidates: Math.min(CLOSEST_SHOWN, plan.maxCandidates) }, tables);
  return { ...asked, candidates: [], closest: nearest.candidates, notSearched: nearest.notSearched };
}
