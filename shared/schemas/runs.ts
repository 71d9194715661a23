import { z } from 'zod';
import { minimumBatchTrials, minimumStudyTrials, recommendedTrials } from '../propagation/coverage.js';
import { DEFAULT_COVERAGE_PROBABILITY, DEFAULT_GRID_POINTS, MAX_GRID_POINTS, MAX_TRIALS, MIN_GRID_POINTS, MIN_TRIALS } from './study-defaults.js';

export const RUN_KINDS = ['uncertainty', 'margin'] as const;
export type RunKind = (typeof RUN_KINDS)[number];
export const RUN_STATES = ['queued', 'running', 'done', 'failed', 'cancelled'] as const;
export type RunState = (typeof RUN_STATES)[number];

export { MAX_TRIALS };

export const uncertaintyStudyRequestSchema = z
  .strictObject({
    /** Fixed trial count, or omit and give `significantDigits` for the adaptive procedure. */
    trials: z.number({ error: 'trials must be a number' }).int({ error: 'trials must be a whole number' })
      .min(MIN_TRIALS, { error: `trials must be ≥ ${MIN_TRIALS}` }).max(MAX_TRIALS, { error: `trials must be ≤ ${MAX_TRIALS}` }).optional(),
    significantDigits: z.number({ error: 'significantDigits must be a number' }).int().min(1, { error: 'significantDigits must be 1 or 2' })
      .max(2, { error: 'significantDigits must be 1 or 2' }).optional(),
    seed: z.number({ error: 'seed must be a number' }).int({ error: 'seed must be a whole number' })
      .min(0, { error: 'seed must be ≥ 0' }).max(2 ** 31 - 1, { error: 'seed must be < 2³¹' }).optional(),
    coverageProbability: z.number({ error: 'coverageProbability must be a number' })
      .gt(0.5, { error: 'coverageProbability must be > 0.5' }).lt(1, { error: 'coverageProbability must be < 1' })
      .refine((p) => !(p > 0.5 && p < 1) || minimumBatchTrials(p) <= MAX_TRIALS, { error: `coverageProbability must be ≤ ${1 - 100 / MAX_TRIALS}: above it one adaptive batch alone exceeds ${MAX_TRIALS} trials` })
      .default(DEFAULT_COVERAGE_PROBABILITY),
    gridPoints: z.number().int().min(MIN_GRID_POINTS, { error: `gridPoints must be ≥ ${MIN_GRID_POINTS}` })
      .max(MAX_GRID_POINTS, { error: `gridPoints must be ≤ ${MAX_GRID_POINTS}` }).default(DEFAULT_GRID_POINTS),
  })
  .refine((v) => !(v.trials !== undefined && v.significantDigits !== undefined), {
    error: 'give trials or significantDigits, not both',
  })
  // Below 50/(1 − p) an interval end is one of a handful of extreme trials; between that and the
  // 10⁴/(1 − p) of JCGM 101 7.2.2 the study runs and its page warns, as a quick look is often wanted.
  .superRefine((v, ctx) => {
    const p = v.coverageProbability;
    if (v.trials === undefined || !(p > 0.5 && p < 1) || v.trials >= minimumStudyTrials(p)) return;
    ctx.addIssue({
      code: 'custom', path: ['trials'],
      message: `trials must be ≥ ${minimumStudyTrials(p)} for a ${+(p * 100).toPrecision(6)} % coverage interval, 25 beyond each end; ${recommendedTrials(p)} are recommended`,
    });
  });
export type UncertaintyStudyRequest = z.infer<typeof uncertaintyStudyRequestSchema>;
