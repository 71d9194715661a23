import { Table, type MigrationInterface, type QueryRunner } from 'typeorm';
import { createdColumn, idColumn } from './portable.js';

export class MarginReview1796233200000 implements MigrationInterface {
  name = 'MarginReview1796233200000';

  async up(q: QueryRunner): Promise<void> {
    await q.createTable(new Table({
      name: 'margin_inputs',
      columns: [
        idColumn(),
        { name: 'revisionId', type: 'integer' },
        { name: 'inputs', type: 'text' },
        { name: 'updatedById', type: 'integer', isNullable: true },
        createdColumn(q, 'updatedAt'),
      ],
      indices: [{ name: 'IDX_margin_inputs_revision', columnNames: ['revisionId'], isUnique: true }],
      foreignKeys: [
        { name: 'FK_margin_inputs_revision', columnNames: ['revisionId'], referencedTableName: 'revisions', referencedColumnNames: ['id'], onDelete: 'CASCADE' },
        { name: 'FK_margin_inputs_updated_by', columnNames: ['updatedById'], referencedTableName: 'users', referencedColumnNames: ['id'], onDelete: 'SET NULL' },
      ],
    }));
  }

  async down(q: QueryRunner): Promise<void> {
    await q.dropTable('margin_inputs');
  }
}
