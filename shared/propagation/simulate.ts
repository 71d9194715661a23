import { TRIALS_PER_BLOCK, blockStreams } from '../random/streams.js';
import { VariateSource } from '../random/variates.js';
import type { TrialChunk, TrialKernel } from './kernel.js';
import { blockCountFor } from './blocks.js';

/**
 * Simulates blocks [firstBlock, firstBlock + blockCount) of a run of `totalTrials` trials.
 * Block b always draws from stream (seed, b) and starts a fresh VariateSource, so any chunking
 * of the same run gives the same per-trial values (JCGM 101:2008 7.2 reproducible generator).
 * @param kernel the trial model
 * @param seed integer in [0, 2^32 − 1]
 * @param totalTrials trials in the whole run (the last block may be partial)
 * @param firstBlock first block of this chunk, integer ≥ 0
 * @param blockCount blocks in this chunk, integer ≥ 1
 * @param onProgress optional callback after each block: (blocks done, blocks in chunk)
 * @throws if the range lies outside the run
 * @example simulateBlocks(kernel, 1, 50_000, 0, 25)
 */
export function simulateBlocks(
  kernel: TrialKernel,
  seed: number,
  totalTrials: number,
  firstBlock: number,
  blockCount: number,
  onProgress?: (blocksDone: number, blockCount: number) => void,
): TrialChunk {
  const trials = chunkTrials(totalTrials, firstBlock, blockCount);
  const values = new Float64Array(trials * kernel.outputCount);
  writeBlocks(kernel, seed, firstBlock, blockCount, trials, values, trials, 0, onProgress);
  return { firstBlock, blockCount, trials, outputCount: kernel.outputCount, values };
}

/**
 * Simulates blocks [firstBlock, firstBlock + blockCount) straight into the output-major array of the
 * whole run (output o, trial t at o·totalTrials + t), so threads sharing one buffer fill disjoint parts
 * of it and no merge copy is needed. The values equal those of {@link simulateBlocks} for any split.
 * @param kernel the trial model
 * @param seed integer in [0, 2^32 − 1]
 * @param totalTrials trials in the whole run
 * @param firstBlock first block to simulate, integer ≥ 0
 * @param blockCount blocks to simulate, integer ≥ 1
 * @param values the run's array, outputs.count × totalTrials entries (e.g. over a SharedArrayBuffer)
 * @param onProgress optional callback after each block: (blocks done, blocks in this call)
 * @param outputs keep only outputs [first, first + count) (default all): a run too large to hold whole
 *   is simulated once per group of outputs, each pass drawing the same trials
 * @throws if the range lies outside the run, the outputs outside the kernel's, or the array has the wrong length
 * @example simulateBlocksInto(kernel, 1, 50_000, 25, 25, new Float64Array(11 * 50_000))
 */
export function simulateBlocksInto(
  kernel: TrialKernel,
  seed: number,
  totalTrials: number,
  firstBlock: number,
  blockCount: number,
  values: Float64Array,
  onProgress?: (blocksDone: number, blockCount: number) => void,
  outputs: { first: number; count: number } = { first: 0, count: kernel.outputCount },
): void {
  const trials = chunkTrials(totalTrials, firstBlock, blockCount);
  const { first, count } = outputs;
  if (!Number.isInteger(first) || !Number.isInteger(count) || first < 0 || count < 1 || first + count > kernel.outputCount) {
    throw new Error(`outputs must lie within the kernel's ${kernel.outputCount}`);
  }
  if (values.length !== totalTrials * count) throw new Error(`values must hold ${totalTrials * count} entries`);
  const start = firstBlock * TRIALS_PER_BLOCK;
  if (count === kernel.outputCount) {
    writeBlocks(kernel, seed, firstBlock, blockCount, trials, values, totalTrials, start, onProgress);
    return;
  }
  // One block at a time into a small array, keeping the wanted outputs
  const block = new Float64Array(TRIALS_PER_BLOCK * kernel.outputCount);
  const streams = blockStreams(seed, firstBlock);
  for (let b = 0; b < blockCount; b++) {
    const offset = b * TRIALS_PER_BLOCK;
    const blockTrials = Math.min(TRIALS_PER_BLOCK, trials - offset);
    kernel.simulate(new VariateSource(streams.next()), blockTrials, block, blockTrials, 0);
    for (let o = 0; o < count; o++) {
      values.set(block.subarray((first + o) * blockTrials, (first + o + 1) * blockTrials), o * totalTrials + start + offset);
    }
    onProgress?.(b + 1, blockCount);
  }
}

