import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { InviteToken } from '../../server/entities/InviteToken.js';

function tokenIn(text: string): string {
  const match = text.match(/\/invite\/([A-Za-z0-9_-]+)/);
  if (!match) throw new Error(`no invitation link in: ${text}`);
  return match[1];
}

describe('pending invitations', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp(); });
  afterAll(async () => { await t.close(); });
  const admin = () => t.signIn('admin@example.test', 'tallyvolt-admin');
  const lastTokenFor = async (email: string) => tokenIn((await t.outbox()).filter((m) => m.to.includes(email)).at(-1)!.text);

  it('lists invitations nobody has accepted, with who sent them, and not the accepted ones', async () => {
    const a = await admin();
    await a.post('/api/invites').send({ email: 'waiting@example.test', role: 'tester' }).expect(201);
    await a.post('/api/invites').send({ email: 'joined@example.test', role: 'lead' }).expect(201);
    const token = await lastTokenFor('joined@example.test');
    await t.agent().post('/api/invites/accept').send({ token, displayName: 'Joined Already', password: 'a long bench passphrase' }).expect(201);
    const list = await a.get('/api/invites');
    expect(list.status).toBe(200);
    expect(list.body.items).toHaveLength(1);
    expect(list.body.items[0]).toMatchObject({ email: 'waiting@example.test', role: 'tester', invitedBy: expect.any(String), expired: false });
    const sentToExpiryH = (Date.parse(list.body.items[0].expiresAt) - Date.parse(list.body.items[0].sentAt)) / 3.6e6;
    expect(sentToExpiryH).toBe(72); // the 72-hour invitation lifetime (in this product)
  });

  it('resends under a new token: the new link works and the old one is dead', async () => {
    const a = await admin();
    const old = await lastTokenFor('waiting@example.test');
    const id = (await a.get('/api/invites')).body.items[0].id;
    const before = (await t.outbox()).length;
    const resent = await a.post(`/api/invites/${id}/resend`);
    expect(resent.status).toBe(200);
    expect(resent.body.invite).toMatchObject({ id, email: 'waiting@example.test', expired: false });
    expect(await t.outbox()).toHaveLength(before + 1);
    const fresh = await lastTokenFor('waiting@example.test');
    expect(fresh).not.toBe(old);
    expect((await t.agent().get(`/api/invites/${old}`)).status).toBe(404);
    expect((await t.agent().get(`/api/invites/${fresh}`)).status).toBe(200);
  });

  it('renews an expired invitation when it is sent again', async () => {
    const a = await admin();
    await t.dataSource.getRepository(InviteToken).update({ email: 'waiting@example.test' }, { expiresAt: new Date(Date.now() - 1000) });
    const listed = (await a.get('/api/invites')).body.items[0];
    expect(listed.expired).toBe(true);
    const resent = await a.post(`/api/invites/${listed.id}/resend`);
    expect(resent.body.invite.expired).toBe(false);
  });

  it('revokes an invitation: it leaves the list and its link stops working', async () => {
    const a = await admin();
    const token = await lastTokenFor('waiting@example.test');
    const id = (await a.get('/api/invites')).body.items[0].id;
    expect((await a.delete(`/api/invites/${id}`)).status).toBe(204);
    expect((await a.get('/api/invites')).body.items).toEqual([]);
    const accept = await t.agent().post('/api/invites/accept').send({ token, displayName: 'Too Late', password: 'a long bench passphrase' });
    expect(accept.status).toBe(404);
    expect((await a.delete(`/api/invites/${id}`)).status).toBe(404);
  });

  it('refuses an accepted invitation, a bad id, and anyone but an admin', async () => {
    const a = await admin();
    const accepted = await t.dataSource.getRepository(InviteToken).findOneByOrFail({ email: 'joined@example.test' });
    expect((await a.post(`/api/invites/${accepted.id}/resend`)).status).toBe(410);
    expect((await a.delete(`/api/invites/${accepted.id}`)).status).toBe(410);
    const bad = await a.post('/api/invites/abc/resend');
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.fields ?? {})).toContain('id');
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    expect((await designer.get('/api/invites')).status).toBe(403);
    expect((await designer.post(`/api/invites/${accepted.id}/resend`)).status).toBe(403);
    expect((await designer.delete(`/api/invites/${accepted.id}`)).status).toBe(403);
    expect((await t.agent().get('/api/invites')).status).toBe(401);
  });
});
