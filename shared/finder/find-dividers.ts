/**
 * The divider finder: for each top string (n equal values, optionally mixed
 * values), the bottom values nearest the ideal R_b = r·R_top/(1 − r) found by
 * binary search, kept when every limit holds, ranked by ratio error, parts, power.
 */
import { CandidateShortlist } from './candidate-ranking.js';
import { evaluateDivider } from './divider-evaluation.js';
import { planSearch } from './finder-request.js';
import type { SearchPlan, SearchValue } from './finder-request.js';
import type { DividerCandidate, FinderRequest } from './finder-types.js';
import { MIXED_STRING_BUDGET, forEachMixedString, multisetCount } from './top-strings.js';

/** Bottom values tried on each side of the ideal one. */
const NEIGHBOURS_EACH_SIDE = 2;

function firstAtOrAbove(values: readonly SearchValue[], ohms: number): number {
  let low = 0;
  let high = values.length;
  while (low < high) {
    const middle = (low + high) >>> 1;
    if (values[middle].ohms < ohms) low = middle + 1;
    else high = middle;
  }
  return low;
}

function tryTopString(plan: SearchPlan, top: SearchValue[], used: Map<SearchValue, number>, shortlist: CandidateShortlist): void {
  const topOhms = top.reduce((sum, part) => sum + part.ohms, 0);
  const idealBottom = (plan.targetRatio * topOhms) / (1 - plan.targetRatio);
  const split = firstAtOrAbove(plan.values, idealBottom);
  const first = Math.max(0, split - NEIGHBOURS_EACH_SIDE);
  const last = Math.min(plan.values.length - 1, split + NEIGHBOURS_EACH_SIDE - 1);
  for (let index = first; index <= last; index++) {
    const bottom = plan.values[index];
    if ((used.get(bottom) ?? 0) + 1 > bottom.quantity) continue;
    const ratio = bottom.ohms / (topOhms + bottom.ohms);
    const ratioErrorFraction = ratio / plan.targetRatio - 1;
    if (Math.abs(ratioErrorFraction) > plan.maxRatioErrorFraction || !shortlist.admits(ratioErrorFraction)) continue;
    const candidate = evaluateDivider(plan, top, topOhms, bottom);
    if (candidate !== null) shortlist.add(candidate);
  }
}

function usage(top: readonly SearchValue[]): Map<SearchValue, number> | null {
  const used = new Map<SearchValue, number>();
  for (const part of top) {
    const count = (used.get(part) ?? 0) + 1;
    if (count > part.quantity) return null;
    used.set(part, count);
  }
  return used;
}

/**
 * Ranked divider candidates for a measurement channel: top string of minTopCount…maxTopCount
 * resistors and one bottom resistor from an E-series (IEC 60063) or a stock list, target ratio
 * fullScaleVolts/maxInputVolts (or targetRatio), every figure evaluated at maxInputVolts.
 * Mixed top strings are tried only for lengths whose multiset count ≤ MIXED_STRING_BUDGET.
 * @param request volts in V, ohms in Ω, watts in W, amps in A (see FinderRequest)
 * @returns up to maxCandidates candidates, best first; empty when nothing meets the limits
 * @throws Error naming the first bad field of the request
 * @example findDividers({ maxInputVolts: 462, fullScaleVolts: 1.85, series: 'E96', minTopCount: 4, maxTopCount: 4 })
 */
export function findDividers(request: FinderRequest): DividerCandidate[] {
  const plan = planSearch(request);
  const shortlist = new CandidateShortlist(plan.maxCandidates);
  const { values } = plan;
  for (let length = plan.minTopCount; length <= plan.maxTopCount; length++) {
    for (const part of values) {
      if (part.quantity < length) continue;
      const top = new Array<SearchValue>(length).fill(part);
      tryTopString(plan, top, new Map([[part, length]]), shortlist);
    }
    if (!plan.mixedTopStrings || length < 2 || multisetCount(values.length, length) > MIXED_STRING_BUDGET) continue;
    forEachMixedString(values.length, length, (indices) => {
      const top = indices.map((index) => values[index]);
      const used = usage(top);
      if (used !== null) tryTopString(plan, top, used, shortlist);
    });
  }
  return shortlist.best();
}
