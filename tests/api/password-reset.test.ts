import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { PasswordResetToken } from '../../server/entities/PasswordResetToken.js';
import { hashOneTimeToken } from '../../server/common/one-time-token.js';

const NEW_PASSWORD = 'lantern gravel orbit fennel';

/** Waits for the background mail of a reset request to reach the Outbox. */
async function resetMailFor(t: TestApp, email: string, count = 1): Promise<{ text: string; token: string }[]> {
  for (let i = 0; i < 100; i++) {
    const mails = (await t.outbox()).filter((m) => m.to.includes(email) && /new Tallyvolt password/.test(m.subject));
    if (mails.length >= count) {
      return mails.map((m) => ({ text: m.text, token: /\/reset-password\/([A-Za-z0-9_-]+)/.exec(m.text)![1] }));
    }
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`no reset mail for ${email}`);
}

describe('password reset by e-mail', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp({ rateLimits: false }); });
  afterAll(async () => { await t.close(); });

  it('mails a one-time link that sets a new password, ends the old sessions and spends the link', async () => {
    const oldSession = await t.signIn('tester@example.test', 'tallyvolt-tester');
    const asked = await t.agent().post('/api/auth/password-reset').send({ email: ' Tester@Example.test ' });
    expect(asked.status).toBe(202);
    const [{ text, token }] = await resetMailFor(t, 'tester@example.test');
    expect(text).toContain('http://tallyvolt.test/reset-password/');
    // only the token's SHA-256 is stored
    const stored = await t.dataSource.getRepository(PasswordResetToken).find();
    expect(stored.map((r) => r.tokenHash)).toContain(hashOneTimeToken(token));
    expect(JSON.stringify(stored)).not.toContain(token);

    const details = await t.agent().get(`/api/auth/password-reset/${token}`);
    expect(details.status).toBe(200);
    expect(details.body.email).toBe('tester@example.test');
    const hours = (Date.parse(details.body.expiresAt) - Date.now()) / 3600_000;
    expect(hours).toBeGreaterThan(0.98); // one hour, as chosen in the service
    expect(hours).toBeLessThanOrEqual(1);

    const weak = await t.agent().post('/api/auth/password-reset/complete').send({ token, password: 'password1234' });
    expect(weak.status).toBe(400);
    expect(weak.body.fields.password).toMatch(/common password/);

    const done = await t.agent().post('/api/auth/password-reset/complete').send({ token, password: NEW_PASSWORD });
    expect(done.status).toBe(200);
    expect((await oldSession.get('/api/auth/me')).status).toBe(401);
    expect((await t.agent().post('/api/auth/sign-in').send({ email: 'tester@example.test', password: 'tallyvolt-tester' })).status).toBe(401);
    expect((await t.agent().post('/api/auth/sign-in').send({ email: 'tester@example.test', password: NEW_PASSWORD })).status).toBe(200);

    const again = await t.agent().post('/api/auth/password-reset/complete').send({ token, password: 'another fresh phrase here' });
    expect(again.status).toBe(410);
    expect(again.body.error).toMatch(/already been used/);
  });

  it('answers an unknown e-mail exactly as a known one and sends it nothing', async () => {
    const unknown = await t.agent().post('/api/auth/password-reset').send({ email: 'nobody@example.test' });
    const known = await t.agent().post('/api/auth/password-reset').send({ email: 'lead@example.test' });
    expect(unknown.status).toBe(known.status);
    expect(unknown.body).toEqual(known.body);
    await resetMailFor(t, 'lead@example.test');
    expect((await t.outbox()).some((m) => m.to.includes('nobody@example.test'))).toBe(false);
  });

  it('refuses an expired link and an unknown one, naming why', async () => {
    await t.agent().post('/api/auth/password-reset').send({ email: 'designer@example.test' });
    const [{ token }] = await resetMailFor(t, 'designer@example.test');
    await t.dataSource.getRepository(PasswordResetToken).update({ tokenHash: hashOneTimeToken(token) }, { expiresAt: new Date(Date.now() - 1000) });
    const expired = await t.agent().post('/api/auth/password-reset/complete').send({ token, password: NEW_PASSWORD });
    expect(expired.status).toBe(410);
    expect(expired.body.error).toMatch(/expired/);
    expect((await t.agent().get(`/api/auth/password-reset/${'x'.repeat(43)}`)).status).toBe(404);
    const malformed = await t.agent().post('/api/auth/password-reset/complete').send({ token: 'short', password: NEW_PASSWORD });
    expect(malformed.status).toBe(400);
    expect(malformed.body.fields.token).toBeDefined();
  });

  it('sends one person at most three reset mails an hour', async () => {
    for (let i = 0; i < 5; i++) {
      expect((await t.agent().post('/api/auth/password-reset').send({ email: 'admin@example.test' })).status).toBe(202);
    }
    await resetMailFor(t, 'admin@example.test', 3);
    await new Promise((r) => setTimeout(r, 300));
    expect((await resetMailFor(t, 'admin@example.test')).length).toBe(3); // the service's hourly allowance
  });
});

describe('password reset rate limit', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp(); });
  afterAll(async () => { await t.close(); });

  it('answers 429 with a message once an address has made ten reset attempts', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 11; i++) {
      statuses.push((await t.agent().post('/api/auth/password-reset').send({ email: `guess${i}@example.test` })).status);
    }
    expect(statuses.slice(0, 10).every((s) => s === 202)).toBe(true);
    const limited = await t.agent().get(`/api/auth/password-reset/${'x'.repeat(43)}`);
    expect(limited.status).toBe(429);
    expect(limited.body.error).toMatch(/too many password-reset attempts/);
  });
});
