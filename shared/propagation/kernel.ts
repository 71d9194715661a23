import type { VariateSource } from '../random/variates.js';

/**
 * A model that simulates trials in bulk. `simulate` writes output o of trial t to
 * `out[o * stride + offset + t]` for t < trials, drawing only from `source`, so a block's
 * values depend on nothing but its stream.
 */
export interface TrialKernel {
  /** Number of outputs each trial produces (e.g. evaluation voltages). */
  readonly outputCount: number;
  simulate(source: VariateSource, trials: number, out: Float64Array, stride: number, offset: number): void;
}

/** Values of a contiguous range of blocks, output-major: output o, trial t at o·trials + t. */
export interface TrialChunk {
  firstBlock: number;
  blockCount: number;
  trials: number;
  outputCount: number;
  values: Float64Array;
}
