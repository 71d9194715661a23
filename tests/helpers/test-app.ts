import 'reflect-metadata';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
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

/** A real app on a fresh migrated SQLite file in a temp folder, with the SMTP fake and the demo team (or the full demo). */
export async function createTestApp(overrides: Partial<AppConfig> = {}, seed: DemoSeed = 'team'): Promise<TestApp> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyvolt-test-'));
  const config: AppConfig = {
    ...loadConfig({}),
    databasePath: path.join(dir, 'test.sqlite'),
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
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
