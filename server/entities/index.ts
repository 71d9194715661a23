import { AnalysisRun } from './AnalysisRun.js';
import { AuditEvent } from './AuditEvent.js';
import { Channel } from './Channel.js';
import { Design } from './Design.js';
import { InviteToken } from './InviteToken.js';
import { OutboxMessage } from './OutboxMessage.js';
import { ResistorSeries } from './ResistorSeries.js';
import { Revision } from './Revision.js';
import { SessionRecord } from './SessionRecord.js';
import { StockPart } from './StockPart.js';
import { User } from './User.js';

export { AnalysisRun, AuditEvent, Channel, Design, InviteToken, OutboxMessage, ResistorSeries, Revision, SessionRecord, StockPart, User };
export const entities = [User, InviteToken, AuditEvent, OutboxMessage, SessionRecord, Design, Revision, Channel, ResistorSeries, StockPart, AnalysisRun];
