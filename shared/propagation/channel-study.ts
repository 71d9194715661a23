import { compileChannel } from '../chain/compile.js';
import { counterOverflow } from '../chain/overflow.js';
import type { ChannelDefinition } from '../chain/types.js';
import { runAdaptiveMonteCarlo, type Stabilisation } from './adaptive.js';
import { channelGum, channelWorstCase, type ChannelGumPoint, type ChannelWorstCasePoint } from './channel-analytic.js';
import { channelKernel } from './channel-kernel.js';
import { validateGum, type GumValidation } from './gum-validation.js';
import type { TrialChunk, TrialKernel } from './kernel.js';
import { blockCountFor } from './blocks.js';
import { summariseChunks } from './monte-carlo.js';
import { simulateBlocks } from './simulate.js';
import type { OutputSummary } from './summary.js';
import { DEFAULT_COVERAGE_PROBABILITY, DEFAULT_GRID_POINTS } from '../schemas/study-defaults.js';

/** Settings of a channel uncertainty study. */
export interface ChannelStudyOptions {
  seed: number;
  /** Fixed trial count; omit to run adaptively (JCGM 101 7.9). */
  trials?: number;
  gridPoints?: number;
  coverageProbability?: number;
  /** Significant digits for the adaptive stop and the GUM validation, default 2. */
  ndig?: number;
  maxTrials?: number;
  /** Fraction of the Monte Carlo done, 0…1 (adaptive runs count against maxTrials). */
  onProgress?: (fraction: number) => void;
}

/** Monte Carlo, GUM and worst case at one evaluation voltage (errors in V). */
export interface ChannelStudyPoint {
  voltageV: number;
  monteCarlo: OutputSummary;
  gum: ChannelGumPoint;
  worstCase: ChannelWorstCasePoint;
  gumValidation: GumValidation;
  stabilisation?: Stabilisation;
  /** True when some reading here wraps the counter (nominal or within the bounds); the numbers include the wrap. */
  counterOverflow?: boolean;
}

/** A whole channel study. */
export interface ChannelStudy {
  seed: number;
  trials: number;
  coverageProbability: number;
  adaptive: boolean;
  /** Adaptive runs only: whether 7.9.4 stabilised before maxTrials. */
  stable: boolean;
  points: ChannelStudyPoint[];
  /** True when the GUM interval is validated (JCGM 101 §8) at every evaluation voltage. */
  gumAdequate: boolean;
}

/**
 * A worst case a lead may sign is never narrower than what the simulation itself produced: the
 * corner bounds are widened to the smallest and largest trial error, and marked when that happened.
 */
function enclosingTrials(worst: ChannelWorstCasePoint, mc: OutputSummary): ChannelWorstCasePoint {
  if (mc.minimum >= worst.minimum && mc.maximum <= worst.maximum) return worst;
  const minimum = Math.min(worst.minimum, mc.minimum);
  const maximum = Math.max(worst.maximum, mc.maximum);
  return { ...worst, minimum, maximum, maxAbs: Math.max(Math.abs(minimum), Math.abs(maximum)), widenedToTrials: true };
}

function fixedRun(kernel: TrialKernel, seed: number, trials: number, p: number, report?: (fraction: number) => void) {
  const blocks = blockCountFor(trials);
  const chunk = simulateBlocks(kernel, seed, trials, 0, blocks, report && ((done) => { if (done % 20 === 0) report(done / blocks); }));
  return { ...summariseChunks([chunk], seed, p, 40, true), stable: true, stabilisation: [] as Stabilisation[] };
}

/** The parts of a channel study that need no simulation: GUM, worst case and counter overflow per voltage. */
export interface ChannelAnalytic {
  gridV: number[];
  gum: ChannelGumPoint[];
  worstCase: ChannelWorstCasePoint[];
  counterOverflow: boolean[];
}

/**
 * GUM (JCGM 100), worst case and counter overflow of a channel at its evaluation voltages; a thread may
 * compute these while others simulate.
 * @param channel fully specified channel
 * @param gridPoints evaluation voltages, integer ≥ 2
 * @param coverageProbability p in (0, 1)
 * @throws Error naming a bad channel input
 * @example channelAnalytic(channel, 11, 0.95).worstCase[0].maxAbs
 */
export function channelAnalytic(channel: ChannelDefinition, gridPoints: number, coverageProbability: number): ChannelAnalytic {
  const compiled = compileChannel(channel, gridPoints);
  return analyticOf(compiled, coverageProbability);
}

