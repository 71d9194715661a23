import { Table, type MigrationInterface, type QueryRunner } from 'typeorm';
import { createdColumn, idColumn } from './portable.js';

/** Frozen results of completed calibration sessions, so a later change of the fit cannot change flashed coefficients. */
export class CalibrationRecords1796250000000 implements MigrationInterface {
  name = 'CalibrationRecords1796250000000';

  async up(q: QueryRunner): Promise<void> {
    await q.createTable(new Table({
      name: 'calibration_records',
      columns: [
        idColumn(),
        { name: 'sessionId', type: 'integer' },
        { name: 'sequence', type: 'integer' },
        { name: 'createdById', type: 'integer' },
        createdColumn(q, 'createdAt'),
        { name: 'payload', type: 'text' },
        { name: 'sha256', type: 'varchar', length: '64' },
      ],
      indices: [{ name: 'IDX_calibration_records_session_sequence', columnNames: ['sessionId', 'sequence'], isUnique: true }],
      foreignKeys: [
        { name: 'FK_calibration_records_session', columnNames: ['sessionId'], referencedTableName: 'calibration_sessions', referencedColumnNames: ['id'], onDelete: 'CASCADE' },
        { name: 'FK_calibration_records_created_by', columnNames: ['createdById'], referencedTableName: 'users', referencedColumnNames: ['id'], onDelete: 'RESTRICT' },
      ],
    }));
  }

  async down(q: QueryRunner): Promise<void> {
    await q.dropTable('calibration_records');
  }
}
