import type { DataSource, EntityManager } from 'typeorm';
import type { FixedPointForm } from '../../../shared/fit/fixed-point.js';
import { fixedPointForm } from '../../../shared/fit/fixed-point.js';
import { countReadingForm, type CountReadingForm } from '../../../shared/fit/count-reading.js';
import type { CaptureDefinition } from '../../../shared/schemas/chain.js';
import { Channel } from '../../entities/Channel.js';
import type { ReferenceSpec } from '../../../shared/schemas/calibration.js';
import type { BoardComparison, FitView } from '../../../shared/schemas/calibration-views.js';
import { ConflictError, HttpError, NotFoundError } from '../../common/errors.js';
import { CalibrationRecord } from '../../entities/CalibrationRecord.js';
import type { CalibrationSession } from '../../entities/CalibrationSession.js';
import { canonicalJson, sha256Hex } from './canonical-json.js';

export const RECORD_FORMAT = 'tallyvolt-calibration-record';

/** Everything an export of a completed session is made from; nothing is recomputed from it. */
export interface RecordPayload {
  format: typeof RECORD_FORMAT;
  version: 1;
  sequence: number;
  frozenAt: string;
  frozenBy: { id: number; displayName: string };
  session: { id: number; performedOn: string; ambientC: number; tester: { id: number; displayName: string }; note: string };
  board: { id: number; serialNumber: string };
  design: { id: number; name: string };
  revision: { id: number; letter: string };
  channel: { key: string; name: string };
  reference: ReferenceSpec;
  /** The reference instrument's traceability as recorded; absent from records frozen before it was kept. */
  referenceTraceability?: { instrumentId: string | null; certificateNumber: string | null; dueOn: string | null };
  points: { appliedV: number; frequencyHz: number; counts: number | null; uncertaintyHz: number | null; excluded: boolean; excludedReason: string }[];
  fit: FitView;
  /** volts = Σ c_k·f^k as fitted, and its integer-only form; fixedPoint is null when the fit has none, with the reason. */
  reading: {
    coefficients: number[]; fixedPoint: FixedPointForm | null; notExportable: string | null;
    /** Whole millivolts from raw counts (integers only), frozen with the capture settings it was made from; absent in records frozen before it existed. */
    countReading?: CountReadingForm | null;
    countNotExportable?: string | null;
  };
  acceptance: { rule: string; decision: string; within: boolean } | null;
}

export interface FrozenRecord {
  sequence: number;
  sessionId: number;
  sha256: string;
  createdAt: Date;
  payload: RecordPayload;
}

export interface SessionForRecord {
  session: CalibrationSession;
  channelName: string;
  fit: FitView;
  comparison: BoardComparison | null;
  actor: { id: number; displayName: string };
  at: Date;
}

function readingOf(fit: FitView, capture: CaptureDefinition | undefined): RecordPayload['reading'] {
  let fixedPoint: FixedPointForm;
  try {
    fixedPoint = fixedPointForm(fit.inverse.coefficients, fit.rangeHz);
  } catch (e) {
    return { coefficients: fit.inverse.coefficients, fixedPoint: null, notExportable: (e as Error).message, countReading: null, countNotExportable: (e as Error).message };
  }
  try {
    if (!capture) throw new Error('the channel\'s capture settings are not known');
    return { coefficients: fit.inverse.coefficients, fixedPoint, notExportable: null, countReading: countReadingForm(fit.inverse.coefficients, fixedPoint, fit.rangeHz, capture), countNotExportable: null };
  } catch (e) {
    return { coefficients: fit.inverse.coefficients, fixedPoint, notExportable: null, countReading: null, countNotExportable: (e as Error).message };
  }
}

/**
 * Freezes the session's current result as its next record, inside the caller's transaction. Insert only: no
 * code path updates or deletes a record (a session's records go only with the session itself).
 */
