import { checkProbability, type ProbabilityCheck } from '../../../shared/precharge/index.js';
import type { MarginCriterion, MarginStudyResult } from '../../../shared/schemas/margin.js';

export const prob = (p: number) => (p === 0 ? '0' : p < 1e-3 ? p.toExponential(1) : p.toPrecision(2));

/** What the shared reading-error draws are, in the words of the chosen mode. */
export function drawsWord(mode: MarginStudyResult['model']['readingErrors']['mode']): string {
  return mode === 'board' ? "draws of the board's calibration uncertainty" : 'simulated boards';
}

/** "k of N trials" with the 95 % bound the count supports, and why a criterion cannot be shown. */
export function countSentence(what: string, c: ProbabilityCheck, allowed: number, draws: string): string {
  const counted = `${what} in ${c.events} of ${c.trials} trials`;
  const shared = c.independentTrials < c.trials ? `, counted as ${c.independentTrials} independent samples because the trials share ${c.independentTrials} ${draws}` : '';
  if (c.outcome === 'not-met') return `${counted}${shared}.`;
  if (c.outcome === 'met') return `${counted}: at most ${prob(c.upperBound)} at 95 % confidence${shared}.`;
  const more = c.independentTrials < c.trials ? `more ${draws}` : 'more trials';
  return `${counted}, but that cannot show ≤ ${prob(allowed)}: at 95 % confidence it is only known to be ≤ ${prob(c.upperBound)}${shared}`
    + ` (these runs can show nothing below ${prob(c.smallestShowable)}); run ${more}.`;
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
