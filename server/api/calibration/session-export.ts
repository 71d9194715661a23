import type { DataSource } from 'typeorm';
import type { FitView, SessionAnalysis } from '../../../shared/schemas/calibration-views.js';
import { ConflictError } from '../../common/errors.js';
import type { CalibrationSession } from '../../entities/CalibrationSession.js';
import { referenceTraceability } from '../../../shared/schemas/reference-traceability.js';
import { freezeRecord, readRecord, recordCountReading, recordFixedPoint, type FrozenRecord } from './calibration-records.js';
import type { ExportContext, ExportRecord } from './firmware-export.js';
import { analyseSession, getSession, sessionChannel } from './sessions.service.js';

export interface ExportSource {
  ctx: ExportContext;
  fit: FitView;
  /** Absent only for a draft session's export, which is computed and says so. */
  record?: ExportRecord;
}

/** An export made from the stored record alone: its identity, fit and fixed-point form as frozen. */
function fromRecord(record: FrozenRecord): ExportSource {
  const p = record.payload;
  return {
    ctx: {
      serialNumber: p.board.serialNumber, designName: p.design.name, revisionLetter: p.revision.letter, channelKey: p.channel.key,
      channelName: p.channel.name, sessionId: p.session.id, performedOn: p.session.performedOn, ambientC: p.session.ambientC,
      state: 'complete', testerName: p.session.tester.displayName, traceability: referenceTraceability(p.session.performedOn, p.referenceTraceability),
    },
    fit: p.fit,
    record: { sequence: record.sequence, sha256: record.sha256, fixed: recordFixedPoint(record), count: recordCountReading(record) },
  };
}

/**
 * A session completed before records were kept has none: its current result is frozen once, as record 1 by its
 * tester, the first time it is needed; from then on it reads like any other.
 */
async function recordOfUnfrozen(dataSource: DataSource, session: CalibrationSession): Promise<FrozenRecord> {
  const analysis = await analyseSession(dataSource, session);
  if (!analysis.fit) throw new ConflictError(`nothing to export: ${analysis.reason}`);
  const channel = await sessionChannel(dataSource, session);
  try {
    return await dataSource.transaction((m) => freezeRecord(m, {
      session, channelName: channel.name, fit: analysis.fit!, comparison: analysis.comparison, actor: session.tester, at: session.completedAt ?? new Date(),
    }));
  } catch (e) {
    // Another request froze it first (the sequence is unique per session): use theirs.
    const stored = await readRecord(dataSource, session.id);
    if (stored) return stored;
    throw e;
  }
}

/** The latest record of a completed session, frozen now if it predates records; null for a draft. */
export async function currentRecord(dataSource: DataSource, session: CalibrationSession): Promise<FrozenRecord | null> {
  if (session.state !== 'complete') return null;
  return (await readRecord(dataSource, session.id)) ?? recordOfUnfrozen(dataSource, session);
}

/**
 * What an export of the session is made from: the named record, else for a completed session its latest record,
 * else (a draft) the fit computed now.
 * @throws NotFoundError for a record the session does not have; ConflictError when a draft has no fit yet
 */
export async function exportSource(dataSource: DataSource, id: number, sequence?: number): Promise<ExportSource> {
  const session = await getSession(dataSource, id);
  // a record frozen before count readings were kept gets its count constants from the revision's capture, and says so
  const withCapture = async (source: ExportSource): Promise<ExportSource> => (source.record?.count
    ? source : { ...source, ctx: { ...source.ctx, capture: (await sessionChannel(dataSource, session)).capture } });
  if (sequence !== undefined) return withCapture(fromRecord((await readRecord(dataSource, id, sequence))!));
  const record = await currentRecord(dataSource, session);
  if (record) return withCapture(fromRecord(record));
  const analysis = await analyseSession(dataSource, session);
  if (!analysis.fit) throw new ConflictError(`nothing to export yet: ${analysis.reason}`);
  const channel = await sessionChannel(dataSource, session);
  return {
    ctx: {
      serialNumber: session.board.serialNumber, designName: session.board.revision.design.name, revisionLetter: session.board.revision.letter,
      channelKey: session.channelKey, channelName: channel.name, sessionId: session.id, performedOn: session.performedOn,
      ambientC: session.ambientC, state: session.state, testerName: session.tester.displayName,
      traceability: referenceTraceability(session.performedOn,
        { instrumentId: session.referenceInstrumentId, certificateNumber: session.referenceCertificate, dueOn: session.referenceDueOn }),
    },
    fit: analysis.fit,
  };
}

/** A completed session shows the fit of its latest record, the one its exports carry; a draft shows the fit computed now. */
export function shownAnalysis(analysis: SessionAnalysis, record: FrozenRecord | null): SessionAnalysis {
  return record ? { ...analysis, fit: record.payload.fit } : analysis;
}
