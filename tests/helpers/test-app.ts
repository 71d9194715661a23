import 'reflect-metadata';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import crypto from 'node:crypto';
import pg from 'pg';
import request from 'supertest';
import { bootstrap, type Running } from '../../server/bootstrap.js';
import { loadConfig, type AppConfig } from '../../server/config.js';
import { OutboxMessage } from '../../server/entities/OutboxMessage.js';
import type { DemoSeed } from '../../server/seed/demo.js';

export interface TestApp extends Running {
  dir: string;
  config: AppConfig;
  /** A supertest agent keeps cookies, like one browser. */
  agent(): ReturnType<typeof request.agent>;
  signIn(email: string, password: string): Promise<ReturnType<typeof request.agent>>;
  outbox(): Promise<OutboxMessage[]>;
}

/**
 * `npm run test:pg` sets TEST_DATABASE_URL to a throw-away cluster; each test app then gets a database of its
 * own there (dropped on close), so the same test files run on PostgreSQL as on SQLite.
 */
export const testDatabaseUrl = process.env.TEST_DATABASE_URL || null;

export interface TestDatabase {
  url: string;
  drop(): Promise<void>;
}

/** A fresh empty PostgreSQL database on the test cluster. */
export async function createTestDatabase(clusterUrl = testDatabaseUrl): Promise<TestDatabase> {
  if (!clusterUrl) throw new Error('TEST_DATABASE_URL is not set (run through npm run test:pg)');
  const name = `tv_${crypto.randomBytes(6).toString('hex')}`;
  const admin = new pg.Client({ connectionString: clusterUrl });
  await admin.connect();
  try {
    await admin.query(`CREATE DATABASE ${name}`);
  } finally {
    await admin.end();
  }
  const url = new URL(clusterUrl);
  url.pathname = `/${name}`;
  return {
    url: url.toString(),
    async drop() {
      const client = new pg.Client({ connectionString: clusterUrl });
      await client.connect();
      try {
        await client.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
      } finally {
        await client.end();
      }
    },
  };
}

/** A real app on a fresh migrated SQLite file (or PostgreSQL database, see testDatabaseUrl) in a temp folder, with the SMTP fake and the demo team (or the full demo). */
export async function createTestApp(overrides: Partial<AppConfig> = {}, seed: DemoSeed = 'team'): Promise<TestApp> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyvolt-test-'));
  const database = testDatabaseUrl ? await createTestDatabase() : null;
  const config: AppConfig = {
    ...loadConfig({}),
    databasePath: path.join(dir, 'test.sqlite'),
    databaseUrl: database?.url ?? null,
    sessionSecret: 'test-secret-not-for-use',
    distDir: path.join(dir, 'no-dist'),
    publicUrl: 'http://tallyvolt.test',
    ...overrides,
  };
  const running = await bootstrap(config, { seed });
  return {
    ...running,
    dir,
    config,
    agent: () => request.agent(running.app),
    async signIn(email, password) {
      const agent = request.agent(running.app);
      const res = await agent.post('/api/auth/sign-in').send({ email, password });
      if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
      return agent;
    },
    outbox: () => running.dataSource.getRepository(OutboxMessage).find({ order: { id: 'ASC' } }),
    async close() {
      await running.close();
      await database?.drop();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
