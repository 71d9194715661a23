import { describe, it, expect } from 'vitest';
import { compileChannel } from '../../../shared/chain/index.js';
import {
  blockCountFor, channelKernel, mergeChunks, planChunks, simulateBlocks, simulateChannelChunk, summariseChunks,
} from '../../../shared/propagation/index.js';
import { deepFreeze } from '../../fixtures/deep-freeze.js';
import { demoChannel } from '../../fixtures/demo-channel.js';

const channel = deepFreeze(demoChannel());
const trials = 5_500; // 6 blocks, the last one partial
const kernel = channelKernel(compileChannel(channel, 5));

describe('seeded Monte Carlo reproducibility', () => {
  it('gives identical per-trial errors for the same seed', () => {
    const a = simulateBlocks(kernel, 21, trials, 0, blockCountFor(trials));
    const b = simulateBlocks(channelKernel(compileChannel(channel, 5)), 21, trials, 0, blockCountFor(trials));
    expect(b.values).toEqual(a.values);
  });

  it('gives identical results whatever the chunking, merged in any order', () => {
    const whole = simulateBlocks(kernel, 21, trials, 0, blockCountFor(trials));
    for (const chunkCount of [2, 3, 6]) {
      const chunks = planChunks(blockCountFor(trials), chunkCount).map((r) => simulateChannelChunk(channel, 5, 21, trials, r.firstBlock, r.blockCount));
      const merged = mergeChunks([...chunks].reverse());
      expect(merged.values).toEqual(whole.values);
      expect(summariseChunks(chunks, 21)).toEqual(summariseChunks([whole], 21));
    }
  });

  it('gives different results for a different seed', () => {
    const a = simulateBlocks(kernel, 21, trials, 0, blockCountFor(trials));
    const b = simulateBlocks(kernel, 22, trials, 0, blockCountFor(trials));
    expect(b.values).not.toEqual(a.values);
    expect(summariseChunks([b], 22).outputs[4].standardDeviation).not.toBe(summariseChunks([a], 21).outputs[4].standardDeviation);
  });

  it('refuses chunks that overlap or leave a gap, and blocks beyond the run', () => {
    const first = simulateBlocks(kernel, 1, trials, 0, 2);
    const third = simulateBlocks(kernel, 1, trials, 3, 1);
    expect(() => mergeChunks([first, third])).toThrow('chunks overlap or leave a gap');
    expect(() => mergeChunks([])).toThrow('chunks must not be empty');
    expect(() => simulateBlocks(kernel, 1, trials, 5, 2)).toThrow('lie beyond');
  });
});
