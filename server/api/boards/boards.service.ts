import type { DataSource } from 'typeorm';
import type { BoardCreateBody } from '../../../shared/schemas/calibration.js';
import { recordAudit } from '../../common/audit.js';
import { BadRequestError, ConflictError, NotFoundError } from '../../common/errors.js';
import { REVISION_STATE_LABELS, type RevisionState } from '../../../shared/schemas/designs.js';
import { Board } from '../../entities/Board.js';
import { CalibrationSession } from '../../entities/CalibrationSession.js';
import { Revision } from '../../entities/Revision.js';
import type { User } from '../../entities/User.js';

/** Revisions a board may be built to without saying so: approved, or in review (its design is settled for now). */
export const BUILDABLE_STATES: readonly RevisionState[] = ['approved', 'in_review'];

export async function createBoard(dataSource: DataSource, actor: User, body: BoardCreateBody): Promise<Board> {
  const id = await dataSource.transaction(async (m) => {
    const revision = await m.getRepository(Revision).findOneBy({ id: body.revisionId });
    if (!revision) throw new NotFoundError(`no revision with id ${body.revisionId}`);
    if (!BUILDABLE_STATES.includes(revision.state) && !body.confirmDraft) {
      const state = REVISION_STATE_LABELS[revision.state].toLowerCase();
      throw new BadRequestError(`revision ${revision.letter} is ${state}, not approved or in review; set confirmDraft to build a board to it anyway`,
        { confirmDraft: `revision ${revision.letter} is ${state}: confirm that this board is built to a draft revision` });
    }
    if (await m.getRepository(Board).existsBy({ serialNumber: body.serialNumber })) {
      throw new ConflictError(`a board with serial number ${body.serialNumber} already exists`, { serialNumber: 'already exists' });
    }
    const { confirmDraft: _confirmed, ...fields } = body;
    const board = await m.getRepository(Board).save(m.getRepository(Board).create({ ...fields, revisionStateAtBuild: revision.state, createdById: actor.id }));
    await recordAudit(m, actor.id, 'board.create', `board:${board.id}`,
      { serialNumber: board.serialNumber, revisionId: body.revisionId, revisionState: revision.state });
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
