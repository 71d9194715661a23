import Database from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { DEMO_USERS } from '../../server/seed/demo-team.js';
import { SessionRecord } from '../../server/entities/SessionRecord.js';

const designer = DEMO_USERS.find((u) => u.role === 'designer')!;

describe('stored sessions', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp(); });
  afterAll(async () => { await t.close(); });

  it('reads a session with the same SQL on every request, so the statement cache is not churned', async () => {
    const agent = await t.signIn(designer.email, designer.password);
    const prepare = vi.spyOn(Database.prototype, 'prepare');
    try {
      for (let i = 0; i < 5; i++) {
        expect((await agent.get('/api/auth/me')).status).toBe(200);
        await new Promise((r) => setTimeout(r, 3));
      }
      // Warm statements are reused from TypeORM's cache; a time written into the SQL would prepare one per request.
      const sessionReads = prepare.mock.calls.map(([sql]) => String(sql)).filter((sql) => sql.startsWith('SELECT') && sql.includes('"sessions"'));
      expect(sessionReads.length).toBeLessThanOrEqual(1);
    } finally {
      prepare.mockRestore();
    }
  });

  it('refuses a session whose stored expiry has passed', async () => {
    const agent = await t.signIn(designer.email, designer.password);
    const sessions = t.dataSource.getRepository(SessionRecord);
    const before = await sessions.find();
    await sessions.createQueryBuilder().update().set({ expiredAt: Date.now() - 1000 }).execute();
    expect((await agent.get('/api/auth/me')).status).toBe(401);
    // the rows themselves are left for the store's clean-up
    expect((await sessions.find()).length).toBe(before.length);
  });

  it('ends every session of a deactivated person, so reactivation does not revive an idle one', async () => {
    const tester = DEMO_USERS.find((u) => u.role === 'tester')!;
    const idle = await t.signIn(tester.email, tester.password);
    const other = await t.signIn(tester.email, tester.password);
    const admin = await t.signIn('admin@example.test', 'tallyvolt-admin');
    const testerId = (await idle.get('/api/auth/me')).body.user.id;
    expect((await admin.patch(`/api/users/${testerId}`).send({ active: false })).status).toBe(200);
    const left = (await t.dataSource.getRepository(SessionRecord).find()).filter((r) => JSON.parse(r.json).passport?.user === testerId);
    expect(left).toEqual([]);
    expect((await admin.patch(`/api/users/${testerId}`).send({ active: true })).status).toBe(200);
    expect((await idle.get('/api/auth/me')).status).toBe(401);
    expect((await other.get('/api/auth/me')).status).toBe(401);
    // the admin's own session is untouched, and the person can sign in afresh
    expect((await admin.get('/api/auth/me')).status).toBe(200);
    expect((await t.agent().post('/api/auth/sign-in').send({ email: tester.email, password: tester.password })).status).toBe(200);
  });

  it('refuses a session destroyed by sign-out, even if its cookie is replayed', async () => {
    const res = await t.agent().post('/api/auth/sign-in').send({ email: designer.email, password: designer.password });
    const cookie = String(res.headers['set-cookie']).split(';')[0];
    expect((await t.agent().get('/api/auth/me').set('cookie', cookie)).status).toBe(200);
    const out = await t.agent().post('/api/auth/sign-out').set('cookie', cookie);
    expect(out.status).toBeLessThan(300);
    expect((await t.agent().get('/api/auth/me').set('cookie', cookie)).status).toBe(401);
  });
});
