import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { putPoints } from '../helpers/saves.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { canonicalJson, sha256Hex } from '../../server/api/calibration/canonical-json.js';
import { CalibrationPoint } from '../../server/entities/CalibrationPoint.js';
import { CalibrationRecord } from '../../server/entities/CalibrationRecord.js';
import { CalibrationSession } from '../../server/entities/CalibrationSession.js';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

const SESSION = {
  channelKey: 'pack', performedOn: '2026-11-21', ambientC: 22.5,
  reference: { description: 'bench HV meter, 1000 V range', percentOfReading: 0.05, plusVolts: 0.1 },
  fit: { degree: 1, intercept: true, weighted: false },
};
/** Invented bench pairs: about 10 Hz/V with an offset and a little scatter. */
const POINTS = [0, 100, 200, 300, 400, 500, 600].map((v, i) => ({ appliedV: v, frequencyHz: 1012.5 + 10.021 * v + [0.4, -0.3, 0.1, -0.5, 0.2, 0.3, -0.2][i] }));

/** Keys sorted at every level, written without spaces: the canonical form, built independently of the server's code (in this test). */
const sortedText = (value: unknown): string => JSON.stringify(value, (_k, v) => (v && typeof v === 'object' && !Array.isArray(v)
  ? Object.fromEntries(Object.keys(v).sort().map((k) => [k, v[k]])) : v));

