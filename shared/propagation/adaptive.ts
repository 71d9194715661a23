import { TRIALS_PER_BLOCK } from '../random/streams.js';
import { minimumBatchTrials } from './coverage.js';
import type { TrialChunk, TrialKernel } from './kernel.js';
import { summariseChunks, type MonteCarloResult } from './monte-carlo.js';
import { mergeChunks, outputValues, simulateBlocks } from './simulate.js';
import { summariseValues } from './summary.js';
import { numericalTolerance } from './tolerance.js';
import { DEFAULT_COVERAGE_PROBABILITY } from '../schemas/study-defaults.js';

/** Settings of an adaptive Monte Carlo run (JCGM 101:2008 7.9). */
export interface AdaptiveOptions {
  seed: number;
  coverageProbability?: number;
  /** Significant digits regarded as meaningful in u(y), default 2. */
  ndig?: number;
  /** Stop (unstable) once this many trials have been used, default 10⁷. */
  maxTrials?: number;
  histogramBins?: number;
  /** Called after each batch with the trials simulated so far. */
  onBatch?: (trials: number) => void;
}

/** Per output: twice the standard deviations of the batch results, and the tolerance δ. */
export interface Stabilisation {
  twiceSdMean: number;
  twiceSdStandardUncertainty: number;
  twiceSdLow: number;
  twiceSdHigh: number;
  numericalTolerance: number;
}

/** An adaptive run's summaries plus how it stopped. */
export interface AdaptiveResult extends MonteCarloResult {
  stable: boolean;
  batches: number;
  batchTrials: number;
  ndig: number;
  stabilisation: Stabilisation[];
}

function sdOfMean(values: readonly number[]): number {
  const h = values.length;
  const mean = values.reduce((a, b) => a + b, 0) / h;
  return Math.sqrt(values.reduce((a, v) => a + (v - mean) ** 2, 0) / (h * (h - 1)));
}

/**
 * Drives the adaptive procedure of JCGM 101:2008 7.9.4 one batch at a time, so a caller may
 * simulate each batch in parallel chunks. Batch h (from 0) is blocks [h·B, (h+1)·B) of the
 * seed's streams, M = max(⌈100/(1 − p)⌉, 10⁴) rounded up to whole blocks.
 */
export class AdaptiveMonteCarlo {
  readonly batchBlocks: number;
  readonly coverageProbability: number;
  readonly ndig: number;
  private readonly chunks: TrialChunk[] = [];
  private readonly perBatch: number[][][] = [];
  private lastStabilisation: Stabilisation[] = [];

  /**
   * @param options seed, coverage probability (default 0.95), ndig (default 2), maxTrials (default 10⁷)
   * @throws if p is outside (0, 1) or ndig is not an integer ≥ 1
   */
  constructor(private readonly options: AdaptiveOptions) {
    this.coverageProbability = options.coverageProbability ?? DEFAULT_COVERAGE_PROBABILITY;
    this.ndig = options.ndig ?? 2;
    if (!(this.coverageProbability > 0 && this.coverageProbability < 1)) throw new Error('coverage probability must be in (0, 1)');
    if (!Number.isInteger(this.ndig) || this.ndig < 1) throw new Error('significant digits must be an integer ≥ 1');
    const batchTrials = Math.max(minimumBatchTrials(this.coverageProbability), 10_000);
    this.batchBlocks = Math.ceil(batchTrials / TRIALS_PER_BLOCK);
  }

  /** Blocks of the next batch and the run length to pass to simulateBlocks. */
  nextBatch(): { firstBlock: number; blockCount: number; totalTrials: number } {
    const firstBlock = this.perBatch.length * this.batchBlocks;
    return { firstBlock, blockCount: this.batchBlocks, totalTrials: (firstBlock + this.batchBlocks) * TRIALS_PER_BLOCK };
  }

