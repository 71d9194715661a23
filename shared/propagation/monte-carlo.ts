import { blockCountFor } from './blocks.js';
import type { TrialChunk, TrialKernel } from './kernel.js';
import { mergeChunks, outputValues, simulateBlocks } from './simulate.js';
import { summariseValues, type OutputSummary } from './summary.js';
import { DEFAULT_COVERAGE_PROBABILITY } from '../schemas/study-defaults.js';

/** Settings of a fixed-size Monte Carlo run. */
export interface MonteCarloOptions {
  seed: number;
  trials: number;
  /** Coverage probability p, default 0.95. */
  coverageProbability?: number;
  histogramBins?: number;
}

/** Result of a Monte Carlo run: one summary per kernel output. */
export interface MonteCarloResult {
  seed: number;
  trials: number;
  coverageProbability: number;
  outputs: OutputSummary[];
}

/**
 * Summarises the merged chunks of a run, output by output (JCGM 101:2008 7.5–7.7).
 * @param chunks chunks covering the run's blocks, any order
 * @param seed seed the chunks were simulated with (echoed in the result)
 * @param coverageProbability p in (0, 1), default 0.95
 * @param histogramBins bins per histogram, default 40
 * @param consume the caller hands the chunks over: each output is sorted where it lies (no copy), which
 *   reorders the chunks' values; otherwise a single chunk is copied one output at a time
 * @throws if the chunks do not join or p is outside (0, 1)
 * @example summariseChunks([a, b], 7)
 */
export function summariseChunks(
  chunks: readonly TrialChunk[],
  seed: number,
  coverageProbability = DEFAULT_COVERAGE_PROBABILITY,
  histogramBins = 40,
  consume = false,
): MonteCarloResult {
  // A merge makes a fresh array, ours to sort; one chunk needs no merge
  const merged = chunks.length === 1 ? chunks[0] : mergeChunks(chunks);
  const inPlace = consume || chunks.length > 1;
  const outputs: OutputSummary[] = [];
  for (let o = 0; o < merged.outputCount; o++) {
    outputs.push(summariseValues(outputValues(merged, o), coverageProbability, histogramBins, inPlace));
  }
  return { seed, trials: merged.trials, coverageProbability, outputs };
}

/**
 * Monte Carlo propagation of distributions with a fixed number of trials M (JCGM 101:2008
 * 7.2–7.7), in one thread. Equal to simulating any chunking with simulateBlocks and calling
 * summariseChunks.
 * @param kernel the trial model
 * @param options seed (integer in [0, 2^32 − 1]), trials M (integer ≥ 1), coverage probability
 * @throws if the options are invalid or M is too small for the coverage probability
 * @example runMonteCarlo(kernel, { seed: 1, trials: 100_000 }).outputs[0].standardDeviation
 */
export function runMonteCarlo(kernel: TrialKernel, options: MonteCarloOptions): MonteCarloResult {
  const chunk = simulateBlocks(kernel, options.seed, options.trials, 0, blockCountFor(options.trials));
  return summariseChunks([chunk], options.seed, options.coverageProbability ?? DEFAULT_COVERAGE_PROBABILITY, options.histogramBins ?? 40, true);
}
