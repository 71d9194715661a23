import { checkProbability, type ProbabilityCheck } from '../../../shared/precharge/index.js';
import type { MarginCriterion, MarginStudyResult } from '../../../shared/schemas/margin.js';

/** A probability as a percentage to two significant digits: 0.003 → "0.3 %", 3·10⁻⁶ → "0.0003 %". */
export const prob = (p: number) => (p === 0 ? '0 %' : `${Number((p * 100).toPrecision(2))} %`);

/** What the shared reading-error draws are, in the words of the chosen mode. */
export function drawsWord(mode: MarginStudyResult['model']['readingErrors']['mode']): string {
  return mode === 'board' ? "draws of the board's calibration uncertainty" : 'simulated boards';
}

/** "k of N trials" with the 95 % bound the count supports, and why a criterion cannot be shown. */
export function countSentence(what: string, c: ProbabilityCheck, allowed: number, draws: string): string {
  const counted = `${what} in ${c.events} of ${c.trials} trials.`;
  if (c.outcome === 'not-met') return counted;
  const boardLimited = c.independentTrials < c.trials;
  const shared = boardLimited ? ` (the trials share ${c.independentTrials} ${draws}, so they count as ${c.independentTrials} samples)` : '';
  if (c.outcome === 'met') return `${counted} At 95 % confidence that shows ≤ ${prob(c.upperBound)}${shared}.`;
  return `${counted} At 95 % confidence that shows only ≤ ${prob(c.upperBound)}${shared}, not ≤ ${prob(allowed)}; run more ${boardLimited ? draws : 'trials'}.`;
}

/**
 * One criterion on a counted probability that must not exceed the allowance: met only when the
 * 95 % upper bound (on no more samples than the shared boards) is within it.
 */
export function probabilityRow(
  base: Pick<MarginCriterion, 'key' | 'criterion'>, probability: number, trials: number, drawCount: number | null,
  allowed: number, what: string, draws: string, tail: string,
): MarginCriterion {
  const c = checkProbability(Math.round(probability * trials), trials, drawCount, allowed);
  return {
    ...base, pass: c.outcome === 'met', outcome: c.outcome, upperBound: c.upperBound,
    value: probability, limit: allowed, unit: '', sense: 'max',
    explanation: countSentence(what, c, allowed, draws) + tail,
  };
}
