import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { DEMO_USERS } from '../../server/seed/demo-team.js';

const as = (role: string) => DEMO_USERS.find((u) => u.role === role)!;

describe('role guard', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp(); });
  afterAll(async () => { await t.close(); });

  it('refuses a designer calling an admin route with 403 naming the role needed', async () => {
    const agent = await t.signIn(as('designer').email, as('designer').password);
    const res = await agent.get('/api/users');
    expect(res.status).toBe(403);
    expect(res.body.error).toMatch(/needs the admin role/);
  });

  it('refuses anonymous callers with 401', async () => {
    expect((await t.agent().get('/api/users')).status).toBe(401);
    expect((await t.agent().get('/api/outbox')).status).toBe(401);
  });

  it('gives every route in the route table an access rule', () => {
    expect(t.routeTable.length).toBeGreaterThan(5);
    for (const row of t.routeTable) {
      expect(row.access === 'public' || row.access === 'signed-in' || (Array.isArray(row.access) && row.access.length > 0)).toBe(true);
    }
  });

  it('lets an admin list people, change a role and deactivate, and keeps the last admin', async () => {
    const admin = await t.signIn(as('admin').email, as('admin').password);
    const list = await admin.get('/api/users?pageSize=10');
    expect(list.status).toBe(200);
    expect(list.body.total).toBe(4);
    const tester = list.body.items.find((u: { role: string }) => u.role === 'tester');
    const changed = await admin.patch(`/api/users/${tester.id}`).send({ role: 'lead' });
    expect(changed.status).toBe(200);
    expect(changed.body.user.role).toBe('lead');
    const deactivated = await admin.patch(`/api/users/${tester.id}`).send({ active: false });
    expect(deactivated.body.user.active).toBe(false);
    const signIn = await t.agent().post('/api/auth/sign-in').send({ email: as('tester').email, password: as('tester').password });
    expect(signIn.status).toBe(401);
    const self = list.body.items.find((u: { role: string }) => u.role === 'admin');
    const lastAdmin = await admin.patch(`/api/users/${self.id}`).send({ role: 'designer' });
    expect(lastAdmin.status).toBe(409);
    expect(lastAdmin.body.fields.role).toMatch(/no active admin/);
    const badRole = await admin.patch(`/api/users/${tester.id}`).send({ role: 'owner' });
    expect(badRole.status).toBe(400);
    expect(badRole.body.fields.role).toMatch(/one of admin/);
    const badId = await admin.patch('/api/users/abc').send({ active: true });
    expect(badId.status).toBe(400);
    expect(badId.body.fields.id).toMatch(/number/);
  });

  it('ends the session of a person who is deactivated', async () => {
    const admin = await t.signIn(as('admin').email, as('admin').password);
    const lead = await t.signIn(as('lead').email, as('lead').password);
    expect((await lead.get('/api/auth/me')).status).toBe(200);
    const { body } = await admin.get('/api/users');
    const leadRow = body.items.find((u: { email: string }) => u.email === as('lead').email);
    await admin.patch(`/api/users/${leadRow.id}`).send({ active: false });
    expect((await lead.get('/api/auth/me')).status).toBe(401);
  });
});
