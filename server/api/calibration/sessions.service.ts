import type { DataSource, EntityManager } from 'typeorm';
import type { CalibrationPointBody, SessionCreateBody, SessionPatchBody } from '../../../shared/schemas/calibration.js';
import { MAX_POINTS_PER_SESSION, pointsLimitMessage } from '../../../shared/schemas/calibration.js';
import type { ChannelDefinition } from '../../../shared/schemas/chain.js';
import { recordAudit } from '../../common/audit.js';
import { BadRequestError, ConflictError, NotFoundError } from '../../common/errors.js';
import { assertCurrentVersion } from '../../common/save-version.js';
import type { Mailer } from '../../common/mail.js';
import { Board } from '../../entities/Board.js';
import { CalibrationPoint } from '../../entities/CalibrationPoint.js';
import { CalibrationSession } from '../../entities/CalibrationSession.js';
import { Channel } from '../../entities/Channel.js';
import type { User } from '../../entities/User.js';
import { sessionCompleteMessage } from './calibration.mail.js';
import { compareBoard } from './design-spread.js';
import { fitSession } from './session-fit.js';
import { freezeRecord } from './calibration-records.js';

/** Fewest points a straight-line calibration with uncertainty can stand on. */
export const MIN_POINTS_TO_COMPLETE = 3;

export async function getSession(db: DataSource | EntityManager, id: number): Promise<CalibrationSession> {
  const session = await db.getRepository(CalibrationSession).findOne({
    where: { id },
    relations: { board: { revision: { design: { owner: true } } }, tester: true, points: true, pointsSavedBy: true },
  });
  if (!session) throw new NotFoundError(`no calibration session with id ${id}`);
  session.points.sort((a, b) => a.position - b.position);
  return session;
}

/** The channel of the board's revision that the session calibrates. */
export async function sessionChannel(db: DataSource | EntityManager, session: CalibrationSession): Promise<ChannelDefinition> {
  const channel = await db.getRepository(Channel).findOneBy({ revisionId: session.board.revisionId, key: session.channelKey });
  if (!channel) throw new NotFoundError(`revision has no channel "${session.channelKey}"`);
  return channel.definition;
}

function assertEditable(session: CalibrationSession): void {
  if (session.state !== 'draft') throw new ConflictError(`calibration session ${session.id} is complete and can no longer change; start a new session`);
}

export async function createSession(dataSource: DataSource, actor: User, boardId: number, body: SessionCreateBody): Promise<CalibrationSession> {
  const id = await dataSource.transaction(async (m) => {
    const board = await m.getRepository(Board).findOneBy({ id: boardId });
    if (!board) throw new NotFoundError(`no board with id ${boardId}`);
    const keys = (await m.getRepository(Channel).findBy({ revisionId: board.revisionId })).map((c) => c.key);
    if (!keys.includes(body.channelKey)) {
      throw new BadRequestError(`the board's revision has no channel "${body.channelKey}"; its channels are ${keys.join(', ')}`, { channelKey: `must be one of ${keys.join(', ')}` });
    }
    const repo = m.getRepository(CalibrationSession);
    const session = await repo.save(repo.create({ ...body, boardId, testerId: actor.id, state: 'draft', completedAt: null }));
    await recordAudit(m, actor.id, 'calibration.create', `board:${boardId}`, { session: session.id, channel: body.channelKey });
    return session.id;
  });
  return getSession(dataSource, id);
}

export async function updateSession(dataSource: DataSource, actor: User, id: number, patch: SessionPatchBody): Promise<CalibrationSession> {
  await dataSource.transaction(async (m) => {
    const session = await getSession(m, id);
    assertEditable(session);
    await m.getRepository(CalibrationSession).update({ id }, { ...patch, updatedAt: new Date() });
    await recordAudit(m, actor.id, 'calibration.edit', `calibration:${id}`, patch as Record<string, unknown>);
  });
  return getSession(dataSource, id);
}

