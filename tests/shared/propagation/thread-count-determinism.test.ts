import { describe, expect, it } from 'vitest';
import { compileChannel } from '../../../shared/chain/index.js';
import {
  assembleChannelStudy, blockCountFor, channelAnalytic, channelKernel, channelStudy, planChunks, simulateBlocks, simulateBlocksInto,
  summariseChunks,
} from '../../../shared/propagation/index.js';
import { summariseValues } from '../../../shared/propagation/summary.js';
import { deepFreeze } from '../../fixtures/deep-freeze.js';
import { demoChannel } from '../../fixtures/demo-channel.js';

const channel = deepFreeze(demoChannel());
const trials = 7_300; // 8 blocks, the last one partial
const gridPoints = 4;
const seed = 15;

/** The pooled path as the server runs it: chunks of blocks into one shared array, one summary per voltage. */
function pooledStudy(chunkCount: number, order: 'forward' | 'reverse') {
  const values = new Float64Array(new SharedArrayBuffer(trials * gridPoints * 8));
  const ranges = planChunks(blockCountFor(trials), chunkCount);
  for (const range of order === 'forward' ? ranges : [...ranges].reverse()) {
    simulateBlocksInto(channelKernel(compileChannel(channel, gridPoints)), seed, trials, range.firstBlock, range.blockCount, values);
  }
  const outputs = Array.from({ length: gridPoints }, (_, o) =>
    summariseValues(new Float64Array(values.buffer, o * trials * 8, trials), 0.95, 40, true));
  return assembleChannelStudy(channelAnalytic(channel, gridPoints, 0.95), { trials, stable: true, outputs, stabilisation: [] }, {
    seed, coverageProbability: 0.95, ndig: 2, adaptive: false,
  });
}

describe('a study split over threads', () => {
  it('gives the one-thread study exactly, whatever the number of chunks and the order they finish in', () => {
    const oneThread = JSON.stringify(channelStudy(channel, { seed, trials, gridPoints }));
    for (const chunkCount of [1, 2, 3, 8]) {
      for (const order of ['forward', 'reverse'] as const) {
        expect(JSON.stringify(pooledStudy(chunkCount, order))).toBe(oneThread); // same seed, same result: JCGM 101:2008 7.2 reproducible generator
      }
    }
  });

  it('writes the same per-trial values into the shared array as a whole-run chunk holds', () => {
    const whole = simulateBlocks(channelKernel(compileChannel(channel, gridPoints)), seed, trials, 0, blockCountFor(trials));
    const shared = new Float64Array(trials * gridPoints);
    for (const range of planChunks(blockCountFor(trials), 3)) {
      simulateBlocksInto(channelKernel(compileChannel(channel, gridPoints)), seed, trials, range.firstBlock, range.blockCount, shared);
    }
    expect(shared).toEqual(whole.values); // blocks seeded from (seed, block index) alone (in this test)
  });

  it('keeps the same values when the voltages are simulated in groups, one pass per group', () => {
    const whole = simulateBlocks(channelKernel(compileChannel(channel, gridPoints)), seed, trials, 0, blockCountFor(trials));
    for (const [first, count] of [[0, 1], [1, 2], [3, 1], [0, 3]]) {
      const group = new Float64Array(trials * count);
      for (const range of planChunks(blockCountFor(trials), 3)) {
        simulateBlocksInto(channelKernel(compileChannel(channel, gridPoints)), seed, trials, range.firstBlock, range.blockCount, group, undefined, { first, count });
      }
      expect(group).toEqual(whole.values.subarray(first * trials, (first + count) * trials)); // each pass draws the same trials (in this test)
    }
    const kernel = channelKernel(compileChannel(channel, gridPoints));
    expect(() => simulateBlocksInto(kernel, seed, trials, 0, 1, new Float64Array(trials), undefined, { first: 4, count: 1 })).toThrow(/outputs must lie/);
  });

  it('summarises the same whether the values are sorted where they lie or copied first', () => {
    const chunk = simulateBlocks(channelKernel(compileChannel(channel, gridPoints)), seed, trials, 0, blockCountFor(trials));
    const copied = summariseChunks([chunk], seed);
    const before = Float64Array.from(chunk.values);
    expect(chunk.values).toEqual(before); // summariseChunks without consume leaves the chunk alone (in this test)
    expect(summariseChunks([chunk], seed, 0.95, 40, true)).toEqual(copied); // in-place sort gives the same summary (in this test)
  });

  it('refuses an array of the wrong length and blocks beyond the run', () => {
    const kernel = channelKernel(compileChannel(channel, gridPoints));
    expect(() => simulateBlocksInto(kernel, seed, trials, 0, 1, new Float64Array(trials))).toThrow(/values must hold/);
    expect(() => simulateBlocksInto(kernel, seed, trials, 7, 2, new Float64Array(trials * gridPoints))).toThrow(/lie beyond/);
  });
});
