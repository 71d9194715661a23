import crypto from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import { marginInputsSchema, type MarginInputs, type MarginStudyRequest } from '../../../shared/schemas/margin.js';
import { recordAudit } from '../../common/audit.js';
import { ConflictError } from '../../common/errors.js';
import { assertCurrentVersion } from '../../common/save-version.js';
import { AnalysisRun } from '../../entities/AnalysisRun.js';
import { MarginInputsRecord } from '../../entities/MarginInputsRecord.js';
import type { Revision } from '../../entities/Revision.js';
import type { User } from '../../entities/User.js';
import { assertDraft, getRevision } from '../revisions/revisions.service.js';
import { contentHash } from '../runs/inputs-hash.js';
import type { RunScheduler } from '../runs/run-scheduler.js';
import { boardReadingErrors } from '../calibration/board-reading-errors.js';
import { DEFAULT_MARGIN_INPUTS } from './margin-defaults.js';
import type { MarginStudyData } from './margin-study.js';
import { assertBoardOfDesign } from './board-membership.js';

export interface StoredMarginInputs {
  inputs: MarginInputs;
  /** False while the revision uses the defaults (nothing saved yet). */
  stored: boolean;
  updatedAt: Date | null;
  updatedById: number | null;
  /** 0 while nothing is stored; up by one with every save. */
  version: number;
  updatedBy: User | null;
}

/** The revision's margin inputs, or the defaults when none are saved. */
export async function marginInputsOf(db: DataSource | EntityManager, revisionId: number): Promise<StoredMarginInputs> {
  const record = await db.getRepository(MarginInputsRecord).findOne({ where: { revisionId }, relations: { updatedBy: true } });
  if (!record) return { inputs: structuredClone(DEFAULT_MARGIN_INPUTS), stored: false, updatedAt: null, updatedById: null, version: 0, updatedBy: null };
  return { inputs: record.inputs, stored: true, updatedAt: record.updatedAt, updatedById: record.updatedById, version: record.version, updatedBy: record.updatedBy };
}

/** What a margin study depends on: the channels (their reading errors, the link divider) and the margin inputs. */
export const marginHash = (channels: { key: string; definition: unknown }[], inputs: MarginInputs) => {
  // The isolation margin is a review check on the isolator, not a study input: changing it leaves the study current.
  const { isolationMarginPct: _isolation, ...studied } = inputs;
  return contentHash({ channels: channels.map((c) => ({ key: c.key, definition: c.definition })), margin: studied });
};

/**
 * Saves a draft's margin inputs (validated again after defaults, so the stored form is complete), refusing a
 * save based on an older version; `baseVersion` is left out only by trusted callers (the demo seed).
 */
export async function saveMarginInputs(
  dataSource: DataSource, actor: User, revisionId: number, inputs: MarginInputs, baseVersion?: number,
): Promise<StoredMarginInputs> {
  await dataSource.transaction(async (m) => {
    const revision = await getRevision(m, revisionId);
    assertDraft(revision);
    const current = await marginInputsOf(m, revisionId);
    assertCurrentVersion('margin inputs', baseVersion, { version: current.version, savedBy: current.updatedBy, savedAt: current.updatedAt });
    const parsed = marginInputsSchema.parse(inputs);
    if (parsed.readingErrors.mode === 'board') {
      await assertBoardOfDesign(m, revision, parsed.readingErrors.boardId, [parsed.packChannelKey, parsed.linkChannelKey]);
    }
    const repo = m.getRepository(MarginInputsRecord);
    const changes = { inputs: parsed, updatedById: actor.id, updatedAt: new Date(), version: current.version + 1 };
    if (!current.stored) await repo.insert({ revisionId, ...changes });
    else {
      // Compare-and-set on the version read above, so two saves can never both build on it.
      const bumped = await repo.update({ revisionId, version: current.version }, changes);
      if (!bumped.affected) throw new ConflictError(`the margin inputs of revision ${revision.letter} changed while saving; reload them and save again`);
    }
    await recordAudit(m, actor.id, 'margin.inputs', `revision:${revisionId}`, null);
  });
  return marginInputsOf(dataSource, revisionId);
}

/** Copies margin inputs to a new revision started from another (called inside that transaction). */
export async function copyMarginInputs(m: EntityManager, fromRevisionId: number, toRevisionId: number): Promise<void> {
  const repo = m.getRepository(MarginInputsRecord);
  const from = await repo.findOneBy({ revisionId: fromRevisionId });
  if (from) await repo.save(repo.create({ revisionId: toRevisionId, inputs: from.inputs, updatedById: from.updatedById }));
}

