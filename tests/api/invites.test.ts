import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { InviteToken } from '../../server/entities/InviteToken.js';
import { User } from '../../server/entities/User.js';

/** Pulls the invitation link out of a stored message, as a person clicking it would. */
function linkFrom(text: string): { url: URL; token: string } {
  const match = text.match(/https?:\/\/\S+\/invite\/([A-Za-z0-9_-]+)/);
  if (!match) throw new Error(`no invitation link in: ${text}`);
  return { url: new URL(match[0]), token: match[1] };
}

describe('invitation flow through the SMTP fake', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp(); });
  afterAll(async () => { await t.close(); });

  async function invite(email: string, role = 'tester') {
    const admin = await t.signIn('admin@example.test', 'tallyvolt-admin');
    const res = await admin.post('/api/invites').send({ email, role });
    expect(res.status).toBe(201);
    const message = (await t.outbox()).find((m) => m.to.includes(email));
    expect(message, 'the invitation reached the outbox').toBeDefined();
    return { res, message: message!, ...linkFrom(message!.text) };
  }

  it('invites by e-mail, follows the link, sets a password and signs in as the new person', async () => {
    const { res, message, url, token } = await invite('new.tester@example.test');
    expect(res.body.invite).toMatchObject({ email: 'new.tester@example.test', role: 'tester' });
    expect(message.subject).toBe('Your Tallyvolt invitation');
    expect(message.html).toContain(`href="${url.href}"`);
    expect(url.origin).toBe('http://tallyvolt.test');
    // Only the hash of the token is stored.
    const stored = await t.dataSource.getRepository(InviteToken).find();
    expect(stored.some((s) => s.tokenHash === token)).toBe(false);
    expect(stored.find((s) => s.email === 'new.tester@example.test')!.tokenHash).toMatch(/^[0-9a-f]{64}$/);

    const lookup = await t.agent().get(`/api/invites/${token}`);
    expect(lookup.status).toBe(200);
    expect(lookup.body).toMatchObject({ email: 'new.tester@example.test', role: 'tester' });

    const newcomer = t.agent();
    const accepted = await newcomer.post('/api/invites/accept').send({ token, displayName: 'Pell Ardent', password: 'a long bench passphrase' });
    expect(accepted.status).toBe(201);
    expect(accepted.body.user).toMatchObject({ email: 'new.tester@example.test', role: 'tester', displayName: 'Pell Ardent' });
    expect((await newcomer.get('/api/auth/me')).body.user.email).toBe('new.tester@example.test');

    const again = await t.agent().post('/api/auth/sign-in').send({ email: 'new.tester@example.test', password: 'a long bench passphrase' });
    expect(again.status).toBe(200);
  });

  it('refuses a reused token with a clear message', async () => {
    const { token } = await invite('twice@example.test', 'lead');
    const first = await t.agent().post('/api/invites/accept').send({ token, displayName: 'Once Only', password: 'twelve chars ok' });
    expect(first.status).toBe(201);
    const second = await t.agent().post('/api/invites/accept').send({ token, displayName: 'Once More', password: 'twelve chars ok' });
    expect(second.status).toBe(410);
    expect(second.body.error).toMatch(/already been used/);
    expect((await t.agent().get(`/api/invites/${token}`)).status).toBe(410);
  });

  it('refuses an expired token with a clear message', async () => {
    const { token } = await invite('late@example.test');
    await t.dataSource.getRepository(InviteToken).update({ email: 'late@example.test' }, { expiresAt: new Date(Date.now() - 1000) });
    const res = await t.agent().post('/api/invites/accept').send({ token, displayName: 'Too Late', password: 'twelve chars ok' });
    expect(res.status).toBe(410);
    expect(res.body.error).toMatch(/expired on .* UTC; ask an admin for a new one/);
    expect(await t.dataSource.getRepository(User).existsBy({ email: 'late@example.test' })).toBe(false);
  });

  it('sets a 72-hour expiry', async () => {
    const before = Date.now();
    const { res } = await invite('clock@example.test');
    const hours = (Date.parse(res.body.invite.expiresAt) - before) / 3_600_000;
    expect(hours).toBeGreaterThan(71.99);
    expect(hours).toBeLessThan(72.01);
  });

  it('refuses a short password naming the field and the minimum, and keeps the token usable', async () => {
    const { token } = await invite('short@example.test');
    const res = await t.agent().post('/api/invites/accept').send({ token, displayName: 'Short Pass', password: 'short' });
    expect(res.status).toBe(400);
    expect(res.body.fields.password).toBe('password must be at least 12 characters');
    expect((await t.agent().get(`/api/invites/${token}`)).status).toBe(200);
  });

  it('refuses blank, repeated, run and common passwords naming the field, and keeps the token usable', async () => {
    const { token } = await invite('weak@example.test');
    const weak: [string, RegExp][] = [
      [' '.repeat(12), /only spaces/], // the example
      ['123456789012', /straight run|common password/], // the example
      ['aaaaaaaaaaaa', /different characters/], // common practice
      ['abcabcabcabc', /different characters/], // common practice
      ['Password1234', /common password/], // common practice
      ['P@ssw0rd2026!', /common password/], // common practice: look-alike digits
      ['qwertyuiop12', /common password/], // common practice: keyboard row
      ['Tallyvolt2026', /common password/], // the product name
    ];
    for (const [password, reason] of weak) {
      const res = await t.agent().post('/api/invites/accept').send({ token, displayName: 'Weak Pass', password });
      expect(res.status, password).toBe(400);
      expect(res.body.fields.password, password).toMatch(reason);
    }
    expect((await t.agent().get(`/api/invites/${token}`)).status).toBe(200);
  });

  it('refuses a display name with nothing visible, or one someone already has in another case', async () => {
    const { token } = await invite('names@example.test');
    for (const displayName of ['   ', '\u200b\u200b\u200b', '\u00a0\u3000', 'Ab\u0007c']) {
      const res = await t.agent().post('/api/invites/accept').send({ token, displayName, password: 'a long bench passphrase' });
      expect(res.status, JSON.stringify(displayName)).toBe(400);
      expect(res.body.fields.displayName).toBeDefined();
    }
    const taken = await t.agent().post('/api/invites/accept').send({ token, displayName: '  tamsin  FENWRIGHT ', password: 'a long bench passphrase' });
    expect(taken.status).toBe(409);
    expect(taken.body.fields.displayName).toBe('someone already has this display name');
    expect((await t.agent().get(`/api/invites/${token}`)).status).toBe(200);
    const ok = await t.agent().post('/api/invites/accept').send({ token, displayName: '  Nell Quarry  ', password: 'a long bench passphrase' });
    expect(ok.status).toBe(201);
    expect(ok.body.user.displayName).toBe('Nell Quarry');
  });

  it('refuses an unknown token, an existing account and a non-admin inviter', async () => {
    expect((await t.agent().get(`/api/invites/${'x'.repeat(43)}`)).status).toBe(404);
    const admin = await t.signIn('admin@example.test', 'tallyvolt-admin');
    const dup = await admin.post('/api/invites').send({ email: 'designer@example.test', role: 'lead' });
    expect(dup.status).toBe(409);
    expect(dup.body.fields.email).toBe('already has an account');
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    expect((await designer.post('/api/invites').send({ email: 'x@example.test', role: 'lead' })).status).toBe(403);
  });
});
