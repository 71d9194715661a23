import 'reflect-metadata';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bootstrap, type Running } from '../../server/bootstrap.js';
import { loadConfig, type AppConfig } from '../../server/config.js';
import { DEMO_USERS } from '../../server/seed/demo-team.js';
import { createTestDatabase, type TestDatabase } from '../helpers/test-app.js';

const tester = DEMO_USERS.find((u) => u.role === 'tester')!;

/** Two app instances on one PostgreSQL database, as behind a reverse proxy. */
describe('several app instances on one PostgreSQL database', () => {
  let db: TestDatabase;
  let dir: string;
  let a: Running;
  let b: Running;
  beforeAll(async () => {
    db = await createTestDatabase();
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyvolt-instances-'));
    const config: AppConfig = {
      ...loadConfig({}),
      databasePath: path.join(dir, 'unused.sqlite'),
      databaseUrl: db.url,
      sessionSecret: 'test-secret-not-for-use',
      distDir: path.join(dir, 'no-dist'),
      publicUrl: 'http://tallyvolt.test',
    };
    a = await bootstrap(config, { seed: 'team' });
    b = await bootstrap(config, { seed: 'team' });
  });
  afterAll(async () => {
    await a?.close();
    await b?.close();
    await db?.drop();
    fs.rmSync(dir, { recursive: true, force: true });
  });

  it('keeps a person signed in through A signed in on B', async () => {
    const res = await request(a.app).post('/api/auth/sign-in').send({ email: tester.email, password: tester.password });
    expect(res.status).toBe(200);
    const cookie = String(res.headers['set-cookie']).split(';')[0];
    const me = await request(b.app).get('/api/auth/me').set('cookie', cookie);
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(tester.email);
  });

  it('ends on B at once the sessions of a person an admin deactivates on A', async () => {
    const signIn = await request(b.app).post('/api/auth/sign-in').send({ email: tester.email, password: tester.password });
    const cookie = String(signIn.headers['set-cookie']).split(';')[0];
    const testerId = (await request(b.app).get('/api/auth/me').set('cookie', cookie)).body.user.id;
    const admin = request.agent(a.app);
    expect((await admin.post('/api/auth/sign-in').send({ email: 'admin@example.test', password: 'tallyvolt-admin' })).status).toBe(200);
    expect((await admin.patch(`/api/users/${testerId}`).send({ active: false })).status).toBe(200);
    expect((await request(b.app).get('/api/auth/me').set('cookie', cookie)).status).toBe(401);
    expect((await admin.patch(`/api/users/${testerId}`).send({ active: true })).status).toBe(200);
  });

  it('counts password-reset attempts from one address across both instances', async () => {
    // the limit is 10 per address in 15 minutes (server/common/rate-limits.ts): 5 on each instance use it up
    for (let i = 0; i < 5; i++) {
      expect((await request(a.app).post('/api/auth/password-reset').send({ email: 'nobody@example.test' })).status).toBeLessThan(429);
      expect((await request(b.app).post('/api/auth/password-reset').send({ email: 'nobody@example.test' })).status).toBeLessThan(429);
    }
    const refused = await request(a.app).post('/api/auth/password-reset').send({ email: 'nobody@example.test' });
    expect(refused.status).toBe(429);
    expect(refused.body.error).toMatch(/too many password-reset attempts/);
  });
});
