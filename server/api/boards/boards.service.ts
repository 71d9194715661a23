import type { DataSource } from 'typeorm';
import type { BoardCreateBody } from '../../../shared/schemas/calibration.js';
import { recordAudit } from '../../common/audit.js';
import { ConflictError, NotFoundError } from '../../common/errors.js';
import { Board } from '../../entities/Board.js';
import { CalibrationSession } from '../../entities/CalibrationSession.js';
import { Revision } from '../../entities/Revision.js';
import type { User } from '../../entities/User.js';

export async function createBoard(dataSource: DataSource, actor: User, body: BoardCreateBody): Promise<Board> {
  const id = await dataSource.transaction(async (m) => {
    if (!(await m.getRepository(Revision).existsBy({ id: body.revisionId }))) {
      throw new NotFoundError(`no revision with id ${body.revisionId}`);
    }
    if (await m.getRepository(Board).existsBy({ serialNumber: body.serialNumber })) {
      throw new ConflictError(`a board with serial number ${body.serialNumber} already exists`, { serialNumber: 'already exists' });
    }
    const board = await m.getRepository(Board).save(m.getRepository(Board).create({ ...body, createdById: actor.id }));
    await recordAudit(m, actor.id, 'board.create', `board:${board.id}`, { serialNumber: board.serialNumber, revisionId: body.revisionId });
    return board.id;
  });
  return getBoard(dataSource, id);
}

export async function getBoard(dataSource: DataSource, id: number): Promise<Board> {
  const board = await dataSource.getRepository(Board).findOne({ where: { id }, relations: { revision: { design: true }, createdBy: true } });
  if (!board) throw new NotFoundError(`no board with id ${id}`);
  return board;
}

export const listBoards = (dataSource: DataSource, revisionId?: number) =>
  dataSource.getRepository(Board).find({
    where: revisionId ? { revisionId } : undefined,
    relations: { revision: { design: true } },
    order: { serialNumber: 'ASC' },
  });

/** Sessions of some boards, newest first, for the lists' "latest calibration" column. */
export const sessionsOfBoards = (dataSource: DataSource, boardIds: number[]) =>
  boardIds.length === 0
    ? Promise.resolve([] as CalibrationSession[])
    : dataSource.getRepository(CalibrationSession)
      .createQueryBuilder('s')
      .leftJoinAndSelect('s.tester', 'tester')
      .where('s.boardId IN (:...ids)', { ids: boardIds })
      .orderBy('s.id', 'DESC')
      .getMany();
