import { TableColumn, type QueryRunner, type TableColumnOptions } from 'typeorm';

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

/** PostgreSQL reports a CURRENT_TIMESTAMP default back as now(), the form TypeORM compares the entities with. */
export const createdColumn = (queryRunner: QueryRunner, name: string): TableColumnOptions => ({
  name, type: dateTimeType(queryRunner), isNullable: false,
  default: queryRunner.connection.options.type === 'postgres' ? 'now()' : 'CURRENT_TIMESTAMP',
});

/** SQLite stores booleans as 0/1 and TypeORM compares defaults in that form; PostgreSQL wants true/false. */
export function booleanDefault(queryRunner: QueryRunner, value: boolean): string | number {
  if (queryRunner.connection.options.type === 'postgres') return String(value);
  return value ? 1 : 0;
}

/**
 * Changes a varchar column's length keeping its rows. TypeORM's changeColumn drops and re-adds a PostgreSQL column
 * whose length changes (losing its values, and failing on a NOT NULL key with rows); PostgreSQL can alter the type
 * in place. SQLite keeps changeColumn, which copies the table.
 */
export async function changeVarcharLength(q: QueryRunner, table: string, column: TableColumnOptions & { length: string }): Promise<void> {
  if (q.connection.options.type !== 'postgres') {
    await q.changeColumn(table, column.name, new TableColumn(column));
    return;
  }
  const length = Number(column.length);
  if (!Number.isInteger(length) || length < 1) throw new Error(`varchar length must be a positive integer, got ${column.length}`);
  const escape = (name: string) => q.connection.driver.escape(name);
  await q.query(`ALTER TABLE ${escape(table)} ALTER COLUMN ${escape(column.name)} TYPE varchar(${length})`);
}
