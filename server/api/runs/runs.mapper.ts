import type { AnalysisRun } from '../../entities/AnalysisRun.js';
import { isoTimeOrNull } from '../../common/iso-time.js';
import type { RunView } from '../../../shared/schemas/run-views.js';

export function toRunView(run: AnalysisRun, liveProgress?: number, currentHash?: string): RunView {
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
    current: currentHash === undefined ? undefined : run.inputsHash === currentHash,
    requestedBy: run.requestedBy ? { id: run.requestedBy.id, displayName: run.requestedBy.displayName } : undefined,
    createdAt: isoTimeOrNull(run.createdAt),
    startedAt: isoTimeOrNull(run.startedAt),
    finishedAt: isoTimeOrNull(run.finishedAt),
    durationMs: run.durationMs,
    result: run.result ?? undefined,
    inputs: run.inputs ?? undefined,
  };
}
