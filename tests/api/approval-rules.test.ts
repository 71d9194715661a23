import * as pdfjs from 'pdfjs-dist/legacy/build/pdf.mjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
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

async function pdfText(data: Buffer): Promise<string> {
  const pdf = await pdfjs.getDocument({ data: new Uint8Array(data), verbosity: 0 }).promise;
  const pages: string[] = [];
  for (let i = 1; i <= pdf.numPages; i++) {
    const content = await (await pdf.getPage(i)).getTextContent();
    pages.push(content.items.map((item) => ('str' in item ? item.str : '')).join(' '));
  }
  await pdf.destroy();
  return pages.join('\n').replace(/\s+/g, ' ');
}

const binary = (res: NodeJS.ReadableStream, done: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => done(null, Buffer.concat(chunks)));
};

const STAMP = /on \d{4}-\d\d-\d\d \d\d:\d\d UTC; someone else must approve it$/;

describe('who may approve a revision, and what an approval against failing checks needs', () => {
  let t: TestApp;
  let designer: Agent;
  let lead: Agent;
  let admin: Agent;
  let tester: Agent;
  beforeAll(async () => {
    t = await createTestApp();
    [designer, lead, admin, tester] = await Promise.all([
      t.signIn('designer@example.test', 'tallyvolt-designer'), t.signIn('lead@example.test', 'tallyvolt-lead'),
      t.signIn('admin@example.test', 'tallyvolt-admin'), t.signIn('tester@example.test', 'tallyvolt-tester'),
    ]);
  });
  afterAll(async () => { await t.close(); });

  async function newRevision(name: string): Promise<number> {
    const { body } = await designer.post('/api/designs').send({ name });
    return body.design.revisions[0].id;
  }

  async function study(agent: Agent, revisionId: number, kind: 'uncertainty' | 'margin') {
    const started = kind === 'uncertainty'
      ? await agent.post(`/api/revisions/${revisionId}/studies`).send({ trials: 1000, gridPoints: 2, seed: 1 })
      : await agent.post(`/api/revisions/${revisionId}/margin-studies`).send({ trials: 2000, faultTrials: 500, readingErrorTrials: 500, seed: 1 });
    expect(started.status).toBe(202);
    expect((await waitForRun(agent, started.body.run.id)).state).toBe('done');
  }

  async function editChannels(agent: Agent, revisionId: number) {
    const { revision } = (await agent.get(`/api/revisions/${revisionId}`)).body;
    const channels = revision.channels.map((c: { key: string; definition: object }) => ({ key: c.key, definition: c.definition }));
    const saved = await agent.put(`/api/revisions/${revisionId}/channels`).send({ channels, note: 'edited', baseVersion: revision.version ?? 0 });
    expect(saved.status).toBe(200);
  }

  async function saveMarginInputs(agent: Agent, revisionId: number, change: Record<string, unknown>) {
    const current = (await agent.get(`/api/revisions/${revisionId}/margin-inputs`)).body;
    const saved = await agent.put(`/api/revisions/${revisionId}/margin-inputs`).send({ ...current.inputs, ...change, baseVersion: current.version ?? 0 });
    expect(saved.status).toBe(200);
  }

  const approve = (agent: Agent, revisionId: number, body: object = {}) => agent.post(`/api/revisions/${revisionId}/approve`).send(body);

  it('refuses an admin who edited the channels, whatever the role, and says when; a lead who did not may approve', async () => {
    const revisionId = await newRevision('Edited by the admin');
    await editChannels(admin, revisionId);
    await study(designer, revisionId, 'uncertainty');
    await study(designer, revisionId, 'margin');
    expect((await designer.post(`/api/revisions/${revisionId}/submit`)).status).toBe(200);
    const check = (await admin.get(`/api/revisions/${revisionId}/approval-check`)).body;
    expect(check.barred).toMatch(/^you edited revision A /);
    // The review shows who did what: the designer created, studied and submitted it; the admin edited its channels.
    expect(check.contributors.map((c: { did: string[] }) => c.did)).toEqual([['created it', 'ran a study as a draft', 'submitted it'], ['edited the channels']]);
    const own = await approve(admin, revisionId);
    expect(own.status).toBe(403);
    expect(own.body.error).toMatch(/^you edited revision A /);
    expect(own.body.error).toMatch(STAMP);
    expect((await designer.get(`/api/revisions/${revisionId}`)).body.revision.state).toBe('in_review'); // nothing half-written
    const history = (await lead.get(`/api/revisions/${revisionId}/history`)).body.items as { action: string; actorId: number }[];
    const adminId = (await admin.get('/api/auth/me')).body.user?.id;
    expect(history.find((e) => e.action === 'revision.edit' && e.actorId === adminId)).toBeTruthy();
    expect((await lead.get(`/api/revisions/${revisionId}/approval-check`)).body.barred).toBeNull();
    expect((await approve(lead, revisionId, { comment: 'Reviewed by someone who did not edit it.', justification: 'x'.repeat(40),
      acknowledged: (await lead.get(`/api/revisions/${revisionId}/approval-check`)).body.failing.map((f: { key: string }) => f.key) })).status).toBe(200);
  });

  it('refuses whoever submitted, changed margin inputs or reopened it, and whoever ran its studies as a draft', async () => {
    const revisionId = await newRevision('Many hands');
    await saveMarginInputs(admin, revisionId, {});
    await study(designer, revisionId, 'uncertainty');
    await study(designer, revisionId, 'margin');
    expect((await admin.post(`/api/revisions/${revisionId}/submit`)).status).toBe(200);
    expect((await approve(admin, revisionId)).body.error).toMatch(/^you submitted revision A /);
    // Sending one's own work back is harmless: an author may request changes.
    expect((await admin.post(`/api/revisions/${revisionId}/request-changes`).send({ comment: 'I want another look.' })).status).toBe(200);
    expect((await admin.post(`/api/revisions/${revisionId}/reopen`)).status).toBe(200);
    expect((await designer.post(`/api/revisions/${revisionId}/submit`)).status).toBe(200);
    const reopened = await approve(admin, revisionId);
    expect(reopened.status).toBe(403);
    expect(reopened.body.error).toMatch(/^you reopened revision A .*someone else must approve it$/);

    const drafted = await newRevision('Studied as a draft');
    await study(designer, drafted, 'uncertainty');
    await study(admin, drafted, 'margin');
    expect((await designer.post(`/api/revisions/${drafted}/submit`)).status).toBe(200);
    expect((await approve(admin, drafted)).body.error).toMatch(/^you ran a study of revision A while it was a draft, on /);
    // A study the reviewer runs while the revision is in review is a check of the work, not part of it.
    await study(lead, drafted, 'margin');
    expect((await lead.get(`/api/revisions/${drafted}/approval-check`)).body.barred).toBeNull();
  });

  it('asks for a justification and an exact acknowledgement of every failing check, and stores and prints them', async () => {
    const revisionId = await newRevision('Fails its checks');
    // A 1 % capacitance shortfall moves the closure time far less than the plausibility window's width, so it is not caught (from memory: τ = RC scales with C).
    const faults = [{ kind: 'open-precharge' }, { kind: 'missing-capacitance', missingPct: 1 }];
    await saveMarginInputs(designer, revisionId, { faults });
    await study(designer, revisionId, 'uncertainty');
    await study(designer, revisionId, 'margin');
    // A built board far off the design: 5 Hz/V where the design gives tens of Hz/V, so it falls outside the design's spread.
    const board = await tester.post('/api/boards').send({ serialNumber: 'OFF-001', revisionId, buildDate: '2026-11-18', confirmDraft: true });
    expect(board.status).toBe(201);
    const session = await tester.post(`/api/boards/${board.body.board.id}/sessions`).send({
      channelKey: 'pack', performedOn: '2026-11-20', ambientC: 23, reference: { description: 'bench meter', percentOfReading: 0.05, plusVolts: 0.1 },
    });
    const csv = ['reference_v,measured_hz', ...[0, 125, 250, 375, 500].map((v, i) => `${v},${100 + 5 * v + [0.2, -0.1, 0.3, -0.2, 0.1][i]}`)].join('\n');
    const imported = await tester.post(`/api/calibrations/${session.body.session.id}/points/import?mode=all`).attach('file', Buffer.from(csv), 'points.csv')
      .field('mapping', JSON.stringify({ appliedV: 'reference_v', frequencyHz: 'measured_hz' }));
    expect(imported.status).toBe(201);
    const completed = await tester.post(`/api/calibrations/${session.body.session.id}/complete`);
    expect(completed.body.error ?? '').toBe('');
    expect(completed.status).toBe(200);
    expect((await designer.post(`/api/revisions/${revisionId}/submit`)).status).toBe(200);

    const check = (await lead.get(`/api/revisions/${revisionId}/approval-check`)).body;
    const keys = check.failing.map((f: { key: string }) => f.key) as string[];
    expect(keys).toContain('fault:fault-2');
    expect(keys).toContain(`board:${board.body.board.id}:pack`);
    expect(check.failing.find((f: { key: string }) => f.key === 'fault:fault-2').label).toBe('Fault detection fails: 1 % of the link capacitance missing is not caught');

    const bare = await approve(lead, revisionId, { comment: '' });
    expect(bare.status).toBe(400);
    expect(bare.body.fields.justification).toMatch(/justification is required/);
    expect(bare.body.error).toContain('1 % of the link capacitance missing');
    const short = await approve(lead, revisionId, { justification: 'ok', acknowledged: keys });
    expect(short.status).toBe(400);
    expect(Object.keys(short.body.fields)).toEqual(['justification']);
    const justification = 'Bench build only: the 1 % shortfall is below what the window can see, and board OFF-001 is being re-measured.';
    const partial = await approve(lead, revisionId, { justification, acknowledged: keys.slice(1) });
    expect(partial.status).toBe(400);
    expect(partial.body.fields.acknowledged).toContain('outside the design\'s spread');
    expect((await approve(lead, revisionId, { justification, acknowledged: [...keys, 'margin:made-up'] })).status).toBe(400);
    expect((await approve(lead, revisionId, { justification, acknowledged: 'all' })).status).toBe(400);
    expect((await lead.get(`/api/revisions/${revisionId}`)).body.revision.state).toBe('in_review');

    const approved = await approve(lead, revisionId, { comment: 'Approved for the bench.', justification, acknowledged: [...keys].reverse() });
    expect(approved.status).toBe(200);
    const history = (await lead.get(`/api/revisions/${revisionId}/history`)).body.items as { action: string; detail: Record<string, unknown> }[];
    const approval = history.find((e) => e.action === 'revision.approve')!;
    expect(approval.detail).toEqual({ from: 'in_review', to: 'approved', comment: 'Approved for the bench.', override: { justification, failing: check.failing } });

    const mail = (await t.outbox()).filter((m) => m.to.includes('designer@example.test')).at(-1)!;
    expect(mail.subject).toBe('Approved: Fails its checks, revision A');
    expect(mail.text).toContain('has approved with an override');
    expect(mail.text).toContain(`Justification: ${justification}`);

    const { report } = (await lead.get(`/api/revisions/${revisionId}/report`)).body;
    const signed = report.signOff.at(-1);
    expect(signed.label).toBe('Approved with an override');
    expect(signed.override).toEqual({ justification, failing: check.failing });
    const pdf = await lead.get(`/api/revisions/${revisionId}/report.pdf`).buffer(true).parse(binary as never);
    expect(pdf.status).toBe(200);
    const text = await pdfText(pdf.body as Buffer);
    expect(text).toContain('Override: approved by');
    expect(text).toContain('1 % of the link capacitance missing is not caught');
    expect(text).toContain('OFF-001');
    expect(text).toContain('re-measured');
  });

  it('approves a revision that passes every check without a justification', async () => {
    const revisionId = await newRevision('Clean pass');
    // 2000 trials on 500 shared boards can show a 1 % allowance (3/500 < 0.01, rule of three, common practice).
    await saveMarginInputs(designer, revisionId, { faults: [{ kind: 'open-precharge' }, { kind: 'bypassed-precharge', residualOhm: 0 }], allowedProbability: 0.01 });
    await study(designer, revisionId, 'uncertainty');
    await study(designer, revisionId, 'margin');
    expect((await designer.post(`/api/revisions/${revisionId}/submit`)).status).toBe(200);
    const check = (await lead.get(`/api/revisions/${revisionId}/approval-check`)).body;
    expect(check).toMatchObject({ failing: [], barred: null, minJustificationChars: 20 });
    expect(check.contributors).toEqual([{ id: expect.any(Number), displayName: expect.any(String), did: ['created it', 'changed the margin inputs', 'ran a study as a draft', 'submitted it'] }]);
    const approved = await approve(lead, revisionId, {});
    expect(approved.status).toBe(200);
    const approval = ((await lead.get(`/api/revisions/${revisionId}/history`)).body.items as { action: string; detail: object }[]).find((e) => e.action === 'revision.approve')!;
    expect(approval.detail).toEqual({ from: 'in_review', to: 'approved' });
  });
});
