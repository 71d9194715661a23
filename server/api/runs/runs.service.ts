import crypto from 'node:crypto';
import type { DataSource } from 'typeorm';
import type { RunKind } from '../../../shared/schemas/runs.js';
import type { UncertaintyStudyRequest } from '../../../shared/schemas/runs.js';
import { recordAudit } from '../../common/audit.js';
import { ConflictError, ForbiddenError, NotFoundError } from '../../common/errors.js';
import { AnalysisRun } from '../../entities/AnalysisRun.js';
import type { User } from '../../entities/User.js';
import { getRevision } from '../revisions/revisions.service.js';
import { contentHash } from './inputs-hash.js';
import type { RunScheduler } from './run-scheduler.js';
import type { UncertaintyRunInputs } from '../../../shared/schemas/run-views.js';

/** The revision content a study depends on. */
export const channelsHash = (channels: { key: string; definition: unknown }[]) =>
  contentHash(channels.map((c) => ({ key: c.key, definition: c.definition })));

/**
 * Stores a queued uncertainty study of the revision's channels as they are now (a snapshot, so later
 * edits of the draft do not change what the run computes) and hands it to the scheduler.
 */
export async function requestUncertaintyStudy(
  dataSource: DataSource, scheduler: RunScheduler, actor: User, revisionId: number, body: UncertaintyStudyRequest,
): Promise<AnalysisRun> {
  const revision = await getRevision(dataSource, revisionId);
  await scheduler.assertUnderLimit(actor.id);
  const channels = revision.channels.map((c) => ({ id: c.id, key: c.key, definition: c.definition }));
  const inputs: UncertaintyRunInputs = { channels, coverageProbability: body.coverageProbability, gridPoints: body.gridPoints };
  const adaptive = body.trials === undefined;
  const run = await dataSource.transaction(async (m) => {
    const repo = m.getRepository(AnalysisRun);
    const saved = await repo.save(repo.create({
      revisionId, kind: 'uncertainty', inputs: inputs as unknown as Record<string, unknown>, inputsHash: channelsHash(channels),
      seed: body.seed ?? crypto.randomInt(0, 2 ** 31 - 1), trials: body.trials ?? null,
      adaptiveDigits: adaptive ? (body.significantDigits ?? 2) : null, state: 'queued', progress: 0, requestedById: actor.id,
    }));
    await recordAudit(m, actor.id, 'study.request', `revision:${revisionId}`, { run: saved.id, kind: 'uncertainty' });
    return saved;
  });
  scheduler.enqueue(run.id);
  // The answer names who started it, so the page can offer Cancel to that person at once.
  run.requestedBy = actor;
  return run;
}

export async function getRun(dataSource: DataSource, id: number): Promise<AnalysisRun> {
  const run = await dataSource.getRepository(AnalysisRun).findOne({ where: { id }, relations: { requestedBy: true } });
  if (!run) throw new NotFoundError(`no study run with id ${id}`);
  return run;
}

/** Runs of a revision, newest first, without their (large) results. */
export const listRuns = (dataSource: DataSource, revisionId: number, kind: RunKind) =>
  dataSource.getRepository(AnalysisRun).find({
    where: { revisionId, kind },
    relations: { requestedBy: true },
    order: { id: 'DESC' },
    select: { id: true, revisionId: true, kind: true, inputsHash: true, seed: true, trials: true, adaptiveDigits: true, state: true,
      progress: true, error: true, createdAt: true, startedAt: true, finishedAt: true, durationMs: true, requestedById: true,
      requestedBy: { id: true, displayName: true } },
    take: 50,
  });

/** Only the person who started a study, or an admin, may cancel it: a colleague's long run is not theirs to stop. */
export async function cancelRun(dataSource: DataSource, scheduler: RunScheduler, actor: User, id: number): Promise<void> {
  const run = await getRun(dataSource, id);
  if (run.requestedById !== actor.id && actor.role !== 'admin') {
    throw new ForbiddenError(`study ${id} was started by ${run.requestedBy.displayName}; only they or an admin may cancel it`);
  }
  if (!scheduler.cancel(id)) throw new ConflictError(`study ${id} is ${run.state}; only a queued or running study can be cancelled`);
  await recordAudit(dataSource.manager, actor.id, 'study.cancel', `revision:${run.revisionId}`, { run: id });
}
