// Worker tasks for the benchmark pool: each simulates one chunk (a range of blocks).
import { simulateChannelChunk, type TrialChunk } from '../../shared/propagation/index.js';
import { simulatePrechargeChunk, type PrechargeDesign } from '../../shared/precharge/index.js';
import type { ChannelDefinition } from '../../shared/schemas/chain.js';

export interface ChunkTask {
  firstBlock: number;
  blockCount: number;
  seed: number;
  totalTrials: number;
}

export function channelChunk(task: ChunkTask & { channel: ChannelDefinition; gridPoints: number }): TrialChunk {
  return simulateChannelChunk(task.channel, task.gridPoints, task.seed, task.totalTrials, task.firstBlock, task.blockCount);
}

export function prechargeChunk(task: ChunkTask & { design: PrechargeDesign }): TrialChunk {
  return simulatePrechargeChunk(task.design, task.seed, task.totalTrials, task.firstBlock, task.blockCount);
}