/**
 * Marks a change of the session's points: refuses it when it was based on an older points version (a
 * `baseVersion` left out means "no basis to check": an import only appends, and the seed is trusted), then
 * moves the version on with who and when, compare-and-set so two changes never both build on one version.
 */
async function bumpPointsVersion(m: EntityManager, session: CalibrationSession, actor: User, baseVersion: number | undefined): Promise<void> {
  assertCurrentVersion('calibration points', baseVersion, { version: session.pointsVersion, savedBy: session.pointsSavedBy, savedAt: session.pointsSavedAt });
  const now = new Date();
  const bumped = await m.getRepository(CalibrationSession).update(
    { id: session.id, pointsVersion: session.pointsVersion },
    { pointsVersion: session.pointsVersion + 1, pointsSavedById: actor.id, pointsSavedAt: now, updatedAt: now },
  );
  if (!bumped.affected) throw new ConflictError(`the points of calibration session ${session.id} changed while saving; reload them and save again`);
}

/** Replaces or appends points in one transaction; the table editor replaces (with its base version), an import appends. */
export async function writePoints(
  dataSource: DataSource, actor: User, id: number, points: CalibrationPointBody[], mode: 'replace' | 'append', baseVersion?: number,
): Promise<CalibrationSession> {
  await dataSource.transaction(async (m) => {
    const session = await getSession(m, id);
    assertEditable(session);
    const total = (mode === 'replace' ? 0 : session.points.length) + points.length;
    if (total > MAX_POINTS_PER_SESSION) throw new BadRequestError(pointsLimitMessage(total), { points: pointsLimitMessage(total) });
    await bumpPointsVersion(m, session, actor, baseVersion);
    const repo = m.getRepository(CalibrationPoint);
    if (mode === 'replace') await repo.delete({ sessionId: id });
    const start = mode === 'replace' ? 0 : session.points.reduce((n, p) => Math.max(n, p.position + 1), 0);
    const rows = points.map((p, i) => repo.create({ ...p, sessionId: id, position: start + i }));
    for (let i = 0; i < rows.length; i += 200) await repo.insert(rows.slice(i, i + 200));
    await m.getRepository(CalibrationSession).update({ id }, { updatedAt: new Date() });
    await recordAudit(m, actor.id, mode === 'replace' ? 'calibration.points' : 'calibration.import', `calibration:${id}`, { points: points.length });
  });
  return getSession(dataSource, id);
}

/** Excludes (with a reason) or restores one point; excluded points stay stored. */
export async function setExclusion(
  dataSource: DataSource, actor: User, pointId: number, excluded: boolean, reason: string, baseVersion?: number,
): Promise<CalibrationSession> {
  const sessionId = await dataSource.transaction(async (m) => {
    const point = await m.getRepository(CalibrationPoint).findOneBy({ id: pointId });
    if (!point) throw new NotFoundError(`no calibration point with id ${pointId}`);
    const session = await getSession(m, point.sessionId);
    assertEditable(session);
    await bumpPointsVersion(m, session, actor, baseVersion);
    await m.getRepository(CalibrationPoint).update({ id: pointId }, { excluded, excludedReason: excluded ? reason : '' });
    await recordAudit(m, actor.id, excluded ? 'calibration.exclude' : 'calibration.restore', `calibration:${point.sessionId}`, { point: pointId, reason });
    return point.sessionId;
  });
  return getSession(dataSource, sessionId);
}

