import type { DataSource, EntityManager } from 'typeorm';
import { BadRequestError } from '../../common/errors.js';
import { Board } from '../../entities/Board.js';
import { CalibrationSession } from '../../entities/CalibrationSession.js';
import type { Revision } from '../../entities/Revision.js';

const FIELD = 'readingErrors.boardId';

/**
 * A margin study may read errors only from a board built to the revision's own design that has a completed
 * calibration of each channel the study reads; otherwise a revision could be signed off on an unrelated
 * board's bench record. Anything else is a 400 naming the board.
 */
export async function assertBoardOfDesign(
  db: DataSource | EntityManager, revision: Pick<Revision, 'designId' | 'letter'>, boardId: number, channelKeys: string[],
): Promise<void> {
  const board = await db.getRepository(Board).findOne({ where: { id: boardId }, relations: { revision: { design: true } } });
  if (!board) throw new BadRequestError(`board ${boardId} does not exist`, { [FIELD]: `no board with id ${boardId}` });
  if (board.revision.designId !== revision.designId) {
    throw new BadRequestError(
      `board ${board.serialNumber} is built to design "${board.revision.design.name}", not to this one; choose a board built to this design`,
      { [FIELD]: `board ${board.serialNumber} belongs to another design` },
    );
  }
  const complete = await db.getRepository(CalibrationSession).findBy({ boardId, state: 'complete' });
  const missing = channelKeys.filter((key) => !complete.some((s) => s.channelKey === key));
  if (missing.length > 0) {
    throw new BadRequestError(
      `board ${board.serialNumber} has no completed calibration of the ${missing.join(' and ')} channel${missing.length > 1 ? 's' : ''}`,
      { [FIELD]: `board ${board.serialNumber} has no completed calibration of ${missing.join(', ')}` },
    );
  }
}