function analyticOf(compiled: ReturnType<typeof compileChannel>, p: number): ChannelAnalytic {
  return {
    gridV: Array.from(compiled.gridV),
    gum: channelGum(compiled, p),
    worstCase: channelWorstCase(compiled),
    counterOverflow: counterOverflow(compiled).map((o) => o.overflows),
  };
}

/** What the Monte Carlo gave a channel study: a summary per voltage and how the run stopped. */
export interface ChannelMonteCarlo {
  trials: number;
  stable: boolean;
  outputs: OutputSummary[];
  stabilisation: Stabilisation[];
}

/**
 * Puts a channel study together from its Monte Carlo summaries and analytic parts (JCGM 101 §8 validation
 * per voltage; worst case widened to the trials). The one-thread study and the pooled one both end here.
 * @param analytic from {@link channelAnalytic}
 * @param mc Monte Carlo summaries, one per evaluation voltage
 * @param options seed, p, ndig and whether the run was adaptive
 * @throws never
 * @example assembleChannelStudy(analytic, mc, { seed: 7, coverageProbability: 0.95, ndig: 2, adaptive: false })
 */
export function assembleChannelStudy(
  analytic: ChannelAnalytic,
  mc: ChannelMonteCarlo,
  options: { seed: number; coverageProbability: number; ndig: number; adaptive: boolean },
): ChannelStudy {
  const points = analytic.gridV.map((voltageV, g) => ({
    voltageV,
    monteCarlo: mc.outputs[g],
    gum: analytic.gum[g],
    worstCase: enclosingTrials(analytic.worstCase[g], mc.outputs[g]),
    gumValidation: validateGum(analytic.gum[g], mc.outputs[g].symmetricInterval, options.ndig),
    stabilisation: mc.stabilisation[g],
    counterOverflow: analytic.counterOverflow[g],
  }));
  return {
    seed: options.seed,
    trials: mc.trials,
    coverageProbability: options.coverageProbability,
    adaptive: options.adaptive,
    stable: mc.stable,
    points,
    gumAdequate: points.every((pt) => pt.gumValidation.adequate),
  };
}

/**
 * Simulates one chunk of a channel Monte Carlo run, for a worker: compile, then the blocks.
 * @param channel fully specified channel (plain data, as sent to a worker)
 * @param gridPoints evaluation voltages, integer ≥ 2
 * @param seed integer in [0, 2^32 − 1]
 * @param totalTrials trials in the whole run
 * @param firstBlock first block of the chunk
 * @param blockCount blocks in the chunk
 * @throws Error naming a bad channel input, or if the blocks lie beyond the run
 * @example simulateChannelChunk(channel, 11, 1, 1e6, 0, 500)
 */
export function simulateChannelChunk(
  channel: ChannelDefinition, gridPoints: number, seed: number, totalTrials: number, firstBlock: number, blockCount: number,
): TrialChunk {
  return simulateBlocks(channelKernel(compileChannel(channel, gridPoints)), seed, totalTrials, firstBlock, blockCount);
}

/**
 * Uncertainty study of a channel's reading error across its range: Monte Carlo (JCGM 101,
 * fixed M or adaptive 7.9.4), GUM law of propagation (JCGM 100) with its budget, worst case,
 * and the §8 validation of GUM against the Monte Carlo symmetric interval.
 * @param channel fully specified channel
 * @param options seed, trials (omit for adaptive), grid points (default 11), p (default 0.95), ndig (default 2)
 * @throws Error naming a bad input
 * @example channelStudy(channel, { seed: 7, trials: 50_000 }).gumAdequate
 */
export function channelStudy(channel: ChannelDefinition, options: ChannelStudyOptions): ChannelStudy {
  const compiled = compileChannel(channel, options.gridPoints ?? DEFAULT_GRID_POINTS);
  const p = options.coverageProbability ?? DEFAULT_COVERAGE_PROBABILITY;
  const ndig = options.ndig ?? 2;
  const kernel = channelKernel(compiled);
  const adaptive = options.trials === undefined;
  const report = options.onProgress;
  const maxTrials = options.maxTrials ?? 10_000_000;
  const mc = adaptive
    ? runAdaptiveMonteCarlo(kernel, {
      seed: options.seed, coverageProbability: p, ndig, maxTrials, onBatch: report && ((t) => report(Math.min(1, t / maxTrials))),
    })
    : fixedRun(kernel, options.seed, options.trials as number, p, report);
  return assembleChannelStudy(analyticOf(compiled, p), mc, { seed: options.seed, coverageProbability: p, ndig, adaptive });
}
