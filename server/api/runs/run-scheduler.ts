import { setMaxListeners } from 'node:events';
import { In, type DataSource } from 'typeorm';
import type { QueryDeepPartialEntity } from 'typeorm/query-builder/QueryPartialEntity.js';
import type { ChannelDefinition } from '../../../shared/schemas/chain.js';
import { HttpError } from '../../common/errors.js';
import { AnalysisRun } from '../../entities/AnalysisRun.js';
import type { StudyPool } from '../../workers/study-pool.js';
import { firstNonFinite, nonFiniteReason } from './non-finite.js';
import type { MarginStudyData } from '../margin/margin-study.js';
import type { UncertaintyRunInputs } from '../../../shared/schemas/run-views.js';
import { blockCountFor, planChunks } from '../../../shared/propagation/blocks.js';
import { DEFAULT_GRID_POINTS, MAX_TRIALS } from '../../../shared/schemas/study-defaults.js';
import { assembleChannelStudy, type ChannelAnalytic, type ChannelStudy } from '../../../shared/propagation/channel-study.js';
import type { OutputSummary } from '../../../shared/propagation/summary.js';

/** Studies one person may have waiting or running at once. */
export const PER_USER_LIMIT = 2;
/** Runs started at once; each spreads its channels and their blocks of trials over the pool's threads. */
const CONCURRENT_RUNS = 2;
const PROGRESS_WRITE_MS = 1000;
/** Most bytes of trial values one study holds at once: the default grid's voltages of the largest run. */
const VALUES_BUDGET_BYTES = DEFAULT_GRID_POINTS * MAX_TRIALS * 8;


interface ActiveRun {
  controller: AbortController;
  progress: number;
}

/**
 * Queues studies and runs them in the worker pool. Progress is kept in memory for polling and written to
 * the database about once a second; the final state and result are always written.
 */
export class RunScheduler {
  private readonly queue: number[] = [];
  private readonly active = new Map<number, ActiveRun>();
  private closed = false;
  /** Most bytes of trial values one channel study holds at once (lowered by tests to force passes). */
  valuesBudgetBytes = VALUES_BUDGET_BYTES;
  /**
   * Shared arrays of valuesBudgetBytes, reused from study to study: a dropped one lingers until every
   * worker that saw it collects garbage, so fresh ones per study pile up. At most one per running study.
   */
  private readonly freeValues: SharedArrayBuffer[] = [];

  constructor(private readonly dataSource: DataSource, private readonly pool: StudyPool) {}

  /** Runs a previous process left unfinished can never finish: say so instead of leaving them "running". */
  async recover(): Promise<void> {
    await this.dataSource.getRepository(AnalysisRun).update(
      { state: In(['queued', 'running']) },
      { state: 'failed', error: 'the server stopped before this study finished; start it again', finishedAt: new Date() },
    );
  }

  async assertUnderLimit(userId: number): Promise<void> {
    const waiting = await this.dataSource.getRepository(AnalysisRun).countBy({ requestedById: userId, state: In(['queued', 'running']) });
    if (waiting >= PER_USER_LIMIT) {
      throw new HttpError(429, `you already have ${waiting} studies waiting or running; wait for one to finish or cancel it`);
    }
  }

  enqueue(runId: number): void {
    this.queue.push(runId);
    this.pump();
  }

  liveProgress(runId: number): number | undefined {
    return this.active.get(runId)?.progress;
  }

  /** Cancels a queued or running study; returns false when it was neither. */
  cancel(runId: number): boolean {
    const at = this.queue.indexOf(runId);
    if (at >= 0) {
      this.queue.splice(at, 1);
      void this.finish(runId, { state: 'cancelled', error: 'cancelled before it started' });
      return true;
    }
    const active = this.active.get(runId);
    if (!active) return false;
    active.controller.abort();
    return true;
  }

  /** Resolves when nothing is queued or running (used by tests and shutdown). */
  async idle(): Promise<void> {
    while (this.queue.length || this.active.size) await new Promise((r) => setTimeout(r, 20));
  }

