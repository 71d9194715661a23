import fs from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';
import pg from 'pg';
import { PostgresStore } from '@acpr/rate-limit-postgresql';
import type { Store } from 'express-rate-limit';

type StoreFactory = (prefix: string) => Store;
type PooledStore = { pool?: { end(): Promise<void>; on(event: 'error', f: (err: Error) => void): void } };

export interface SharedRateLimits {
  storeFor: StoreFactory;
  /** Ends the stores' connections (on shutdown, and before a test drops its database). */
  close(): Promise<void>;
}

/** Any fixed number: instances starting together take turns at creating the store's tables. */
const SETUP_LOCK = 740_316_021;

/**
 * On PostgreSQL the request counters live in the database (schema `rate_limit`, created by the store package), so
 * several app instances behind one proxy count together; on SQLite (one process) they stay in memory.
 *
 * The store starts its own migrations from its constructor without a way to wait for them, and two running at
 * once leave a broken migration record; so one store is created under an advisory lock here and its migrations
 * waited for, before the app builds the real ones (which then find everything in place).
 */
export async function rateLimitStoreFor(databaseUrl: string | null): Promise<SharedRateLimits | null> {
  if (!databaseUrl) return null;
  const migrationCount = fs.readdirSync(path.join(packageDir(), 'dist', 'migrations')).filter((f) => f.endsWith('.sql')).length;
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    await client.query('SELECT pg_advisory_lock($1)', [SETUP_LOCK]);
    if ((await appliedMigrations(client)) < migrationCount) {
      const probe = new PostgresStore({ connectionString: databaseUrl, max: 1 }, 'tallyvolt-setup');
      for (let waited = 0; (await appliedMigrations(client)) < migrationCount; waited += 100) {
        if (waited > 30_000) throw new Error('the rate-limit store did not create its tables within 30 s');
        await sleep(100);
      }
      await (probe as unknown as PooledStore).pool?.end();
    }
  } finally {
    await client.query('SELECT pg_advisory_unlock($1)', [SETUP_LOCK]).catch(() => undefined);
    await client.end();
  }
  const stores: PooledStore[] = [];
  return {
    storeFor(prefix) {
      const store = new PostgresStore({ connectionString: databaseUrl, max: 2 }, `tallyvolt-${prefix}`);
      const init = store.init.bind(store);
      store.init = (options) => {
        init(options);
        // A dropped connection costs one counted request at most; it must not end the process
        (store as unknown as PooledStore).pool?.on('error', (err) => console.error('[rate-limit] store connection:', err.message));
      };
      stores.push(store as unknown as PooledStore);
      return store as unknown as Store;
    },
    async close() {
      await Promise.all(stores.map((store) => store.pool?.end().catch(() => undefined)));
    },
  };
}

/** The store records its steps in `public.migrations` (id 0 is the record table itself). */
async function appliedMigrations(client: pg.Client): Promise<number> {
  const table = await client.query(`SELECT to_regclass('public.migrations') AS name`);
  if (!table.rows[0]?.name) return 0;
  const rows = await client.query('SELECT count(*)::int AS n FROM public.migrations WHERE id > 0');
  return rows.rows[0].n as number;
}

function packageDir(): string {
  const require = createRequire(import.meta.url);
  return path.dirname(path.dirname(require.resolve('@acpr/rate-limit-postgresql')));
}
