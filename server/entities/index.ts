import { AnalysisRun } from './AnalysisRun.js';
import { AuditEvent } from './AuditEvent.js';
import { Board } from './Board.js';
import { CalibrationPoint } from './CalibrationPoint.js';
import { CalibrationRecord } from './CalibrationRecord.js';
import { CalibrationSession } from './CalibrationSession.js';
import { Channel } from './Channel.js';
import { Design } from './Design.js';
import { InviteToken } from './InviteToken.js';
import { MarginInputsRecord } from './MarginInputsRecord.js';
import { OutboxMessage } from './OutboxMessage.js';
import { ResistorSeries } from './ResistorSeries.js';
import { Revision } from './Revision.js';
import { SessionRecord } from './SessionRecord.js';
import { StockPart } from './StockPart.js';
import { User } from './User.js';

export { AnalysisRun, AuditEvent, Board, CalibrationPoint, CalibrationRecord, CalibrationSession, Channel, Design, InviteToken, MarginInputsRecord, OutboxMessage, ResistorSeries, Revision, SessionRecord, StockPart, User };
export const entities = [User, InviteToken, AuditEvent, OutboxMessage, SessionRecord, Design, Revision, Channel, ResistorSeries, StockPart, AnalysisRun, Board, CalibrationSession, CalibrationPoint, MarginInputsRecord, CalibrationRecord];
