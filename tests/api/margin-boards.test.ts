import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { MarginInputsRecord } from '../../server/entities/MarginInputsRecord.js';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

const SESSION = {
  performedOn: '2026-11-21', ambientC: 23,
  reference: { description: 'bench HV meter, 1000 V range', percentOfReading: 0.05, plusVolts: 0.1 },
};
/** Five invented bench pairs on a straight line with a little scatter. */
const POINTS = [100, 200, 300, 400, 500].map((v, i) => ({ appliedV: v, frequencyHz: 500 + 80 * v + [0.3, -0.2, 0.1, -0.1, 0.2][i] }));
const small = { trials: 2000, faultTrials: 500, readingErrorTrials: 500, seed: 11 };

describe('a margin study reads errors only from a board of its own design', () => {
  let t: TestApp;
  let designer: Agent;
  let tester: Agent;
  let demoBoard: { id: number; serialNumber: string; revisionId: number; designId: number };
  beforeAll(async () => {
    t = await createTestApp({}, 'full');
    designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    tester = await t.signIn('tester@example.test', 'tallyvolt-tester');
    demoBoard = (await tester.get('/api/boards')).body.items.find((b: { serialNumber: string }) => b.serialNumber === 'PM-2-001');
  });
  afterAll(async () => { await t.close(); });

  async function saveInputs(revisionId: number, readingErrors: object) {
    const current = (await designer.get(`/api/revisions/${revisionId}/margin-inputs`)).body;
    return designer.put(`/api/revisions/${revisionId}/margin-inputs`).send({ ...current.inputs, faults: [], readingErrors, baseVersion: current.version });
  }

  it('refuses a board built to another design with a 400 naming the board, and stores nothing', async () => {
    const id = (await designer.post('/api/designs').send({ name: 'Unrelated design' })).body.design.revisions[0].id;
    const res = await saveInputs(id, { mode: 'board', boardId: demoBoard.id });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/board PM-2-001 is built to design ".*", not to this one/);
    expect(res.body.fields['readingErrors.boardId']).toMatch(/PM-2-001/);
    expect(await t.dataSource.getRepository(MarginInputsRecord).countBy({ revisionId: id })).toBe(0); // nothing stored

    // Inputs stored before the rule (written straight to the table) are refused when a study is asked for.
    const view = (await designer.get(`/api/revisions/${id}/margin-inputs`)).body;
    await t.dataSource.getRepository(MarginInputsRecord).insert({ revisionId: id, inputs: { ...view.inputs, faults: [], readingErrors: { mode: 'board', boardId: demoBoard.id } }, updatedById: null });
    const study = await designer.post(`/api/revisions/${id}/margin-studies`).send(small);
    expect(study.status).toBe(400);
    expect(study.body.error).toMatch(/board PM-2-001 is built to design/);
  });

  it('refuses a board of this design without a completed calibration of each channel the study reads', async () => {
    const created = (await designer.post('/api/designs').send({ name: 'Half calibrated' })).body.design;
    const id = created.revisions[0].id;
    const board = (await tester.post('/api/boards').send({ serialNumber: 'HALF-1', revisionId: id, buildDate: '2026-11-19', confirmDraft: true })).body.board;
    const bare = await saveInputs(id, { mode: 'board', boardId: board.id });
    expect(bare.status).toBe(400);
    expect(bare.body.error).toBe('board HALF-1 has no completed calibration of the pack and link channels');

    const session = (await tester.post(`/api/boards/${board.id}/sessions`).send({ ...SESSION, channelKey: 'pack' })).body.session;
    expect((await tester.put(`/api/calibrations/${session.id}/points`).send({ points: POINTS, baseVersion: session.pointsVersion })).status).toBe(200);
    const draftOnly = await saveInputs(id, { mode: 'board', boardId: board.id });
    expect(draftOnly.status).toBe(400); // a calibration still in draft does not count
    expect(draftOnly.body.error).toBe('board HALF-1 has no completed calibration of the pack and link channels');

    expect((await tester.post(`/api/calibrations/${session.id}/complete`)).status).toBe(200);
    const packOnly = await saveInputs(id, { mode: 'board', boardId: board.id });
    expect(packOnly.status).toBe(400);
    expect(packOnly.body.error).toBe('board HALF-1 has no completed calibration of the link channel');

    const missing = await saveInputs(id, { mode: 'board', boardId: 999_999 });
    expect(missing.status).toBe(400);
    expect(missing.body.fields['readingErrors.boardId']).toBe('no board with id 999999');
  });

  it('accepts a calibrated board built to an earlier revision of the same design', async () => {
    const design = (await designer.get(`/api/designs/${demoBoard.designId}`)).body.design;
    const latest = design.revisions.at(-1);
    const next = await designer.post(`/api/designs/${design.id}/revisions`).send({ fromRevisionId: latest.id });
    expect(next.status).toBe(201);
    const saved = await saveInputs(next.body.revision.id, { mode: 'board', boardId: demoBoard.id });
    expect(saved.status).toBe(200);
    expect(saved.body.inputs.readingErrors).toEqual({ mode: 'board', boardId: demoBoard.id });
  });
});
