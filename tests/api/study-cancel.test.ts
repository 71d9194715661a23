import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { AnalysisRun } from '../../server/entities/AnalysisRun.js';

describe('who may cancel a study', () => {
  let t: TestApp;
  let revisionId: number;
  beforeAll(async () => {
    t = await createTestApp();
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const { body } = await designer.post('/api/designs').send({ name: 'Cancel rights' });
    revisionId = body.design.revisions[0].id;
  });
  afterAll(async () => { await t.close(); });

  it('refuses a lead cancelling a designer\'s study, and lets the designer and an admin cancel', async () => {
    const designer = await t.signIn('designer@example.test', 'tallyvolt-designer');
    const lead = await t.signIn('lead@example.test', 'tallyvolt-lead');
    const admin = await t.signIn('admin@example.test', 'tallyvolt-admin');
    const first = await designer.post(`/api/revisions/${revisionId}/studies`).send({ trials: 2_000_000, seed: 21 });
    const second = await designer.post(`/api/revisions/${revisionId}/studies`).send({ trials: 2_000_000, seed: 22 });
    expect([first.status, second.status]).toEqual([202, 202]);

    const refused = await lead.post(`/api/runs/${first.body.run.id}/cancel`);
    expect(refused.status).toBe(403);
    expect(refused.body.error).toMatch(/only they or an admin may cancel it/);
    const untouched = await t.dataSource.getRepository(AnalysisRun).findOneByOrFail({ id: first.body.run.id });
    expect(['queued', 'running']).toContain(untouched.state);

    expect((await designer.post(`/api/runs/${first.body.run.id}/cancel`)).status).toBe(202);
    expect((await admin.post(`/api/runs/${second.body.run.id}/cancel`)).status).toBe(202);
  });
});
