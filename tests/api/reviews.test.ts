import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { putChannels, putMarginInputs } from '../helpers/saves.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

async function waitForRun(agent: Agent, id: number, timeoutMs = 60_000) {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const { body } = await agent.get(`/api/runs/${id}`);
    if (!['queued', 'running'].includes(body.run.state)) return body.run;
    if (Date.now() > end) throw new Error(`run ${id} still ${body.run.state}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

describe('review workflow', () => {
  let t: TestApp;
  let designer: Agent;
  let lead: Agent;
  let admin: Agent;
  beforeAll(async () => {
    t = await createTestApp();
    [designer, lead, admin] = await Promise.all([
      t.signIn('designer@example.test', 'tallyvolt-designer'), t.signIn('lead@example.test', 'tallyvolt-lead'), t.signIn('admin@example.test', 'tallyvolt-admin'),
    ]);
  });
  afterAll(async () => { await t.close(); });

  async function newRevision(agent: Agent, name: string): Promise<{ designId: number; revisionId: number }> {
    const { body } = await agent.post('/api/designs').send({ name });
    return { designId: body.design.id, revisionId: body.design.revisions[0].id };
  }

  async function finishStudies(agent: Agent, revisionId: number, which: ('uncertainty' | 'margin')[] = ['uncertainty', 'margin']) {
    for (const kind of which) {
      const started = kind === 'uncertainty'
        ? await agent.post(`/api/revisions/${revisionId}/studies`).send({ trials: 1000, gridPoints: 2, seed: 1 })
        : await agent.post(`/api/revisions/${revisionId}/margin-studies`).send({ trials: 2000, faultTrials: 500, readingErrorTrials: 500, seed: 1 });
      expect(started.status).toBe(202);
      expect((await waitForRun(agent, started.body.run.id)).state).toBe('done');
    }
  }

  const mailTo = async (address: string) => (await t.outbox()).filter((m) => m.to.includes(address));

  it('refuses to submit without current studies, naming what is missing', async () => {
    const { revisionId } = await newRevision(designer, 'Needs studies');
    const none = await designer.post(`/api/revisions/${revisionId}/submit`);
    expect(none.status).toBe(409);
    expect(none.body.error).toMatch(/cannot go to review yet: no finished uncertainty study; run one; no finished margin study; run one/);
    expect(none.body.fields).toEqual({ uncertaintyStudy: 'no finished uncertainty study; run one', marginStudy: 'no finished margin study; run one' });
    await finishStudies(designer, revisionId, ['uncertainty']);
    const half = await designer.post(`/api/revisions/${revisionId}/submit`);
    expect(half.status).toBe(409);
    expect(Object.keys(half.body.fields)).toEqual(['marginStudy']);
    await finishStudies(designer, revisionId, ['margin']);
    const inputs = (await designer.get(`/api/revisions/${revisionId}/margin-inputs`)).body.inputs;
    await putMarginInputs(designer, revisionId, { ...inputs, timeoutS: 6 });
    const stale = await designer.post(`/api/revisions/${revisionId}/submit`);
    expect(stale.status).toBe(409);
    expect(stale.body.fields).toEqual({ marginStudy: 'the latest finished margin study used older inputs; run it again' });
    expect((await designer.get(`/api/revisions/${revisionId}`)).body.revision.state).toBe('draft');
  });

  it('submits, mails every lead, and lets a lead approve: locked, designer told, all audited', async () => {
    const { designId, revisionId } = await newRevision(designer, 'Sign me off');
    const defaults = (await designer.get(`/api/revisions/${revisionId}/margin-inputs`)).body.inputs;
    // A 1 % allowance is one that 2000 trials on 500 shared boards can show (3/500 < 0.01, rule of three, common practice), so every check passes.
    expect((await putMarginInputs(designer, revisionId, { ...defaults, timeoutS: 4.5, allowedProbability: 0.01,
      faults: defaults.faults.filter((f: { kind: string }) => f.kind !== 'missing-capacitance') })).status).toBe(200);
    await finishStudies(designer, revisionId);
    const before = (await t.outbox()).length;
    const submitted = await designer.post(`/api/revisions/${revisionId}/submit`);
    expect(submitted.status).toBe(200);
    expect(submitted.body).toMatchObject({ revision: { id: revisionId, state: 'in_review' }, mail: { sent: ['lead@example.test'], failed: [] } });
    const toLead = (await mailTo('lead@example.test')).at(-1)!;
    expect(toLead.subject).toBe('Review wanted: Sign me off, revision A');
    expect(toLead.text).toContain(`http://tallyvolt.test/revisions/${revisionId}/review`);
    expect((await t.outbox()).length).toBe(before + 1); // only leads are mailed on submission

    const list = await lead.get('/api/reviews');
    expect(list.status).toBe(200);
    const row = list.body.items.find((i: { revision: { id: number } }) => i.revision.id === revisionId);
    expect(row).toMatchObject({ design: { id: designId, name: 'Sign me off' }, submittedBy: { displayName: 'Tamsin Fenwright' }, margin: { verdict: expect.any(String) } });

    const byDesigner = await designer.post(`/api/revisions/${revisionId}/approve`).send({ comment: 'looks fine to me' });
    expect(byDesigner.status).toBe(403);
    expect(byDesigner.body.error).toMatch(/needs the lead or admin role/);
    expect((await designer.post(`/api/revisions/${revisionId}/submit`)).status).toBe(409); // already in review

    const approved = await lead.post(`/api/revisions/${revisionId}/approve`).send({ comment: 'Margins hold; window catches all three faults.' });
    expect(approved.status).toBe(200);
    expect(approved.body).toMatchObject({ revision: { state: 'approved' }, mail: { sent: ['designer@example.test'], failed: [] } });
    const toDesigner = (await mailTo('designer@example.test')).at(-1)!;
    expect(toDesigner.subject).toBe('Approved: Sign me off, revision A');
    expect(toDesigner.text).toContain('Margins hold; window catches all three faults.');

    const rev = (await designer.get(`/api/revisions/${revisionId}`)).body.revision;
    const edit = await putChannels(designer, revisionId, { channels: rev.channels.map((c: { key: string; definition: unknown }) => ({ key: c.key, definition: c.definition })) });
    expect(edit.status).toBe(409);
    expect(edit.body.error).toMatch(/approved and cannot be edited/);
    const inputs = (await designer.get(`/api/revisions/${revisionId}/margin-inputs`)).body.inputs;
    expect((await putMarginInputs(designer, revisionId, inputs)).status).toBe(409);
    expect((await lead.post(`/api/revisions/${revisionId}/approve`).send({})).status).toBe(409); // not in review any more

    const history = (await lead.get(`/api/revisions/${revisionId}/history`)).body.items;
    const review = history.filter((e: { action: string }) => e.action.startsWith('revision.') && e.action !== 'revision.edit');
    expect(review.map((e: { action: string }) => e.action)).toEqual(['revision.submit', 'revision.approve']);
    expect(review[1].detail).toEqual({ from: 'in_review', to: 'approved', comment: 'Margins hold; window catches all three faults.' });
    expect(review[1].actorId).not.toBe(review[0].actorId);

    const next = await designer.post(`/api/designs/${designId}/revisions`).send({ fromRevisionId: revisionId });
    expect(next.status).toBe(201);
    expect((await designer.get(`/api/revisions/${next.body.revision.id}/margin-inputs`)).body).toMatchObject({ stored: true, editable: true, inputs: { timeoutS: 4.5 } }); // the next revision starts from these inputs
  });

  it('lets nobody approve their own revision', async () => {
    const { revisionId } = await newRevision(admin, 'Admin made this');
    await finishStudies(admin, revisionId);
    expect((await admin.post(`/api/revisions/${revisionId}/submit`)).status).toBe(200);
    const own = await admin.post(`/api/revisions/${revisionId}/approve`).send({});
    expect(own.status).toBe(403);
    expect(own.body.error).toBe('you created revision A; someone else must approve it');
    // The default inputs' 30 % missing-capacitance case is not caught, so the lead approves with an override.
    const { failing } = (await lead.get(`/api/revisions/${revisionId}/approval-check`)).body;
    expect((await lead.post(`/api/revisions/${revisionId}/approve`).send({
      justification: 'Accepted for the bench build; the fault case is covered by the bench check.', acknowledged: failing.map((f: { key: string }) => f.key),
    })).status).toBe(200);
  });

  it('sends a revision back with a required comment, then reopens it as a draft', async () => {
    const { revisionId } = await newRevision(designer, 'Send me back');
    await finishStudies(designer, revisionId);
    await designer.post(`/api/revisions/${revisionId}/submit`);
    const noComment = await lead.post(`/api/revisions/${revisionId}/request-changes`).send({ comment: '  ' });
    expect(noComment.status).toBe(400);
    expect(noComment.body.fields.comment).toBe('comment is required: say what to change');
    const back = await lead.post(`/api/revisions/${revisionId}/request-changes`).send({ comment: 'Catch 30 % missing capacitance.' });
    expect(back.status).toBe(200);
    expect(back.body.revision.state).toBe('changes_requested');
    const mail = (await mailTo('designer@example.test')).at(-1)!;
    expect(mail.subject).toBe('Changes requested: Send me back, revision A');
    expect(mail.text).toContain('Catch 30 % missing capacitance.');
    expect((await lead.post(`/api/revisions/${revisionId}/reopen`)).status).toBe(403);
    const reopened = await designer.post(`/api/revisions/${revisionId}/reopen`);
    expect(reopened.status).toBe(200);
    expect(reopened.body.revision.state).toBe('draft');
    const actions = (await designer.get(`/api/revisions/${revisionId}/history`)).body.items.map((e: { action: string }) => e.action);
    expect(actions.filter((a: string) => /^revision\.(submit|approve|request-changes|reopen)$/.test(a))).toEqual(['revision.submit', 'revision.request-changes', 'revision.reopen']);
  });

  it('keeps the transition when the e-mail cannot be sent, and says so', async () => {
    const { revisionId } = await newRevision(designer, 'Mail trouble');
    await finishStudies(designer, revisionId);
    const send = t.mailer.send;
    t.mailer.send = async () => { throw new Error('smtp down'); };
    try {
      const submitted = await designer.post(`/api/revisions/${revisionId}/submit`);
      expect(submitted.status).toBe(200);
      expect(submitted.body.mail).toEqual({ sent: [], failed: ['lead@example.test'] });
    } finally {
      t.mailer.send = send;
    }
    expect((await lead.get(`/api/revisions/${revisionId}`)).body.revision.state).toBe('in_review');
    const actions = (await lead.get(`/api/revisions/${revisionId}/history`)).body.items.map((e: { action: string }) => e.action);
    expect(actions).toContain('review.mail-failed');
  });
});
