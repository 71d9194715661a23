import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

describe('asking whether anyone is signed in', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp(); });
  afterAll(async () => { await t.close(); });

  it('answers 200 with no user before sign-in, so a signed-out page load logs no failed request', async () => {
    const res = await t.agent().get('/api/auth/session');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ user: null });
  });

  it('answers with the signed-in person, and with no user again after a deliberate sign-out', async () => {
    const tester = await t.signIn('tester@example.test', 'tallyvolt-tester');
    const during = await tester.get('/api/auth/session');
    expect(during.status).toBe(200);
    expect(during.body.user).toMatchObject({ email: 'tester@example.test', role: 'tester' });
    expect(during.body.user.passwordHash).toBeUndefined();
    expect((await tester.post('/api/auth/sign-out')).status).toBe(204);
    const after = await tester.get('/api/auth/session');
    expect(after.status).toBe(200);
    expect(after.body).toEqual({ user: null });
    expect((await tester.get('/api/auth/me')).status).toBe(401);
  });
});
