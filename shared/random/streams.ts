import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import type { JumpableRandomGenerator } from 'pure-rand/types/JumpableRandomGenerator';

/** Trials simulated from one block stream; chunks of work are whole ranges of blocks. */
export const TRIALS_PER_BLOCK = 1000;

/** A seeded generator that can be advanced by 2^64 draws at once. */
export type BlockGenerator = JumpableRandomGenerator;

function assertSeed(seed: number): void {
  if (!Number.isInteger(seed) || seed < 0 || seed > 0xffffffff) {
    throw new Error('seed must be an integer in [0, 2^32 − 1]');
  }
}

/**
 * Yields the generator of every block from `firstBlock` on. Block b's stream is the
 * xoroshiro128+ stream seeded with `seed` and jumped b times (2^64 draws per jump), so
 * streams never overlap and depend only on (seed, blockIndex), never on how work is chunked.
 * @param seed integer in [0, 2^32 − 1]
 * @param firstBlock index of the first block wanted (integer ≥ 0)
 * @throws if the seed or block index is not a valid integer
 * @example const streams = blockStreams(7, 3); const rngOfBlock3 = streams.next();
 */
export function blockStreams(seed: number, firstBlock: number): { next(): BlockGenerator } {
  assertSeed(seed);
  if (!Number.isInteger(firstBlock) || firstBlock < 0) throw new Error('block index must be an integer ≥ 0');
  const cursor = xoroshiro128plus(seed);
  for (let b = 0; b < firstBlock; b++) cursor.jump();
  return {
    next(): BlockGenerator {
      const current = cursor.clone();
      cursor.jump();
      return current;
    },
  };
}

/**
 * The generator of one block (see {@link blockStreams}).
 * @param seed integer in [0, 2^32 − 1]
 * @param blockIndex integer ≥ 0
 * @throws if either argument is invalid
 * @example const rng = blockStream(42, 0); rng.next();
 */
export function blockStream(seed: number, blockIndex: number): BlockGenerator {
  return blockStreams(seed, blockIndex).next();
}