  async close(): Promise<void> {
    this.closed = true;
    for (const a of this.active.values()) a.controller.abort();
    await this.idle();
  }

  private pump(): void {
    while (!this.closed && this.active.size < CONCURRENT_RUNS && this.queue.length) {
      const runId = this.queue.shift()!;
      const active: ActiveRun = { controller: new AbortController(), progress: 0 };
      this.active.set(runId, active);
      this.execute(runId, active)
        .catch((err) => console.error(`[runs] run ${runId} could not be recorded`, err))
        .finally(() => {
          this.active.delete(runId);
          this.pump();
        });
    }
  }

  private async execute(runId: number, active: ActiveRun): Promise<void> {
    const repo = this.dataSource.getRepository(AnalysisRun);
    const run = await repo.findOneBy({ id: runId });
    if (!run || run.state !== 'queued') return;
    const startedAt = new Date();
    await repo.update({ id: runId }, { state: 'running', startedAt });
    let lastWrite = Date.now();
    const setProgress = (p: number) => {
      active.progress = p;
      if (Date.now() - lastWrite > PROGRESS_WRITE_MS) {
        lastWrite = Date.now();
        void repo.update({ id: runId, state: 'running' }, { progress: active.progress });
      }
    };
    try {
      const result = run.kind === 'margin'
        ? await this.marginStudy(run, active, setProgress)
        : await this.uncertaintyStudy(run, active, setProgress);
      const nonFinite = firstNonFinite(result);
      if (nonFinite) throw new Error(nonFiniteReason(nonFinite));
      await this.finish(runId, { state: 'done', result: result as QueryDeepPartialEntity<AnalysisRun>['result'], progress: 1 }, startedAt);
    } catch (err) {
      const cancelled = active.controller.signal.aborted;
      await this.finish(runId, cancelled
        ? { state: 'cancelled', error: this.closed ? 'the server stopped while this study ran' : 'cancelled while running' }
        : { state: 'failed', error: failureReason(err) }, startedAt);
    }
  }

  private async uncertaintyStudy(run: AnalysisRun, active: ActiveRun, setProgress: (p: number) => void) {
    const inputs = run.inputs as unknown as UncertaintyRunInputs;
    const perChannel = inputs.channels.map(() => 0);
    const onProgress = (i: number) => (p: number) => {
      perChannel[i] = p;
      setProgress(perChannel.reduce((a, b) => a + b, 0) / perChannel.length);
    };
    const signal = active.controller.signal;
    const trials = run.trials;
    let studies: ChannelStudy[];
    if (trials === null || trials === undefined) {
      // The adaptive procedure decides batch by batch, so each channel runs in one thread
      studies = await Promise.all(inputs.channels.map((c, i) =>
        this.pool.run<ChannelStudy>(
          {
            kind: 'channel-uncertainty', channel: c.definition, seed: run.seed, ndig: run.adaptiveDigits ?? undefined,
            coverageProbability: inputs.coverageProbability, gridPoints: inputs.gridPoints,
          },
          { onProgress: onProgress(i), signal },
        ),
      ));
    } else {
      // One channel at a time over every thread: only one channel's values are held at once
      studies = [];
      for (let i = 0; i < inputs.channels.length; i++) {
        studies.push(await this.pooledChannelStudy(inputs.channels[i].definition, run.seed, trials, run.adaptiveDigits, inputs, onProgress(i), signal));
      }
    }
    return { channels: inputs.channels.map((c, i) => ({ key: c.key, name: c.definition.name, study: studies[i] })) };
  }

