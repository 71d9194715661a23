import { Table, type MigrationInterface, type QueryRunner } from 'typeorm';
import { booleanDefault, createdColumn, dateTimeType, idColumn } from './portable.js';

export class Foundation1796218693528 implements MigrationInterface {
  name = 'Foundation1796218693528';

  async up(q: QueryRunner): Promise<void> {
    const dt = dateTimeType(q);
    await q.createTable(new Table({
      name: 'users',
      columns: [
        idColumn(),
        { name: 'email', type: 'varchar', length: '254' },
        { name: 'displayName', type: 'varchar', length: '120' },
        { name: 'role', type: 'varchar', length: '16' },
        { name: 'passwordHash', type: 'varchar', length: '100' },
        { name: 'active', type: 'boolean', default: booleanDefault(q, true) },
        createdColumn(q, 'createdAt'),
      ],
      indices: [{ name: 'IDX_users_email', columnNames: ['email'], isUnique: true }],
    }));
    await q.createTable(new Table({
      name: 'invite_tokens',
      columns: [
        idColumn(),
        { name: 'tokenHash', type: 'varchar', length: '64' },
        { name: 'email', type: 'varchar', length: '254' },
        { name: 'role', type: 'varchar', length: '16' },
        { name: 'expiresAt', type: dt },
        { name: 'usedAt', type: dt, isNullable: true },
        createdColumn(q, 'createdAt'),
        { name: 'invitedById', type: 'integer', isNullable: true },
      ],
      indices: [{ name: 'IDX_invite_tokens_hash', columnNames: ['tokenHash'], isUnique: true }],
      foreignKeys: [{ name: 'FK_invite_tokens_invited_by', columnNames: ['invitedById'], referencedTableName: 'users', referencedColumnNames: ['id'], onDelete: 'SET NULL' }],
    }));
    await q.createTable(new Table({
      name: 'audit_events',
      columns: [
        idColumn(),
        { name: 'actorId', type: 'integer', isNullable: true },
        { name: 'action', type: 'varchar', length: '64' },
        { name: 'subject', type: 'varchar', length: '120' },
        { name: 'detail', type: 'text', isNullable: true },
        createdColumn(q, 'at'),
      ],
      indices: [{ name: 'IDX_audit_events_subject', columnNames: ['subject'] }],
    }));
    await q.createTable(new Table({
      name: 'outbox_messages',
      columns: [
        idColumn(),
        { name: 'to', type: 'varchar', length: '1000' },
        { name: 'from', type: 'varchar', length: '254' },
        { name: 'subject', type: 'varchar', length: '500' },
        { name: 'text', type: 'text' },
        { name: 'html', type: 'text', isNullable: true },
        createdColumn(q, 'receivedAt'),
      ],
    }));
    await q.createTable(new Table({
      name: 'sessions',
      columns: [
        { name: 'id', type: 'varchar', length: '255', isPrimary: true },
        { name: 'expiredAt', type: 'bigint' },
        { name: 'json', type: 'text' },
        { name: 'destroyedAt', type: dt, isNullable: true },
      ],
      indices: [{ name: 'IDX_sessions_expired_at', columnNames: ['expiredAt'] }],
    }));
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of ['sessions', 'outbox_messages', 'audit_events', 'invite_tokens', 'users']) await q.dropTable(table);
  }
}
