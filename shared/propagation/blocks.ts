import { TRIALS_PER_BLOCK } from '../random/streams.js';

/** A contiguous range of blocks handed to one worker. */
export interface BlockRange {
  firstBlock: number;
  blockCount: number;
}

/**
 * Number of blocks that hold `trials` trials (the last one may be partial).
 * @param trials total trials, integer ≥ 1
 * @throws if trials is not an integer ≥ 1
 * @example blockCountFor(2500) // 3
 */
export function blockCountFor(trials: number): number {
  if (!Number.isInteger(trials) || trials < 1) throw new Error('trials must be an integer ≥ 1');
  return Math.ceil(trials / TRIALS_PER_BLOCK);
}

/**
 * Trials simulated in block `blockIndex` of a run of `totalTrials` trials.
 * @param blockIndex block index, integer ≥ 0
 * @param totalTrials trials in the whole run, integer ≥ 1
 * @throws if the block lies beyond the run
 * @example trialsInBlock(2, 2500) // 500
 */
export function trialsInBlock(blockIndex: number, totalTrials: number): number {
  const trials = Math.min(TRIALS_PER_BLOCK, totalTrials - blockIndex * TRIALS_PER_BLOCK);
  if (!(trials > 0)) throw new Error(`block ${blockIndex} lies beyond ${totalTrials} trials`);
  return trials;
}

/**
 * Splits the blocks of a run into at most `chunkCount` near-equal contiguous ranges.
 * The split changes only who computes what, never the values.
 * @param totalBlocks blocks in the run, integer ≥ 1
 * @param chunkCount wanted number of chunks, integer ≥ 1
 * @param firstBlock index of the run's first block (default 0)
 * @throws if a count is not an integer ≥ 1
 * @example planChunks(10, 3) // [{0,4},{4,3},{7,3}]
 */
export function planChunks(totalBlocks: number, chunkCount: number, firstBlock = 0): BlockRange[] {
  if (!Number.isInteger(totalBlocks) || totalBlocks < 1) throw new Error('block count must be an integer ≥ 1');
  if (!Number.isInteger(chunkCount) || chunkCount < 1) throw new Error('chunk count must be an integer ≥ 1');
  const chunks = Math.min(chunkCount, totalBlocks);
  const ranges: BlockRange[] = [];
  let next = firstBlock;
  for (let i = 0; i < chunks; i++) {
    const blockCount = Math.floor(totalBlocks / chunks) + (i < totalBlocks % chunks ? 1 : 0);
    ranges.push({ firstBlock: next, blockCount });
    next += blockCount;
  }
  return ranges;
}
