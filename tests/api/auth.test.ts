import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { DEMO_USERS } from '../../server/seed/demo-team.js';

const designer = DEMO_USERS.find((u) => u.role === 'designer')!;

describe('sign-in', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp(); });
  afterAll(async () => { await t.close(); });

  it('signs in with the right password and returns the user without its hash', async () => {
    const agent = t.agent();
    const res = await agent.post('/api/auth/sign-in').send({ email: designer.email, password: designer.password });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email: designer.email, role: 'designer', active: true });
    expect(JSON.stringify(res.body)).not.toContain('passwordHash');
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(designer.email);
  });

  it('refuses a wrong password with 401 and the same message as an unknown account', async () => {
    const wrong = await t.agent().post('/api/auth/sign-in').send({ email: 'tester@example.test', password: 'not the password' });
    const unknown = await t.agent().post('/api/auth/sign-in').send({ email: 'nobody@example.test', password: 'not the password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error).toBe(unknown.body.error);
    expect(wrong.body.error).not.toMatch(/stack|sql/i);
  });

  it('names the missing field with 400', async () => {
    const res = await t.agent().post('/api/auth/sign-in').send({ email: designer.email });
    expect(res.status).toBe(400);
    expect(res.body.fields).toEqual({ password: 'password is required' });
    expect(res.body.error).toContain('password');
  });

  it('names an unknown field and a malformed e-mail', async () => {
    const res = await t.agent().post('/api/auth/sign-in').send({ email: 'not-an-address', password: 'x', admin: true });
    expect(res.status).toBe(400);
    expect(res.body.fields.email).toMatch(/not a valid address/);
    expect(res.body.fields.admin).toMatch(/not an allowed field/);
  });

  it('answers an unknown API path with 404 JSON and bad JSON with 400', async () => {
    const missing = await t.agent().get('/api/no-such-thing');
    expect(missing.status).toBe(404);
    expect(missing.body.error).toMatch(/no API route/);
    const bad = await t.agent().post('/api/auth/sign-in').set('content-type', 'application/json').send('{"email":');
    expect(bad.status).toBe(400);
    expect(bad.body.error).toBe('request body is not valid JSON');
  });

  it('refuses an oversized body with 413', async () => {
    const res = await t.agent().post('/api/auth/sign-in').send({ email: 'a@example.test', password: 'x'.repeat(300_000) });
    expect(res.status).toBe(413);
    expect(res.body.error).toMatch(/too large/);
  });

  it('returns 401 from /me when not signed in, and after sign-out', async () => {
    const agent = await t.signIn(designer.email, designer.password);
    expect((await agent.post('/api/auth/sign-out')).status).toBe(204);
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(401);
    expect(me.body.error).toBe('sign in first');
  });

  it('sets the security headers', async () => {
    const res = await t.agent().get('/api/auth/me');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});

describe('sign-in delay per account', () => {
  let t: TestApp;
  // Waits far longer than a request takes; the test moves the clock past them instead of sitting them out.
  beforeAll(async () => { t = await createTestApp({ signInDelay: { firstMs: 10_000, capMs: 40_000 } }); });
  afterAll(async () => { vi.useRealTimers(); await t.close(); });

  const signIn = (email: string, password: string) => t.agent().post('/api/auth/sign-in').send({ email, password });
  const passTime = (ms: number) => vi.setSystemTime(Date.now() + ms);

  it('makes the next try wait after a failure, says how long, and never locks the owner out', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    for (let i = 0; i < 8; i++) {
      expect((await signIn('lead@example.test', `guess ${i}`)).status).toBe(401);
      const early = await signIn('lead@example.test', 'tallyvolt-lead');
      expect(early.status).toBe(429);
      expect(early.body.error).toMatch(/wait \d+ s/);
      expect(Number(early.headers['retry-after'])).toBeGreaterThanOrEqual(1);
      passTime(45_000); // past the cap set above
    }
    // Eight wrong guesses later the right password still signs in once the wait is over.
    expect((await signIn('lead@example.test', 'tallyvolt-lead')).status).toBe(200);
    // and success clears the count
    expect((await signIn('lead@example.test', 'another guess')).status).toBe(401);
    vi.useRealTimers();
  });

  it('delays an unknown e-mail exactly as a real one, and leaves other accounts alone', async () => {
    expect((await signIn('nobody@example.test', 'a guess')).status).toBe(401);
    const early = await signIn('nobody@example.test', 'a guess');
    expect(early.status).toBe(429);
    expect(early.body.error).toMatch(/wait \d+ s/);
    expect((await signIn(designer.email, designer.password)).status).toBe(200);
  });
});
