import type { QueryRunner, TableColumnOptions } from 'typeorm';

/**
 * Column helpers for migrations written with TypeORM's schema API (not raw SQL), so the same migration
 * runs on SQLite today and on PostgreSQL later; only the timestamp type name differs between them.
 */
export function dateTimeType(queryRunner: QueryRunner): string {
  return queryRunner.connection.options.type === 'postgres' ? 'timestamp' : 'datetime';
}

export const idColumn = (): TableColumnOptions => ({
  name: 'id', type: 'integer', isPrimary: true, isGenerated: true, generationStrategy: 'increment',
});

export const createdColumn = (queryRunner: QueryRunner, name: string): TableColumnOptions => ({
  name, type: dateTimeType(queryRunner), isNullable: false, default: 'CURRENT_TIMESTAMP',
});

/** SQLite stores booleans as 0/1 and TypeORM compares defaults in that form; PostgreSQL wants true/false. */
export function booleanDefault(queryRunner: QueryRunner, value: boolean): string | number {
  if (queryRunner.connection.options.type === 'postgres') return String(value);
  return value ? 1 : 0;
}