function channelPair(revision: Revision, inputs: MarginInputs) {
  const find = (key: string, field: string) => {
    const channel = revision.channels.find((c) => c.key === key);
    if (!channel) {
      throw new ConflictError(`revision ${revision.letter} has no channel '${key}' for the margin study; set ${field} to one of ${revision.channels.map((c) => c.key).join(', ')}`,
        { [field]: `no channel '${key}'` });
    }
    return { id: channel.id, key: channel.key, definition: channel.definition };
  };
  return { pack: find(inputs.packChannelKey, 'packChannelKey'), link: find(inputs.linkChannelKey, 'linkChannelKey') };
}

async function boardErrors(dataSource: DataSource, revision: Revision, inputs: MarginInputs, packKey: string, linkKey: string): Promise<MarginStudyData['board']> {
  if (inputs.readingErrors.mode !== 'board') return undefined;
  const boardId = inputs.readingErrors.boardId;
  await assertBoardOfDesign(dataSource, revision, boardId, [packKey, linkKey]);
  const board = await boardReadingErrors(dataSource, boardId);
  const pack = board.channels[packKey];
  const link = board.channels[linkKey];
  if (!pack || !link) {
    throw new ConflictError(`board ${boardId} has no calibration for the ${!pack ? packKey : linkKey} channel`, { 'readingErrors.boardId': 'no calibration for this channel' });
  }
  const plain = (m: typeof pack) => (m.kind === 'sigma' ? m : { kind: 'samples' as const, gainErrorFraction: Array.from(m.gainErrorFraction), offsetErrorV: Array.from(m.offsetErrorV) });
  return { boardId, description: board.description, pack: plain(pack), link: plain(link) };
}

/** A snapshot of everything a margin study of the revision needs, and its content hash. */
export async function marginStudyData(
  dataSource: DataSource, revision: Revision, request: MarginStudyRequest & { seed: number },
): Promise<{ data: MarginStudyData; hash: string }> {
  const { inputs } = await marginInputsOf(dataSource, revision.id);
  const { pack, link } = channelPair(revision, inputs);
  const board = await boardErrors(dataSource, revision, inputs, pack.key, link.key);
  const data: MarginStudyData = {
    inputs, pack, link, ...(board ? { board } : {}),
    seed: request.seed, trials: request.trials, faultTrials: request.faultTrials, readingErrorTrials: request.readingErrorTrials,
  };
  return { data, hash: marginHash(revision.channels, inputs) };
}

/** Queues a margin study of the revision as it is now (any state: a lead may study a revision in review). */
export async function requestMarginStudy(
  dataSource: DataSource, scheduler: RunScheduler, actor: User, revisionId: number, body: MarginStudyRequest,
): Promise<AnalysisRun> {
  const revision = await getRevision(dataSource, revisionId);
  await scheduler.assertUnderLimit(actor.id);
  const seed = body.seed ?? crypto.randomInt(0, 2 ** 31 - 1);
  const { data, hash } = await marginStudyData(dataSource, revision, { ...body, seed });
  const run = await dataSource.transaction(async (m) => {
    const repo = m.getRepository(AnalysisRun);
    const saved = await repo.save(repo.create({
      revisionId, kind: 'margin', inputs: data as unknown as Record<string, unknown>, inputsHash: hash,
      seed, trials: body.trials, adaptiveDigits: null, state: 'queued', progress: 0, requestedById: actor.id,
    }));
    await recordAudit(m, actor.id, 'study.request', `revision:${revisionId}`, { run: saved.id, kind: 'margin' });
    return saved;
  });
  scheduler.enqueue(run.id);
  return run;
}

/** The newest finished run of a kind, with its result. */
export const latestDoneRun = (db: DataSource | EntityManager, revisionId: number, kind: 'uncertainty' | 'margin') =>
  db.getRepository(AnalysisRun).findOne({ where: { revisionId, kind, state: 'done' }, order: { id: 'DESC' }, relations: { requestedBy: true } });

/** The hash a run of this kind would have if started now: equal to a run's inputsHash when that run is current. */
export async function currentRunHash(db: DataSource | EntityManager, revision: Revision, kind: string): Promise<string> {
  if (kind === 'margin') return marginHash(revision.channels, (await marginInputsOf(db, revision.id)).inputs);
  return contentHash(revision.channels.map((c) => ({ key: c.key, definition: c.definition })));
}
