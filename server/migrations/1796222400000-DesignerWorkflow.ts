import { Table, type MigrationInterface, type QueryRunner } from 'typeorm';
import { createdColumn, dateTimeType, idColumn } from './portable.js';

export class DesignerWorkflow1796222400000 implements MigrationInterface {
  name = 'DesignerWorkflow1796222400000';

  async up(q: QueryRunner): Promise<void> {
    const dt = dateTimeType(q);
    await q.createTable(new Table({
      name: 'designs',
      columns: [
        idColumn(),
        { name: 'name', type: 'varchar', length: '120' },
        { name: 'purpose', type: 'text', default: "''" },
        { name: 'ownerId', type: 'integer' },
        createdColumn(q, 'createdAt'),
        createdColumn(q, 'updatedAt'),
      ],
      indices: [{ name: 'IDX_designs_name', columnNames: ['name'] }],
      foreignKeys: [{ name: 'FK_designs_owner', columnNames: ['ownerId'], referencedTableName: 'users', referencedColumnNames: ['id'], onDelete: 'RESTRICT' }],
    }));
    await q.createTable(new Table({
      name: 'revisions',
      columns: [
        idColumn(),
        { name: 'designId', type: 'integer' },
        { name: 'letter', type: 'varchar', length: '4' },
        { name: 'state', type: 'varchar', length: '20', default: "'draft'" },
        { name: 'note', type: 'text', default: "''" },
        { name: 'basedOnId', type: 'integer', isNullable: true },
        { name: 'createdById', type: 'integer' },
        createdColumn(q, 'createdAt'),
        createdColumn(q, 'updatedAt'),
      ],
      indices: [{ name: 'IDX_revisions_design_letter', columnNames: ['designId', 'letter'], isUnique: true }],
      foreignKeys: [
        { name: 'FK_revisions_design', columnNames: ['designId'], referencedTableName: 'designs', referencedColumnNames: ['id'], onDelete: 'CASCADE' },
        { name: 'FK_revisions_created_by', columnNames: ['createdById'], referencedTableName: 'users', referencedColumnNames: ['id'], onDelete: 'RESTRICT' },
      ],
    }));
    await q.createTable(new Table({
      name: 'channels',
      columns: [
        idColumn(),
        { name: 'revisionId', type: 'integer' },
        { name: 'key', type: 'varchar', length: '40' },
        { name: 'position', type: 'integer', default: 0 },
        { name: 'definition', type: 'text' },
      ],
      indices: [{ name: 'IDX_channels_revision_key', columnNames: ['revisionId', 'key'], isUnique: true }],
      foreignKeys: [{ name: 'FK_channels_revision', columnNames: ['revisionId'], referencedTableName: 'revisions', referencedColumnNames: ['id'], onDelete: 'CASCADE' }],
    }));
    await q.createTable(new Table({
      name: 'resistor_series',
      columns: [
        { name: 'name', type: 'varchar', length: '8', isPrimary: true },
        { name: 'valuesPerDecade', type: 'integer' },
        { name: 'values', type: 'text' },
      ],
    }));
    await q.createTable(new Table({
      name: 'stock_parts',
      columns: [
        idColumn(),
        { name: 'ohms', type: 'real' },
        { name: 'tolerancePct', type: 'real' },
        { name: 'tcrPpmPerK', type: 'real', default: 0 },
        { name: 'voltageCoefficientPpmPerV', type: 'real', default: 0 },
        { name: 'ratedVoltageV', type: 'real', isNullable: true },
        { name: 'ratedPowerW', type: 'real', isNullable: true },
        { name: 'package', type: 'varchar', length: '40', default: "''" },
        { name: 'quantity', type: 'integer', default: 0 },
        { name: 'note', type: 'varchar', length: '500', default: "''" },
        createdColumn(q, 'createdAt'),
        createdColumn(q, 'updatedAt'),
      ],
      indices: [{ name: 'IDX_stock_parts_ohms', columnNames: ['ohms'] }],
    }));
    await q.createTable(new Table({
      name: 'analysis_runs',
      columns: [
        idColumn(),
        { name: 'revisionId', type: 'integer' },
        { name: 'kind', type: 'varchar', length: '20' },
        { name: 'inputs', type: 'text' },
        { name: 'inputsHash', type: 'varchar', length: '64' },
        { name: 'seed', type: 'integer' },
        { name: 'trials', type: 'integer', isNullable: true },
        { name: 'adaptiveDigits', type: 'integer', isNullable: true },
        { name: 'state', type: 'varchar', length: '12', default: "'queued'" },
        { name: 'progress', type: 'real', default: 0 },
        { name: 'result', type: 'text', isNullable: true },
        { name: 'error', type: 'text', isNullable: true },
        { name: 'requestedById', type: 'integer' },
        createdColumn(q, 'createdAt'),
        { name: 'startedAt', type: dt, isNullable: true },
        { name: 'finishedAt', type: dt, isNullable: true },
        { name: 'durationMs', type: 'integer', isNullable: true },
      ],
      indices: [
        { name: 'IDX_analysis_runs_revision', columnNames: ['revisionId', 'kind'] },
        { name: 'IDX_analysis_runs_state', columnNames: ['state'] },
      ],
      foreignKeys: [
        { name: 'FK_analysis_runs_revision', columnNames: ['revisionId'], referencedTableName: 'revisions', referencedColumnNames: ['id'], onDelete: 'CASCADE' },
        { name: 'FK_analysis_runs_requested_by', columnNames: ['requestedById'], referencedTableName: 'users', referencedColumnNames: ['id'], onDelete: 'RESTRICT' },
      ],
    }));
    // The IEC 60063 rows are written by OwnSeries1796271300000, once the table has its final columns.
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of ['analysis_runs', 'stock_parts', 'resistor_series', 'channels', 'revisions', 'designs']) await q.dropTable(table);
  }
}
