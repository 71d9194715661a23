import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { putPoints } from '../helpers/saves.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { canonicalJson, sha256Hex } from '../../server/api/calibration/canonical-json.js';
import { CalibrationRecord } from '../../server/entities/CalibrationRecord.js';
import { referenceTraceability } from '../../shared/schemas/reference-traceability.js';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

// Invented instrument identifiers and bench pairs: about 10 Hz/V with an offset and a little scatter.
const TRACE = { referenceInstrumentId: 'LAB-DMM-07', referenceCertificate: 'CERT-2026-0311', referenceDueOn: '2026-11-30' };
const SESSION = {
  channelKey: 'pack', ambientC: 22.5, fit: { degree: 1, intercept: true, weighted: false },
  reference: { description: 'bench HV meter, 1000 V range', percentOfReading: 0.05, plusVolts: 0.1 },
};
const POINTS = [0, 100, 200, 300, 400, 500].map((v, i) => ({ appliedV: v, frequencyHz: 1012.5 + 10.021 * v + [0.4, -0.3, 0.1, -0.5, 0.2, 0.3][i] }));

describe('reference instrument traceability', () => {
  let t: TestApp;
  let tester: Agent;
  let boardId: number;
  let revisionId: number;

  beforeAll(async () => {
    t = await createTestApp({}, 'full');
    tester = await t.signIn('tester@example.test', 'tallyvolt-tester');
    const designs = (await tester.get('/api/designs')).body.items;
    const design = (await tester.get(`/api/designs/${designs[0].id}`)).body.design;
    revisionId = design.revisions.find((r: { state: string }) => r.state === 'approved').id;
    const board = await tester.post('/api/boards').send({ serialNumber: 'TRACE-001', revisionId, buildDate: '2026-11-18' });
    expect(board.status, JSON.stringify(board.body)).toBe(201);
    boardId = board.body.board.id;
  });
  afterAll(async () => { await t.close(); });

  async function completed(performedOn: string, trace: object = TRACE): Promise<number> {
    const created = await tester.post(`/api/boards/${boardId}/sessions`).send({ ...SESSION, performedOn, ...trace });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const id = created.body.session.id as number;
    expect((await putPoints(tester, id, { points: POINTS })).status).toBe(200);
    expect((await tester.post(`/api/calibrations/${id}/complete`)).status).toBe(200);
    return id;
  }

  it('flags a session only when it was performed after the due date', () => {
    const stored = { instrumentId: 'A', certificateNumber: 'B', dueOn: '2026-11-30' };
    expect(referenceTraceability('2026-11-30', stored).overdue).toBe(false); // on the due date the calibration still holds (common practice)
    expect(referenceTraceability('2026-12-01', stored).overdue).toBe(true); // the day after it has lapsed (common practice)
    expect(referenceTraceability('2027-01-01', { dueOn: null }).overdue).toBe(false); // no due date recorded: nothing to compare (in this test)
    expect(referenceTraceability('2027-01-01', undefined)).toEqual({ instrumentId: null, certificateNumber: null, dueOn: null, overdue: false });
  });

  it('records the identifier, certificate and due date and leaves a session within its due date unflagged', async () => {
    const id = await completed('2026-11-29');
    const detail = (await tester.get(`/api/calibrations/${id}`)).body.session;
    expect(detail.traceability).toEqual({ instrumentId: 'LAB-DMM-07', certificateNumber: 'CERT-2026-0311', dueOn: '2026-11-30', overdue: false });
    const header = (await tester.get(`/api/calibrations/${id}/export.h`)).text;
    expect(header).toContain(' * Reference instrument LAB-DMM-07, calibration certificate CERT-2026-0311, calibration due 2026-11-30.\n');
    expect(header).not.toContain('WARNING');
    const json = (await tester.get(`/api/calibrations/${id}/export.json`)).body;
    expect(json.referenceInstrument).toEqual(detail.traceability);
  });

  it('flags a session after the due date on the session, the review overview and both exports, from the frozen record', async () => {
    const id = await completed('2026-12-02');
    const detail = (await tester.get(`/api/calibrations/${id}`)).body.session;
    expect(detail.traceability.overdue).toBe(true);
    const [record] = await t.dataSource.getRepository(CalibrationRecord).find({ where: { sessionId: id } });
    expect(JSON.parse(record.payload).referenceTraceability).toEqual({ instrumentId: 'LAB-DMM-07', certificateNumber: 'CERT-2026-0311', dueOn: '2026-11-30' });
    const header = (await tester.get(`/api/calibrations/${id}/export.h`)).text;
    expect(header).toContain('calibration due 2026-11-30. WARNING: the session was performed after the reference\'s calibration due date.');
    expect((await tester.get(`/api/calibrations/${id}/export.json`)).body.referenceInstrument.overdue).toBe(true);
    const overview = (await tester.get(`/api/calibrations/overview?revisionId=${revisionId}&channelKey=pack`)).body;
    const row = overview.boards.find((b: { serialNumber: string }) => b.serialNumber === 'TRACE-001');
    expect(row.sessionId).toBe(id);
    expect(row.traceability).toEqual({ instrumentId: 'LAB-DMM-07', certificateNumber: 'CERT-2026-0311', dueOn: '2026-11-30', overdue: true });
  });

  it('exports a record frozen before traceability was kept as not recorded', async () => {
    const id = await completed('2026-12-03');
    const repo = t.dataSource.getRepository(CalibrationRecord);
    const [row] = await repo.find({ where: { sessionId: id } });
    const { referenceTraceability: _dropped, ...older } = JSON.parse(row.payload);
    const text = canonicalJson(older);
    await repo.update({ id: row.id }, { payload: text, sha256: sha256Hex(text) });
    const header = (await tester.get(`/api/calibrations/${id}/export.h`));
    expect(header.status).toBe(200);
    expect(header.text).toContain(' * Reference instrument traceability: not recorded.\n');
    expect((await tester.get(`/api/calibrations/${id}/export.json`)).body.referenceInstrument).toEqual({ instrumentId: null, certificateNumber: null, dueOn: null, overdue: false });
  });

  it('refuses a bad due date naming the field, stores nothing, and lets a draft change only what it names', async () => {
    const before = (await tester.get(`/api/boards/${boardId}`)).body.board.sessions.length;
    const bad = await tester.post(`/api/boards/${boardId}/sessions`).send({ ...SESSION, performedOn: '2026-12-01', referenceDueOn: '2026-13-01' });
    expect(bad.status).toBe(400);
    expect(bad.body.fields.referenceDueOn).toMatch(/reference calibration due date/);
    const long = await tester.post(`/api/boards/${boardId}/sessions`).send({ ...SESSION, performedOn: '2026-12-01', referenceCertificate: 'x'.repeat(81) });
    expect(long.status).toBe(400);
    expect(long.body.fields.referenceCertificate).toMatch(/at most 80/);
    expect((await tester.get(`/api/boards/${boardId}`)).body.board.sessions.length).toBe(before);

    const draft = (await tester.post(`/api/boards/${boardId}/sessions`).send({ ...SESSION, performedOn: '2026-12-01', ...TRACE })).body.session;
    const patched = await tester.patch(`/api/calibrations/${draft.id}`).send({ referenceDueOn: '2026-12-31' });
    expect(patched.status, JSON.stringify(patched.body)).toBe(200);
    expect(patched.body.session.traceability).toEqual({ instrumentId: 'LAB-DMM-07', certificateNumber: 'CERT-2026-0311', dueOn: '2026-12-31', overdue: false });
  });
});
