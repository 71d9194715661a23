import { TableColumn, TableForeignKey, type MigrationInterface, type QueryRunner } from 'typeorm';
import { dateTimeType } from './portable.js';

/** Versions (and who saved last) on the records people edit together, so a stale save can be refused. */
export class SaveVersions1796240000000 implements MigrationInterface {
  name = 'SaveVersions1796240000000';

  async up(q: QueryRunner): Promise<void> {
    await q.addColumns('revisions', [
      new TableColumn({ name: 'version', type: 'integer', default: 1 }),
      new TableColumn({ name: 'updatedById', type: 'integer', isNullable: true }),
    ]);
    await q.createForeignKey('revisions', new TableForeignKey({
      name: 'FK_revisions_updated_by', columnNames: ['updatedById'], referencedTableName: 'users', referencedColumnNames: ['id'], onDelete: 'SET NULL',
    }));
    await q.addColumn('margin_inputs', new TableColumn({ name: 'version', type: 'integer', default: 1 }));
    await q.addColumns('calibration_sessions', [
      new TableColumn({ name: 'pointsVersion', type: 'integer', default: 1 }),
      new TableColumn({ name: 'pointsSavedById', type: 'integer', isNullable: true }),
      new TableColumn({ name: 'pointsSavedAt', type: dateTimeType(q), isNullable: true }),
    ]);
    await q.createForeignKey('calibration_sessions', new TableForeignKey({
      name: 'FK_calibration_sessions_points_saved_by', columnNames: ['pointsSavedById'], referencedTableName: 'users', referencedColumnNames: ['id'], onDelete: 'SET NULL',
    }));
  }

  async down(q: QueryRunner): Promise<void> {
    await q.dropForeignKey('calibration_sessions', 'FK_calibration_sessions_points_saved_by');
    await q.dropColumns('calibration_sessions', ['pointsSavedAt', 'pointsSavedById', 'pointsVersion']);
    await q.dropColumn('margin_inputs', 'version');
    await q.dropForeignKey('revisions', 'FK_revisions_updated_by');
    await q.dropColumns('revisions', ['updatedById', 'version']);
  }
}
