import type { ChannelStudy } from '../propagation/channel-study.js';
import type { ChannelDefinition } from './chain.js';
import type { PersonRef } from './design-views.js';
import type { MarginInputs, MarginStudyResult } from './margin.js';
import type { RunState } from './runs.js';

/** What the server returns about study runs; one definition for the server and the client. */

/** What a finished uncertainty study holds: one engine study per channel. */
export interface StudyResult {
  channels: { key: string; name: string; study: ChannelStudy }[];
}

export interface RunView<Result = unknown> {
  id: number;
  revisionId: number;
  kind: 'uncertainty' | 'margin';
  state: RunState;
  progress: number;
  seed: number;
  trials: number | null;
  adaptiveDigits: number | null;
  error: string | null;
  /** Whether the run used the revision's content as it is now; absent where the server did not check. */
  current?: boolean;
  requestedBy?: PersonRef;
  createdAt: string | null;
  startedAt: string | null;
  finishedAt: string | null;
  durationMs: number | null;
  result?: Result;
  /** The study's own inputs where it has them (a margin study's criteria). */
  inputs?: unknown;
}

/** What an uncertainty study was asked to compute: the revision's channels as they were, and its settings. */
export interface UncertaintyRunInputs {
  /** `id` is the revision's channel id (kept across saves); runs stored before ids were kept stable lack it. */
  channels: { id?: number; key: string; definition: ChannelDefinition }[];
  coverageProbability: number;
  gridPoints: number;
}

/** An uncertainty study run. */
export type Run = Omit<RunView<StudyResult>, 'inputs'> & { inputs?: UncertaintyRunInputs };

/** A margin study run: the shared run fields with the margin result once done. */
export type MarginRun = Omit<RunView<MarginStudyResult>, 'kind'> & { kind: 'margin' };

export interface MarginInputsView {
  inputs: MarginInputs;
  /** False while the revision still uses the defaults. */
  stored: boolean;
  /** Only a draft's inputs may change. */
  editable: boolean;
  updatedAt: string | null;
  updatedById: number | null;
  /** 0 while nothing is stored; up by one with every save. A save names the version it was based on. */
  version: number;
  updatedBy: PersonRef | null;
}