export async function freezeRecord(m: EntityManager, input: SessionForRecord): Promise<FrozenRecord> {
  const { session: s, fit, comparison, actor, at } = input;
  const repo = m.getRepository(CalibrationRecord);
  const last = await repo.findOne({ where: { sessionId: s.id }, order: { sequence: 'DESC' }, select: { id: true, sequence: true } });
  const sequence = (last?.sequence ?? 0) + 1;
  const payload: RecordPayload = {
    format: RECORD_FORMAT,
    version: 1,
    sequence,
    frozenAt: at.toISOString(),
    frozenBy: { id: actor.id, displayName: actor.displayName },
    session: { id: s.id, performedOn: s.performedOn, ambientC: s.ambientC, tester: { id: s.tester.id, displayName: s.tester.displayName }, note: s.note },
    board: { id: s.board.id, serialNumber: s.board.serialNumber },
    design: { id: s.board.revision.design.id, name: s.board.revision.design.name },
    revision: { id: s.board.revision.id, letter: s.board.revision.letter },
    channel: { key: s.channelKey, name: input.channelName },
    reference: s.reference,
    referenceTraceability: { instrumentId: s.referenceInstrumentId ?? null, certificateNumber: s.referenceCertificate ?? null, dueOn: s.referenceDueOn ?? null },
    points: s.points.map((p) => ({ appliedV: p.appliedV, frequencyHz: p.frequencyHz, counts: p.counts, uncertaintyHz: p.uncertaintyHz, excluded: p.excluded, excludedReason: p.excludedReason })),
    fit,
    reading: readingOf(fit, (await m.getRepository(Channel).findOneBy({ revisionId: s.board.revision.id, key: s.channelKey }))?.definition.capture),
    acceptance: comparison ? { rule: comparison.acceptance.rule, decision: comparison.acceptance.decision, within: comparison.within } : null,
  };
  const text = canonicalJson(payload);
  const sha256 = sha256Hex(text);
  await repo.insert({ sessionId: s.id, sequence, createdById: actor.id, createdAt: at, payload: text, sha256 });
  // What is returned is what a later read gives back: the stored text parsed, not the object it was made from.
  return { sequence, sessionId: s.id, sha256, createdAt: at, payload: JSON.parse(text) as RecordPayload };
}

/** The session's records without their payloads, oldest first. */
export function listRecords(db: DataSource | EntityManager, sessionId: number) {
  return db.getRepository(CalibrationRecord).find({
    where: { sessionId }, order: { sequence: 'ASC' }, relations: { createdBy: true },
    select: { id: true, sequence: true, sha256: true, createdAt: true, createdBy: { id: true, displayName: true } },
  });
}

/**
 * One stored record (the latest when no sequence is given), its text checked against its hash before use.
 * @throws NotFoundError when the session has no such record
 */
export async function readRecord(db: DataSource | EntityManager, sessionId: number, sequence?: number): Promise<FrozenRecord | null> {
  const repo = db.getRepository(CalibrationRecord);
  const row = sequence === undefined
    ? await repo.findOne({ where: { sessionId }, order: { sequence: 'DESC' } })
    : await repo.findOneBy({ sessionId, sequence });
  if (!row) {
    if (sequence === undefined) return null;
    throw new NotFoundError(`calibration session ${sessionId} has no record ${sequence}`);
  }
  if (sha256Hex(row.payload) !== row.sha256) {
    throw new HttpError(500, `record ${row.sequence} of calibration session ${sessionId} does not match its SHA-256; it was changed after it was stored`);
  }
  return { sequence: row.sequence, sessionId, sha256: row.sha256, createdAt: row.createdAt, payload: JSON.parse(row.payload) as RecordPayload };
}

/** The record's frozen count reading, or undefined for a record frozen before count readings were kept. */
export function recordCountReading(record: FrozenRecord): { form: CountReadingForm | null; reason: string | null; frozen: true } | undefined {
  const { countReading, countNotExportable } = record.payload.reading;
  return countReading === undefined ? undefined : { form: countReading, reason: countNotExportable ?? null, frozen: true };
}

/** The record's fixed-point form, or a 409 saying why its fit has none. */
export function recordFixedPoint(record: FrozenRecord): FixedPointForm {
  const { fixedPoint, notExportable } = record.payload.reading;
  if (!fixedPoint) throw new ConflictError(`this fit cannot be exported for firmware: ${notExportable}`);
  return fixedPoint;
}
