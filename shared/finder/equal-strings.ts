/**
 * Top strings of n equal values: for each value v, the bottom values walked outward from the ideal
 * R_b' = r₀·n·v/(1 − r₀). The worst-case error grows monotonically away from the ideal (see
 * loaded-divider), so a walk stops at the first bottom that cannot rank; nothing that could is skipped.
 */
import { stringCapOhms, usableInTop } from './finder-limits.js';
import { worstCaseError } from './loaded-divider.js';
import { mayRank, offer, MAX_REJECTIONS_IN_A_ROW, type SearchState } from './search-state.js';
import { firstSumAtOrAbove } from './top-strings.js';

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
