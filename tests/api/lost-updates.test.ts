import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { AnalysisRun } from '../../server/entities/AnalysisRun.js';
import { CalibrationPoint } from '../../server/entities/CalibrationPoint.js';
import { Channel } from '../../server/entities/Channel.js';
import { MarginInputsRecord } from '../../server/entities/MarginInputsRecord.js';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
interface ChannelView { id: number; key: string; definition: Record<string, any> }

const SESSION = {
  channelKey: 'pack', performedOn: '2026-11-20', ambientC: 23,
  reference: { description: 'bench HV meter, 1000 V range', percentOfReading: 0.05, plusVolts: 0.1 },
};
/** Four invented bench pairs on a straight line. */
const POINTS = [100, 200, 300, 400].map((v) => ({ appliedV: v, frequencyHz: 500 + 80 * v }));

const bodyOf = (channels: ChannelView[]) => channels.map((c) => ({ key: c.key, definition: c.definition }));

describe('saves based on an older version are refused', () => {
  let t: TestApp;
  let designer: Agent;
  let admin: Agent;
  let tester: Agent;
  beforeAll(async () => {
    t = await createTestApp({}, 'full');
    designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    admin = await t.signIn('admin@example.test', 'tallyvolt-admin');
    tester = await t.signIn('tester@example.test', 'tallyvolt-tester');
  });
  afterAll(async () => { await t.close(); });

  async function newRevision(name: string): Promise<number> {
    const created = await designer.post('/api/designs').send({ name });
    expect(created.status).toBe(201);
    return created.body.design.revisions[0].id;
  }

  it('keeps the first of two channel saves made from the same version and tells the second who saved and when', async () => {
    const id = await newRevision('Two editors');
    const mine = (await designer.get(`/api/revisions/${id}`)).body.revision;
    const theirs = (await admin.get(`/api/revisions/${id}`)).body.revision;
    expect(mine.version).toBe(theirs.version);
    expect(mine.version).toBe(1); // a new revision starts at version 1 (the rule under test)

    const packEdit = structuredClone(mine.channels) as ChannelView[];
    packEdit[0].definition.divider.bottom.nominalOhm = 33_200;
    const first = await designer.put(`/api/revisions/${id}/channels`).send({ channels: bodyOf(packEdit), baseVersion: mine.version });
    expect(first.status).toBe(200);
    expect(first.body.revision.version).toBe(mine.version + 1); // one version step per save, common practice
    expect(first.body.revision.updatedBy).toMatchObject({ displayName: 'Tamsin Fenwright' });

    const linkEdit = structuredClone(theirs.channels) as ChannelView[];
    linkEdit[1].definition.divider.bottom.nominalOhm = 30_100;
    const second = await admin.put(`/api/revisions/${id}/channels`).send({ channels: bodyOf(linkEdit), baseVersion: theirs.version });
    expect(second.status).toBe(409);
    expect(second.body.error).toMatch(/Tamsin Fenwright saved version 2 at .*baseVersion/);
    expect(second.body.conflict).toMatchObject({
      subject: 'channels', baseVersion: 1, version: 2, savedBy: { displayName: 'Tamsin Fenwright' }, // versions of the rule under test
    });
    expect(Date.parse(second.body.conflict.savedAt)).toBe(Date.parse(first.body.revision.updatedAt));

    // Nothing of the refused save reached the database: the pack edit stands, the link is as before.
    const stored = await t.dataSource.getRepository(Channel).findBy({ revisionId: id });
    expect(stored.find((c) => c.key === 'pack')!.definition.divider.bottom.nominalOhm).toBe(33_200); // the first save's value
    expect(stored.find((c) => c.key === 'link')!.definition.divider.bottom.nominalOhm).toBe(theirs.channels[1].definition.divider.bottom.nominalOhm); // unchanged
    expect((await designer.get(`/api/revisions/${id}`)).body.revision.version).toBe(2); // the refused save moved nothing

    // Re-based on the version that stands, the same change goes through.
    const rebased = await admin.put(`/api/revisions/${id}/channels`).send({ channels: bodyOf(linkEdit.map((c, i) => (i === 0 ? packEdit[0] : c))), baseVersion: 2 });
    expect(rebased.status).toBe(200);
    expect(rebased.body.revision.version).toBe(3); // one version step per save, common practice
  });

  it('requires the base version of a channel save and names the field', async () => {
    const id = await newRevision('No version');
    const rev = (await designer.get(`/api/revisions/${id}`)).body.revision;
    const res = await designer.put(`/api/revisions/${id}/channels`).send({ channels: bodyOf(rev.channels) });
    expect(res.status).toBe(400);
    expect(res.body.fields.baseVersion).toMatch(/baseVersion is required/);
  });

  it('keeps channel ids across saves, and study snapshots refer to them', async () => {
    const id = await newRevision('Stable ids');
    const before = (await designer.get(`/api/revisions/${id}`)).body.revision;
    const ids = Object.fromEntries(before.channels.map((c: ChannelView) => [c.key, c.id]));
    const edited = structuredClone(before.channels) as ChannelView[];
    edited[1].definition.divider.bottom.nominalOhm = 33_200;
    const saved = await designer.put(`/api/revisions/${id}/channels`).send({ channels: bodyOf(edited), baseVersion: before.version });
    expect(saved.status).toBe(200);
    expect(Object.fromEntries(saved.body.revision.channels.map((c: ChannelView) => [c.key, c.id]))).toEqual(ids);

    // Reordered and with a third channel: the two keep their ids, the new one gets its own.
    const third = { key: 'aux', definition: { ...structuredClone(edited[0].definition), name: 'Auxiliary' } };
    const reordered = await designer.put(`/api/revisions/${id}/channels`).send({ channels: [bodyOf(edited)[1], bodyOf(edited)[0], third], baseVersion: 2 });
    expect(reordered.status).toBe(200);
    const after = reordered.body.revision.channels as ChannelView[];
    expect(after.find((c) => c.key === 'pack')!.id).toBe(ids.pack);
    expect(after.find((c) => c.key === 'link')!.id).toBe(ids.link);
    expect(Object.values(ids)).not.toContain(after.find((c) => c.key === 'aux')!.id);

    const run = await designer.post(`/api/revisions/${id}/studies`).send({ trials: 1000, seed: 3 });
    expect(run.status).toBe(202);
    const stored = await t.dataSource.getRepository(AnalysisRun).findOneByOrFail({ id: run.body.run.id });
    const snapshot = (stored.inputs as { channels: { id: number; key: string }[] }).channels;
    expect(snapshot.find((c) => c.key === 'pack')!.id).toBe(ids.pack);
    // Dropping a channel and saving again leaves the others' ids, so the snapshot still names live channels.
    const dropped = await designer.put(`/api/revisions/${id}/channels`).send({ channels: bodyOf(after).filter((c) => c.key !== 'aux'), baseVersion: 3 });
    expect(dropped.status).toBe(200);
    expect(dropped.body.revision.channels.map((c: ChannelView) => c.id).sort()).toEqual(Object.values(ids).sort());
    expect(snapshot.filter((c) => c.key !== 'aux').every((c) => dropped.body.revision.channels.some((d: ChannelView) => d.id === c.id))).toBe(true);
  });

  it('refuses a margin-inputs save from an older version and keeps the first', async () => {
    const id = await newRevision('Margin twice');
    const mine = (await designer.get(`/api/revisions/${id}/margin-inputs`)).body;
    const theirs = (await admin.get(`/api/revisions/${id}/margin-inputs`)).body;
    expect(mine).toMatchObject({ stored: false, version: 0, updatedBy: null }); // 0: nothing stored yet (the rule under test)

    const first = await designer.put(`/api/revisions/${id}/margin-inputs`).send({ ...mine.inputs, timeoutS: 6, baseVersion: mine.version });
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ stored: true, version: 1, updatedBy: { displayName: 'Tamsin Fenwright' } }); // one version step per save, common practice

    const second = await admin.put(`/api/revisions/${id}/margin-inputs`).send({ ...theirs.inputs, prechargeOhm: 2200, baseVersion: theirs.version });
    expect(second.status).toBe(409);
    expect(second.body.conflict).toMatchObject({ subject: 'margin inputs', baseVersion: 0, version: 1, savedBy: { displayName: 'Tamsin Fenwright' } }); // versions of the rule under test
    expect(second.body.error).toMatch(/Tamsin Fenwright saved version 1/);
    const record = await t.dataSource.getRepository(MarginInputsRecord).findOneByOrFail({ revisionId: id });
    expect(record.inputs).toMatchObject({ timeoutS: 6, prechargeOhm: mine.inputs.prechargeOhm }); // the first save's values, nothing of the second
    expect(record.version).toBe(1); // the refused save moved nothing

    const missing = await admin.put(`/api/revisions/${id}/margin-inputs`).send({ ...theirs.inputs });
    expect(missing.status).toBe(400);
    expect(missing.body.fields.baseVersion).toMatch(/baseVersion is required/);
  });

  it('refuses a calibration-points save from an older version, and an exclusion made from one', async () => {
    const designs = (await tester.get('/api/designs')).body.items;
    const design = (await tester.get(`/api/designs/${designs[0].id}`)).body.design;
    const board = await tester.post('/api/boards').send({ serialNumber: 'LOST-UPDATE-1', revisionId: design.revisions[0].id, buildDate: '2026-11-18', confirmDraft: true });
    expect(board.status).toBe(201);
    const created = await tester.post(`/api/boards/${board.body.board.id}/sessions`).send(SESSION);
    expect(created.status).toBe(201);
    const id = created.body.session.id;

    const mine = (await tester.get(`/api/calibrations/${id}`)).body.session;
    const theirs = (await admin.get(`/api/calibrations/${id}`)).body.session;
    expect(mine).toMatchObject({ pointsVersion: 1, pointsSavedBy: null, pointsSavedAt: null }); // a new session starts at version 1 (the rule under test)

    const first = await tester.put(`/api/calibrations/${id}/points`).send({ points: POINTS, baseVersion: mine.pointsVersion });
    expect(first.status).toBe(200);
    expect(first.body.session).toMatchObject({ pointsVersion: 2, pointsSavedBy: { displayName: 'Ivo Kestrand' } }); // one version step per save, common practice

    const second = await admin.put(`/api/calibrations/${id}/points`).send({ points: POINTS.slice(0, 3), baseVersion: theirs.pointsVersion });
    expect(second.status).toBe(409);
    expect(second.body.conflict).toMatchObject({ subject: 'calibration points', baseVersion: 1, version: 2, savedBy: { displayName: 'Ivo Kestrand' } }); // versions of the rule under test
    expect(Date.parse(second.body.conflict.savedAt)).toBe(Date.parse(first.body.session.pointsSavedAt));
    expect(await t.dataSource.getRepository(CalibrationPoint).countBy({ sessionId: id })).toBe(4); // the first save's four points, nothing of the second

    const pointId = first.body.session.points[0].id;
    const staleExclusion = await admin.patch(`/api/calibrations/${id}/points/${pointId}`).send({ excluded: true, reason: 'probe slipped', baseVersion: 1 });
    expect(staleExclusion.status).toBe(409);
    expect((await t.dataSource.getRepository(CalibrationPoint).findOneByOrFail({ id: pointId })).excluded).toBe(false);
    const exclusion = await admin.patch(`/api/calibrations/${id}/points/${pointId}`).send({ excluded: true, reason: 'probe slipped', baseVersion: 2 });
    expect(exclusion.status).toBe(200);
    expect(exclusion.body.session).toMatchObject({ pointsVersion: 3, pointsSavedBy: { displayName: 'Odile Brackwater' } }); // one version step per change, common practice

    // An import appends, so it needs no base version; it still moves the version on for everyone else.
    const imported = await tester.post(`/api/calibrations/${id}/points/import?mode=all`)
      .attach('file', Buffer.from('v,f\n500,40500'), 'points.csv').field('mapping', JSON.stringify({ appliedV: 'v', frequencyHz: 'f' }));
    expect(imported.status).toBe(201);
    expect(imported.body.session.pointsVersion).toBe(4); // one version step per change, common practice
    const afterImport = await tester.put(`/api/calibrations/${id}/points`).send({ points: POINTS, baseVersion: 3 });
    expect(afterImport.status).toBe(409);
    expect(await t.dataSource.getRepository(CalibrationPoint).countBy({ sessionId: id })).toBe(5); // four saved plus one imported
  });
});
