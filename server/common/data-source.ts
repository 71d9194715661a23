import 'reflect-metadata';
import fs from 'node:fs';
import path from 'node:path';
import { DataSource } from 'typeorm';
import { entities } from '../entities/index.js';
import { migrations } from '../migrations/index.js';
import { loadConfig } from '../config.js';

/**
 * One SQLite file through better-sqlite3. WAL lets readers run beside the writer, foreign keys are off by
 * default in SQLite, and the busy timeout makes a second writer wait instead of failing at once.
 */
export function createDataSource(databasePath: string, busyTimeoutMs = 5000): DataSource {
  if (databasePath !== ':memory:') fs.mkdirSync(path.dirname(databasePath), { recursive: true });
  return new DataSource({
    type: 'better-sqlite3',
    database: databasePath,
    entities,
    migrations,
    migrationsRun: false,
    synchronize: false,
    logging: ['error'],
    prepareDatabase: (db: { pragma: (s: string) => unknown }) => {
      if (databasePath !== ':memory:') db.pragma('journal_mode = WAL');
      db.pragma('foreign_keys = ON');
      db.pragma(`busy_timeout = ${Math.round(busyTimeoutMs)}`);
    },
  });
}

/** For the TypeORM CLI (`npm run migration:generate`). */
export default createDataSource(loadConfig().databasePath);
