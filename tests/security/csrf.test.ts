import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

describe('cross-site request defence', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp(); });
  afterAll(async () => { await t.close(); });

  it('refuses a state-changing request that a browser marks cross-site, even with a valid session', async () => {
    const admin = await t.signIn('admin@example.test', 'tallyvolt-admin');
    const res = await admin.post('/api/invites').set('Sec-Fetch-Site', 'cross-site').send({ email: 'x@example.test', role: 'lead' });
    expect(res.status).toBe(403);
    expect(res.body.error).toMatch(/cross-site request refused/);
    expect(await t.outbox()).toHaveLength(0);
  });

  it('refuses a foreign or opaque Origin and accepts our own', async () => {
    const admin = await t.signIn('admin@example.test', 'tallyvolt-admin');
    const foreign = await admin.post('/api/invites').set('Origin', 'https://elsewhere.example.test').send({ email: 'y@example.test', role: 'lead' });
    expect(foreign.status).toBe(403);
    const opaque = await admin.post('/api/invites').set('Origin', 'null').send({ email: 'y@example.test', role: 'lead' });
    expect(opaque.status).toBe(403);
    const own = await admin.post('/api/invites').set('Host', 'tallyvolt.test').set('Origin', 'http://tallyvolt.test').set('Sec-Fetch-Site', 'same-origin')
      .send({ email: 'y@example.test', role: 'lead' });
    expect(own.status).toBe(201);
  });

  it('lets reads through from anywhere (they change nothing)', async () => {
    const admin = await t.signIn('admin@example.test', 'tallyvolt-admin');
    expect((await admin.get('/api/users').set('Sec-Fetch-Site', 'cross-site')).status).toBe(200);
  });

  it('regenerates the session id at sign-in, so a planted id is useless', async () => {
    const agent = t.agent();
    await agent.post('/api/auth/sign-in').send({ email: 'nobody@example.test', password: 'wrong one' });
    const first = await agent.post('/api/auth/sign-in').send({ email: 'lead@example.test', password: 'tallyvolt-lead' });
    const cookieA = String(first.headers['set-cookie']).split(';')[0];
    await agent.post('/api/auth/sign-out');
    const second = await agent.post('/api/auth/sign-in').send({ email: 'lead@example.test', password: 'tallyvolt-lead' });
    const cookieB = String(second.headers['set-cookie']).split(';')[0];
    expect(cookieA).not.toBe(cookieB);
    // The old cookie no longer signs anyone in.
    const stale = await t.agent().get('/api/auth/me').set('Cookie', cookieA);
    expect(stale.status).toBe(401);
  });

  it('sets Secure on the cookie behind an HTTPS proxy when TRUST_PROXY is on', async () => {
    const proxied = await createTestApp({ trustProxy: true });
    try {
      const res = await proxied.agent().post('/api/auth/sign-in').set('X-Forwarded-Proto', 'https')
        .send({ email: 'lead@example.test', password: 'tallyvolt-lead' });
      expect(String(res.headers['set-cookie'])).toMatch(/Secure/);
    } finally {
      await proxied.close();
    }
  });
});

describe('invitation guessing', () => {
  it('is limited per address with a 429 and a message', async () => {
    const t = await createTestApp();
    try {
      const statuses: number[] = [];
      for (let i = 0; i < 31; i++) statuses.push((await t.agent().get(`/api/invites/${'g'.repeat(40)}${String(i).padStart(3, '0')}`)).status);
      expect(statuses.slice(0, 30).every((s) => s === 404)).toBe(true);
      const limited = await t.agent().post('/api/invites/accept').send({ token: 'x'.repeat(43), displayName: 'Guess Er', password: 'long enough pass' });
      expect(limited.status).toBe(429);
      expect(limited.body.error).toMatch(/too many invitation attempts/);
    } finally {
      await t.close();
    }
  });
});
