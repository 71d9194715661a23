import { Table, type MigrationInterface, type QueryRunner } from 'typeorm';
import { createdColumn, dateTimeType, idColumn } from './portable.js';

/** One-time password-reset links (hashed tokens), spent or expired, per person. */
export class PasswordResets1796260000000 implements MigrationInterface {
  name = 'PasswordResets1796260000000';

  async up(q: QueryRunner): Promise<void> {
    const dt = dateTimeType(q);
    await q.createTable(new Table({
      name: 'password_reset_tokens',
      columns: [
        idColumn(),
        { name: 'tokenHash', type: 'varchar', length: '64' },
        { name: 'userId', type: 'integer' },
        { name: 'expiresAt', type: dt },
        { name: 'usedAt', type: dt, isNullable: true },
        createdColumn(q, 'createdAt'),
      ],
      indices: [
        { name: 'IDX_password_reset_tokens_hash', columnNames: ['tokenHash'], isUnique: true },
        { name: 'IDX_password_reset_tokens_user', columnNames: ['userId'] },
      ],
      foreignKeys: [
        { name: 'FK_password_reset_tokens_user', columnNames: ['userId'], referencedTableName: 'users', referencedColumnNames: ['id'], onDelete: 'CASCADE' },
      ],
    }));
  }

  async down(q: QueryRunner): Promise<void> {
    await q.dropTable('password_reset_tokens');
  }
}
