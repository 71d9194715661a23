import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { putChannels } from '../helpers/saves.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { Channel } from '../../server/entities/Channel.js';
import { Revision } from '../../server/entities/Revision.js';

describe('designs and revisions', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp(); });
  afterAll(async () => { await t.close(); });

  it('creates a design with a draft revision A holding the pack and link channels', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const res = await designer.post('/api/designs').send({ name: 'Test monitor', purpose: 'bench trial' });
    expect(res.status).toBe(201);
    expect(res.body.design.revisions).toHaveLength(1);
    expect(res.body.design.revisions[0]).toMatchObject({ letter: 'A', state: 'draft' });
    const rev = await designer.get(`/api/revisions/${res.body.design.revisions[0].id}`);
    expect(rev.body.revision.channels.map((c: { key: string }) => c.key)).toEqual(['pack', 'link']);
    expect(rev.body.revision.channels[0].definition.divider.top).toHaveLength(4);
  });

  it('lists, searches and sorts designs with owner and latest revision', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    await designer.post('/api/designs').send({ name: 'Alpha 50%_odd' });
    await designer.post('/api/designs').send({ name: 'Beta rig' });
    const lead = await t.signIn('lead@example.test', 'tallyvolt-lead');
    const list = await lead.get('/api/designs?sort=name&order=asc');
    expect(list.status).toBe(200);
    expect(list.body.items.map((d: { name: string }) => d.name)).toEqual(['Alpha 50%_odd', 'Beta rig', 'Test monitor']);
    expect(list.body.items[0]).toMatchObject({ owner: { displayName: 'Tamsin Fenwright' }, latestRevision: { letter: 'A', state: 'draft' } });
    const found = await lead.get(`/api/designs?search=${encodeURIComponent('50%_')}`);
    expect(found.body.items.map((d: { name: string }) => d.name)).toEqual(['Alpha 50%_odd']);
    // By owner: the admin's design and the designer's, ordered by the name shown (binary order, ties by id).
    const admin = await t.signIn('admin@example.test', 'tallyvolt-admin');
    expect((await admin.post('/api/designs').send({ name: 'Zulu bench' })).status).toBe(201);
    for (const order of ['asc', 'desc'] as const) {
      const byOwner = (await lead.get(`/api/designs?sort=owner&order=${order}`)).body.items as { id: number; owner: { displayName: string } }[];
      const expected = [...byOwner].sort((a, b) => {
        const byName = a.owner.displayName < b.owner.displayName ? -1 : a.owner.displayName > b.owner.displayName ? 1 : 0;
        return (order === 'asc' ? byName : -byName) || a.id - b.id;
      });
      expect(byOwner.map((d) => d.id)).toEqual(expected.map((d) => d.id));
      expect(new Set(byOwner.map((d) => d.owner.displayName)).size).toBe(2);
    }
    const bad = await lead.get('/api/designs?sort=colour&pageSize=0');
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.fields).sort()).toEqual(['pageSize', 'sort']);
  });

  it('edits a draft, refuses bad chain input naming the field, and stores nothing half-written', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const { body } = await designer.post('/api/designs').send({ name: 'Edit me' });
    const revId = body.design.revisions[0].id;
    const rev = (await designer.get(`/api/revisions/${revId}`)).body.revision;
    const channels = rev.channels.map((c: { key: string; definition: unknown }) => ({ key: c.key, definition: c.definition }));
    channels[0].definition.divider.bottom.nominalOhm = 33.2e3;
    const ok = await putChannels(designer, revId, { channels });
    expect(ok.status).toBe(200);
    expect(ok.body.revision.channels[0].definition.divider.bottom.nominalOhm).toBe(33200);

    const broken = structuredClone(channels);
    broken[1].definition.divider.bottom.nominalOhm = 0;
    broken[1].definition.capture = { method: 'gated', gateS: 0 };
    const refused = await putChannels(designer, revId, { channels: broken });
    expect(refused.status).toBe(400);
    expect(refused.body.fields['channels.1.definition.divider.bottom.nominalOhm']).toBe('resistance must be > 0 Ω');
    expect(refused.body.fields['channels.1.definition.capture.gateS']).toBe('gate time must be > 0 s');
    const stored = await t.dataSource.getRepository(Channel).findBy({ revisionId: revId });
    expect(stored).toHaveLength(2);
    expect(stored.find((c) => c.key === 'link')!.definition.divider.bottom.nominalOhm).toBe(32400);
  });

  it('locks a revision that is not a draft and starts the next letter from it', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const { body } = await designer.post('/api/designs').send({ name: 'Lock me' });
    const revA = body.design.revisions[0].id;
    await t.dataSource.getRepository(Revision).update({ id: revA }, { state: 'approved' });
    const rev = (await designer.get(`/api/revisions/${revA}`)).body.revision;
    const edit = await putChannels(designer, revA, { channels: rev.channels.map((c: { key: string; definition: unknown }) => ({ key: c.key, definition: c.definition })) });
    expect(edit.status).toBe(409);
    expect(edit.body.error).toBe('revision A is approved and cannot be edited; start the next revision from it');
    const next = await designer.post(`/api/designs/${body.design.id}/revisions`).send({ fromRevisionId: revA });
    expect(next.status).toBe(201);
    expect(next.body.revision).toMatchObject({ letter: 'B', state: 'draft', basedOnId: revA });
    expect(next.body.revision.channels).toHaveLength(2);
    const again = await designer.post(`/api/designs/${body.design.id}/revisions`).send({ fromRevisionId: revA });
    expect(again.status).toBe(409);
    expect(again.body.error).toMatch(/revision B is already a draft/);
    const history = await designer.get(`/api/revisions/${next.body.revision.id}/history`);
    expect(history.body.items.map((e: { action: string }) => e.action)).toEqual(['revision.start']);
  });

  it('lets testers and leads read designs but not write them', async () => {
    const tester = await t.signIn('tester@example.test', 'tallyvolt-tester');
    expect((await tester.get('/api/designs')).status).toBe(200);
    const res = await tester.post('/api/designs').send({ name: 'Nope' });
    expect(res.status).toBe(403);
    expect((await tester.get('/api/designs/9999')).status).toBe(404);
  });
});

describe('the demo design', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp({}, 'full'); });
  afterAll(async () => { await t.close(); });

  it('has an approved revision A and B in review that changes the link-side bottom resistor', async () => {
    const lead = await t.signIn('lead@example.test', 'tallyvolt-lead');
    const list = await lead.get('/api/designs');
    expect(list.body.items.map((d: { name: string }) => d.name)).toEqual(['PM-2 pack monitor']);
    const design = (await lead.get(`/api/designs/${list.body.items[0].id}`)).body.design;
    expect(design.revisions.map((r: { letter: string; state: string }) => `${r.letter}:${r.state}`)).toEqual(['A:approved', 'B:in_review']);
    const [a, b] = await Promise.all(design.revisions.map((r: { id: number }) => lead.get(`/api/revisions/${r.id}`)));
    expect(a.body.revision.channels[1].definition.divider.bottom.nominalOhm).toBe(32400);
    expect(b.body.revision.channels[1].definition.divider.bottom.nominalOhm).toBe(33200);
    expect((await lead.get('/api/stock')).body.total).toBeGreaterThan(5);
  });
});
