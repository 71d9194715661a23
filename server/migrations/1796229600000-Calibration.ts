import { Table, type MigrationInterface, type QueryRunner } from 'typeorm';
import { booleanDefault, createdColumn, dateTimeType, idColumn } from './portable.js';

export class Calibration1796229600000 implements MigrationInterface {
  name = 'Calibration1796229600000';

  async up(q: QueryRunner): Promise<void> {
    await q.createTable(new Table({
      name: 'boards',
      columns: [
        idColumn(),
        { name: 'serialNumber', type: 'varchar', length: '40' },
        { name: 'revisionId', type: 'integer' },
        { name: 'buildDate', type: 'varchar', length: '10' },
        { name: 'note', type: 'text', default: "''" },
        { name: 'createdById', type: 'integer' },
        createdColumn(q, 'createdAt'),
      ],
      indices: [
        { name: 'IDX_boards_serial', columnNames: ['serialNumber'], isUnique: true },
        { name: 'IDX_boards_revision', columnNames: ['revisionId'] },
      ],
      foreignKeys: [
        { name: 'FK_boards_revision', columnNames: ['revisionId'], referencedTableName: 'revisions', referencedColumnNames: ['id'], onDelete: 'RESTRICT' },
        { name: 'FK_boards_created_by', columnNames: ['createdById'], referencedTableName: 'users', referencedColumnNames: ['id'], onDelete: 'RESTRICT' },
      ],
    }));
    await q.createTable(new Table({
      name: 'calibration_sessions',
      columns: [
        idColumn(),
        { name: 'boardId', type: 'integer' },
        { name: 'channelKey', type: 'varchar', length: '40' },
        { name: 'testerId', type: 'integer' },
        { name: 'performedOn', type: 'varchar', length: '10' },
        { name: 'ambientC', type: 'real' },
        { name: 'reference', type: 'text' },
        { name: 'fit', type: 'text' },
        { name: 'note', type: 'text', default: "''" },
        { name: 'state', type: 'varchar', length: '12', default: "'draft'" },
        { name: 'completedAt', type: dateTimeType(q), isNullable: true },
        createdColumn(q, 'createdAt'),
        createdColumn(q, 'updatedAt'),
      ],
      indices: [{ name: 'IDX_calibration_sessions_board', columnNames: ['boardId', 'channelKey'] }],
      foreignKeys: [
        { name: 'FK_calibration_sessions_board', columnNames: ['boardId'], referencedTableName: 'boards', referencedColumnNames: ['id'], onDelete: 'CASCADE' },
        { name: 'FK_calibration_sessions_tester', columnNames: ['testerId'], referencedTableName: 'users', referencedColumnNames: ['id'], onDelete: 'RESTRICT' },
      ],
    }));
    await q.createTable(new Table({
      name: 'calibration_points',
      columns: [
        idColumn(),
        { name: 'sessionId', type: 'integer' },
        { name: 'position', type: 'integer' },
        { name: 'appliedV', type: 'real' },
        { name: 'frequencyHz', type: 'real' },
        { name: 'counts', type: 'integer', isNullable: true },
        { name: 'uncertaintyHz', type: 'real', isNullable: true },
        { name: 'excluded', type: 'boolean', default: booleanDefault(q, false) },
        { name: 'excludedReason', type: 'varchar', length: '300', default: "''" },
      ],
      indices: [{ name: 'IDX_calibration_points_session', columnNames: ['sessionId', 'position'] }],
      foreignKeys: [
        { name: 'FK_calibration_points_session', columnNames: ['sessionId'], referencedTableName: 'calibration_sessions', referencedColumnNames: ['id'], onDelete: 'CASCADE' },
      ],
    }));
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of ['calibration_points', 'calibration_sessions', 'boards']) await q.dropTable(table);
  }
}
