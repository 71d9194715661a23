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

export type StudyTask = ChannelStudyTask | MarginStudyTask | FaultTask;
