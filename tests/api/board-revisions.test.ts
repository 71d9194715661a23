import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { Board } from '../../server/entities/Board.js';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
interface RevisionRef { id: number; letter: string; state: string }

describe('boards are built to approved revisions', () => {
  let t: TestApp;
  let tester: Agent;
  let revisions: RevisionRef[];
  let draft: RevisionRef;

  beforeAll(async () => {
    t = await createTestApp({}, 'full');
    tester = await t.signIn('tester@example.test', 'tallyvolt-tester');
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const designId = (await tester.get('/api/designs')).body.items[0].id;
    const design = (await tester.get(`/api/designs/${designId}`)).body.design;
    const next = await designer.post(`/api/designs/${designId}/revisions`).send({ fromRevisionId: design.revisions.at(-1).id });
    expect(next.status, JSON.stringify(next.body)).toBe(201);
    revisions = (await tester.get(`/api/designs/${designId}`)).body.design.revisions;
    draft = revisions.find((r) => r.id === next.body.revision.id)!;
  });
  afterAll(async () => { await t.close(); });

  const create = (serialNumber: string, revisionId: number, extra: object = {}) =>
    tester.post('/api/boards').send({ serialNumber, revisionId, buildDate: '2026-12-01', ...extra });

  it('builds to an approved or an in-review revision without a word', async () => {
    const approved = revisions.find((r) => r.state === 'approved')!;
    const inReview = revisions.find((r) => r.state === 'in_review')!;
    for (const [serial, revision] of [['OK-A', approved], ['OK-R', inReview]] as const) {
      const made = await create(serial, revision.id);
      expect(made.status, JSON.stringify(made.body)).toBe(201);
      expect(made.body.board).toMatchObject({ revisionStateAtBuild: revision.state, builtToDraft: false });
    }
  });

  it('refuses a draft revision without the confirmation, naming the field, and stores nothing', async () => {
    expect(draft.state).toBe('draft');
    for (const extra of [{}, { confirmDraft: false }]) {
      const refused = await create('DRAFT-1', draft.id, extra);
      expect(refused.status).toBe(400);
      expect(refused.body.fields.confirmDraft).toBe(`revision ${draft.letter} is draft: confirm that this board is built to a draft revision`);
    }
    const notBoolean = await create('DRAFT-1', draft.id, { confirmDraft: 'yes' });
    expect(notBoolean.status).toBe(400);
    expect(notBoolean.body.fields.confirmDraft).toBe('confirmDraft must be true or false');
    expect(await t.dataSource.getRepository(Board).existsBy({ serialNumber: 'DRAFT-1' })).toBe(false);
  });

  it('builds to a draft when confirmed and says so on the board and in the list, even after the revision moves on', async () => {
    const made = await create('DRAFT-1', draft.id, { confirmDraft: true });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    expect(made.body.board).toMatchObject({ revisionStateAtBuild: 'draft', builtToDraft: true });
    const id = made.body.board.id;
    expect((await tester.get(`/api/boards/${id}`)).body.board.builtToDraft).toBe(true);
    const listed = (await tester.get('/api/boards')).body.items.find((b: { id: number }) => b.id === id);
    expect(listed).toMatchObject({ revisionLetter: draft.letter, builtToDraft: true });
  });

  it('treats the demo board recorded by the seed as built to its approved revision', async () => {
    const demo = (await tester.get('/api/boards')).body.items.find((b: { serialNumber: string }) => b.serialNumber === 'PM-2-001');
    expect(demo).toMatchObject({ revisionStateAtBuild: 'approved', builtToDraft: false });
  });
});
