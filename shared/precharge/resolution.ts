import { clopperPearsonUpper } from '../stats/clopper-pearson.js';
import type { PrechargeDesign, ReadingErrorModel } from './types.js';

/** Whether a probability criterion is met, missed, or beyond what the trials can show. */
export type CriterionOutcome = 'met' | 'not-met' | 'not-shown';

/** A counted probability against its allowance, with the 95 % bound the count supports. */
export interface ProbabilityCheck {
  events: number;
  trials: number;
  /** Independent samples the count rests on: the trials, or fewer when trials share reading-error draws. */
  independentTrials: number;
  estimate: number;
  /** One-sided 95 % upper confidence bound of the probability. */
  upperBound: number;
  /** The smallest probability these trials could show at all (the bound after no events). */
  smallestShowable: number;
  outcome: CriterionOutcome;
}

/** Size of a reading-error pool that trials draw from with replacement; null when every trial draws afresh. */
function poolSize(model: ReadingErrorModel): number | null {
  return model.kind === 'samples' ? model.gainErrorFraction.length : null;
}

/**
 * How many reading-error draws (simulated boards) the trials of a design share: the smaller pool
 * of the two channels, or null when both channels draw fresh errors for every trial.
 * @param design the pre-charge design
 * @throws never
 * @example readingErrorDraws(design) // 20000 for two pools of 20 000 boards
 */
export function readingErrorDraws(design: PrechargeDesign): number | null {
  const sizes = [poolSize(design.packReading), poolSize(design.linkReading)].filter((n): n is number => n !== null);
  return sizes.length === 0 ? null : Math.min(...sizes);
}

/**
 * Independent samples behind a count over `trials` trials that reuse `draws` reading-error draws:
 * min(trials, draws). When an event is decided by which board a trial drew, every trial on that
 * board agrees, so the trials are clusters of one board each and carry no more information than
 * the boards themselves (design effect of wholly concordant clusters); the bound stays valid for
 * any mix of board and trial effects.
 * @param trials trials counted, integer ≥ 1
 * @param draws reading-error pool size, or null for fresh draws
 * @throws if trials or draws is not an integer ≥ 1
 * @example independentTrials(1_000_000, 500) // 500
 */
export function independentTrials(trials: number, draws: number | null): number {
  if (!Number.isInteger(trials) || trials < 1) throw new Error('trials must be an integer ≥ 1');
  if (draws !== null && (!Number.isInteger(draws) || draws < 1)) throw new Error('reading-error draws must be an integer ≥ 1');
  return draws === null ? trials : Math.min(trials, draws);
}

/**
 * Checks a counted probability against an allowance: the estimate k/M, and a one-sided 95 %
 * Clopper–Pearson upper bound on n = independentTrials(M, draws) samples with the count rescaled
 * to k·n/M. Met when the bound is ≤ allowed; not met when the estimate itself exceeds it; not
 * shown otherwise (the trials or the boards are too few to tell).
 * @param events k, integer in [0, trials]
 * @param trials M, integer ≥ 1
 * @param draws reading-error pool size shared by the trials, or null for fresh draws
 * @param allowedProbability the allowance, in (0, 1)
 * @throws if a count is out of range or the allowance is outside (0, 1)
 * @example checkProbability(3, 1_000_000, 500, 1e-5).outcome // 'not-shown'
 */
export function checkProbability(events: number, trials: number, draws: number | null, allowedProbability: number): ProbabilityCheck {
  if (!(allowedProbability > 0 && allowedProbability < 1)) throw new Error('allowed probability must be in (0, 1)');
  if (!Number.isInteger(events) || events < 0 || events > trials) throw new Error('events must be a whole number in [0, trials]');
  const n = independentTrials(trials, draws);
  const estimate = events / trials;
  const upperBound = clopperPearsonUpper((events * n) / trials, n);
  const outcome = estimate > allowedProbability ? 'not-met' : upperBound <= allowedProbability ? 'met' : 'not-shown';
  return { events, trials, independentTrials: n, estimate, upperBound, smallestShowable: clopperPearsonUpper(0, n), outcome };
}