function chunkTrials(totalTrials: number, firstBlock: number, blockCount: number): number {
  if (!Number.isInteger(blockCount) || blockCount < 1) throw new Error('block count must be an integer ≥ 1');
  if (!Number.isInteger(firstBlock) || firstBlock < 0 || firstBlock + blockCount > blockCountFor(totalTrials)) {
    throw new Error(`blocks ${firstBlock}…${firstBlock + blockCount - 1} lie beyond ${totalTrials} trials`);
  }
  return Math.min(totalTrials, (firstBlock + blockCount) * TRIALS_PER_BLOCK) - firstBlock * TRIALS_PER_BLOCK;
}

function writeBlocks(
  kernel: TrialKernel, seed: number, firstBlock: number, blockCount: number, trials: number,
  values: Float64Array, stride: number, start: number, onProgress?: (blocksDone: number, blockCount: number) => void,
): void {
  const streams = blockStreams(seed, firstBlock);
  for (let b = 0; b < blockCount; b++) {
    const offset = b * TRIALS_PER_BLOCK;
    const blockTrials = Math.min(TRIALS_PER_BLOCK, trials - offset);
    kernel.simulate(new VariateSource(streams.next()), blockTrials, values, stride, start + offset);
    onProgress?.(b + 1, blockCount);
  }
}

/**
 * Joins chunks of one run into one output-major array in block order, whatever order the
 * chunks arrive in; exact (values are copied, not re-accumulated).
 * @param chunks chunks covering a contiguous range of blocks, any order
 * @throws if the chunks are empty, overlap, leave a gap or disagree on the output count
 * @example mergeChunks([chunkB, chunkA]).values
 */
export function mergeChunks(chunks: readonly TrialChunk[]): TrialChunk {
  if (chunks.length === 0) throw new Error('chunks must not be empty');
  const ordered = [...chunks].sort((a, b) => a.firstBlock - b.firstBlock);
  const outputCount = ordered[0].outputCount;
  let trials = 0;
  for (let i = 0; i < ordered.length; i++) {
    const chunk = ordered[i];
    if (chunk.outputCount !== outputCount) throw new Error('chunks disagree on the output count');
    if (i > 0 && chunk.firstBlock !== ordered[i - 1].firstBlock + ordered[i - 1].blockCount) {
      throw new Error('chunks overlap or leave a gap');
    }
    trials += chunk.trials;
  }
  const values = new Float64Array(trials * outputCount);
  let at = 0;
  for (const chunk of ordered) {
    for (let o = 0; o < outputCount; o++) {
      values.set(chunk.values.subarray(o * chunk.trials, (o + 1) * chunk.trials), o * trials + at);
    }
    at += chunk.trials;
  }
  const blockCount = ordered.reduce((n, c) => n + c.blockCount, 0);
  return { firstBlock: ordered[0].firstBlock, blockCount, trials, outputCount, values };
}

/**
 * The values of one output of a chunk (a view, not a copy).
 * @param chunk simulated chunk
 * @param output output index, 0 ≤ output < chunk.outputCount
 * @throws if the output index is out of range
 * @example outputValues(merged, 3)
 */
export function outputValues(chunk: TrialChunk, output: number): Float64Array {
  if (!Number.isInteger(output) || output < 0 || output >= chunk.outputCount) throw new Error('output index out of range');
  return chunk.values.subarray(output * chunk.trials, (output + 1) * chunk.trials);
}
