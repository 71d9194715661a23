import { blockCountFor } from '../propagation/blocks.js';
import { histogramOf, type Histogram } from '../propagation/histogram.js';
import type { TrialChunk } from '../propagation/kernel.js';
import { mergeChunks, outputValues, simulateBlocks } from '../propagation/simulate.js';
import { ratioEnvelope, type RatioEnvelope } from './envelope.js';
import { evaluateFaults, type FaultOutcome } from './faults.js';
import { PRECHARGE_OUTPUT, prechargeKernel } from './kernel.js';
import { plausibilityWindow, type PlausibilityWindow } from './plausibility.js';
import { finiteSorted, quantileTable } from './quantiles.js';
import { steadyStateFraction, timeConstantS } from './rc.js';
import type { PrechargeDesign, PrechargeFault } from './types.js';

/** Settings of a margin study run. */
export interface PrechargeStudyOptions {
  seed: number;
  trials: number;
  plausibilityMarginFraction?: number;
  plausibilityProbabilities?: [number, number];
  histogramBins?: number;
  envelopePoints?: number;
  /** Trials (the first ones) the envelope is drawn from, default 2000. */
  envelopeTrials?: number;
  faults?: PrechargeFault[];
  faultTrials?: number;
  faultMissFraction?: number;
}

/** A distribution: histogram plus quantiles. */
export interface Distribution {
  histogram: Histogram;
  quantiles: { probability: number; value: number }[];
}

/** Result of a margin study. */
export interface PrechargeStudy {
  trials: number;
  /** P(contactor closes while the true link/pack ratio < required fraction). */
  earlyClosureProbability: number;
  /** P(threshold not reached before the timeout). */
  neverReachedProbability: number;
  closureTimeS: Distribution;
  ratioAtClosure: Distribution;
  stepAtClosureV: Distribution;
  window: PlausibilityWindow;
  envelope: RatioEnvelope;
  faults: FaultOutcome[];
}

/**
 * Simulates one chunk of a margin study (for a worker).
 * @param design pre-charge design
 * @param seed integer in [0, 2^32 − 1]
 * @param totalTrials trials in the whole run
 * @param firstBlock first block of the chunk
 * @param blockCount blocks in the chunk
 * @throws Error naming a bad input
 * @example simulatePrechargeChunk(design, 1, 1e6, 500, 500)
 */
export function simulatePrechargeChunk(design: PrechargeDesign, seed: number, totalTrials: number, firstBlock: number, blockCount: number): TrialChunk {
  return simulateBlocks(prechargeKernel(design), seed, totalTrials, firstBlock, blockCount);
}

function distribution(sorted: Float64Array, values: Float64Array, bins: number): Distribution {
  return { histogram: histogramOf(values, bins), quantiles: quantileTable(sorted) };
}

/**
 * Summarises the chunks of a margin study: early-closure and never-reached probabilities,
 * distributions of closure time, true ratio and voltage step at closure, plausibility window,
 * ratio envelope and the injected faults' verdicts. Chunking never changes the result.
 * @param design pre-charge design
 * @param chunks chunks covering the run, any order
 * @param options seed (for the fault runs), margin (default 0.2), probabilities (default [0.001, 0.999]), faults
 * @throws if no healthy trial closes, or an input is bad
 * @example summarisePrecharge(design, [a, b], { seed: 1, trials: 1e6 })
 */
export function summarisePrecharge(design: PrechargeDesign, chunks: readonly TrialChunk[], options: PrechargeStudyOptions): PrechargeStudy {
  const merged = mergeChunks(chunks);
  const bins = options.histogramBins ?? 40;
  const closeS = outputValues(merged, PRECHARGE_OUTPUT.closeTimeS);
  const ratio = outputValues(merged, PRECHARGE_OUTPUT.ratio);
  const stepV = outputValues(merged, PRECHARGE_OUTPUT.stepV);
  let early = 0;
  for (let i = 0; i < ratio.length; i++) if (ratio[i] < design.requiredFraction) early++;
  const sortedClose = finiteSorted(closeS);
  const never = merged.trials - sortedClose.length;
  const window = plausibilityWindow(sortedClose, never, design.timeoutS, options.plausibilityMarginFraction ?? 0.2, options.plausibilityProbabilities ?? [0.001, 0.999]);
  const envelopeTrials = Math.min(merged.trials, options.envelopeTrials ?? 2000);
  const network = { prechargeOhm: design.prechargeOhm, leakageOhm: design.leakageOhm ?? Infinity, capacitanceF: design.linkCapacitanceF };
  const envelope = ratioEnvelope(
    outputValues(merged, PRECHARGE_OUTPUT.steadyFraction).subarray(0, envelopeTrials),
    outputValues(merged, PRECHARGE_OUTPUT.timeConstantS).subarray(0, envelopeTrials),
    { steady: steadyStateFraction(network), tauS: timeConstantS(network) },
    Math.min(design.timeoutS, 1.5 * sortedClose[sortedClose.length - 1]),
    options.envelopePoints ?? 60,
  );
  return {
    trials: merged.trials,
    earlyClosureProbability: early / merged.trials,
    neverReachedProbability: never / merged.trials,
    closureTimeS: distribution(sortedClose, closeS, bins),
    ratioAtClosure: distribution(finiteSorted(ratio), ratio, bins),
    stepAtClosureV: distribution(finiteSorted(stepV), stepV, bins),
    window,
    envelope,
    faults: evaluateFaults(design, window, options.faults ?? [], { seed: options.seed, trials: options.faultTrials, missFraction: options.faultMissFraction }),
  };
}

/**
 * Margin study of a pre-charge in one thread (see prechargeKernel for the model).
 * @param design pre-charge design
 * @param options seed, trials and summary settings
 * @throws Error naming a bad input
 * @example runPrechargeStudy(design, { seed: 1, trials: 100_000, faults: [{ kind: 'open-precharge' }] })
 */
export function runPrechargeStudy(design: PrechargeDesign, options: PrechargeStudyOptions): PrechargeStudy {
  return summarisePrecharge(design, [simulatePrechargeChunk(design, options.seed, options.trials, 0, blockCountFor(options.trials))], options);
}
