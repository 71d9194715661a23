import type { MessagePort } from 'node:worker_threads';
import type { ChannelDefinition } from '../../shared/schemas/chain.js';
import type { MarginStudyData } from '../api/margin/margin-study.js';

/** The adaptive procedure stops (unstable) at this many trials on the server. */
export const ADAPTIVE_MAX_TRIALS = 1_000_000;

/** What the pool is asked to do: one channel's uncertainty study (plain data, structured-cloned). */
export interface ChannelStudyTask {
  kind: 'channel-uncertainty';
  channel: ChannelDefinition;
  seed: number;
  trials?: number;
  ndig?: number;
  coverageProbability: number;
  gridPoints: number;
  /** Progress messages `{ progress: 0…1 }` go here. */
  port?: MessagePort;
}

/**
 * Blocks [firstBlock, firstBlock + blockCount) of a channel's fixed-size run, written into the run's
 * shared output-major array, so threads split one channel with no merge copy.
 */
export interface ChannelBlocksTask {
  kind: 'channel-blocks';
  channel: ChannelDefinition;
  gridPoints: number;
  seed: number;
  totalTrials: number;
  firstBlock: number;
  blockCount: number;
  /** Outputs kept in `values`: [firstOutput, firstOutput + outputCount). */
  firstOutput: number;
  outputCount: number;
  values: SharedArrayBuffer;
  port?: MessagePort;
}

/** Summary of some outputs of a simulated run held in a shared array (sorted where they lie). */
export interface ChannelSummaryTask {
  kind: 'channel-summary';
  values: SharedArrayBuffer;
  totalTrials: number;
  outputs: number[];
  coverageProbability: number;
}

/** GUM, worst case and counter overflow of a channel, computed while other threads simulate. */
export interface ChannelAnalyticTask {
  kind: 'channel-analytic';
  channel: ChannelDefinition;
  gridPoints: number;
  coverageProbability: number;
}

/** One revision's margin study (the pre-charge Monte Carlo with its fault cases), in one thread. */
export interface MarginStudyTask {
  kind: 'margin';
  data: MarginStudyData;
  port?: MessagePort;
}

/** A task that fails on purpose, for the fault tests: throws, or ends the worker thread. */
export interface FaultTask {
  kind: 'fault';
  mode: 'throw' | 'exit';
}

/** Does nothing: run once per thread at start so each thread has loaded the engine before a study. */
export interface WarmTask {
  kind: 'warm';
}

export type StudyTask = ChannelStudyTask | ChannelBlocksTask | ChannelSummaryTask | ChannelAnalyticTask | MarginStudyTask | FaultTask | WarmTask;
