import type { Board } from '../../entities/Board.js';
import type { CalibrationRecord } from '../../entities/CalibrationRecord.js';
import type { CalibrationSession } from '../../entities/CalibrationSession.js';
import { isoTime, isoTimeOrNull } from '../../common/iso-time.js';
import { referenceTraceability } from '../../../shared/schemas/reference-traceability.js';
import type { BoardRow, SessionDetail, SessionSummary, SessionAnalysis } from '../../../shared/schemas/calibration-views.js';

export function toSessionSummary(s: CalibrationSession): SessionSummary {
  return {
    id: s.id,
    boardId: s.boardId,
    channelKey: s.channelKey,
    state: s.state,
    performedOn: s.performedOn,
    ambientC: s.ambientC,
    traceability: referenceTraceability(s.performedOn, { instrumentId: s.referenceInstrumentId, certificateNumber: s.referenceCertificate, dueOn: s.referenceDueOn }),
    tester: s.tester ? { id: s.tester.id, displayName: s.tester.displayName } : undefined,
    completedAt: isoTimeOrNull(s.completedAt),
    createdAt: isoTime(s.createdAt),
    updatedAt: isoTime(s.updatedAt),
  };
}

export function toSessionDetail(s: CalibrationSession, analysis: SessionAnalysis, records: CalibrationRecord[] = []): SessionDetail {
  return {
    ...toSessionSummary(s),
    reference: s.reference,
    fit: s.fit,
    note: s.note,
    board: { id: s.board.id, serialNumber: s.board.serialNumber, revisionId: s.board.revisionId, revisionLetter: s.board.revision.letter,
      designId: s.board.revision.design.id, designName: s.board.revision.design.name },
    points: s.points.map((p) => ({ id: p.id, position: p.position, appliedV: p.appliedV, frequencyHz: p.frequencyHz, counts: p.counts,
      uncertaintyHz: p.uncertaintyHz, excluded: p.excluded, excludedReason: p.excludedReason })),
    analysis,
    pointsVersion: s.pointsVersion,
    pointsSavedBy: s.pointsSavedBy ? { id: s.pointsSavedBy.id, displayName: s.pointsSavedBy.displayName } : null,
    pointsSavedAt: isoTimeOrNull(s.pointsSavedAt),
    records: records.map((r) => ({ sequence: r.sequence, sha256: r.sha256, createdAt: isoTime(r.createdAt),
      createdBy: { id: r.createdBy.id, displayName: r.createdBy.displayName } })),
  };
}

export function toBoardView(b: Board, sessions: CalibrationSession[]): BoardRow {
  const latest: Record<string, SessionSummary> = {};
  for (const s of sessions) if (s.boardId === b.id && !latest[s.channelKey]) latest[s.channelKey] = toSessionSummary(s);
  return {
    id: b.id,
    serialNumber: b.serialNumber,
    revisionId: b.revisionId,
    revisionLetter: b.revision.letter,
    designId: b.revision.design.id,
    designName: b.revision.design.name,
    buildDate: b.buildDate,
    note: b.note,
    revisionStateAtBuild: b.revisionStateAtBuild,
    builtToDraft: b.revisionStateAtBuild === 'draft' || b.revisionStateAtBuild === 'changes_requested',
    createdAt: isoTime(b.createdAt),
    latestByChannel: latest,
  };
}