  /**
   * A fixed-size channel study split over the pool: the run's blocks of trials are simulated in several
   * chunks straight into one shared array (each block seeded from (seed, block), so the values do not depend
   * on the split), then each voltage is summarised in its own task, while one task computes GUM and worst
   * case. Equal, value for value, to channelStudy in one thread. Past valuesBudgetBytes the voltages are
   * taken in groups, the same trials simulated again for each group.
   */
  private async pooledChannelStudy(
    channel: ChannelDefinition, seed: number, trials: number, ndig: number | null, inputs: UncertaintyRunInputs,
    onProgress: (p: number) => void, signal: AbortSignal,
  ): Promise<ChannelStudy> {
    const { gridPoints, coverageProbability } = inputs;
    // Every queued task of the study listens for its cancel: a 41-voltage study has over 41 at once
    setMaxListeners(gridPoints + this.pool.threads * 3 + 10, signal);
    const analytic = this.pool.run<ChannelAnalytic>({ kind: 'channel-analytic', channel, gridPoints, coverageProbability }, { signal });
    // Settled now so a failure while the blocks run is not reported as unhandled
    analytic.catch(() => undefined);
    const totalBlocks = blockCountFor(trials);
    // A few chunks per thread, so a thread busy with the analytic task does not hold up the rest
    const ranges = planChunks(totalBlocks, this.pool.threads * 3);
    // Memory stays bounded: a run too large to hold whole is simulated once per group of voltages
    const perPass = Math.max(1, Math.min(gridPoints, Math.floor(this.valuesBudgetBytes / (trials * 8))));
    const passes = Math.ceil(gridPoints / perPass);
    const outputs: OutputSummary[] = [];
    for (let pass = 0; pass < passes; pass++) {
      const firstOutput = pass * perPass;
      const outputCount = Math.min(perPass, gridPoints - firstOutput);
      const needed = trials * outputCount * 8;
      const free = this.freeValues.pop();
      const values = free && free.byteLength >= needed ? free : new SharedArrayBuffer(Math.max(this.valuesBudgetBytes, needed));
      const done = ranges.map(() => 0);
      await Promise.all(ranges.map((range, r) => this.pool.run(
        { kind: 'channel-blocks', channel, gridPoints, seed, totalTrials: trials, ...range, firstOutput, outputCount, values },
        {
          signal,
          onProgress: (p) => {
            done[r] = p * range.blockCount;
            onProgress(0.95 * (pass + done.reduce((a, b) => a + b, 0) / totalBlocks) / passes);
          },
        },
      )));
      outputs.push(...(await Promise.all(Array.from({ length: outputCount }, (_, o) =>
        this.pool.run<OutputSummary[]>({ kind: 'channel-summary', values, totalTrials: trials, outputs: [o], coverageProbability }, { signal }),
      ))).flat());
      // Handed on only after every task on it has finished: after a failure or cancel one may still be writing
      if (values.byteLength === this.valuesBudgetBytes) this.freeValues.push(values);
    }
    onProgress(1);
    return assembleChannelStudy(await analytic, { trials, stable: true, outputs, stabilisation: [] }, {
      seed, coverageProbability, ndig: ndig ?? 2, adaptive: false,
    });
  }

  /** One worker runs the whole margin study; its inputs snapshot holds everything it needs. */
  private async marginStudy(run: AnalysisRun, active: ActiveRun, setProgress: (p: number) => void): Promise<Record<string, unknown>> {
    const data = run.inputs as unknown as MarginStudyData;
    return this.pool.run({ kind: 'margin', data }, { onProgress: setProgress, signal: active.controller.signal });
  }

  private async finish(runId: number, patch: QueryDeepPartialEntity<AnalysisRun>, startedAt?: Date): Promise<void> {
    const finishedAt = new Date();
    await this.dataSource.getRepository(AnalysisRun).update({ id: runId }, {
      ...patch, finishedAt, durationMs: startedAt ? finishedAt.getTime() - startedAt.getTime() : null,
    });
  }
}

/** A worker's error message is the engine's own ("gate time must be > 0 s"); a dead worker gets a plain one. */
function failureReason(err: unknown): string {
  const message = err instanceof Error ? err.message : String(err);
  if (/worker (exited|terminated)|exit code/i.test(message)) return `the study's worker stopped unexpectedly (${message})`;
  return message.slice(0, 500);
}
