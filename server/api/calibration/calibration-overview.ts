import type { DataSource } from 'typeorm';
import { NotFoundError } from '../../common/errors.js';
import { Board } from '../../entities/Board.js';
import { Channel } from '../../entities/Channel.js';
import { getSession } from './sessions.service.js';
import { BOARD_ACCEPTANCE_RULE, compareBoard, designPopulation } from './design-spread.js';
import { sessionsOfBoards } from '../boards/boards.service.js';
import { referenceTraceability } from '../../../shared/schemas/reference-traceability.js';

/**
 * Every board of a revision against the design's spread for one channel: the latest completed session's
 * gain and offset errors per board with its guarded-acceptance decision, and the design population at the reference temperature.
 */
export async function calibrationOverview(dataSource: DataSource, revisionId: number, channelKey: string) {
  const channel = await dataSource.getRepository(Channel).findOneBy({ revisionId, key: channelKey });
  if (!channel) throw new NotFoundError(`revision ${revisionId} has no channel "${channelKey}"`);
  const boards = await dataSource.getRepository(Board).find({ where: { revisionId }, order: { serialNumber: 'ASC' } });
  const sessions = (await sessionsOfBoards(dataSource, boards.map((b) => b.id))).filter((s) => s.channelKey === channelKey && s.state === 'complete');
  const rows = [];
  for (const board of boards) {
    const latest = sessions.find((s) => s.boardId === board.id);
    if (!latest) {
      rows.push({ boardId: board.id, serialNumber: board.serialNumber, sessionId: null, gainError: null, offsetErrorV: null, within: null, decision: null, traceability: null });
      continue;
    }
    const session = await getSession(dataSource, latest.id);
    const c = compareBoard(channel.definition, session.ambientC, session.points, session.reference);
    rows.push({ boardId: board.id, serialNumber: board.serialNumber, sessionId: session.id, gainError: c.board.gainError, offsetErrorV: c.board.offsetErrorV, within: c.within, decision: c.acceptance.decision,
      traceability: referenceTraceability(session.performedOn, { instrumentId: session.referenceInstrumentId, certificateNumber: session.referenceCertificate, dueOn: session.referenceDueOn }) });
  }
  return { channelKey, channelName: channel.definition.name, rule: BOARD_ACCEPTANCE_RULE, population: designPopulation(channel.definition, channel.definition.environment.referenceC), boards: rows };
}
