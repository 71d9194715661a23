import type { DataSource } from 'typeorm';
import { createApp, type BuiltApp } from './app.js';
import { databaseTarget, type AppConfig } from './config.js';
import { createDataSource } from './common/data-source.js';
import { withRateLimitStore } from './common/rate-limits.js';
import { rateLimitStoreFor } from './common/rate-limit-store.js';
import { createMailer, startMailFake, type MailFake, type Mailer } from './common/mail.js';
import { seedDemoIfEmpty, type DemoSeed } from './seed/demo.js';
import { RunScheduler } from './api/runs/run-scheduler.js';
import { createStudyPool, type StudyPool } from './workers/study-pool.js';

export interface Running extends BuiltApp {
  dataSource: DataSource;
  mailer: Mailer;
  mailFake: MailFake | null;
  pool: StudyPool;
  scheduler: RunScheduler;
  close(): Promise<void>;
}

/** Opens the database (a SQLite path or a postgres:// URL) and applies every pending migration (never `synchronize`). */
export async function openDatabase(target: string, busyTimeoutMs?: number): Promise<DataSource> {
  const dataSource = createDataSource(target, busyTimeoutMs);
  await dataSource.initialize();
  await dataSource.runMigrations({ transaction: 'each' });
  return dataSource;
}

/** Everything `npm start` and the API tests need: migrated database, mail path, Express app. */
export async function bootstrap(config: AppConfig, options: { seed: DemoSeed | false }): Promise<Running> {
  const dataSource = await openDatabase(databaseTarget(config), config.busyTimeoutMs);
  if (options.seed) await seedDemoIfEmpty(dataSource, options.seed);
  const mailFake = config.smtpUrl ? null : await startMailFake(dataSource);
  const mailer = createMailer(config.mailFrom, config.smtpUrl ? { smtpUrl: config.smtpUrl } : { fakePort: mailFake!.port });
  const pool = createStudyPool(config.studyThreads);
  const scheduler = new RunScheduler(dataSource, pool);
  await scheduler.recover();
  const sharedLimits = await rateLimitStoreFor(config.databaseUrl);
  const built = withRateLimitStore(sharedLimits?.storeFor ?? null, () => createApp({ dataSource, mailer, config, scheduler }));
  return {
    ...built,
    dataSource,
    mailer,
    mailFake,
    pool,
    scheduler,
    async close() {
      await scheduler.close();
      await pool.close();
      await mailer.close();
      await mailFake?.close();
      await sharedLimits?.close();
      await dataSource.destroy();
    },
  };
}
