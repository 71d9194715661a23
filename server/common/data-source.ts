import 'reflect-metadata';
import fs from 'node:fs';
import path from 'node:path';
import { DataSource, getMetadataArgsStorage } from 'typeorm';
import { entities } from '../entities/index.js';
import { migrations } from '../migrations/index.js';
import { loadConfig, databaseTarget } from '../config.js';

/** A `postgres://` or `postgresql://` URL selects PostgreSQL; anything else is a SQLite file path. */
export function isPostgresUrl(target: string): boolean {
  return /^postgres(ql)?:\/\//i.test(target);
}

/**
 * The entities name their timestamps `datetime` (SQLite's word); PostgreSQL calls the same column `timestamp`.
 * TypeORM builds metadata from these arguments when a data source initialises, so naming the dialect's word here,
 * once per data source, keeps the entities and the SQLite schema unchanged.
 */
function useTimestampWord(word: 'datetime' | 'timestamp'): void {
  for (const column of getMetadataArgsStorage().columns) {
    if (column.options.type === 'datetime' || column.options.type === 'timestamp') column.options.type = word;
  }
}

/**
 * The one place the database is chosen. SQLite: one file through better-sqlite3; WAL lets readers run beside the
 * writer, foreign keys are off by default in SQLite, and the busy timeout makes a second writer wait instead of
 * failing at once. PostgreSQL: the `pg` driver with a small pool per process (several app instances and workers
 * share one server).
 */
export function createDataSource(target: string, busyTimeoutMs = 5000): DataSource {
  if (isPostgresUrl(target)) {
    useTimestampWord('timestamp');
    return new DataSource({
      type: 'postgres',
      url: target,
      entities,
      migrations,
      // `migrations` is the rate-limit store's own record table (server/common/rate-limit-store.ts)
      migrationsTableName: 'schema_migrations',
      migrationsRun: false,
      synchronize: false,
      logging: ['error'],
      extra: { max: 10 },
    });
  }
  useTimestampWord('datetime');
  if (target !== ':memory:') fs.mkdirSync(path.dirname(target), { recursive: true });
  return new DataSource({
    type: 'better-sqlite3',
    database: target,
    entities,
    migrations,
    migrationsRun: false,
    synchronize: false,
    logging: ['error'],
    prepareDatabase: (db: { pragma: (s: string) => unknown }) => {
      if (target !== ':memory:') db.pragma('journal_mode = WAL');
      db.pragma('foreign_keys = ON');
      db.pragma(`busy_timeout = ${Math.round(busyTimeoutMs)}`);
    },
  });
}

/** For the TypeORM CLI (`npm run migration:generate`). */
export default createDataSource(databaseTarget(loadConfig()));