/** Fit and comparison with the design, or the reason there is none yet. */
export async function analyseSession(dataSource: DataSource | EntityManager, session: CalibrationSession) {
  // Only a session stored before the limit can be over it; it is not fitted, so reading it stays cheap.
  if (session.points.length > MAX_POINTS_PER_SESSION) {
    return { fit: null, comparison: null, reason: `holds ${session.points.length} points, more than the ${MAX_POINTS_PER_SESSION} a session may hold; remove points before fitting` };
  }
  const used = session.points.filter((p) => !p.excluded);
  const needed = session.fit.degree + (session.fit.intercept ? 1 : 0) + 1;
  if (used.length < needed) {
    return { fit: null, comparison: null, reason: `needs at least ${needed} points that are not excluded for a degree ${session.fit.degree} fit (has ${used.length})` };
  }
  const channel = await sessionChannel(dataSource, session);
  try {
    const fit = fitSession(session.fit, session.points, session.reference);
    const comparison = compareBoard(channel, session.ambientC, session.points, session.reference);
    return { fit, comparison, reason: null };
  } catch (err) {
    return { fit: null, comparison: null, reason: (err as Error).message };
  }
}

/** Completes a session and e-mails the design's owner the result with a link (after the commit). */
export async function completeSession(dataSource: DataSource, mailer: Mailer, actor: User, id: number, baseUrl: string): Promise<CalibrationSession> {
  const session = await getSession(dataSource, id);
  assertEditable(session);
  const { fit, comparison, reason } = await analyseSession(dataSource, session);
  if (!fit || session.points.filter((p) => !p.excluded).length < MIN_POINTS_TO_COMPLETE) {
    throw new ConflictError(`calibration session ${id} cannot be completed: ${reason ?? `needs at least ${MIN_POINTS_TO_COMPLETE} points`}`);
  }
  const channel = await sessionChannel(dataSource, session);
  await dataSource.transaction(async (m) => {
    // The record freezes what was analysed above, so nothing may have changed since it was read.
    const fresh = await m.getRepository(CalibrationSession).findOneBy({ id });
    if (fresh && fresh.state === 'draft' && fresh.updatedAt.getTime() !== session.updatedAt.getTime()) {
      throw new ConflictError(`calibration session ${id} changed while it was being completed; reload it and complete again`);
    }
    const at = new Date();
    const done = await m.getRepository(CalibrationSession).update({ id, state: 'draft' }, { state: 'complete', completedAt: at });
    if (!done.affected) throw new ConflictError(`calibration session ${id} is already complete`);
    const record = await freezeRecord(m, { session, channelName: channel.name, fit, comparison, actor, at });
    await recordAudit(m, actor.id, 'calibration.complete', `calibration:${id}`, {
      within: comparison?.within ?? null, decision: comparison?.acceptance.decision ?? null, record: record.sequence, sha256: record.sha256,
    });
  });
  const design = session.board.revision.design;
  try {
    await mailer.send(sessionCompleteMessage({
      to: design.owner.email, serialNumber: session.board.serialNumber, channelName: channel.name, designName: design.name,
      revisionLetter: session.board.revision.letter, testerName: actor.displayName, decision: comparison?.acceptance.decision ?? null,
      summary: `Gain ${fit.coefficients[1].toPrecision(6)} Hz/V, offset ${fit.coefficients[0].toPrecision(4)} Hz, residual SD ${fit.residualStandardDeviationHz.toPrecision(3)} Hz from ${fit.pointsUsed} points.`,
      link: `${baseUrl}/calibrations/${id}`,
    }));
  } catch (err) {
    // The calibration stands; the notice is only a courtesy, so a mail failure is logged, not fatal.
    console.error('[mail] calibration notice not sent', err);
  }
  return getSession(dataSource, id);
}

/**
 * Moves a completed session back to draft so its points or fit can be corrected. Its records stay as they were;
 * completing it again freezes a new record with the next sequence number.
 */
export async function reopenSession(dataSource: DataSource, actor: User, id: number): Promise<CalibrationSession> {
  await dataSource.transaction(async (m) => {
    const reopened = await m.getRepository(CalibrationSession).update({ id, state: 'complete' }, { state: 'draft', completedAt: null, updatedAt: new Date() });
    if (!reopened.affected) {
      await getSession(m, id);
      throw new ConflictError(`calibration session ${id} is a draft already`);
    }
    await recordAudit(m, actor.id, 'calibration.reopen', `calibration:${id}`, {});
  });
  return getSession(dataSource, id);
}