describe('frozen calibration records', () => {
  let t: TestApp;
  let tester: Agent;
  let boardId: number;

  beforeAll(async () => {
    t = await createTestApp({}, 'full');
    tester = await t.signIn('tester@example.test', 'tallyvolt-tester');
    const designs = (await tester.get('/api/designs')).body.items;
    const design = (await tester.get(`/api/designs/${designs[0].id}`)).body.design;
    const board = await tester.post('/api/boards').send({ serialNumber: 'REC-001', revisionId: design.revisions[0].id, buildDate: '2026-11-18' });
    expect(board.status).toBe(201);
    boardId = board.body.board.id;
  });
  afterAll(async () => { await t.close(); });

  async function completedSession(): Promise<number> {
    const created = await tester.post(`/api/boards/${boardId}/sessions`).send(SESSION);
    expect(created.status).toBe(201);
    const id = created.body.session.id as number;
    expect((await putPoints(tester, id, { points: POINTS })).status).toBe(200);
    const done = await tester.post(`/api/calibrations/${id}/complete`);
    expect(done.status, JSON.stringify(done.body)).toBe(200);
    return id;
  }
  const exports = async (id: number, query = '') => ({
    header: (await tester.get(`/api/calibrations/${id}/export.h${query}`)).text,
    json: (await tester.get(`/api/calibrations/${id}/export.json${query}`)).text,
  });
  const storedRecords = (sessionId: number) => t.dataSource.getRepository(CalibrationRecord).find({ where: { sessionId }, order: { sequence: 'ASC' } });

  it('hashes with SHA-256 and writes keys in a stable order', () => {
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad'); // FIPS 180-2 Appendix B.1, "abc"
    expect(sha256Hex('')).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855'); // FIPS 180-4 SHA-256 of the empty message, common test vector
    expect(canonicalJson({ b: [1, { d: 0.1, c: -0 }], a: 'x', u: undefined })).toBe('{"a":"x","b":[1,{"c":0,"d":0.1}]}'); // RFC 8785 §3.2.3 member order; ECMAScript Number::toString for 0.1 and -0
    expect(canonicalJson({ z: Infinity, y: [undefined] })).toBe('{"y":[null],"z":null}'); // what JSON.stringify writes for these (ECMA-262 SerializeJSONProperty)
    const frozen = Object.freeze({ k: Object.freeze([3, 2]) });
    expect(canonicalJson(frozen)).toBe('{"k":[3,2]}'); // array order kept (in this test); the frozen input is not mutated
  });

  it('freezes the fit, the coefficients and the identity on completion, with a hash of the stored text', async () => {
    const id = await completedSession();
    const [row, ...more] = await storedRecords(id);
    expect(more).toEqual([]);
    expect(row.sequence).toBe(1);
    expect(createHash('sha256').update(row.payload, 'utf8').digest('hex')).toBe(row.sha256); // FIPS 180-4 SHA-256 of the stored text, recomputed here (in this test)
    expect(sortedText(JSON.parse(row.payload))).toBe(row.payload); // canonical: re-sorting changes nothing (in this test)
    const payload = JSON.parse(row.payload);
    expect(payload.session.id).toBe(id);
    expect(payload.board.serialNumber).toBe('REC-001');
    expect(payload.channel.key).toBe('pack');
    expect(payload.reading.fixedPoint.scaled.length).toBe(2);
    expect(payload.points.length).toBe(POINTS.length);

    const detail = (await tester.get(`/api/calibrations/${id}`)).body.session;
    expect(detail.records).toEqual([expect.objectContaining({ sequence: 1, sha256: row.sha256 })]);
    expect(detail.analysis.fit.coefficients).toEqual(payload.fit.coefficients); // the page shows the record's own fit (in this test)

    const { header, json } = await exports(id);
    expect(header).toContain(`record 1 of session ${id}, SHA-256 ${row.sha256}`);
    const body = JSON.parse(json);
    expect(body.record).toMatchObject({ sequence: 1, sha256: row.sha256, statement: `record 1 of session ${id}, SHA-256 ${row.sha256}` });
    expect(body.reading.coefficients).toEqual(payload.reading.coefficients);
    expect(body.reading.fixedPoint).toMatchObject(payload.reading.fixedPoint);
  });

  it('exports a completed session byte for byte the same after its fit settings and points change underneath', async () => {
    const id = await completedSession();
    const before = await exports(id);
    // What a later change of fit code or settings amounts to for a stored session: different inputs to a recomputation.
    await t.dataSource.getRepository(CalibrationSession).update({ id }, { fit: { degree: 2, intercept: false, weighted: true } });
    const first = await t.dataSource.getRepository(CalibrationPoint).findOneByOrFail({ sessionId: id, position: 0 });
    await t.dataSource.getRepository(CalibrationPoint).update({ id: first.id }, { frequencyHz: first.frequencyHz + 50 });
    const after = await exports(id);
    expect(after.header).toBe(before.header);
    expect(after.json).toBe(before.json);
  });

  it('makes a new, separately identified record when a reopened session is completed again, and keeps the old one downloadable', async () => {
    const id = await completedSession();
    const first = await exports(id);
    const [record1] = await storedRecords(id);

    const reopened = await tester.post(`/api/calibrations/${id}/reopen`);
    expect(reopened.status).toBe(200);
    expect(reopened.body.session.state).toBe('draft');
    expect(reopened.body.session.records.map((r: { sequence: number }) => r.sequence)).toEqual([1]);
    expect((await tester.post(`/api/calibrations/${id}/reopen`)).status).toBe(409);
    const draft = await exports(id);
    expect(draft.header).toContain('Not from a frozen record');
    expect(JSON.parse(draft.json).record).toBeNull();

    const refit = POINTS.map((p) => ({ ...p, frequencyHz: p.frequencyHz + 2 }));
    expect((await putPoints(tester, id, { points: refit })).status).toBe(200);
    expect((await tester.post(`/api/calibrations/${id}/complete`)).status).toBe(200);

    const [again1, record2] = await storedRecords(id);
    expect(again1.payload).toBe(record1.payload); // the first record is untouched (in this test)
    expect(again1.sha256).toBe(record1.sha256);
    expect(record2.sequence).toBe(2);
    expect(record2.sha256).not.toBe(record1.sha256);

    const latest = await exports(id);
    expect(latest.header).toContain(`record 2 of session ${id}, SHA-256 ${record2.sha256}`);
    expect(JSON.parse(latest.json).record.sequence).toBe(2);
    const old = await exports(id, '?record=1');
    expect(old.header).toBe(first.header);
    expect(old.json).toBe(first.json);
    const missing = await tester.get(`/api/calibrations/${id}/export.h?record=3`);
    expect(missing.status).toBe(404);
    expect(missing.body.error).toContain('no record 3');
    const bad = await tester.get(`/api/calibrations/${id}/export.json?record=first`);
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toContain('record');
  });

  it('refuses to export a record whose stored text no longer matches its hash', async () => {
    const id = await completedSession();
    const [row] = await storedRecords(id);
    await t.dataSource.getRepository(CalibrationRecord).update({ id: row.id }, { payload: row.payload.replace('"REC-001"', '"REC-999"') });
    expect((await tester.get(`/api/calibrations/${id}/export.h`)).status).toBe(500);
    await t.dataSource.getRepository(CalibrationRecord).update({ id: row.id }, { payload: row.payload });
    expect((await tester.get(`/api/calibrations/${id}/export.h`)).status).toBe(200);
  });

  it('lets a designer read records but not reopen a session', async () => {
    const id = await completedSession();
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    expect((await designer.post(`/api/calibrations/${id}/reopen`)).status).toBe(403);
    expect((await designer.get(`/api/calibrations/${id}/export.h?record=1`)).status).toBe(200);
  });

  it('gives the demo board\'s completed sessions their first record', async () => {
    const sessions = (await t.dataSource.getRepository(CalibrationSession).findBy({ state: 'complete' })).filter((s) => s.boardId !== boardId);
    expect(sessions.length).toBeGreaterThan(0);
    for (const s of sessions) expect((await storedRecords(s.id)).map((r) => r.sequence)).toEqual([1]);
  });
});
