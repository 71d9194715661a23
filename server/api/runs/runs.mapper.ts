import type { AnalysisRun } from '../../entities/AnalysisRun.js';

const iso = (d: Date | string | null) => (d ? new Date(d).toISOString() : null);

export function toRunView(run: AnalysisRun, liveProgress?: number, currentHash?: string) {
  return {
    id: run.id,
    revisionId: run.revisionId,
    kind: run.kind,
    state: run.state,
    progress: liveProgress ?? run.progress,
    seed: run.seed,
    trials: run.trials,
    adaptiveDigits: run.adaptiveDigits,
    error: run.error,
    /** Whether the run used the revision's content as it is now. */
    current: currentHash === undefined ? undefined : run.inputsHash === currentHash,
    requestedBy: run.requestedBy ? { id: run.requestedBy.id, displayName: run.requestedBy.displayName } : undefined,
    createdAt: iso(run.createdAt),
    startedAt: iso(run.startedAt),
    finishedAt: iso(run.finishedAt),
    durationMs: run.durationMs,
    result: run.result ?? undefined,
    inputs: run.inputs ?? undefined,
  };
}