  /** Adds the chunks of the batch announced by nextBatch (7.9.4 c–d). @throws if they are not that batch */
  addBatch(batchChunks: readonly TrialChunk[]): void {
    const batch = mergeChunks(batchChunks);
    const expected = this.nextBatch();
    if (batch.firstBlock !== expected.firstBlock || batch.blockCount !== expected.blockCount) throw new Error('chunks are not the next batch');
    this.chunks.push(batch);
    this.perBatch.push(
      Array.from({ length: batch.outputCount }, (_, o) => {
        const s = summariseValues(outputValues(batch, o), this.coverageProbability, 1);
        return [s.mean, s.standardDeviation, s.symmetricInterval.low, s.symmetricInterval.high];
      }),
    );
  }

  /** Trials simulated so far. */
  get trials(): number {
    return this.perBatch.length * this.batchBlocks * TRIALS_PER_BLOCK;
  }

  /**
   * Whether the run is stable (7.9.4 f–i): h ≥ 2 and, for every output, twice the standard
   * deviation of the batch means, u, y_low and y_high are all ≤ δ of u(y) from all h·M values.
   */
  isStable(): boolean {
    const h = this.perBatch.length;
    if (h < 2) return false;
    const m = this.batchBlocks * TRIALS_PER_BLOCK;
    let stable = true;
    this.lastStabilisation = [];
    for (let o = 0; o < this.perBatch[0].length; o++) {
      const column = (k: number): number[] => this.perBatch.map((b) => b[o][k]);
      // u(y) of all h·M values, pooled from the batch means and deviations (exact, fixed order)
      const grand = column(0).reduce((a, b) => a + b, 0) / h;
      const squares = this.perBatch.reduce((a, b) => a + (m - 1) * b[o][1] ** 2 + m * (b[o][0] - grand) ** 2, 0);
      const u = Math.sqrt(squares / (h * m - 1));
      const s: Stabilisation = {
        twiceSdMean: 2 * sdOfMean(column(0)),
        twiceSdStandardUncertainty: 2 * sdOfMean(column(1)),
        twiceSdLow: 2 * sdOfMean(column(2)),
        twiceSdHigh: 2 * sdOfMean(column(3)),
        numericalTolerance: numericalTolerance(u, this.ndig),
      };
      const worst = Math.max(s.twiceSdMean, s.twiceSdStandardUncertainty, s.twiceSdLow, s.twiceSdHigh);
      if (worst > s.numericalTolerance) stable = false;
      this.lastStabilisation.push(s);
    }
    return stable;
  }

  /** Summaries from all h·M values (7.9.4 j). */
  result(stable: boolean): AdaptiveResult {
    if (this.chunks.length === 0) throw new Error('no batch has been added');
    // The batches are this run's own and are not read again once summarised
    const summary = summariseChunks(this.chunks, this.options.seed, this.coverageProbability, this.options.histogramBins ?? 40, true);
    return {
      ...summary,
      stable,
      batches: this.chunks.length,
      batchTrials: this.batchBlocks * TRIALS_PER_BLOCK,
      ndig: this.ndig,
      stabilisation: this.lastStabilisation,
    };
  }
}

/**
 * Adaptive Monte Carlo per JCGM 101:2008 7.9.4 in one thread: batches of M trials until the
 * results are stable to ndig significant digits of u(y), or maxTrials is reached (stable: false).
 * @param kernel the trial model
 * @param options seed, coverage probability, ndig, maxTrials
 * @throws if the options are invalid
 * @example runAdaptiveMonteCarlo(kernel, { seed: 1, ndig: 2 }).outputs[0].symmetricInterval
 */
export function runAdaptiveMonteCarlo(kernel: TrialKernel, options: AdaptiveOptions): AdaptiveResult {
  const run = new AdaptiveMonteCarlo(options);
  const maxTrials = options.maxTrials ?? 10_000_000;
  for (;;) {
    const batch = run.nextBatch();
    run.addBatch([simulateBlocks(kernel, options.seed, batch.totalTrials, batch.firstBlock, batch.blockCount)]);
    options.onBatch?.(run.trials);
    if (run.isStable()) return run.result(true);
    if (run.trials >= maxTrials) return run.result(false);
  }
}
