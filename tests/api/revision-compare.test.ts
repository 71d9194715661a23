import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as pdfjs from 'pdfjs-dist/legacy/build/pdf.mjs';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { putChannels, putMarginInputs } from '../helpers/saves.js';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
interface Row { section: string; label: string; before: string | null; after: string | null; changed: boolean }
interface Comparison { against: string[]; revision: { letter: string }; rows: Row[]; changedCount: number }

/** The text of every page of a PDF, joined, with runs of white space made one space. */
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

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- superagent's parser hands over its own response stream
const binary = (res: any, callback: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => callback(null, Buffer.concat(chunks)));
};

describe('revision comparison in the review report', () => {
  let t: TestApp;
  let designer: Agent;
  let lead: Agent;
  let ids: { A: number; B: number; C: number };
  beforeAll(async () => {
    t = await createTestApp({}, 'full');
    [designer, lead] = await Promise.all([t.signIn('designer@example.test', 'tallyvolt-designer'), t.signIn('lead@example.test', 'tallyvolt-lead')]);
    const design = (await lead.get('/api/designs')).body.items[0];
    const revisions = (await lead.get(`/api/designs/${design.id}`)).body.design.revisions;
    const started = await designer.post(`/api/designs/${design.id}/revisions`).send({ fromRevisionId: revisions[1].id });
    expect(started.status).toBe(201);
    ids = { A: revisions[0].id, B: revisions[1].id, C: started.body.revision.id };
  });
  afterAll(async () => { await t.close(); });

  it('a revision started from another compares equal to it until something changes', async () => {
    const report = (await lead.get(`/api/revisions/${ids.C}/report`)).body.report;
    const comparisons = report.comparisons as Comparison[];
    expect(comparisons.map((c) => [c.revision.letter, c.against])).toEqual([['B', ['previous']], ['A', ['approved']]]); // demo: A approved, B in review
    const previous = comparisons[0];
    // C has no studies yet, so only the study headlines differ from B's
    expect(previous.rows.filter((r) => r.changed && !r.section.endsWith('study'))).toEqual([]);
    expect(previous.rows.find((r) => r.label === 'Margin verdict')).toMatchObject({ before: 'fail', after: 'no finished study', changed: true }); // the seed's B fails one fault case
  });

  it('shows each changed channel and margin input old → new with its unit', async () => {
    const revision = (await designer.get(`/api/revisions/${ids.C}`)).body.revision;
    const channels = revision.channels.map((c: { key: string; definition: Record<string, unknown> }) => ({ key: c.key, definition: c.definition }));
    const pack = channels[0].definition as { divider: { bottom: { nominalOhm: number } }; isolator?: Record<string, unknown>; name: string };
    const oldBottom = pack.divider.bottom.nominalOhm;
    pack.divider.bottom.nominalOhm = 4.75e3;
    pack.isolator = { maxSignalRateBd: 1e6, ratedWorkingVoltageV: 400, creepageMm: 3, requiredCreepageMm: 4, isolationRule: 'team layout rule 7' };
    expect((await putChannels(designer, ids.C, { channels })).status).toBe(200);
    const inputs = (await designer.get(`/api/revisions/${ids.C}/margin-inputs`)).body.inputs;
    expect((await putMarginInputs(designer, ids.C, { ...inputs, closingThresholdPct: 93, isolationMarginPct: 25 })).status).toBe(200);

    const report = (await lead.get(`/api/revisions/${ids.C}/report`)).body.report;
    const previous = (report.comparisons as Comparison[])[0];
    const changed = previous.rows.filter((r) => r.changed && !r.section.endsWith('study'));
    const row = (label: string) => changed.find((r) => r.label === label);
    expect(row('Bottom resistor resistance')).toMatchObject({ section: `${pack.name} · Divider`, after: '4.75 kΩ' });
    expect(row('Bottom resistor resistance')?.before).toBe(`${Number((oldBottom / 1e3).toPrecision(6))} kΩ`);
    expect(row('Rated working voltage')).toMatchObject({ before: null, after: '400 V' });
    expect(row('Closing threshold')).toMatchObject({ section: 'Margin inputs', after: '93 %' });
    expect(row('Isolation margin')).toMatchObject({ before: null, after: '25 %' });
    expect(previous.changedCount).toBe(previous.rows.filter((r) => r.changed).length);

    // The review shows the isolation check at the margin inputs' 25 %: 500 V × 1.25 = 625 V > 400 V (hand arithmetic in this test)
    expect(report.channels[0].stages[0].rows.find((r: { label: string }) => r.label === 'maximum')?.value).toBe(500);
    const warnings = report.channels[0].warnings as { message: string; where: string }[];
    expect(warnings.find((w) => w.where === 'isolator.ratedWorkingVoltageV')?.message).toContain('625 V');
    expect(warnings.find((w) => w.where === 'isolator.creepageMm')?.message).toContain('(team layout rule 7)');
  });

  it('prints the changed values in the report PDF', async () => {
    const res = await lead.get(`/api/revisions/${ids.C}/report.pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    const text = await pdfText(res.body as Buffer);
    expect(text).toContain('Revision comparison');
    expect(text).toContain('Against revision B (in review)');
    expect(text).toMatch(/Bottom resistor resistance .*4\.75 kΩ changed/);
  });

  it('refuses an isolation margin out of range, naming the field, and leaves the inputs as they were', async () => {
    const before = (await designer.get(`/api/revisions/${ids.C}/margin-inputs`)).body;
    const res = await putMarginInputs(designer, ids.C, { ...before.inputs, isolationMarginPct: -5 });
    expect(res.status).toBe(400);
    expect(res.body.fields?.isolationMarginPct).toBe('isolation margin must be in [0, 200] %');
    expect((await designer.get(`/api/revisions/${ids.C}/margin-inputs`)).body.inputs.isolationMarginPct).toBe(25);
  });

  it('a first revision has nothing to compare with', async () => {
    expect((await lead.get(`/api/revisions/${ids.A}/report`)).body.report.comparisons).toEqual([]);
  });
});
